#!/usr/bin/env bash
# `npm run serve`: a real single-machine install (a club's laptop or a small server). No demo data,
# no fakes: hosted e-mail, payments and storage come from .env, which must hold no demo value
# (scripts/serve-config.ts names each one left). PostgreSQL is a durable local cluster (fsync on,
# .data/pg-serve). The first site administrator is created at a prompt on this console.
# Safe to run twice and after a killed run. `npm run serve -- --check` stops after the checks.
set -euo pipefail
source "$(dirname "$0")/lib.sh"

ensure_node_modules
ENV_FILE="${BORELINE_ENV_FILE:-.env}"
node_modules/.bin/tsx scripts/env-secrets.ts
set -a; source "$ENV_FILE"; set +a
export NEXT_TELEMETRY_DISABLED=1 BORELINE_MODE=serve NODE_ENV=production
unset BORELINE_DEV_TOOLS

node_modules/.bin/tsx scripts/serve-config.ts
[ "${1:-}" = --check ] && exit 0

db_name="$(node -e 'console.log(new URL(process.env.DATABASE_URL).pathname.slice(1))')"
PG_DURABLE=1 bash scripts/pg.sh "$db_name"
log "migrating the database (no demo data)"
npx sequelize-cli db:migrate >/dev/null
node_modules/.bin/tsx scripts/create-first-admin.ts

mkdir -p .data/run
log "building the app"
{ env -u DATABASE_URL npx next build && node scripts/compile-hints.mjs && node scripts/build-sw.mjs; } >.data/run/build-serve.log 2>&1 || { cat .data/run/build-serve.log; exit 1; }

log "starting on $NEXTAUTH_URL (stop with Ctrl-C)"
exec node scripts/server.mjs
