#!/usr/bin/env bash
# `npm start`: install what is missing, start PostgreSQL and the fakes, migrate, seed the demo,
# build and serve Boreline on http://localhost:$PORT. Safe to run twice and after a killed run.
set -euo pipefail
source "$(dirname "$0")/lib.sh"

if [ ! -f .env ]; then
  log "creating .env from .env.example with a fresh NEXTAUTH_SECRET"
  secret="$(node -e 'console.log(require("crypto").randomBytes(32).toString("base64url"))')"
  sed "s|^NEXTAUTH_SECRET=.*|NEXTAUTH_SECRET=$secret|" .env.example >.env
fi
set -a; source .env; set +a
export NEXT_TELEMETRY_DISABLED=1 BORELINE_DEV_TOOLS=1

ensure_node_modules
bash scripts/pg.sh boreline
log "migrating and seeding the demo"
npx sequelize-cli db:migrate >/dev/null
npx sequelize-cli db:seed:all >/dev/null
node_modules/.bin/tsx scripts/seed-demo-inspections.ts

start_fakes .data/run/fakes.pid .data/run/fakes.log
trap 'stop_pidfile .data/run/fakes.pid' EXIT

log "building the app"
env -u DATABASE_URL npx next build >.data/run/build.log 2>&1 || { cat .data/run/build.log; exit 1; }

free_port "$PORT"
cat <<MSG

  Boreline is starting on $NEXTAUTH_URL

  Demo sign-ins (password for all: tarnwater-demo)
    organiser         organiser@tarnwater.example
    chief scrutineer  chief@tarnwater.example
    scrutineer        scrutineer@tarnwater.example
    steward           steward@tarnwater.example
    entrant           entrant@tarnwater.example
    site admin        admin@boreline.example

  E-mail goes to the local fake: ${NEXTAUTH_URL}/dev/outbox
  Stop with Ctrl-C.

MSG
npx next start -p "$PORT"
