#!/usr/bin/env bash
# npm test — every tier against a throwaway MariaDB and object store, ending with one line "N passed, N failed".
set -uo pipefail
source "$(dirname "$0")/lib.sh"
cd "$ROOT"

ensure_apt mariadb-server mariadb-client chromium poppler-utils wrk
ensure_node_modules

RUN_DIR="$ROOT/.data/test-$$"
REPORTS="$RUN_DIR/reports"; mkdir -p "$REPORTS"
export CI="${CI:-}" SIEVEWRIGHT_TEST=1 NEXT_TELEMETRY_DISABLED=1
export DB_HOST=127.0.0.1 DB_PORT="${TEST_DB_PORT:-3317}" DB_USER=sw_test DB_PASSWORD=sw-test-pass DB_NAME=sw_e2e
# Two accounts as in production: migrations (and the integration tests' own set-up) run as the migrator; the app, the
# outbox sender and the code under test run as sw_test, which has row privileges only (README, "Security"). The
# migrator's credentials are shell variables, not exported: only db_accounts, the migration step and the integration
# runner get them (MIGRATOR_ENV), so the app under the end-to-end tests runs without them, as under npm start.
DB_MIGRATOR_USER=sw_test_migrator DB_MIGRATOR_PASSWORD=sw-test-migrator-pass
export -n DB_MIGRATOR_USER DB_MIGRATOR_PASSWORD
MIGRATOR_ENV=(env DB_MIGRATOR_USER="$DB_MIGRATOR_USER" DB_MIGRATOR_PASSWORD="$DB_MIGRATOR_PASSWORD")
export APP_PORT="${TEST_APP_PORT:-3100}"
export NEXTAUTH_URL="http://127.0.0.1:$APP_PORT" NEXTAUTH_SECRET=test-secret-not-for-production
export APP_BASE_URL="http://127.0.0.1:$APP_PORT"
export SMTP_HOST=127.0.0.1 SMTP_PORT="${TEST_SMTP_PORT:-2626}" SMTP_FROM="Sievewright <no-reply@sievewright.test>"
export MAIL_SINK_DIR="$RUN_DIR/mail" OUTBOX_POLL_MS=300 UPLOAD_DIR="$RUN_DIR/uploads" RATE_LIMIT_PER_MINUTE=100000
export S3_ENDPOINT="http://127.0.0.1:${TEST_S3_PORT:-4500}" S3_REGION=us-east-1 S3_BUCKET=sw-test S3_ACCESS_KEY_ID=S3RVER S3_SECRET_ACCESS_KEY=S3RVER S3_FORCE_PATH_STYLE=true

port_free "$APP_PORT" || die "Port $APP_PORT is in use; the end-to-end tests serve the app there. Stop what uses it (ss -ltnp | grep :$APP_PORT)."
port_free "$SMTP_PORT" || die "Port $SMTP_PORT is in use; the tests run their SMTP sink there. Stop what uses it or set TEST_SMTP_PORT."

PIDS=()
cleanup() {
  trap - INT TERM EXIT
  for ((i=${#PIDS[@]}-1; i>=0; i--)); do stop_pid "${PIDS[$i]}"; done
  rm -rf "$RUN_DIR"
}
trap cleanup INT TERM EXIT

db_start "$RUN_DIR" "$DB_PORT"; PIDS+=("$DB_PID")
s3_fake_start "$RUN_DIR/s3"; PIDS+=("$S3_PID")
db_accounts "$RUN_DIR" sw_it

node scripts/build-workers.mjs || die "Building the worker threads (bench-sheet PDFs) failed."

PASSED=0; FAILED=0; FAILED_STEPS=()
# TEST_TIERS (default: all) picks tiers for a quicker local run, e.g. TEST_TIERS=unit,integration;
# VITEST_FILTER / E2E_GREP narrow the runners. CI always runs everything.
TEST_TIERS="${TEST_TIERS:-static,unit,integration,e2e}"
tier() { [[ ",$TEST_TIERS," == *",$1,"* ]]; }
step_result() { # NAME EXIT_CODE — a step that is not a test runner counts as one check
  if [ "$2" = "0" ]; then PASSED=$((PASSED+1)); say "✔ $1"; else FAILED=$((FAILED+1)); FAILED_STEPS+=("$1"); say "✘ $1"; fi
}
count_json() { # NAME JSONFILE EXIT_CODE — adds a runner's counts from its JSON report
  local out
  out="$(node scripts/count-results.mjs "$2" 2>/dev/null)" || out=""
  if [ -z "$out" ]; then step_result "$1 (no report)" 1; return; fi
  local p="${out% *}" f="${out#* }"
  PASSED=$((PASSED+p)); FAILED=$((FAILED+f))
  if [ "$f" != "0" ] || [ "$3" != "0" ]; then FAILED_STEPS+=("$1"); [ "$f" = "0" ] && FAILED=$((FAILED+1)); fi
  say "$1: $p passed, $f failed"
}

if tier static; then
say "Typecheck"; npx tsc --noEmit; step_result "typecheck" $?
say "Lint"; npx eslint . --max-warnings=0; step_result "lint" $?
fi

if tier unit; then
say "Unit and reference tests"
npx vitest run --project unit ${VITEST_FILTER:-} --reporter=default --reporter=json --outputFile.json="$REPORTS/unit.json"
count_json "unit+reference" "$REPORTS/unit.json" $?
fi

if tier integration; then
say "Integration tests (MariaDB on 127.0.0.1:$DB_PORT)"
DB_NAME=sw_it "${MIGRATOR_ENV[@]}" npx vitest run --project integration ${VITEST_FILTER:-} --reporter=default --reporter=json --outputFile.json="$REPORTS/integration.json"
count_json "integration" "$REPORTS/integration.json" $?
fi

if tier e2e; then
say "Migrate and seed the end-to-end database"
"${MIGRATOR_ENV[@]}" node --import tsx scripts/migrate.ts && node --import tsx scripts/seed.ts; step_result "migrate+seed" $?

say "Production build"
node node_modules/next/dist/bin/next build; step_result "build" $?

say "Mail sink and outbox sender"
node --import tsx scripts/mail-sink.ts & PIDS+=("$!")
node --import tsx scripts/outbox-worker.ts & PIDS+=("$!")

say "End-to-end tests (Playwright, Debian Chromium)"
PLAYWRIGHT_JSON_OUTPUT_NAME="$REPORTS/e2e.json" npx playwright test ${E2E_GREP:+--grep "$E2E_GREP"} --reporter=list,json
count_json "end-to-end" "$REPORTS/e2e.json" $?
fi

[ ${#FAILED_STEPS[@]} -gt 0 ] && say "Failed: ${FAILED_STEPS[*]}"
echo "$PASSED passed, $FAILED failed"
[ "$FAILED" = "0" ] && [ ${#FAILED_STEPS[@]} -eq 0 ]
