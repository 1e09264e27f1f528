#!/usr/bin/env bash
# Loopback load test of the packaged service with wrk (Debian package "wrk"): throughput and p50/p99 latency
# of POST /v1/designs (the README's indexing axis) and of the GET /health floor, and their ratio.
# Bounded: DURATION per endpoint (default 10s), at most MAX_REQUESTS responses per wrk thread, 127.0.0.1 only.
#   mvn -B -q package -DskipTests && bench/load.sh
#   DURATION=5s CONNECTIONS=4 THREADS=2 bench/load.sh
set -euo pipefail
cd "$(dirname "$0")/.."

DURATION=${DURATION:-10s}
THREADS=${THREADS:-2}
CONNECTIONS=${CONNECTIONS:-8}
MAX_REQUESTS=${MAX_REQUESTS:-200000}
PORT=${PORT:-18777}
JAR=service/target/loopwright.jar
HOST=127.0.0.1

if ! command -v wrk >/dev/null 2>&1; then
  (apt-get update -qq && apt-get install -y -qq wrk) >/dev/null
fi
if [ ! -f "$JAR" ]; then
  mvn -B -q package -DskipTests
fi

work=$(mktemp -d)
LOOPWRIGHT_PORT=$PORT LOOPWRIGHT_LOG_LEVEL=WARN java -jar "$JAR" > "$work/server.log" 2>&1 &
pid=$!
trap 'kill $pid 2>/dev/null || true; wait $pid 2>/dev/null || true; rm -rf "$work"' EXIT
for _ in $(seq 1 120); do
  curl -fsS "http://$HOST:$PORT/health/ready" >/dev/null 2>&1 && break
  sleep 0.5
done
curl -fsS "http://$HOST:$PORT/health/ready" >/dev/null

cat > "$work/design.json" <<'JSON'
{"plant":{"form":"canonical","a0":0,"a1":0.48,"b":400,"d":400},"spec":{"settlingTime":0.15,"overshootPercent":1.5}}
JSON

# Warm up the JIT on both paths (bounded: 3 s each) before measuring.
MAX_REQUESTS=$MAX_REQUESTS BODY_FILE="$work/design.json" wrk --threads 1 --connections 2 --duration 3s \
  --script bench/wrk/bounded.lua "http://$HOST:$PORT/v1/designs" >/dev/null
MAX_REQUESTS=$MAX_REQUESTS wrk --threads 1 --connections 2 --duration 3s \
  --script bench/wrk/bounded.lua "http://$HOST:$PORT/health" >/dev/null

run() { # key name url [body]
  local key=$1; shift
  local out="$work/$key.txt"
  MAX_REQUESTS=$MAX_REQUESTS BODY_FILE="${3:-}" wrk --threads "$THREADS" --connections "$CONNECTIONS" \
    --duration "$DURATION" --timeout 10s --latency --script bench/wrk/bounded.lua "$2" > "$out"
  local rps p50 p99 non200
  rps=$(awk '/^Requests\/sec:/ {print $2}' "$out")
  p50=$(awk '$1 == "50%" {print $2}' "$out")
  p99=$(awk '$1 == "99%" {print $2}' "$out")
  non200=$(awk '/^non200/ {print $2}' "$out")
  printf '%-16s %12s req/s   p50 %10s   p99 %10s   non-200 %s\n' "$1" "$rps" "$p50" "$p99" "${non200:-0}"
  echo "$rps" > "$work/$key.rps"
  echo "$p50" > "$work/$key.p50"
}

ms() { # wrk latency (e.g. 1.23ms, 850.00us, 1.02s) in milliseconds
  awk -v v="$1" 'BEGIN { n = v + 0; if (v ~ /us$/) n /= 1000; else if (v ~ /ms$/) n *= 1; else if (v ~ /s$/) n *= 1000; print n }'
}

echo "wrk: $THREADS threads, $CONNECTIONS connections, $DURATION per endpoint, loopback port $PORT, $(nproc) CPUs"
run designs "POST /v1/designs" "http://$HOST:$PORT/v1/designs" "$work/design.json"
run health "GET /health" "http://$HOST:$PORT/health"
design_rps=$(cat "$work/designs.rps"); health_rps=$(cat "$work/health.rps")
design_p50=$(ms "$(cat "$work/designs.p50")"); health_p50=$(ms "$(cat "$work/health.p50")")
awk -v d="$design_rps" -v h="$health_rps" -v dl="$design_p50" -v hl="$health_p50" 'BEGIN {
  printf "ratio            health/designs throughput %.1f x, designs/health p50 latency %.1f x\n", h / d, dl / hl }'
