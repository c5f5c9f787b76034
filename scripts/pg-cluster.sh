#!/usr/bin/env bash
# A throwaway PostgreSQL cluster for the api-pg tests, CI and trying DATABASE_URL by hand.
#
#   eval "$(scripts/pg-cluster.sh start)"   # prints the exports: TEST_DATABASE_URL, PG_CLUSTER_DIR
#   scripts/pg-cluster.sh stop              # stops it and removes its folder (PG_CLUSTER_DIR)
#
# Installs Debian's postgresql when no server binaries are found (as root). The cluster lives in
# a temporary folder, trusts every local connection, listens on 127.0.0.1 on a free port only,
# and skips fsync: it holds test data that is thrown away, never anything to keep.
set -euo pipefail

find_bin() {
  local d
  for d in /usr/lib/postgresql/*/bin; do
    if [ -x "$d/initdb" ]; then
      echo "$d"
      return 0
    fi
  done
  return 1
}

# initdb refuses to run as root: as root, run the server as the postgres user.
as_postgres() {
  if [ "$(id -u)" = 0 ]; then
    (cd / && runuser -u postgres -- "$@")
  else
    "$@"
  fi
}

start() {
  local bin dir port
  if ! bin=$(find_bin); then
    if [ "$(id -u)" != 0 ]; then
      echo "PostgreSQL is not installed: run 'apt-get install postgresql' as root" >&2
      exit 1
    fi
    echo "Installing Debian's postgresql" >&2
    export DEBIAN_FRONTEND=noninteractive
    apt-get update -qq >&2
    apt-get install -y -qq postgresql >/dev/null
    bin=$(find_bin)
  fi
  dir=$(mktemp -d "${TMPDIR:-/tmp}/workback-pg-XXXXXX")
  chmod 755 "$dir"
  if [ "$(id -u)" = 0 ]; then chown postgres: "$dir"; fi
  port=$(node -e "const s=require('node:net').createServer();s.listen(0,'127.0.0.1',()=>{console.log(s.address().port);s.close()})")
  as_postgres "$bin/initdb" -D "$dir/data" -U postgres -A trust -E UTF8 --no-locale \
    >"$dir/initdb.log" 2>&1 || {
    cat "$dir/initdb.log" >&2
    exit 1
  }
  # One test app holds a few connections (queries, sessions) and two workers run side by side.
  as_postgres "$bin/pg_ctl" -D "$dir/data" -l "$dir/server.log" -w -s start \
    -o "-c listen_addresses=127.0.0.1 -c port=$port -c unix_socket_directories=$dir \
        -c max_connections=300 -c fsync=off -c synchronous_commit=off -c full_page_writes=off" >&2 || {
    cat "$dir/server.log" >&2
    exit 1
  }
  echo "export TEST_DATABASE_URL=postgres://postgres@127.0.0.1:$port/postgres"
  echo "export PG_CLUSTER_DIR=$dir"
  echo "PostgreSQL ($("$bin/postgres" --version)) on 127.0.0.1:$port, folder $dir" >&2
}

stop() {
  local dir=${1:-${PG_CLUSTER_DIR:-}} bin
  if [ -z "$dir" ] || [ ! -d "$dir/data" ]; then
    echo "No cluster folder given (PG_CLUSTER_DIR)" >&2
    exit 1
  fi
  bin=$(find_bin)
  as_postgres "$bin/pg_ctl" -D "$dir/data" -m fast -w -s stop || true
  rm -rf "$dir"
}

case "${1:-}" in
  start) start ;;
  stop) stop "${2:-}" ;;
  *)
    echo "usage: $0 start | stop [folder]" >&2
    exit 2
    ;;
esac
