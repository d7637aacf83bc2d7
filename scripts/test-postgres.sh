#!/usr/bin/env bash
# A throwaway PostgreSQL cluster for tests, on loopback only.
#   scripts/test-postgres.sh start [DIR] [PORT]   create (if needed) and start it
#   scripts/test-postgres.sh stop  [DIR]          stop it (the folder stays)
#   scripts/test-postgres.sh url   [DIR] [PORT]   print the admin URL for LOTWISE_TEST_POSTGRES_URL
# Defaults: DIR=/tmp/lotwise-postgres, PORT=4810. Trust authentication on 127.0.0.1: the cluster
# holds test data only and is never reachable from another machine.
set -euo pipefail

command=${1:-}
dir=${2:-/tmp/lotwise-postgres}
port=${3:-4810}

bindir=${POSTGRES_BIN:-}
if [ -z "$bindir" ]; then
  bindir=$(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -n 1 || true)
fi
if [ -z "$bindir" ] || [ ! -x "$bindir/pg_ctl" ]; then
  echo "PostgreSQL server binaries not found (apt-get install -y postgresql, or set POSTGRES_BIN)" >&2
  exit 1
fi

# initdb and postgres refuse to run as root: run them as the postgres user then.
as_owner() {
  if [ "$(id -u)" = 0 ]; then
    su postgres -s /bin/sh -c "$*"
  else
    sh -c "$*"
  fi
}

case "$command" in
  start)
    if [ ! -f "$dir/PG_VERSION" ]; then
      mkdir -p "$dir"
      if [ "$(id -u)" = 0 ]; then chown postgres: "$dir"; fi
      chmod 700 "$dir"
      as_owner "'$bindir/initdb' -D '$dir' -U postgres -A trust --no-sync -E UTF8 --locale=C.UTF-8" >/dev/null
    fi
    # fsync off: a crash loses the cluster, which is thrown away anyway.
    as_owner "'$bindir/pg_ctl' -D '$dir' -l '$dir/server.log' -w -o \"-h 127.0.0.1 -p $port -k '$dir' -c fsync=off -c synchronous_commit=off -c full_page_writes=off -c max_connections=200\" start" >/dev/null
    echo "postgres://postgres@127.0.0.1:$port/postgres"
    ;;
  stop)
    if [ -f "$dir/postmaster.pid" ]; then
      as_owner "'$bindir/pg_ctl' -D '$dir' -m fast -w stop" >/dev/null
    fi
    ;;
  url)
    echo "postgres://postgres@127.0.0.1:$port/postgres"
    ;;
  *)
    echo "usage: $0 start|stop|url [DIR] [PORT]" >&2
    exit 2
    ;;
esac
