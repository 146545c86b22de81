# Shared helpers for scripts/start.sh and scripts/test.sh (sourced, not run).
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
cd "$ROOT"

log() { printf '\033[1m[boreline]\033[0m %s\n' "$*"; }

# Install npm packages when node_modules is missing or older than the lock file.
ensure_node_modules() {
  if [ ! -f node_modules/.package-lock.json ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
    log "installing npm packages (npm ci)"
    npm ci --no-audit --no-fund --loglevel=error
  fi
}

# Kill a process recorded in a pid file (and its group), if it is still running.
stop_pidfile() {
  local f="$1"
  if [ -f "$f" ]; then
    local pid; pid="$(cat "$f")"
    if [ -n "$pid" ] && kill -0 "$pid" 2>/dev/null; then
      kill -- "-$pid" 2>/dev/null || kill "$pid" 2>/dev/null || true
      for _ in $(seq 1 50); do kill -0 "$pid" 2>/dev/null || break; sleep 0.1; done
      kill -9 "$pid" 2>/dev/null || true
    fi
    rm -f "$f"
  fi
}

# Frees a port held by a leftover of THIS checkout (a killed earlier run); a port held by anything
# else (another checkout, another program) is never killed: the run stops and says which port.
free_port() {
  local port="$1" pids pid cwd here mine=() others=()
  here="$(pwd -P)"
  pids="$(ss -ltnpH "sport = :$port" 2>/dev/null | grep -o 'pid=[0-9]*' | cut -d= -f2 | sort -u || true)"
  for pid in $pids; do
    cwd="$(readlink "/proc/$pid/cwd" 2>/dev/null || true)"
    if [ "$cwd" = "$here" ] || [[ "$cwd" == "$here"/* ]]; then mine+=("$pid"); else others+=("$pid"); fi
  done
  if [ "${#others[@]}" -gt 0 ]; then
    log "port $port is taken by another program (pid ${others[*]}: $(tr '\0' ' ' <"/proc/${others[0]}/cmdline" 2>/dev/null | cut -c1-80)); choose another port (PORT=…, BORELINE_PGPORT=…, TEST_PORT=…) or stop that program"
    return 1
  fi
  if [ "${#mine[@]}" -gt 0 ]; then kill "${mine[@]}" 2>/dev/null || true; sleep 0.3; fi
  return 0
}

# Start the fakes of hosted services in their own process group; pid kept in $1.
start_fakes() {
  local pidfile="$1" logfile="$2"
  stop_pidfile "$pidfile"
  local payments_port storage_port
  payments_port="$(node -e 'console.log(new URL(process.env.STRIPE_API_URL).port)')"
  storage_port="$(node -e 'console.log(new URL(process.env.S3_ENDPOINT).port)')"
  free_port "$(node -e 'console.log(new URL(process.env.SMTP_URL).port)')"
  free_port "$MAIL_FAKE_HTTP_PORT"; free_port "$payments_port"; free_port "$storage_port"
  mkdir -p "$(dirname "$pidfile")"
  setsid node_modules/.bin/tsx scripts/fakes/index.ts >"$logfile" 2>&1 9>&- &
  echo $! >"$pidfile"
  for _ in $(seq 1 150); do
    if curl -fsS "http://127.0.0.1:$MAIL_FAKE_HTTP_PORT/health" >/dev/null 2>&1 \
      && curl -fsS "http://127.0.0.1:$payments_port/_fake/health" >/dev/null 2>&1 \
      && curl -fsS "http://127.0.0.1:$storage_port/_fake/health" >/dev/null 2>&1; then return 0; fi
    sleep 0.1
  done
  log "the fakes did not start; see $logfile"; cat "$logfile"; return 1
}

wait_for_http() {
  local url="$1" tries="${2:-300}"
  for _ in $(seq 1 "$tries"); do
    curl -fsS -o /dev/null "$url" 2>/dev/null && return 0
    sleep 0.2
  done
  return 1
}
