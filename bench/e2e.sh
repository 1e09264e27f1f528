#!/usr/bin/env bash
# End-to-end throughput of the packaged service, on loopback only, bounded in time and request count.
#
# Starts service/target/loopwright.jar (built if missing) with a fixed heap, drives GET /health (the HTTP floor),
# POST /v1/designs and POST /v1/designs/batch with wrk, and prints ratios measured in this one run:
#   design throughput / health throughput, batch designs per second, p99 latency, resident memory after the run,
#   and the CPU time the service process spent per request (and per design), from /proc/PID/stat, so that runs on
#   a shared machine can be compared by cost rather than by wall-clock rate.
# The design requests cycle through a small fixed set of our own scenarios (SCENARIOS below), and the batch repeats
# that set, so that no answer could be served from a cache of one body.
#
# Settings (environment):
#   LOOPWRIGHT_PORT  port for the service (default 18180)
#   E2E_SECONDS      seconds per wrk run, 1-60 (default 10)
#   E2E_WARMUP_SECONDS  seconds of unmeasured load on each of /v1/designs, the batch and /health first, 1-60
#                    (default 10):
#                    the JIT compiles the service for about 15 s of load, and a measurement taken during that
#                    time says more about the compiler than about the service
#   E2E_THREADS      wrk threads (default 2), E2E_CONNECTIONS open connections (default 16, at most 256)
#   E2E_BATCH_ITEMS  designs per batch request, 1-1000 (default 100)
#   E2E_HEAP         -Xmx of the service (default 256m: the heap target)
#   E2E_BUILD=1      rebuild the jar first; E2E_JAR another jar to measure (default service/target/loopwright.jar)
# Needs JDK 17, curl and wrk (the Debian package wrk; installed with apt-get if missing and possible).
set -euo pipefail
cd "$(dirname "$0")/.."

port=${LOOPWRIGHT_PORT:-18180}
seconds=${E2E_SECONDS:-10}
warmup_seconds=${E2E_WARMUP_SECONDS:-10}
threads=${E2E_THREADS:-2}
connections=${E2E_CONNECTIONS:-16}
batch_items=${E2E_BATCH_ITEMS:-100}
heap=${E2E_HEAP:-256m}
base="http://127.0.0.1:$port"

# Bounds: every run is time-boxed, and the whole script cannot run away.
(( seconds >= 1 && seconds <= 60 )) || { echo "E2E_SECONDS must be 1-60" >&2; exit 2; }
(( warmup_seconds >= 1 && warmup_seconds <= 60 )) || { echo "E2E_WARMUP_SECONDS must be 1-60" >&2; exit 2; }
(( connections >= 1 && connections <= 256 )) || { echo "E2E_CONNECTIONS must be 1-256" >&2; exit 2; }
(( threads >= 1 && threads <= connections )) || { echo "E2E_THREADS must be 1-E2E_CONNECTIONS" >&2; exit 2; }
(( batch_items >= 1 && batch_items <= 1000 )) || { echo "E2E_BATCH_ITEMS must be 1-1000" >&2; exit 2; }

if ! command -v wrk >/dev/null 2>&1; then
  echo "wrk not found; installing the Debian package" >&2
  (apt-get install -y -qq wrk || (apt-get update -qq && apt-get install -y -qq wrk)) >/dev/null 2>&1 \
    || { echo "could not install wrk; install it (apt-get install wrk) and rerun" >&2; exit 2; }
fi
command -v curl >/dev/null 2>&1 || { echo "curl is required" >&2; exit 2; }

jar=${E2E_JAR:-service/target/loopwright.jar}
if [[ ! -f $jar || ${E2E_BUILD:-0} == 1 ]]; then
  mvn -B -q package -DskipTests -pl service -am
fi

source "$(dirname "$0")/service-jar.sh"
service_workdir

# Our own scenarios: the README's packaging-line indexing axis (and a slower and a rise-time variant of it), the
# README batch's conveyor, a tank-level loop and a camera gimbal axis. Single designs cycle through them; the batch
# repeats them in turn up to batch_items items. Every one must design and certify (checked below).
SCENARIOS=(
  '{"plant":{"a0":0,"a1":0.48,"b":400,"d":400},"spec":{"settlingTime":0.15,"overshootPercent":1.5}}'
  '{"plant":{"a0":0,"a1":0.48,"b":400,"d":400},"spec":{"settlingTime":0.2,"overshootPercent":1}}'
  '{"plant":{"a0":0,"a1":0.48,"b":400,"d":400},"spec":{"riseTime":0.1,"overshootPercent":2}}'
  '{"plant":{"a0":0,"a1":2,"b":150,"d":60},"spec":{"settlingTime":0.3,"overshootPercent":1}}'
  '{"plant":{"a0":0.05,"a1":0.4,"b":0.8,"d":0.5},"spec":{"settlingTime":4,"overshootPercent":2}}'
  '{"plant":{"a0":0,"a1":8,"b":2500,"d":900},"spec":{"settlingTime":0.05,"overshootPercent":4}}'
)
design=${SCENARIOS[0]}
batch=$(printf '{"items":['; for ((i = 0; i < batch_items; i++)); do
  (( i > 0 )) && printf ','; printf '%s' "${SCENARIOS[i % ${#SCENARIOS[@]}]}"; done; printf ']}')
printf '%s' "$design" > "$work/design.json"
printf '%s' "$batch" > "$work/batch.json"

# wrk scripts: the request, and a machine-readable summary (requests/s, p99 in ms, non-2xx and socket errors).
summary='
done = function(summary, latency, requests)
  local seconds = summary.duration / 1e6
  local e = summary.errors
  io.write(string.format("RESULT rps=%.1f p50_ms=%.3f p99_ms=%.3f requests=%d non2xx=%d socket_errors=%d\n",
    summary.requests / seconds, latency:percentile(50) / 1000, latency:percentile(99) / 1000, summary.requests,
    e.status, e.connect + e.read + e.write + e.timeout))
end'
lua_string() { python3 -c 'import json,sys; print(json.dumps(open(sys.argv[1]).read()))' "$1"; }
printf '%s\n' "$summary" > "$work/get.lua"
cat > "$work/batch.lua" <<LUA
wrk.method = "POST"
wrk.headers["Content-Type"] = "application/json"
wrk.body = $(lua_string "$work/batch.json")
$summary
LUA
# Single designs: every scenario's request is formatted once per wrk thread, then sent in turn.
{
  echo 'local bodies = {'
  for body in "${SCENARIOS[@]}"; do printf '%s' "$body" > "$work/one.json"; echo "  $(lua_string "$work/one.json"),"; done
  echo '}'
  cat <<'LUA'
local requests = {}
local next_request = 0
init = function(args)
  for i, body in ipairs(bodies) do
    requests[i] = wrk.format("POST", nil, {["Content-Type"] = "application/json"}, body)
  end
end
request = function()
  next_request = next_request % #requests + 1
  return requests[next_request]
end
LUA
  printf '%s\n' "$summary"
} > "$work/design.lua"

service_start_tries=120 service_start "$heap" "$base" LOOPWRIGHT_PORT="$port"

# Correctness before speed: every scenario answers 200 with a certified design.
for body in "${SCENARIOS[@]}"; do
  curl -fsS -H 'Content-Type: application/json' --data-binary "$body" "$base/v1/designs" \
    | grep -q '"certified":true' || { echo "POST /v1/designs did not return a certified design for $body" >&2; exit 1; }
done

batch_status=$(curl -sS -o "$work/batch.out" -w '%{http_code}' -H 'Content-Type: application/json' \
  --data-binary @"$work/batch.json" "$base/v1/designs/batch")
batch_available=0
if [[ $batch_status == 200 ]]; then
  lines=$(grep -c '"status":200' "$work/batch.out" || true)
  if [[ $lines != "$batch_items" ]]; then
    echo "POST /v1/designs/batch: expected $batch_items lines with status 200, got $lines" >&2; exit 1
  fi
  batch_available=1
elif [[ $batch_status == 404 || $batch_status == 405 ]]; then
  echo "note: POST /v1/designs/batch is not in this build (HTTP $batch_status); batch is not measured"
else
  echo "POST /v1/designs/batch answered HTTP $batch_status:" >&2; head -c 500 "$work/batch.out" >&2; exit 1
fi

ticks_per_second=$(getconf CLK_TCK)
cpu_ticks() { # user + system CPU of the service process so far, in clock ticks (fields 14 and 15 of stat)
  awk '{ sub(/^.*\) /, ""); print $12 + $13 }' "/proc/$pid/stat"
}
run() { # name, path, script [, seconds] -> prints the RESULT line with the service's CPU microseconds per request
  local before after result requests
  before=$(cpu_ticks)
  result=$(wrk -t"$threads" -c"$connections" -d"${4:-$seconds}s" --timeout 10s -s "$work/$3" "$base$2" | grep '^RESULT' \
    | sed "s/^RESULT/$1/")
  after=$(cpu_ticks)
  requests=$(sed -n 's/.*requests=\([0-9]*\).*/\1/p' <<< "$result")
  awk -v r="$result" -v t=$((after - before)) -v hz="$ticks_per_second" -v n="$requests" \
    'BEGIN { printf "%s service_cpu_s=%.2f cpu_us_per_request=%.1f\n", r, t / hz, (n > 0 ? 1e6 * t / hz / n : 0) }'
}
field() { sed -n "s/.*$2=\([0-9.]*\).*/\1/p" <<< "$1"; }

echo "load before: $(uptime)"
echo "wrk: $threads threads, $connections connections, ${seconds}s per run after ${warmup_seconds}s of warm-up on each path; service heap -Xmx$heap; $(nproc) cores"
run warmup /v1/designs design.lua "$warmup_seconds" > /dev/null
if (( batch_available )); then
  run warmup /v1/designs/batch batch.lua "$warmup_seconds" > /dev/null
fi
run warmup /health get.lua "$warmup_seconds" > /dev/null
health=$(run health /health get.lua); echo "$health"
single=$(run design /v1/designs design.lua); echo "$single"
if (( batch_available )); then
  batched=$(run batch /v1/designs/batch batch.lua); echo "$batched"
fi
echo "load after: $(uptime)"

rss_kib=$(awk '/^VmRSS:/ {print $2}' "/proc/$pid/status")
# Heap in use: G1 reports one "garbage-first heap" line, Serial/Parallel one line per generation (Metaspace is not heap).
heap_used=$(jcmd "$pid" GC.heap_info 2>/dev/null \
  | awk '/generation|garbage-first heap/ { for (i = 1; i < NF; i++) if ($i == "used") { v = $(i + 1); sub(/K.*/, "", v); s += v } }
         END { if (s > 0) print s }' || true)

for r in "$health" "$single" ${batched:+"$batched"}; do
  if [[ $(field "$r" non2xx) != 0 || $(field "$r" socket_errors) != 0 ]]; then
    echo "errors during the run: $r" >&2; exit 1
  fi
done

awk -v h="$(field "$health" rps)" -v d="$(field "$single" rps)" -v p99="$(field "$single" p99_ms)" \
    -v b="${batched:+$(field "$batched" rps)}" -v bp99="${batched:+$(field "$batched" p99_ms)}" \
    -v hc="$(field "$health" cpu_us_per_request)" -v dc="$(field "$single" cpu_us_per_request)" \
    -v bc="${batched:+$(field "$batched" cpu_us_per_request)}" \
    -v items="$batch_items" -v rss="$rss_kib" -v used="${heap_used:-}" 'BEGIN {
  printf "design throughput / HTTP floor: %.0f / %.0f req/s = %.1f%% (target >= 70%%)\n", d, h, 100 * d / h
  printf "design p99 latency: %.2f ms\n", p99
  printf "service CPU per request: health %.1f us, design %.1f us\n", hc, dc
  if (b != "") {
    printf "batch: %.0f designs/s (%d per request, p99 %.2f ms per request; target >= 20000 on 2 cores)\n",
      b * items, items, bp99
    printf "batch service CPU per design: %.1f us\n", bc / items
  } else {
    print "batch: not measured (endpoint absent)"
  }
  printf "resident memory after the run (VmRSS): %.1f MiB\n", rss / 1024
  if (used != "") printf "heap in use after the run: %.1f MiB of a -Xmx cap the run never exceeded (target < 256 MiB)\n", used / 1024
}'
