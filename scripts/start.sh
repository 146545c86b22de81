#!/usr/bin/env bash
# `npm start`: the demo. Install what is missing, start PostgreSQL and the fakes, migrate, seed the
# invented scenario, build and serve Boreline on http://127.0.0.1:$PORT (loopback only; set
# BORELINE_HOST=0.0.0.0 to reach it from the network, with a warning). Safe to run twice and after
# a killed run. A real install is `npm run serve` (scripts/serve.sh).
set -euo pipefail
source "$(dirname "$0")/lib.sh"

ensure_node_modules
# Every secret is made here, per install, into the ignored .env (none is read from a committed file).
node_modules/.bin/tsx scripts/env-secrets.ts
# What the environment asks for wins over .env (PORT=3321 npm start serves on 3321).
declare -A asked=()
for v in PORT NEXTAUTH_URL BORELINE_HOST SMTP_URL MAIL_FAKE_HTTP_PORT STRIPE_API_URL S3_ENDPOINT; do
  if [ -n "${!v:-}" ]; then asked[$v]="${!v}"; fi
done
set -a; source .env; set +a
for v in "${!asked[@]}"; do export "$v=${asked[$v]}"; done
# The sign-in address follows a port asked for, unless the address was asked for too.
if [ -n "${asked[PORT]:-}" ]; then
  if [ -z "${asked[NEXTAUTH_URL]:-}" ]; then export NEXTAUTH_URL="http://localhost:$PORT"; fi
  export PAYMENTS_WEBHOOK_URL="http://127.0.0.1:$PORT/api/payments/webhook"
fi
# BORELINE_PGPORT chooses this checkout's PostgreSQL port (another checkout may hold 54329); the
# database address follows the port, whatever .env says.
export PGPORT="${BORELINE_PGPORT:-${PGPORT:-54329}}"
DATABASE_URL="$(node -e 'const u = new URL(process.env.DATABASE_URL); u.port = process.env.PGPORT; console.log(u.toString())')"
export DATABASE_URL
export NEXT_TELEMETRY_DISABLED=1 BORELINE_DEV_TOOLS=1 BORELINE_MODE=demo

PG_PROFILE=demo bash scripts/pg.sh boreline
log "migrating and seeding the demo"
npx sequelize-cli db:migrate >/dev/null
npx sequelize-cli db:seed:all >/dev/null
node_modules/.bin/tsx scripts/seed-demo-inspections.ts

start_fakes .data/run/fakes.pid .data/run/fakes.log
trap 'stop_pidfile .data/run/fakes.pid' EXIT

log "building the app"
{ env -u DATABASE_URL npx next build && node scripts/compile-hints.mjs && node scripts/build-sw.mjs; } >.data/run/build.log 2>&1 || { cat .data/run/build.log; exit 1; }

free_port "$PORT"
cat <<MSG

  Boreline (demo) is starting on $NEXTAUTH_URL

  Demo sign-ins (password for all: tarnwater-demo)
    organiser         organiser@tarnwater.example
    chief scrutineer  chief@tarnwater.example
    scrutineer        scrutineer@tarnwater.example
    steward           steward@tarnwater.example
    entrant           entrant@tarnwater.example
    site admin        admin@boreline.example
    appeal body       appeals@boreline.example

  E-mail goes to the local fake; the site admin reads it at ${NEXTAUTH_URL}/dev/outbox
  Stop with Ctrl-C.

MSG
node scripts/server.mjs
