#!/usr/bin/env bash
# `npm run dev`: the database, the API server in watch mode on API_PORT
# (default 3001) and Vite with hot reload on 5173, proxying /api.
set -uo pipefail
source "$(dirname "$0")/lib.sh"
cd "$PROJECT_ROOT"

ensure_node_modules
export API_PORT=${API_PORT:-3001}
if [ -z "${DATABASE_URL:-}" ]; then
  ensure_postgres_binaries
  PGPORT=${PGPORT:-54329}
  pg_up pg "$PGPORT"
  pg_createdb "$PGPORT" phasewright
  database_urls "$PGPORT" phasewright
fi
export PHASEWRIGHT_SEED_DEMO=${PHASEWRIGHT_SEED_DEMO:-1}
export APP_URL=${APP_URL:-http://127.0.0.1:5173}

PORT=$API_PORT node --import tsx --watch server/index.ts &
API_PID=$!
node node_modules/vite/bin/vite.js &
VITE_PID=$!
trap 'kill $API_PID $VITE_PID 2>/dev/null; wait; [ "${PG_STARTED_BY_US:-0}" = 1 ] && pg_down "$PG_DIR"; exit 130' INT TERM
wait
