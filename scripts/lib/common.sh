#!/usr/bin/env bash
# Shared helpers for `npm start` and `npm test`: dependencies, PostgreSQL cluster, secrets.
# Every failure the user can fix prints one line that says what to do (die), not a stack trace.

die() { echo "ampwarden: $*" >&2; exit 1; }
say() { echo "ampwarden: $*"; }

is_root() { [ "$(id -u)" = "0" ]; }

port_in_use() { (exec 3<>"/dev/tcp/127.0.0.1/$1") 2>/dev/null; }

# npm ci when node_modules is missing or older than the lock file it was installed from.
ensure_node_modules() {
  local stamp=node_modules/.ampwarden-lock.sha
  local want; want=$(sha256sum package-lock.json | cut -d' ' -f1)
  if [ ! -d node_modules ] || [ ! -f "$stamp" ] || [ "$(cat "$stamp")" != "$want" ]; then
    say "installing dependencies (npm ci)…"
    npm ci --no-audit --no-fund --loglevel=error || die "npm ci failed; check the network to the npm registry and run again"
    echo "$want" > "$stamp"
  fi
}

# Finds Debian's PostgreSQL server binaries; installs them as root when missing.
PG_BIN=""
find_pg_bin() {
  local d
  for d in $(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V -r); do
    if [ -x "$d/initdb" ] && [ -x "$d/pg_ctl" ]; then PG_BIN="$d"; return 0; fi
  done
  return 1
}
ensure_postgres() {
  find_pg_bin && return 0
  if is_root; then
    say "PostgreSQL server not found; installing Debian's package (apt-get install postgresql)…"
    DEBIAN_FRONTEND=noninteractive apt-get update -qq >/dev/null || die "apt-get update failed; check access to Debian's package mirror"
    DEBIAN_FRONTEND=noninteractive apt-get install -y -qq postgresql >/dev/null || die "apt-get install postgresql failed"
    find_pg_bin || die "PostgreSQL installed but initdb was not found under /usr/lib/postgresql/*/bin"
  else
    die "PostgreSQL server is missing: run 'sudo apt-get install -y postgresql' (Debian) and try again"
  fi
}

# Runs a PostgreSQL server command as the owner of the cluster (initdb refuses root).
as_pg() {
  if is_root; then runuser -u postgres -- "$@"; else "$@"; fi
}

# init_cluster DIR PASSWORD: a new cluster whose superuser `ampwarden` has the given password.
init_cluster() {
  local dir=$1 password=$2
  mkdir -p "$dir" 2>/dev/null || die "cannot create database folder $dir; make its parent writable"
  [ -w "$dir" ] || die "database folder $dir is not writable; fix its permissions or remove it"
  if is_root; then
    id postgres >/dev/null 2>&1 || die "the 'postgres' system user is missing; reinstall Debian's postgresql package"
    chown postgres:postgres "$dir"
    chmod 700 "$dir"
    runuser -u postgres -- test -w "$dir" || die "user postgres cannot write $dir (a parent folder blocks it); clone the project under a folder others can traverse"
  fi
  local pwfile; pwfile=$(mktemp)
  printf '%s\n' "$password" > "$pwfile"
  chmod 644 "$pwfile"
  as_pg "$PG_BIN/initdb" -D "$dir" -U ampwarden --pwfile="$pwfile" --auth-local=scram-sha-256 \
    --auth-host=scram-sha-256 -E UTF8 --locale=C.UTF-8 >"$dir.initdb.log" 2>&1 \
    || { rm -f "$pwfile"; die "initdb failed (see $dir.initdb.log)"; }
  rm -f "$pwfile"
}

# start_cluster DIR PORT: listens on 127.0.0.1 only, sockets inside the data folder.
start_cluster() {
  local dir=$1 port=$2
  if as_pg "$PG_BIN/pg_ctl" -D "$dir" status >/dev/null 2>&1; then
    say "database already running on port $port"
    return 0
  fi
  port_in_use "$port" && die "port $port is taken by another program; stop it or set AMPWARDEN_PG_PORT to a free port"
  rm -f "$dir/postmaster.pid" 2>/dev/null || true
  as_pg "$PG_BIN/pg_ctl" -D "$dir" -l "$dir/server.log" -w -t 60 \
    -o "-c listen_addresses=127.0.0.1 -p $port -k $dir -c fsync=${PG_FSYNC:-on}" start >/dev/null \
    || die "PostgreSQL did not start; see $dir/server.log"
}

stop_cluster() {
  local dir=$1
  [ -n "$PG_BIN" ] || find_pg_bin || return 0
  as_pg "$PG_BIN/pg_ctl" -D "$dir" -m fast -w stop >/dev/null 2>&1 || true
}

# psql_admin PORT PASSWORD SQL…: runs SQL as the cluster superuser against `postgres`.
psql_admin() {
  local port=$1 password=$2; shift 2
  PGPASSWORD="$password" "$PG_BIN/psql" -h 127.0.0.1 -p "$port" -U ampwarden -d postgres -v ON_ERROR_STOP=1 -qAt "$@"
}

ensure_database() {
  local port=$1 password=$2 name=$3
  local exists; exists=$(psql_admin "$port" "$password" -c "select 1 from pg_database where datname='$name'")
  [ "$exists" = "1" ] || psql_admin "$port" "$password" -c "create database \"$name\"" >/dev/null
}

random_hex() { node -e "process.stdout.write(require('crypto').randomBytes($1).toString('hex'))"; }

# Debian's Chromium for the browser tests (never a downloaded browser).
ensure_chromium() {
  [ -x /usr/bin/chromium ] && return 0
  if is_root; then
    say "installing Debian's chromium for the browser tests…"
    DEBIAN_FRONTEND=noninteractive apt-get update -qq >/dev/null || die "apt-get update failed"
    DEBIAN_FRONTEND=noninteractive apt-get install -y -qq chromium >/dev/null || die "apt-get install chromium failed"
  else
    die "Chromium is missing for the browser tests: run 'sudo apt-get install -y chromium' and try again"
  fi
}
