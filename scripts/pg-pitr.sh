#!/usr/bin/env bash
# Point-in-time recovery of this machine's PostgreSQL (the demo's cluster; PG_PROFILE=serve for a
# real install's), with PostgreSQL's own tools: WAL archiving (archive_command, set by scripts/pg.sh)
# and base backups (pg_basebackup).
#   npm run db:basebackup                          take a base backup now (keep one a day, say)
#   npm run db:recover -- --to "2026-12-03 11:45:00+00"
#       stop the cluster, keep its data folder aside, restore the newest base backup from before that
#       time and replay the archived WAL up to it, then open the database for writing again.
# Stop the app first and start it again after a recovery. db:backup/db:restore (pg_dump) stay the way
# to move a database to another machine.
set -euo pipefail
source "$(dirname "$0")/lib.sh"
[ -f .env ] && { set -a; source .env; set +a; }
export PGPORT="${BORELINE_PGPORT:-${PGPORT:-54329}}"
export PG_PROFILE="${PG_PROFILE:-demo}"
case "${1:-}" in
  basebackup)
    PG_ACTION=basebackup bash scripts/pg.sh boreline ;;
  recover)
    shift
    to=""
    while [ $# -gt 0 ]; do
      case "$1" in
        --to) to="${2:-}"; shift 2 ;;
        --to=*) to="${1#--to=}"; shift ;;
        *) log "unknown argument $1 (use --to \"<time>\")"; exit 1 ;;
      esac
    done
    [ -n "$to" ] || { log "say to which moment: npm run db:recover -- --to \"2026-12-03 11:45:00+00\""; exit 1; }
    PG_ACTION=recover PG_RECOVER_TO="$to" bash scripts/pg.sh boreline ;;
  *) log "usage: scripts/pg-pitr.sh basebackup | recover --to \"<time>\""; exit 1 ;;
esac
