#!/usr/bin/env bash
# `npm start`: everything needed to run Phasewright with the demo workspace on
# a fresh Debian machine. Running it again keeps the data.
set -uo pipefail
source "$(dirname "$0")/lib.sh"
cd "$PROJECT_ROOT"

ensure_node_modules
PORT=${PORT:-3000}
export PORT

stop_all() {
  [ -n "${SERVER_PID:-}" ] && kill -TERM "$SERVER_PID" 2>/dev/null && wait "$SERVER_PID" 2>/dev/null
  if [ "${PG_STARTED_BY_US:-0}" = 1 ]; then pg_down "$PG_DIR"; fi
}
trap 'stop_all; exit 130' INT TERM

if [ -z "${DATABASE_URL:-}" ]; then
  ensure_postgres_binaries
  PGPORT=${PGPORT:-54329}
  pg_up pg "$PGPORT"
  pg_createdb "$PGPORT" phasewright
  database_urls "$PGPORT" phasewright
fi

log "building the client"
node node_modules/vite/bin/vite.js build --logLevel warn || { stop_all; die "client build failed"; }
log "compiling the server"
node server/build/server.mjs >/dev/null || { stop_all; die "server build failed"; }

export PHASEWRIGHT_SEED_DEMO=${PHASEWRIGHT_SEED_DEMO:-1}
# A smaller young generation: about 30 MB less at idle; --expose-gc lets the server collect once
# its engine threads have retired, giving their memory back (docs/deployment.md).
node --max-semi-space-size=4 --expose-gc dist-server/index.js &
SERVER_PID=$!
wait "$SERVER_PID"
status=$?
SERVER_PID=
stop_all
exit $status
