#!/usr/bin/env bash
# Ensure a project-local PostgreSQL cluster on 127.0.0.1 is installed, initialised, running,
# and has the role of DATABASE_URL (default boreline) and the databases named in $@ (default:
# boreline boreline_test). Idempotent: safe to run repeatedly and after a killed run.
# PG_DURABLE=1 (npm run serve): its own cluster (.data/pg-serve) with fsync on and passwords
# required over TCP; otherwise (demo, tests) fsync is off and loopback connections are trusted.
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
PGPORT="${PGPORT:-54329}"
DBS=("$@"); [ ${#DBS[@]} -gt 0 ] || DBS=(boreline boreline_test)

find_bin() { ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -n 1; }
PGBIN="$(find_bin || true)"
if [ -z "$PGBIN" ] || [ ! -x "$PGBIN/initdb" ]; then
  if [ "$(id -u)" = 0 ] && command -v apt-get >/dev/null; then
    echo "[pg] installing PostgreSQL from Debian's packages"
    DEBIAN_FRONTEND=noninteractive apt-get install -y -qq postgresql >/dev/null 2>&1 || {
      apt-get update -qq >/dev/null && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq postgresql >/dev/null; }
    PGBIN="$(find_bin)"
  else
    echo "[pg] PostgreSQL server binaries are missing: install Debian's 'postgresql' package (sudo apt-get install postgresql)" >&2
    exit 1
  fi
fi

# Run server binaries as the postgres system user when we are root (initdb refuses root).
as_pg() { if [ "$(id -u)" = 0 ]; then runuser -u postgres -- "$@"; else "$@"; fi; }

# The data folder must be reachable by the postgres user; a clone under /root is not.
DURABLE="${PG_DURABLE:-0}"
NAME=pg; [ "$DURABLE" = 1 ] && NAME=pg-serve
DATA="$ROOT/.data/$NAME"
if [ "$(id -u)" = 0 ] && ! runuser -u postgres -- test -x "$ROOT" 2>/dev/null; then
  key="$(printf '%s' "$ROOT" | sha1sum | cut -c1-12)"
  DATA="/var/tmp/boreline-$NAME-$key"
fi
export PGDATA="$DATA"
mkdir -p "$(dirname "$DATA")"
if [ ! -s "$DATA/PG_VERSION" ]; then
  echo "[pg] initialising cluster in $DATA"
  rm -rf "$DATA"; mkdir -p "$DATA"
  [ "$(id -u)" = 0 ] && chown postgres:postgres "$DATA"
  chmod 700 "$DATA"
  if [ "$DURABLE" = 1 ]; then
    # The unix socket lives in the data folder (mode 700), so only its owner reaches it; TCP needs a password.
    as_pg "$PGBIN/initdb" -D "$DATA" --locale=C.UTF-8 -E UTF8 --auth-local=trust --auth-host=scram-sha-256 -U postgres >/dev/null
  else
    as_pg "$PGBIN/initdb" -D "$DATA" --locale=C.UTF-8 -E UTF8 -A trust -U postgres >/dev/null
  fi
fi

if [ "${PG_ACTION:-start}" = stop ]; then
  as_pg "$PGBIN/pg_ctl" -D "$DATA" -w -m fast stop >/dev/null 2>&1 || true
  echo "[pg] stopped"; exit 0
fi

# The demo's and the tests' data can be rebuilt, so they skip fsync; a real install's cannot.
DURABILITY="-c fsync=off"; [ "$DURABLE" = 1 ] && DURABILITY="-c fsync=on -c synchronous_commit=on -c full_page_writes=on"
if ! as_pg "$PGBIN/pg_ctl" -D "$DATA" status >/dev/null 2>&1; then
  rm -f "$DATA/postmaster.pid"
  as_pg "$PGBIN/pg_ctl" -D "$DATA" -w -t 30 -l "$DATA/server.log" \
    -o "-c listen_addresses=127.0.0.1 -p $PGPORT -k $DATA $DURABILITY -c max_connections=200" start >/dev/null 9>&-
fi

psql_pg() { psql -h "$DATA" -p "$PGPORT" -U postgres -v ON_ERROR_STOP=1 -qtA "$@"; }
if [ "$DURABLE" = 1 ] && [ "$(psql_pg -d postgres -c 'show fsync')" != on ]; then
  echo "[pg] the cluster in $DATA runs with fsync off: stop it (PG_ACTION=stop PG_DURABLE=1 bash scripts/pg.sh) and start again" >&2
  exit 1
fi
# The role and its password come from DATABASE_URL (a real install's password is generated per install).
read -r ROLE PASS < <(node -e 'const u = new URL(process.env.DATABASE_URL || "postgres://boreline:boreline@x/boreline"); console.log(decodeURIComponent(u.username) || "boreline", decodeURIComponent(u.password) || "boreline")')
[[ "$ROLE" =~ ^[a-z_][a-z0-9_]*$ ]] || { echo "[pg] the user name in DATABASE_URL must be lower-case letters, digits and _" >&2; exit 1; }
if [ "$(psql_pg -d postgres -c "select 1 from pg_roles where rolname='$ROLE'")" != 1 ]; then
  psql_pg -d postgres -c "create role $ROLE login createdb"
fi
printf "alter role %s password :'pass';\n" "$ROLE" | psql_pg -d postgres -v pass="$PASS" >/dev/null
for db in "${DBS[@]}"; do
  [[ "$db" =~ ^[a-z_][a-z0-9_]*$ ]] || { echo "[pg] database name $db must be lower-case letters, digits and _" >&2; exit 1; }
  if [ "$(psql_pg -d postgres -c "select 1 from pg_database where datname='$db'")" != 1 ]; then
    psql_pg -d postgres -c "create database $db owner $ROLE"
  fi
done
echo "[pg] ready on 127.0.0.1:$PGPORT (data $DATA)"
