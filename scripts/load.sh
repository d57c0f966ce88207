#!/usr/bin/env bash
# npm run load — installs wrk (Debian) when missing, then runs scripts/load.ts against the running app.
set -uo pipefail
source "$(dirname "$0")/lib.sh"
cd "$ROOT"
ensure_apt wrk
exec node --import tsx scripts/load.ts "$@"
