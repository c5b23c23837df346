#!/usr/bin/env bash
# Shared bootstrap for `npm start`, `npm test` and `npm run dev`: installs what
# is missing on a plain Debian machine and runs a project-local PostgreSQL.
# Sourced, not executed.

PROJECT_ROOT=$(cd "$(dirname "${BASH_SOURCE[0]}")/../.." && pwd)

log() { printf '\033[1;36m[phasewright]\033[0m %s\n' "$*" >&2; }
die() { printf '\033[1;31m[phasewright]\033[0m %s\n' "$*" >&2; exit 1; }

as_root() {
  if [ "$(id -u)" = 0 ]; then "$@"
  elif command -v sudo >/dev/null 2>&1; then sudo "$@"
  else die "need root or sudo to run: $*"; fi
}

APT_UPDATED=0
apt_install() {
  if [ "$APT_UPDATED" = 0 ]; then
    log "apt-get update"
    as_root apt-get update -qq >&2 || die "apt-get update failed"
    APT_UPDATED=1
  fi
  log "installing Debian packages: $*"
  as_root env DEBIAN_FRONTEND=noninteractive apt-get install -y -qq "$@" >&2 || die "apt-get install $* failed"
}

ensure_node_modules() {
  cd "$PROJECT_ROOT" || exit 1
  if [ ! -d node_modules ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
    log "installing npm dependencies from the lockfile (npm ci)"
    npm ci --no-audit --no-fund >&2 || die "npm ci failed"
  fi
}

pg_bindir() {
  ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -1
}

ensure_postgres_binaries() {
  local bin
  bin=$(pg_bindir)
  if [ -z "$bin" ] || [ ! -x "$bin/initdb" ]; then
    apt_install postgresql
    bin=$(pg_bindir)
    [ -x "$bin/initdb" ] || die "PostgreSQL server binaries not found after install"
  fi
  PGBIN="$bin"
  export PGBIN
}

ensure_chromium() {
  if [ ! -x /usr/bin/chromium ]; then
    apt_install chromium
  fi
}

# Runs a command as the owner of the cluster: postgres when we are root
# (initdb refuses root), ourselves otherwise.
as_pg_owner() {
  if [ "$(id -u)" = 0 ]; then runuser -u postgres -- "$@"; else "$@"; fi
}

# Picks the cluster folder. Normally .data/<name> in the project; when we are
# root and the postgres user cannot enter the project folder, a folder under
# /var/tmp named after the project path instead.
pg_cluster_dir() {
  local name=$1 base="$PROJECT_ROOT/.data"
  if [ "$(id -u)" = 0 ]; then
    mkdir -p "$base"
    chown postgres: "$base" 2>/dev/null
    if ! runuser -u postgres -- test -w "$base" 2>/dev/null; then
      base="/var/tmp/phasewright-$(printf '%s' "$PROJECT_ROOT" | md5sum | cut -c1-10)"
    fi
  fi
  printf '%s/%s' "$base" "$name"
}

# pg_up NAME PORT [extra postgres options]: initialise the cluster if needed and
# start it on 127.0.0.1:PORT. Sets PG_STARTED_BY_US=1 when it was not running.
pg_up() {
  local name=$1 port=$2; shift 2
  local dir run
  dir=$(pg_cluster_dir "$name")
  run="$dir.run"
  # Socket paths are limited to 107 bytes; fall back to /tmp for long paths.
  if [ ${#run} -gt 90 ]; then run="/tmp/phasewright-sock-$(printf '%s' "$dir" | md5sum | cut -c1-10)"; fi
  mkdir -p "$dir" "$run"
  if [ "$(id -u)" = 0 ]; then chown postgres: "$dir" "$run" "$(dirname "$dir")"; fi
  chmod 700 "$dir"
  if [ ! -f "$dir/PG_VERSION" ]; then
    log "creating PostgreSQL cluster in $dir"
    as_pg_owner "$PGBIN/initdb" -D "$dir" -U postgres --auth=trust -E UTF8 --locale=C.UTF-8 >"$dir.init.log" 2>&1 \
      || { cat "$dir.init.log" >&2; die "initdb failed"; }
  fi
  PG_STARTED_BY_US=0
  if ! as_pg_owner "$PGBIN/pg_ctl" -D "$dir" status >/dev/null 2>&1; then
    log "starting PostgreSQL on 127.0.0.1:$port"
    as_pg_owner "$PGBIN/pg_ctl" -D "$dir" -l "$dir.log" -w -t 60 \
      -o "-p $port -k $run -c listen_addresses=127.0.0.1 $*" start >/dev/null \
      || { tail -20 "$dir.log" >&2; die "PostgreSQL did not start (see $dir.log)"; }
    PG_STARTED_BY_US=1
  fi
  PG_DIR="$dir"
  export PG_DIR PG_STARTED_BY_US
}

pg_down() {
  local dir=$1
  [ -n "${PGBIN:-}" ] || die "pg_down: run ensure_postgres_binaries first (PGBIN is not set)"
  if as_pg_owner "$PGBIN/pg_ctl" -D "$dir" status >/dev/null 2>&1; then
    log "stopping PostgreSQL"
    as_pg_owner "$PGBIN/pg_ctl" -D "$dir" -m fast -w stop >/dev/null 2>&1 || true
  fi
}

# The owner role (schema, migrations) and the server's own role (owns nothing).
APP_DB_ROLE=phasewright_app
OWNER_DB_ROLE=phasewright_owner

# pg_createdb PORT NAME: create the two roles and the database (owned by the
# owner role) if they do not exist; a database made before the roles existed
# is handed to the owner role.
pg_createdb() {
  local port=$1 db=$2
  local psql=("$PGBIN/psql" -X -q -v ON_ERROR_STOP=1 -h 127.0.0.1 -p "$port" -U postgres)
  "${psql[@]}" -f "$PROJECT_ROOT/server/scripts/roles.sql" postgres >/dev/null || die "creating the database roles failed"
  if ! "${psql[@]}" -tAc "select 1 from pg_database where datname='$db'" postgres | grep -q 1; then
    "$PGBIN/createdb" -h 127.0.0.1 -p "$port" -U postgres -O "$OWNER_DB_ROLE" "$db" || die "createdb $db failed"
  fi
  "${psql[@]}" -c "ALTER DATABASE \"$db\" OWNER TO $OWNER_DB_ROLE" postgres >/dev/null || die "ALTER DATABASE $db failed"
  "${psql[@]}" -f "$PROJECT_ROOT/server/scripts/database-owner.sql" "$db" >/dev/null || die "handing $db to $OWNER_DB_ROLE failed"
}

# database_urls PORT NAME: export the server's and the owner's connection URLs.
database_urls() {
  local port=$1 db=$2
  export DATABASE_URL="postgres://$APP_DB_ROLE@127.0.0.1:$port/$db"
  export DATABASE_OWNER_URL="postgres://$OWNER_DB_ROLE@127.0.0.1:$port/$db"
}
