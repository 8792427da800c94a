#!/usr/bin/env bash
# Starts or stops every local stand-in of a hosted service (standins/<name>/main.ts) on 127.0.0.1.
# A stand-in signals it is ready by creating $LOADLINE_RUN_DIR/standins/<name>.ready; each takes its ports from the environment.
# Usage: standins.sh start|stop
set -euo pipefail
root=$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)
cd "$root"
run_dir=${LOADLINE_RUN_DIR:-$root/.run}/standins
mkdir -p "$run_dir"
export LOADLINE_RUN_DIR=${LOADLINE_RUN_DIR:-$root/.run}

names() { for d in standins/*/; do [ -f "$d/main.ts" ] && basename "$d"; done; return 0; }

stop_one() {
  local pid_file="$run_dir/$1.pid"
  if [ -f "$pid_file" ]; then
    local pid; pid=$(cat "$pid_file")
    # The pid is that of the stand-in's own process group (npx, tsx and node): signal them all, or node outlives npx.
    kill -TERM -- "-$pid" 2>/dev/null || kill -TERM "$pid" 2>/dev/null || true
    for _ in $(seq 1 50); do kill -0 -- "-$pid" 2>/dev/null || break; sleep 0.1; done
    kill -KILL -- "-$pid" 2>/dev/null || true
    rm -f "$pid_file"
  fi
  rm -f "$run_dir/$1.ready"
}

start_one() {
  local name=$1
  stop_one "$name"
  # Job control gives the stand-in a process group of its own, led by the pid written below.
  set -m
  npx tsx --tsconfig tsconfig.server.json "standins/$name/main.ts" >"$run_dir/$name.log" 2>&1 &
  echo $! >"$run_dir/$name.pid"
  set +m
  for _ in $(seq 1 300); do
    [ -f "$run_dir/$name.ready" ] && { echo "loadline: stand-in $name is up"; return 0; }
    kill -0 "$(cat "$run_dir/$name.pid")" 2>/dev/null || break
    sleep 0.1
  done
  echo "loadline: stand-in $name did not start; its log:" >&2
  cat "$run_dir/$name.log" >&2
  return 1
}

case "${1:-}" in
  start) for n in $(names); do start_one "$n"; done ;;
  stop) for n in $(names); do stop_one "$n"; done ;;
  *) echo "usage: standins.sh start|stop" >&2; exit 2 ;;
esac
