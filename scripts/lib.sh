# Shared by scripts/start.sh and scripts/test.sh: installs, background services, waiting.
export NEXT_TELEMETRY_DISABLED=1

ensure_node_modules() {
  # Install when node_modules is missing or older than the lock file.
  if [ ! -d node_modules ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
    echo "Installing dependencies (npm ci)…"
    npm ci --no-audit --no-fund
  fi
}

RUN_DIR=.data/run
LOG_DIR=.data/logs

# start_bg NAME COMMAND… — runs a service in its own process group, logging to .data/logs/NAME.log
start_bg() {
  local name=$1; shift
  mkdir -p "$RUN_DIR" "$LOG_DIR"
  stop_bg "$name"
  setsid "$@" >"$LOG_DIR/$name.log" 2>&1 < /dev/null &
  echo $! >"$RUN_DIR/$name.pid"
}

stop_bg() {
  local pidfile="$RUN_DIR/$1.pid"
  if [ -f "$pidfile" ]; then
    local pid; pid=$(cat "$pidfile")
    kill -TERM -- "-$pid" 2>/dev/null || kill -TERM "$pid" 2>/dev/null || true
    for _ in $(seq 1 50); do kill -0 "$pid" 2>/dev/null || break; sleep 0.1; done
    kill -KILL -- "-$pid" 2>/dev/null || true
    rm -f "$pidfile"
  fi
}

# wait_http URL NAME [SECONDS]
wait_http() {
  local url=$1 name=$2 limit=${3:-60}
  for _ in $(seq 1 $((limit * 4))); do
    if node -e "fetch(process.argv[1]).then(r=>process.exit(r.status<500?0:1),()=>process.exit(1))" "$url" 2>/dev/null; then return 0; fi
    sleep 0.25
  done
  echo "$name did not come up at $url; its log:" >&2
  tail -n 40 "$LOG_DIR/$name.log" >&2 || true
  return 1
}

# wait_port PORT NAME [SECONDS]
wait_port() {
  local port=$1 name=$2 limit=${3:-30}
  for _ in $(seq 1 $((limit * 4))); do
    if node -e "const s=require('net').connect(+process.argv[1],'127.0.0.1');s.on('connect',()=>process.exit(0));s.on('error',()=>process.exit(1))" "$port" 2>/dev/null; then return 0; fi
    sleep 0.25
  done
  echo "$name did not open port $port; its log:" >&2
  tail -n 40 "$LOG_DIR/$name.log" >&2 || true
  return 1
}

# Node with the react-server condition, so modules marked server-only load in scripts.
tsx_server() { node --conditions=react-server --import tsx "$@"; }
