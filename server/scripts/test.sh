#!/usr/bin/env bash
# `npm test`: the same bootstrap as `npm start`, against a throwaway cluster
# (.data/pg-test, never the demo data), then every check. Exit status is
# non-zero on any failure.
set -uo pipefail
source "$(dirname "$0")/lib.sh"
cd "$PROJECT_ROOT"

ensure_node_modules
ensure_postgres_binaries
ensure_chromium

export TEST_PGPORT=${TEST_PGPORT:-54330}
# A throwaway cluster: durability is not wanted, speed is.
pg_up pg-test "$TEST_PGPORT" "-c fsync=off -c synchronous_commit=off -c full_page_writes=off -c max_connections=200"
cleanup() { if [ "${PG_STARTED_BY_US:-0}" = 1 ]; then pg_down "$PG_DIR"; fi; }
trap cleanup EXIT
trap 'exit 130' INT TERM

log "type-check"
npm run --silent typecheck || exit 1

log "format check (prettier)"
npm run --silent format:check || { log "run 'npm run format' to fix the files listed above"; exit 1; }

log "lint"
npm run --silent lint || exit 1

log "building the client for the browser tests"
node node_modules/vite/bin/vite.js build --logLevel warn || exit 1

log "unit, reference, API and browser tests"
node node_modules/vitest/vitest.mjs run "$@" || exit 1
