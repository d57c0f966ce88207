#!/usr/bin/env bash
# Shared shell helpers for scripts/start.sh and scripts/test.sh.
# Sourced, not executed. Every helper prints what it does and fails loudly.

ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
export PATH="$ROOT/node_modules/.bin:$PATH"

say() { printf '\033[1m[sievewright]\033[0m %s\n' "$*"; }
die() { printf '\033[1;31m[sievewright] %s\033[0m\n' "$*" >&2; exit 1; }

as_root() {
  if [ "$(id -u)" = "0" ]; then "$@"; elif command -v sudo >/dev/null 2>&1; then sudo "$@"; else
    die "Need root to run: $* (install sudo or run as root)"; fi
}

# ensure_apt PKG... — installs Debian packages that are not installed yet.
ensure_apt() {
  local missing=()
  for p in "$@"; do dpkg-query -W -f='${Status}' "$p" 2>/dev/null | grep -q "install ok installed" || missing+=("$p"); done
  [ ${#missing[@]} -eq 0 ] && return 0
  say "Installing Debian packages: ${missing[*]}"
  as_root apt-get update -qq || die "apt-get update failed; check the network to Debian's mirrors."
  as_root env DEBIAN_FRONTEND=noninteractive apt-get install -y -qq "${missing[@]}" >/dev/null \
    || die "apt-get install ${missing[*]} failed."
}

# ensure_node_modules — npm ci when node_modules is missing or older than the lock file.
ensure_node_modules() {
  if [ ! -d "$ROOT/node_modules" ] || [ "$ROOT/package-lock.json" -nt "$ROOT/node_modules/.package-lock.json" ]; then
    say "Installing npm dependencies (npm ci)"
    (cd "$ROOT" && npm ci --no-audit --no-fund) || die "npm ci failed."
  fi
}

# ensure_env — writes .env from .env.example with a generated NEXTAUTH_SECRET if there is none, and .env.migrator
# (DB_MIGRATOR_USER and a generated DB_MIGRATOR_PASSWORD; mode 600) if there is none. The migrator's credentials live
# apart from .env because Next.js loads .env into the app process itself: an .env written before the split has its
# DB_MIGRATOR_* lines moved into .env.migrator (README, "Security").
ensure_env() {
  local gen='console.log(require("crypto").randomBytes(32).toString("base64url"))'
  if [ ! -f "$ROOT/.env" ]; then
    sed -e "s|^NEXTAUTH_SECRET=.*|NEXTAUTH_SECRET=$(node -e "$gen")|" "$ROOT/.env.example" > "$ROOT/.env"
    say "Wrote .env from .env.example with a new NEXTAUTH_SECRET"
  fi
  if [ ! -f "$ROOT/.env.migrator" ]; then
    local user pass
    user="$(sed -n 's/^DB_MIGRATOR_USER=//p' "$ROOT/.env" | tail -n 1)"
    pass="$(sed -n 's/^DB_MIGRATOR_PASSWORD=//p' "$ROOT/.env" | tail -n 1)"
    [ -n "$user" ] || user=sievewright_migrator
    { [ -n "$pass" ] && [ "$pass" != "change-me" ]; } || pass="$(node -e "$gen")"
    (umask 077 && cat > "$ROOT/.env.migrator" <<EOF_MIGRATOR) || die "Writing .env.migrator failed."
# Database account for migrations, grants, backups and restores (README, "Security"). Read only by npm run db:migrate,
# db:backup, db:restore and npm start's set-up; never by the app: Next.js does not load this file, and npm start
# removes DB_MIGRATOR_* from the environment of the app and the outbox sender.
DB_MIGRATOR_USER=$user
DB_MIGRATOR_PASSWORD=$pass
EOF_MIGRATOR
    chmod 600 "$ROOT/.env.migrator"
    if grep -q '^DB_MIGRATOR_' "$ROOT/.env"; then
      sed -i '/^DB_MIGRATOR_/d' "$ROOT/.env"
      say "Moved the migrator account (DB_MIGRATOR_*) from .env into .env.migrator (mode 600): the app no longer sees it"
    else
      say "Wrote .env.migrator (mode 600) with the migrator account and a new password"
    fi
  elif grep -q '^DB_MIGRATOR_' "$ROOT/.env"; then
    sed -i '/^DB_MIGRATOR_/d' "$ROOT/.env"
    say "Removed DB_MIGRATOR_* from .env (they belong in .env.migrator; Next.js loads .env into the app)"
  fi
  chmod 600 "$ROOT/.env.migrator"
}

# "${WITHOUT_MIGRATOR[@]}" CMD... — runs CMD with DB_MIGRATOR_USER and DB_MIGRATOR_PASSWORD removed from its
# environment: the app, the outbox sender, the build and the helpers never hold the migrator's credentials. An array,
# not a function, so `"${WITHOUT_MIGRATOR[@]}" node … &` leaves $! the PID of node itself (env execs it).
WITHOUT_MIGRATOR=(env -u DB_MIGRATOR_USER -u DB_MIGRATOR_PASSWORD)

# port_free PORT — true when nothing listens on 127.0.0.1:PORT.
port_free() { ! (exec 3<>"/dev/tcp/127.0.0.1/$1") 2>/dev/null; }

# db_start DATADIR PORT — initialises (if needed) and starts a project-local MariaDB on loopback.
# Sets DB_PID. Creates database $DB_NAME and its two accounts (db_accounts).
db_start() {
  local dir="$1" port="$2"
  mkdir -p "$dir/run"
  command -v mariadbd >/dev/null 2>&1 || PATH="$PATH:/usr/sbin"
  if [ -f "$dir/run/mariadb.pid" ] && kill -0 "$(cat "$dir/run/mariadb.pid")" 2>/dev/null; then
    die "A MariaDB from $dir is already running (pid $(cat "$dir/run/mariadb.pid")). Stop it: kill $(cat "$dir/run/mariadb.pid")"
  fi
  port_free "$port" || die "Port $port is in use, so the project's MariaDB cannot start. Stop what uses it (ss -ltnp | grep :$port) or set DB_PORT in .env."
  if [ ! -d "$dir/mariadb/mysql" ]; then
    say "Initialising MariaDB data in $dir/mariadb"
    mariadb-install-db --no-defaults --datadir="$dir/mariadb" --user="$(id -un)" \
      --auth-root-authentication-method=socket --skip-test-db > "$dir/install-db.log" 2>&1 \
      || die "mariadb-install-db failed; see $dir/install-db.log"
  fi
  mariadbd --no-defaults --user="$(id -un)" --datadir="$dir/mariadb" --bind-address=127.0.0.1 --port="$port" \
    --socket="$dir/run/mariadb.sock" --pid-file="$dir/run/mariadb.pid" --log-error="$dir/mariadb.err" \
    --skip-name-resolve --character-set-server=utf8mb4 --collation-server=utf8mb4_unicode_ci >/dev/null 2>&1 &
  DB_PID=$!
  local i=0
  until mariadb-admin --no-defaults --socket="$dir/run/mariadb.sock" -uroot ping >/dev/null 2>&1; do
    sleep 0.2; i=$((i+1))
    if ! kill -0 "$DB_PID" 2>/dev/null || [ $i -gt 150 ]; then
      tail -n 20 "$dir/mariadb.err" >&2 2>/dev/null
      die "MariaDB did not start (log: $dir/mariadb.err). If the data folder is damaged, move $dir away and run again."
    fi
  done
  db_accounts "$dir" "$DB_NAME"
  say "MariaDB listening on 127.0.0.1:$port (pid $DB_PID, data $dir/mariadb)"
}

# db_accounts DATADIR DATABASE — creates DATABASE (if needed) and the two accounts (README, "Security"):
#   the migrator $DB_MIGRATOR_USER: every privilege on DATABASE, with GRANT OPTION (migrations, grants, backups);
#   the app $DB_USER: nothing here — after each migration the migrator grants it row privileges table by table
#   (db/grants.ts): no DROP, ALTER, CREATE, TRIGGER or TRUNCATE, no UPDATE/DELETE on audit_events and signatures.
# Passwords follow the environment on every start. With DB_MIGRATOR_USER unset (or equal to DB_USER) the one
# account gets every privilege, as before the split.
db_accounts() {
  local dir="$1" name="$2" app="'$DB_USER'@'127.0.0.1'" migrator="'${DB_MIGRATOR_USER:-}'@'127.0.0.1'"
  local sql="CREATE DATABASE IF NOT EXISTS \`$name\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
CREATE USER IF NOT EXISTS $app IDENTIFIED BY '$DB_PASSWORD'; ALTER USER $app IDENTIFIED BY '$DB_PASSWORD';"
  if [ -z "${DB_MIGRATOR_USER:-}" ] || [ "$DB_MIGRATOR_USER" = "$DB_USER" ]; then
    sql="$sql GRANT ALL PRIVILEGES ON \`$name\`.* TO $app;"
  else
    sql="$sql REVOKE ALL PRIVILEGES, GRANT OPTION FROM $app;
CREATE USER IF NOT EXISTS $migrator IDENTIFIED BY '$DB_MIGRATOR_PASSWORD'; ALTER USER $migrator IDENTIFIED BY '$DB_MIGRATOR_PASSWORD';
GRANT ALL PRIVILEGES ON \`$name\`.* TO $migrator WITH GRANT OPTION;"
  fi
  db_sql "$dir" "$sql FLUSH PRIVILEGES;" || die "Creating database $name and its accounts failed."
}

# db_sql DATADIR SQL — runs SQL as the local root over the socket.
db_sql() { mariadb --no-defaults --socket="$1/run/mariadb.sock" -uroot -e "$2"; }

# stop_pid PID — TERM, wait up to 10 s, then KILL.
stop_pid() {
  local pid="$1" i=0
  [ -n "$pid" ] || return 0
  kill -0 "$pid" 2>/dev/null || return 0
  kill -TERM "$pid" 2>/dev/null
  while kill -0 "$pid" 2>/dev/null; do sleep 0.1; i=$((i+1)); [ $i -gt 100 ] && kill -KILL "$pid" 2>/dev/null; done
  return 0
}

# load_env FILE — exports every KEY=VALUE in FILE that is not already set in the environment.
load_env() {
  [ -f "$1" ] || return 0
  while IFS= read -r line || [ -n "$line" ]; do
    case "$line" in ''|'#'*) continue ;; esac
    local key="${line%%=*}" val="${line#*=}"
    [ -z "${!key+x}" ] && export "$key=$val"
  done < "$1"
}

# s3_fake_start DATADIR — when S3_ENDPOINT points at loopback, starts the local S3-compatible fake (s3rver) there with
# its data in DATADIR, waits until it answers, and sets S3_PID (empty when a real store is configured).
s3_fake_start() {
  S3_PID=""
  case "${S3_ENDPOINT:-}" in
    http://127.0.0.1:*|http://localhost:*) ;;
    *) say "Object store: ${S3_ENDPOINT:-provider default}, bucket ${S3_BUCKET:-sievewright} (not started here)"; return 0 ;;
  esac
  local port="${S3_ENDPOINT#http://*:}"; port="${port%%/*}"
  port_free "$port" || die "Port $port (local object store) is in use. Stop what uses it (ss -ltnp | grep :$port) or set S3_ENDPOINT in .env."
  S3_FAKE_DIR="$1" "${WITHOUT_MIGRATOR[@]}" node --import tsx "$ROOT/scripts/s3-fake.ts" & S3_PID=$!
  local i=0
  until ! port_free "$port"; do
    sleep 0.2; i=$((i+1))
    if ! kill -0 "$S3_PID" 2>/dev/null || [ $i -gt 100 ]; then die "The local object store did not start on 127.0.0.1:$port."; fi
  done
}
