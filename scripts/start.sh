#!/usr/bin/env bash
# npm start  — install what is missing, start the local MariaDB, mail sink and object store, migrate, seed, build, serve.
# npm run dev — the same with `next dev` (hot reload) instead of build + start.
set -uo pipefail
source "$(dirname "$0")/lib.sh"
cd "$ROOT"
MODE="prod"; [ "${1:-}" = "--dev" ] && MODE="dev"
export NEXT_TELEMETRY_DISABLED=1

ensure_apt mariadb-server mariadb-client
ensure_node_modules
ensure_env
load_env "$ROOT/.env"
# The migrator's credentials: only this script's database set-up and scripts/migrate.ts get them; every process the app
# consists of is started through WITHOUT_MIGRATOR (README, "Security").
load_env "$ROOT/.env.migrator"
APP_PORT="${APP_PORT:-3000}"
port_free "$APP_PORT" || die "Port $APP_PORT is in use: another server (perhaps an earlier npm start) is running. Stop it, or set APP_PORT in .env."

PIDS=()
cleanup() {
  trap - INT TERM EXIT
  say "Stopping (pids ${PIDS[*]:-none})"
  for ((i=${#PIDS[@]}-1; i>=0; i--)); do stop_pid "${PIDS[$i]}"; done
  exit 0
}
trap cleanup INT TERM EXIT

db_start "$ROOT/.data/dev" "$DB_PORT"; PIDS+=("$DB_PID")

MAIL_SINK_DIR="${MAIL_SINK_DIR:-$ROOT/.data/mail}"; export MAIL_SINK_DIR
if [ "${SMTP_HOST:-127.0.0.1}" = "127.0.0.1" ]; then
  port_free "$SMTP_PORT" || die "Port $SMTP_PORT (SMTP sink) is in use. Stop what uses it or set SMTP_PORT in .env."
  "${WITHOUT_MIGRATOR[@]}" node --import tsx scripts/mail-sink.ts & PIDS+=("$!")
fi

export S3_ENDPOINT="${S3_ENDPOINT-http://127.0.0.1:4500}"  # unset (an .env from before the object store): the local fake
s3_fake_start "$ROOT/.data/s3"; [ -n "$S3_PID" ] && PIDS+=("$S3_PID")
"${WITHOUT_MIGRATOR[@]}" node --import tsx scripts/storage.ts check || die "File storage is unavailable (S3_ENDPOINT=${S3_ENDPOINT:-default}, bucket ${S3_BUCKET:-sievewright}); check the S3_* settings in .env."

say "Migrating the database"
node --import tsx scripts/migrate.ts || die "Migrations failed."
"${WITHOUT_MIGRATOR[@]}" node --import tsx scripts/seed.ts --if-empty || die "Seeding the demo data failed."
"${WITHOUT_MIGRATOR[@]}" node --import tsx scripts/storage.ts sweep || say "The orphan sweep of the object store failed (see above); continuing."

"${WITHOUT_MIGRATOR[@]}" node --import tsx scripts/outbox-worker.ts & PIDS+=("$!")

"${WITHOUT_MIGRATOR[@]}" node scripts/build-workers.mjs || die "Building the worker threads (bench-sheet PDFs) failed."
if [ "$MODE" = "dev" ]; then
  "${WITHOUT_MIGRATOR[@]}" node node_modules/next/dist/bin/next dev -p "$APP_PORT" -H 127.0.0.1 & PIDS+=("$!")
else
  say "Building (next build)"
  "${WITHOUT_MIGRATOR[@]}" node node_modules/next/dist/bin/next build || die "next build failed."
  # One app process per core (APP_WORKERS, default "auto"); scripts/serve.ts is a Node cluster primary.
  NODE_ENV=production "${WITHOUT_MIGRATOR[@]}" node --import tsx scripts/serve.ts & PIDS+=("$!")
fi
APP_PID="${PIDS[-1]}"
for _ in $(seq 1 100); do port_free "$APP_PORT" || break; sleep 0.3; done
cat <<MSG

  Sievewright is running at http://127.0.0.1:$APP_PORT   (Ctrl-C stops everything)

  Demo accounts (password for all: sievewright-demo)
    dana.dev@example.test     assay developer     (lee.dev@example.test too)
    quinn.qa@example.test     QA reviewer         (rhea.qa@example.test too)
    tomas.tech@example.test   technician
    sam.super@example.test    supervisor
    ari.admin@example.test    admin
  Captured e-mail: http://127.0.0.1:$APP_PORT/mail (signed in as admin or supervisor)

MSG
wait "$APP_PID"
