#!/usr/bin/env bash
# The performance floors of issue 21 in one run, on loopback only, every step bounded in time and count:
#   1. the reference script (bench/reference/design_reference.py: SciPy Riccati solve + 2,000-point step + metrics
#      of the README design, single-threaded BLAS) and Loopwright's in-process design of the same request with its
#      verification (com.loopwright.bench.InProcessDesigns, one thread): CPU per design on one core, side by side;
#   2. the in-process limit: the six scenarios below computed bytes to bytes on two threads (InProcessDesigns);
#   3. the packaged service (service/target/loopwright.jar, -Xmx256m) under wrk: GET /health, POST /v1/designs at
#      16 and at 64 connections, POST /v1/designs/batch; then the service is stopped and
#   4. the echo floor (com.loopwright.bench.EchoFloor: the service's Javalin/Jetty settings, the same request bodies
#      read, the service's own recorded answers to them written back) under the same wrk load as the designs;
#   5. allocation per design: JMH -prof gc on DesignBenchmark (jsonEncode is the service's request-to-response path);
# and prints every ratio with its target, then the table for docs/benchmarks.md ("target | measured | met?").
# The CPU-only measurements (1, 2, 5) run while no server is up. Each server path is warmed up before it is measured:
# the JIT compiles the service for about 15 s of load, and a measurement taken during that time says more about the
# compiler than about the service. The service's CPU time per request is read from /proc/PID/stat, so runs on a
# shared machine can be compared by cost rather than by wall-clock rate.
#
# Settings (environment):
#   BENCH_SECONDS    short mode: every measured and warm-up time is this many seconds (1-60), JMH one 1 s iteration;
#                    BENCH_SECONDS=2 is a smoke test of the tools (about 1.5 min), not a measurement
#   LOOPWRIGHT_PORT  port for the service and then the echo floor (default 18180)
#   E2E_SECONDS      seconds per measured run, 1-60 (default 10)
#   E2E_WARMUP_SECONDS  seconds of unmeasured load first on each path (and of in-process warm-up), 1-60 (default 10)
#   E2E_THREADS      wrk threads (default 2), E2E_CONNECTIONS open connections (default 16, at most 256),
#   E2E_HIGH_CONNECTIONS  connections of the no-error run of POST /v1/designs (default 64, at most 256)
#   E2E_BATCH_ITEMS  designs per batch request, 1-1000 (default 100)
#   E2E_HEAP         -Xmx of the service, the echo floor and the in-process runs (default 256m: the heap target)
#   E2E_BUILD=1      rebuild the jars first; E2E_JAR another service jar to measure (default service/target/loopwright.jar)
#   E2E_JMH=0        skip the allocation measurement
# Needs JDK 17, curl, wrk (Debian package wrk) and python3 with SciPy (Debian package python3-scipy); the packages
# are installed with apt-get when missing and possible, and without SciPy the script comparison is skipped.
set -euo pipefail
cd "$(dirname "$0")/.."

port=${LOOPWRIGHT_PORT:-18180}
seconds=${E2E_SECONDS:-10}
warmup_seconds=${E2E_WARMUP_SECONDS:-10}
jmh_settings=(-f 1 -wi 3 -i 5 -w 1s -r 1s)
if [[ -n ${BENCH_SECONDS:-} ]]; then
  seconds=$BENCH_SECONDS
  warmup_seconds=$BENCH_SECONDS
  jmh_settings=(-f 1 -wi 1 -i 1 -w 1s -r 1s)
fi
threads=${E2E_THREADS:-2}
connections=${E2E_CONNECTIONS:-16}
high_connections=${E2E_HIGH_CONNECTIONS:-64}
batch_items=${E2E_BATCH_ITEMS:-100}
heap=${E2E_HEAP:-256m}
base="http://127.0.0.1:$port"

# Bounds: every run is time-boxed, and the whole script cannot run away.
(( seconds >= 1 && seconds <= 60 )) || { echo "E2E_SECONDS (BENCH_SECONDS) must be 1-60" >&2; exit 2; }
(( warmup_seconds >= 1 && warmup_seconds <= 60 )) || { echo "E2E_WARMUP_SECONDS must be 1-60" >&2; exit 2; }
(( connections >= 1 && connections <= 256 )) || { echo "E2E_CONNECTIONS must be 1-256" >&2; exit 2; }
(( high_connections >= 1 && high_connections <= 256 )) || { echo "E2E_HIGH_CONNECTIONS must be 1-256" >&2; exit 2; }
(( threads >= 1 && threads <= connections && threads <= high_connections )) \
  || { echo "E2E_THREADS must be 1-E2E_CONNECTIONS" >&2; exit 2; }
(( batch_items >= 1 && batch_items <= 1000 )) || { echo "E2E_BATCH_ITEMS must be 1-1000" >&2; exit 2; }

apt_install() { # PACKAGE: installs a Debian package when running as root with apt-get, else fails
  [[ $(id -u) == 0 ]] && command -v apt-get >/dev/null 2>&1 || return 1
  (apt-get install -y -qq "$1" || (apt-get update -qq && apt-get install -y -qq "$1")) >/dev/null 2>&1
}
if ! command -v wrk >/dev/null 2>&1; then
  echo "wrk not found; installing the Debian package" >&2
  apt_install wrk || { echo "could not install wrk; install it (apt-get install wrk) and rerun" >&2; exit 2; }
fi
command -v curl >/dev/null 2>&1 || { echo "curl is required" >&2; exit 2; }
reference=1
if ! python3 -c 'import scipy' >/dev/null 2>&1; then
  echo "SciPy not found; installing the Debian package python3-scipy" >&2
  if ! apt_install python3-scipy; then
    echo "SKIPPED: the reference script comparison (no SciPy: apt-get install python3-scipy as root, or" \
      "pip install scipy, and rerun)" >&2
    reference=0
  fi
fi

jar=${E2E_JAR:-service/target/loopwright.jar}
bench_jar=bench/target/loopwright-bench.jar
if [[ ! -f $jar || ${E2E_BUILD:-0} == 1 ]]; then
  mvn -B -q package -DskipTests -pl service -am
fi
if [[ ! -f $bench_jar || ${E2E_BUILD:-0} == 1 ]]; then
  mvn -B -q package -DskipTests -pl bench -am
fi

source "$(dirname "$0")/service-jar.sh"
service_workdir

# Our own scenarios, one request per line, shared with InProcessDesigns: the README's packaging-line indexing axis
# (and a slower and a rise-time variant of it), the README batch's conveyor, a tank-level loop and a camera gimbal
# axis. Single designs cycle through them; the batch repeats them in turn up to batch_items items. Every one must
# design and certify (checked below).
mapfile -t SCENARIOS < <(grep -v '^[[:space:]]*$' bench/src/main/resources/e2e-scenarios.ndjson)
batch=$(printf '{"items":['; for ((i = 0; i < batch_items; i++)); do
  (( i > 0 )) && printf ','; printf '%s' "${SCENARIOS[i % ${#SCENARIOS[@]}]}"; done; printf ']}')
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
# Single designs (and the echo floor): every scenario's request is formatted once per wrk thread, then sent in turn.
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

field() { sed -n "s/.*$2=\([0-9.]*\).*/\1/p" <<< "$1"; }

# Every JVM of the run (service, echo floor, in-process baseline) gets the collector the container runs: the JVM picks
# the serial collector by itself at the deployment's 2 CPUs and 768 MiB (below its server-class 1792 MB), and the
# Dockerfile names it; on this 24 GiB machine it would pick G1 instead (about 15 % fewer designs/s, measured).
export SERVICE_JAVA_OPTS=${SERVICE_JAVA_OPTS--XX:+UseSerialGC}
echo "load before: $(uptime)"
echo "$(nproc) cores; measured ${seconds}s after ${warmup_seconds}s of warm-up per path; heap -Xmx$heap; JVM options: ${SERVICE_JAVA_OPTS:-none}"

# 1. One core: the reference script and Loopwright's in-process design of the same README request.
script=
if (( reference )); then
  script=$(OPENBLAS_NUM_THREADS=1 REFERENCE_WARMUP_SECONDS=$(( warmup_seconds < 2 ? warmup_seconds : 2 )) \
    REFERENCE_SECONDS=$seconds timeout $(( 2 * seconds + 60 )) python3 bench/reference/design_reference.py)
  grep -v '^RESULT' <<< "$script"
  script=$(grep '^RESULT' <<< "$script" | sed 's/^RESULT/script/')
  echo "$script"
fi
in_process() { # THREADS SCENARIOS NAME
  # shellcheck disable=SC2086 # SERVICE_JAVA_OPTS is a list of JVM options
  java -Xmx"$heap" $SERVICE_JAVA_OPTS -cp "$bench_jar" com.loopwright.bench.InProcessDesigns "$1" "$warmup_seconds" "$seconds" "$2" \
    | grep '^RESULT' | sed "s/^RESULT/$3/"
}
one_core=$(in_process 1 readme in_process_one_core); echo "$one_core"
# 2. The in-process limit of the batch: the six scenarios on two threads (and on one, for comparison: batches share
# ceil(workers/2) design workers, ComputePool.batchShare, one on two cores; short items such as these six designs may
# also borrow a worker that is idle while no request waits, so a lone batch can use both).
two_threads=$(in_process 2 all in_process_two_threads); echo "$two_threads"
one_thread=$(in_process 1 all in_process_one_thread); echo "$one_thread"

# 5 (before any server). Allocation per design.
alloc_encode= alloc_solver=
if [[ ${E2E_JMH:-1} == 1 ]]; then
  java -jar "$bench_jar" 'com\.loopwright\.bench\.DesignBenchmark\.' "${jmh_settings[@]}" -prof gc -rf csv -rff "$work/jmh.csv" > "$work/jmh.log" 2>&1 \
    || { echo "JMH failed:" >&2; tail -20 "$work/jmh.log" >&2; exit 1; }
  jmh_score() { # BENCHMARK_METHOD [SECONDARY]: the score of one row of JMH's CSV (primary: us/op; secondary: B/op)
    awk -F, -v name="[.]DesignBenchmark[.]$1${2:+:.*$2}\$" '{ gsub(/"/, "") } $1 ~ name { printf "%.1f", $5 }' \
      "$work/jmh.csv"
  }
  alloc_encode=$(jmh_score jsonEncode gc.alloc.rate.norm); alloc_solver=$(jmh_score solverPipeline gc.alloc.rate.norm)
  echo "jmh DesignBenchmark.jsonEncode $(jmh_score jsonEncode) us/op $alloc_encode B/op;" \
    "solverPipeline $(jmh_score solverPipeline) us/op $alloc_solver B/op"
fi

# 3. The service.
service_start_tries=120 service_start "$heap" "$base" LOOPWRIGHT_PORT="$port"

# Correctness before speed: every scenario answers 200 with a certified design; the answers are kept for the echo
# floor, which writes them back byte for byte.
mkdir "$work/responses"
for i in "${!SCENARIOS[@]}"; do
  curl -fsS -o "$work/responses/$i.json" -H 'Content-Type: application/json' --data-binary "${SCENARIOS[i]}" \
    "$base/v1/designs"
  grep -q '"certified":true' "$work/responses/$i.json" \
    || { echo "POST /v1/designs did not return a certified design for ${SCENARIOS[i]}" >&2; exit 1; }
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
cpu_ticks() { # user + system CPU of the server process so far, in clock ticks (fields 14 and 15 of stat)
  awk '{ sub(/^.*\) /, ""); print $12 + $13 }' "/proc/$pid/stat"
}
run() { # name, path, script [, seconds [, connections]] -> the RESULT line with the server's CPU us per request
  local before after result requests
  before=$(cpu_ticks)
  result=$(wrk -t"$threads" -c"${5:-$connections}" -d"${4:-$seconds}s" --timeout 10s -s "$work/$3" "$base$2" \
    | grep '^RESULT' | sed "s/^RESULT/$1/")
  after=$(cpu_ticks)
  requests=$(sed -n 's/.*requests=\([0-9]*\).*/\1/p' <<< "$result")
  awk -v r="$result" -v t=$((after - before)) -v hz="$ticks_per_second" -v n="$requests" \
    'BEGIN { printf "%s service_cpu_s=%.2f cpu_us_per_request=%.1f\n", r, t / hz, (n > 0 ? 1e6 * t / hz / n : 0) }'
}

echo "wrk: $threads threads, $connections connections (and $high_connections for the no-error run)"
run warmup /v1/designs design.lua "$warmup_seconds" > /dev/null
if (( batch_available )); then
  run warmup /v1/designs/batch batch.lua "$warmup_seconds" > /dev/null
fi
run warmup /health get.lua "$warmup_seconds" > /dev/null
health=$(run health /health get.lua); echo "$health"
single=$(run design /v1/designs design.lua); echo "$single"
crowded=$(run design_at_$high_connections /v1/designs design.lua "$seconds" "$high_connections"); echo "$crowded"
batched=
if (( batch_available )); then
  batched=$(run batch /v1/designs/batch batch.lua); echo "$batched"
  if [[ $(field "$batched" requests) == 0 ]]; then
    echo "note: no batch of $batch_items finished within ${seconds}s; the batch is not measured (raise E2E_SECONDS)"
    batched=
  fi
fi

rss_kib=$(awk '/^VmRSS:/ {print $2}' "/proc/$pid/status")
# Heap in use: G1 reports one "garbage-first heap" line, Serial/Parallel one line per generation (Metaspace is not heap).
heap_used=$(jcmd "$pid" GC.heap_info 2>/dev/null \
  | awk '/generation|garbage-first heap/ { for (i = 1; i < NF; i++) if ($i == "used") { v = $(i + 1); sub(/K.*/, "", v); s += v } }
         END { if (s > 0) print s }' || true)
service_stop

# 4. The echo floor: the same bodies read, the service's own answers written back, the same wrk load.
echo_floor_start "$heap" "$base" "$port" "$work"/responses/*.json
run warmup /v1/designs design.lua "$warmup_seconds" > /dev/null
floor=$(run echo_floor /v1/designs design.lua); echo "$floor"
service_stop
echo "load after: $(uptime)"

for r in "$health" "$single" "$floor" ${batched:+"$batched"}; do
  if [[ $(field "$r" non2xx) != 0 || $(field "$r" socket_errors) != 0 ]]; then
    echo "errors during the run: $r" >&2; exit 1
  fi
done

awk -v h="$(field "$health" rps)" -v d="$(field "$single" rps)" -v e="$(field "$floor" rps)" \
    -v p99="$(field "$single" p99_ms)" -v conns="$connections" -v high="$high_connections" \
    -v c_rps="$(field "$crowded" rps)" -v c_p99="$(field "$crowded" p99_ms)" \
    -v c_non2xx="$(field "$crowded" non2xx)" -v c_errors="$(field "$crowded" socket_errors)" \
    -v b="${batched:+$(field "$batched" rps)}" -v bp99="${batched:+$(field "$batched" p99_ms)}" \
    -v hc="$(field "$health" cpu_us_per_request)" -v dc="$(field "$single" cpu_us_per_request)" \
    -v ec="$(field "$floor" cpu_us_per_request)" -v bc="${batched:+$(field "$batched" cpu_us_per_request)}" \
    -v two="$(field "$two_threads" designs_per_s)" -v two_cpu="$(field "$two_threads" cpu_us_per_design)" \
    -v one="$(field "$one_thread" designs_per_s)" \
    -v one_cpu="$(field "$one_core" cpu_us_per_design)" \
    -v s_cpu="${script:+$(field "$script" cpu_us_per_design)}" \
    -v s_ric="${script:+$(field "$script" riccati_cpu_us)}" -v s_step="${script:+$(field "$script" step_cpu_us)}" \
    -v a_enc="$alloc_encode" -v a_sol="$alloc_solver" \
    -v items="$batch_items" -v rss="$rss_kib" -v used="${heap_used:-}" 'function met(ok) { return ok ? "yes" : "**no**" }
BEGIN {
  print ""
  printf "service CPU per request: echo floor %.1f us, health %.1f us, design %.1f us\n", ec, hc, dc
  printf "design throughput / GET /health (the old floor): %.0f / %.0f req/s = %.1f%%\n", d, h, 100 * d / h
  if (b != "") printf "batch: %.0f designs/s (%d per request, p99 %.2f ms per request), service CPU %.1f us per design\n",
    b * items, items, bp99, bc / items
  printf "in-process: two threads %.0f designs/s (%.1f us CPU per design), one thread %.0f designs/s; one core %.1f us CPU per README design\n",
    two, two_cpu, one, one_cpu
  if (b != "") printf "batch / in-process on one thread (the batch share of the design workers on 2 cores, before borrowing): %.2f x\n",
    b * items / one
  if (s_cpu != "") printf "reference script: %.0f us CPU per design (Riccati %.0f us, step and metrics %.0f us)\n",
    s_cpu, s_ric, s_step
  printf "resident memory after the run (VmRSS): %.1f MiB\n", rss / 1024
  if (used != "") printf "heap in use after the run: %.1f MiB (-Xmx cap never exceeded)\n", used / 1024
  print ""
  print "| target | measured | met? |"
  print "| --- | --- | --- |"
  printf "| POST /v1/designs >= 0.7 x echo floor | %.2f x (%.0f / %.0f req/s, %d connections) | %s |\n",
    d / e, d, e, conns, met(d / e >= 0.7)
  if (b != "") printf "| batch >= 0.8 x in-process on two threads | %.2f x (%.0f / %.0f designs/s) | %s |\n",
    b * items / two, b * items, two, met(b * items / two >= 0.8)
  else print "| batch >= 0.8 x in-process on two threads | not measured (no batch endpoint, or no batch finished) | - |"
  if (s_cpu != "") {
    printf "| in-process design >= 300 x the script, one core | %.0f x (%.0f vs %.1f us CPU per design) | %s |\n",
      s_cpu / one_cpu, s_cpu, one_cpu, met(s_cpu / one_cpu >= 300)
    if (b != "") printf "| batch end to end >= 300 x the script | %.0f x (%.0f vs %.0f designs/s) | %s |\n",
      b * items * s_cpu / 1e6, b * items, 1e6 / s_cpu, met(b * items * s_cpu / 1e6 >= 300)
    else print "| batch end to end >= 300 x the script | not measured (no batch) | - |"
  } else {
    print "| in-process design >= 300 x the script, one core | not measured (no SciPy) | - |"
    print "| batch end to end >= 300 x the script | not measured (no SciPy) | - |"
  }
  printf "| p99 of POST /v1/designs at %d connections <= 3 ms | %.2f ms | %s |\n", conns, p99, met(p99 <= 3)
  printf "| %d connections: no error, no 5xx | %d non-2xx, %d socket errors (%.0f req/s, p99 %.2f ms) | %s |\n",
    high, c_non2xx, c_errors, c_rps, c_p99, met(c_non2xx == 0 && c_errors == 0)
  if (a_enc != "") printf "| allocation per design reported (JMH -prof gc) | %s B per request-to-response design, %s B solver alone | yes |\n",
    a_enc, a_sol
  if (used != "") printf "| heap under -Xmx256m | %.1f MiB in use after the run, VmRSS %.1f MiB | %s |\n",
    used / 1024, rss / 1024, met(used / 1024 < 256)
}'
