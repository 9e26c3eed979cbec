#!/usr/bin/env bash
# Shared by start.sh, dev.sh and test.sh: install what is missing, run a local PostgreSQL cluster.
set -euo pipefail

ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/../.." && pwd)"
PGBIN="${PGBIN:-$(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -n 1 || true)}"

say() { printf '\033[1mcompline:\033[0m %s\n' "$*"; }

# npm ci when node_modules is missing or older than the lockfile.
ensure_node_modules() {
  if [ ! -d "$ROOT/node_modules" ] || [ "$ROOT/package-lock.json" -nt "$ROOT/node_modules/.package-lock.json" ]; then
    say "installing npm packages (npm ci)…"
    # --include=dev: the client build (vite) and the tests need dev packages even when NODE_ENV=production.
    (cd "$ROOT" && npm ci --include=dev --no-audit --no-fund --loglevel=error)
  fi
}

# ensure_debian_packages "binary:package" …: apt-get install the packages whose binary is absent.
ensure_debian_packages() {
  local missing=() pair bin pkg
  for pair in "$@"; do
    bin="${pair%%:*}"; pkg="${pair##*:}"
    if [ "$bin" = "postgres" ]; then
      [ -n "$PGBIN" ] && [ -x "$PGBIN/postgres" ] && continue
    elif command -v "$bin" >/dev/null 2>&1; then
      continue
    fi
    missing+=("$pkg")
  done
  [ ${#missing[@]} -eq 0 ] && return 0
  local cmd="apt-get update && DEBIAN_FRONTEND=noninteractive apt-get install -y ${missing[*]}"
  say "installing Debian packages: ${missing[*]}"
  if [ "$(id -u)" -eq 0 ]; then
    bash -c "$cmd"
  elif command -v sudo >/dev/null 2>&1 && sudo -n true 2>/dev/null; then
    sudo bash -c "$cmd"
  else
    say "these Debian packages are missing and I cannot install them without root. Run:"
    echo "    sudo bash -c '$cmd'"
    exit 1
  fi
  PGBIN="$(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -n 1 || true)"
}

# Run a PostgreSQL binary as the postgres user when we are root (the server refuses root).
as_pg() {
  if [ "$(id -u)" -eq 0 ]; then runuser -u postgres -- "$@"; else "$@"; fi
}

# pick_pgdata PREFERRED FALLBACK_NAME: PREFERRED when the postgres user can reach it, else a folder
# under /var/tmp that it can.
pick_pgdata() {
  local preferred="$1" name="$2" parent
  parent="$(dirname "$preferred")"
  mkdir -p "$parent"
  if [ "$(id -u)" -ne 0 ] || runuser -u postgres -- test -x "$parent" 2>/dev/null; then
    echo "$preferred"
  else
    local fallback="/var/tmp/compline-$name-$(printf '%s' "$ROOT" | sha256sum | cut -c1-10)/pg"
    say "the postgres user cannot reach $parent; the cluster lives in $fallback" >&2
    echo "$fallback"
  fi
}

# init_cluster PGDATA [fast]: initdb once.
init_cluster() {
  local data="$1"
  [ -f "$data/PG_VERSION" ] && return 0
  mkdir -p "$data"
  if [ "$(id -u)" -eq 0 ]; then
    chown postgres:postgres "$data"
    chmod 700 "$data"
  fi
  as_pg "$PGBIN/initdb" -D "$data" -U postgres --auth=trust --encoding=UTF8 --locale=C.UTF-8 ${2:+--no-sync} >/dev/null
}

# start_cluster PGDATA PORT [fast]
start_cluster() {
  local data="$1" port="$2" extra=""
  [ -n "${3:-}" ] && extra="-c fsync=off -c synchronous_commit=off -c full_page_writes=off"
  if as_pg "$PGBIN/pg_ctl" -D "$data" status >/dev/null 2>&1; then
    say "PostgreSQL already running in $data"
    return 0
  fi
  as_pg "$PGBIN/pg_ctl" -D "$data" -l "$data/server.log" -w -t 30 \
    -o "-c listen_addresses=127.0.0.1 -p $port -c unix_socket_directories='' -c max_connections=200 $extra" start >/dev/null \
    || { say "PostgreSQL did not start; its log:"; tail -n 20 "$data/server.log"; exit 1; }
}

stop_cluster() {
  local data="$1"
  as_pg "$PGBIN/pg_ctl" -D "$data" -m fast -w stop >/dev/null 2>&1 || true
}

# ensure_database PORT NAME
ensure_database() {
  local port="$1" name="$2"
  if ! "$PGBIN/psql" -h 127.0.0.1 -p "$port" -U postgres -d postgres -tAc "select 1 from pg_database where datname='$name'" | grep -q 1; then
    "$PGBIN/psql" -h 127.0.0.1 -p "$port" -U postgres -d postgres -qc "create database \"$name\"" >/dev/null
  fi
}
