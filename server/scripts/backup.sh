#!/usr/bin/env bash
# `npm run db:backup [FILE]`: a consistent snapshot of the database in DATABASE_URL (default:
# the local cluster of `npm start`) in pg_dump's custom format, restorable with
# `npm run db:restore FILE`. docs/deployment.md describes the procedure.
set -euo pipefail
source "$(dirname "$0")/lib.sh"
cd "$PROJECT_ROOT"
ensure_postgres_binaries

# The schema owner dumps and restores (the server's own role owns nothing).
url=${DATABASE_OWNER_URL:-${DATABASE_URL:-postgres://postgres@127.0.0.1:${PGPORT:-54329}/phasewright}}
file=${1:-backups/phasewright-$(date -u +%Y%m%dT%H%M%SZ).dump}
mkdir -p "$(dirname "$file")"
# One transaction at repeatable-read isolation: every table as of the same moment.
"$PGBIN/pg_dump" --format=custom --compress=6 --file="$file" --dbname="$url" \
  || die "pg_dump failed"
log "backup written to $file ($(du -h "$file" | cut -f1))"
"$PGBIN/pg_restore" --list "$file" >/dev/null || die "the backup in $file cannot be read back"
log "backup checked: its table of contents reads back"
