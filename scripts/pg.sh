#!/usr/bin/env bash
# Ensure a project-local PostgreSQL cluster on 127.0.0.1 is installed, initialised, running,
# and has the role of DATABASE_URL (default boreline) and the databases named in $@ (default:
# boreline boreline_test). Idempotent: safe to run repeatedly and after a killed run.
#
# PG_PROFILE chooses the cluster (each has its own data folder):
#   demo  (npm start, the default)   .data/pg        PostgreSQL's durability settings on; loopback trusted
#   serve (npm run serve; PG_DURABLE=1 says the same) .data/pg-serve  durable; passwords over TCP
#   test  (npm test and the benches) .data/pg-test   durability traded for speed (see below)
# PGPORT is the port (scripts/start.sh and scripts/test.sh set it from BORELINE_PGPORT); PG_DATA_DIR
# overrides the data folder (a test starts a throwaway cluster with it).
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
PGPORT="${PGPORT:-54329}"
DBS=("$@"); [ ${#DBS[@]} -gt 0 ] || DBS=(boreline boreline_test)
PROFILE="${PG_PROFILE:-demo}"; [ "${PG_DURABLE:-0}" = 1 ] && PROFILE=serve
case "$PROFILE" in
  demo) NAME=pg ;;
  serve) NAME=pg-serve ;;
  test) NAME=pg-test ;;
  *) echo "[pg] PG_PROFILE must be demo, serve or test (got '$PROFILE')" >&2; exit 1 ;;
esac

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
DATA="${PG_DATA_DIR:-$ROOT/.data/$NAME}"
if [ -z "${PG_DATA_DIR:-}" ] && [ "$(id -u)" = 0 ] && ! runuser -u postgres -- test -x "$ROOT" 2>/dev/null; then
  key="$(printf '%s' "$ROOT" | sha1sum | cut -c1-12)"
  DATA="/var/tmp/boreline-$NAME-$key"
fi
export PGDATA="$DATA"
# Point-in-time recovery (demo and serve): completed WAL segments are copied here by PostgreSQL's own
# archive_command, and base backups (npm run db:basebackup) are kept beside them.
ARCHIVE="$DATA-wal-archive"
BASES="$DATA-base-backups"
mkdir -p "$(dirname "$DATA")"
if [ ! -s "$DATA/PG_VERSION" ]; then
  echo "[pg] initialising cluster in $DATA"
  rm -rf "$DATA"; mkdir -p "$DATA"
  [ "$(id -u)" = 0 ] && chown postgres:postgres "$DATA"
  chmod 700 "$DATA"
  if [ "$PROFILE" = serve ]; then
    # The unix socket lives in the data folder (mode 700), so only its owner reaches it; TCP needs a password.
    as_pg "$PGBIN/initdb" -D "$DATA" --locale=C.UTF-8 -E UTF8 --auth-local=trust --auth-host=scram-sha-256 -U postgres >/dev/null
  else
    as_pg "$PGBIN/initdb" -D "$DATA" --locale=C.UTF-8 -E UTF8 -A trust -U postgres >/dev/null
  fi
fi

# PG_ACTION=kill: a crash, not a stop (the crash tests): SIGKILL the postmaster and every backend at once.
if [ "${PG_ACTION:-start}" = kill ]; then
  pid="$(head -n 1 "$DATA/postmaster.pid" 2>/dev/null || true)"
  if [ -n "$pid" ] && kill -0 "$pid" 2>/dev/null; then
    # shellcheck disable=SC2046
    kill -9 "$pid" $(pgrep -P "$pid" || true) 2>/dev/null || true
    for _ in $(seq 1 50); do kill -0 "$pid" 2>/dev/null || break; sleep 0.1; done
  fi
  echo "[pg] killed"; exit 0
fi
if [ "${PG_ACTION:-start}" = stop ]; then
  as_pg "$PGBIN/pg_ctl" -D "$DATA" -w -m fast stop >/dev/null 2>&1 || true
  echo "[pg] stopped"; exit 0
fi

# Durability. The demo and a real install keep PostgreSQL's own settings (fsync, synchronous_commit and
# full_page_writes on): a record a scrutineer was told is saved survives a power cut. Only the test
# cluster trades some for speed, because every run drops and rebuilds its database from migrations and
# seeds, so a machine crash there loses nothing anybody needs. It keeps synchronous_commit on: without
# fsync a commit still reaches the operating system before it is acknowledged, so the crash tests that
# SIGKILL PostgreSQL (the process, not the machine) still find every acknowledged record.
if [ "$PROFILE" = test ]; then
  DURABILITY="-c fsync=off -c synchronous_commit=on -c full_page_writes=off"
else
  DURABILITY="-c fsync=on -c synchronous_commit=on -c full_page_writes=on"
  # WAL archiving for point-in-time recovery (scripts/pg-pitr.sh); archive_timeout bounds how much
  # committed work waits in an unfinished segment (5 minutes).
  for d in "$ARCHIVE" "$BASES"; do mkdir -p "$d"; [ "$(id -u)" = 0 ] && chown postgres:postgres "$d"; chmod 700 "$d"; done
  DURABILITY="$DURABILITY -c wal_level=replica -c archive_mode=on -c archive_timeout=300 -c 'archive_command=test ! -f $ARCHIVE/%f && cp %p $ARCHIVE/%f'"
fi
RECOVERY_OPTS="${PG_RECOVERY_OPTS:-}"
psql_pg() { psql -h "$DATA" -p "$PGPORT" -U postgres -v ON_ERROR_STOP=1 -qtA "$@"; }
# Who answers on the port when our cluster is not running: another checkout's cluster, or another program.
port_taken() { node -e 'const s=require("net").connect(+process.argv[1],"127.0.0.1");s.on("connect",()=>{s.destroy();process.exit(0)});s.on("error",()=>process.exit(1))' "$PGPORT"; }
start_cluster() {
  rm -f "$DATA/postmaster.pid"
  if port_taken; then
    cat >&2 <<MSG
[pg] port $PGPORT on 127.0.0.1 is already taken by another program (another Boreline checkout's
[pg] PostgreSQL, or a system PostgreSQL), so this checkout's cluster ($DATA) cannot start there.
[pg] Choose another port for this checkout, for example:
[pg]   BORELINE_PGPORT=$((PGPORT + 100)) npm start     (the demo; tests and benches use BORELINE_PGPORT + 10,
[pg]   or TEST_PGPORT to name their port)
MSG
    exit 1
  fi
  as_pg "$PGBIN/pg_ctl" -D "$DATA" -w -t 60 -l "$DATA/server.log" \
    -o "-c listen_addresses=127.0.0.1 -p $PGPORT -k $DATA $DURABILITY -c max_connections=200 $RECOVERY_OPTS" start >/dev/null 9>&- || {
    echo "[pg] PostgreSQL did not start; the end of its log ($DATA/server.log):" >&2
    tail -n 15 "$DATA/server.log" >&2 || true
    exit 1
  }
}
# PG_ACTION=recover with PG_RECOVER_TO=<time>: point-in-time recovery from the newest base backup taken
# before that time, replaying the archived WAL up to it (scripts/pg-pitr.sh explains; demo and serve only).
if [ "${PG_ACTION:-start}" = recover ]; then
  TO="${PG_RECOVER_TO:-}"
  [ "$PROFILE" != test ] || { echo "[pg] the test cluster keeps no WAL archive: nothing to recover from" >&2; exit 1; }
  if ! [[ "$TO" =~ ^[0-9T:+.\ Z-]+$ ]] || ! to_epoch="$(date -d "$TO" +%s 2>/dev/null)"; then
    echo "[pg] --to needs a time such as \"2026-12-03 11:45:00+00\" (got '$TO')" >&2; exit 1
  fi
  [ "$to_epoch" -le "$(date +%s)" ] || { echo "[pg] --to $TO is in the future" >&2; exit 1; }
  base=""
  for b in $(ls -1 "$BASES" 2>/dev/null | sort); do
    [[ "$b" =~ ^([0-9]{4})([0-9]{2})([0-9]{2})T([0-9]{2})([0-9]{2})([0-9]{2})Z$ ]] || continue
    t="$(date -u -d "${BASH_REMATCH[1]}-${BASH_REMATCH[2]}-${BASH_REMATCH[3]} ${BASH_REMATCH[4]}:${BASH_REMATCH[5]}:${BASH_REMATCH[6]}" +%s)"
    [ "$t" -lt "$to_epoch" ] && base="$b"
  done
  [ -n "$base" ] || { echo "[pg] no base backup from before $TO in $BASES (npm run db:basebackup takes one)" >&2; exit 1; }
  if as_pg "$PGBIN/pg_ctl" -D "$DATA" status >/dev/null 2>&1; then
    # Close the WAL segment in use so the archive holds everything committed until now, and wait for it.
    seg="$(psql_pg -d postgres -c 'select pg_walfile_name(pg_switch_wal())')"
    for _ in $(seq 1 100); do
      [ -f "$ARCHIVE/$seg" ] && break
      sleep 0.1
    done
  fi
  as_pg "$PGBIN/pg_ctl" -D "$DATA" -w -m fast stop >/dev/null 2>&1 || true
  kept="$DATA-before-recovery-$(date -u +%Y%m%dT%H%M%SZ)"
  mv "$DATA" "$kept"
  cp -a "$BASES/$base" "$DATA"
  # The backup holds the socket's lock file (the socket lives in the data folder): not ours to keep.
  rm -f "$DATA"/.s.PGSQL.* "$DATA/postmaster.pid"
  as_pg touch "$DATA/recovery.signal"
  RECOVERY_OPTS="-c 'restore_command=cp $ARCHIVE/%f %p' -c 'recovery_target_time=$TO' -c recovery_target_action=promote"
  start_cluster
  for _ in $(seq 1 240); do
    [ "$(psql_pg -d postgres -c 'select pg_is_in_recovery()' 2>/dev/null)" = f ] && break
    sleep 0.5
  done
  [ "$(psql_pg -d postgres -c 'select pg_is_in_recovery()')" = f ] || { echo "[pg] recovery did not finish; see $DATA/server.log" >&2; exit 1; }
  echo "[pg] recovered to $TO from base backup $base and the archived WAL; the cluster as it was is kept in $kept"
  exit 0
fi

# A cluster of this checkout already running on another port than the one asked (TEST_PGPORT or
# BORELINE_PGPORT changed since it started): the test profile's is restarted on the asked port; a demo's
# or server's is left alone, with the way out named, rather than failing later on a missing socket.
running_port="$(sed -n 4p "$DATA/postmaster.pid" 2>/dev/null || true)"
if [ -n "$running_port" ] && [ "$running_port" != "$PGPORT" ] && as_pg "$PGBIN/pg_ctl" -D "$DATA" status >/dev/null 2>&1; then
  if [ "$PROFILE" = test ]; then
    echo "[pg] this checkout's test cluster ($DATA) runs on port $running_port; restarting it on $PGPORT"
    as_pg "$PGBIN/pg_ctl" -D "$DATA" -w -m fast stop >/dev/null
  else
    cat >&2 <<MSG
[pg] this checkout's $PROFILE cluster ($DATA) is already running on port $running_port, not $PGPORT.
[pg] Use that port (BORELINE_PGPORT=$running_port) or stop it first:
[pg]   PG_PROFILE=$PROFILE PGPORT=$running_port PG_ACTION=stop bash scripts/pg.sh
MSG
    exit 1
  fi
fi

if ! as_pg "$PGBIN/pg_ctl" -D "$DATA" status >/dev/null 2>&1; then
  start_cluster
elif [ "$PROFILE" != test ] && [ "$(psql_pg -d postgres -c 'show fsync' -c 'show archive_mode' | tr '\n' ' ')" != "on on " ]; then
  # Started by an older checkout with fsync off (or without WAL archiving): restart it with the durable settings.
  echo "[pg] the cluster in $DATA runs with fsync off or without WAL archiving; restarting it with PostgreSQL's durability settings"
  as_pg "$PGBIN/pg_ctl" -D "$DATA" -w -m fast stop >/dev/null
  start_cluster
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
if [ "${PG_ACTION:-start}" = basebackup ]; then
  [ "$PROFILE" != test ] || { echo "[pg] the test cluster keeps no WAL archive: a base backup of it recovers nothing" >&2; exit 1; }
  name="$(date -u +%Y%m%dT%H%M%SZ)"
  as_pg "$PGBIN/pg_basebackup" -h "$DATA" -p "$PGPORT" -U postgres -D "$BASES/$name" -Fp -X stream -c fast
  echo "[pg] base backup in $BASES/$name"
  exit 0
fi
echo "[pg] ready on 127.0.0.1:$PGPORT (data $DATA)"
