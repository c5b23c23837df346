#!/usr/bin/env bash
# `npm run db:restore FILE [--replace]`: restores a backup made by `npm run db:backup` into the
# database in DATABASE_URL (default: the local cluster of `npm start`). The database must be
# empty (create it with createdb); --replace drops the database and creates it afresh first
# (the connecting role needs the right to create databases). The restore itself is all or
# nothing: one transaction, stopping at the first error. Stop the servers first.
# docs/deployment.md describes the procedure.
set -euo pipefail
source "$(dirname "$0")/lib.sh"
cd "$PROJECT_ROOT"
ensure_postgres_binaries

file=${1:-}
[ -n "$file" ] && [ -f "$file" ] || die "usage: npm run db:restore -- FILE [--replace]"
# The schema owner dumps and restores (the server's own role owns nothing).
url=${DATABASE_OWNER_URL:-${DATABASE_URL:-postgres://postgres@127.0.0.1:${PGPORT:-54329}/phasewright}}
if [ "${2:-}" = "--replace" ]; then
  db=${url##*/}
  db=${db%%\?*}
  maintenance="${url%/*}/postgres"
  log "replacing database $db"
  "$PGBIN/psql" -q -v ON_ERROR_STOP=1 --dbname="$maintenance" \
    -c "DROP DATABASE IF EXISTS \"$db\" WITH (FORCE)" -c "CREATE DATABASE \"$db\"" \
    || die "could not recreate database $db"
fi
"$PGBIN/pg_restore" --exit-on-error --single-transaction --dbname="$url" "$file" \
  || die "pg_restore failed; nothing was restored"
log "restored $file"
