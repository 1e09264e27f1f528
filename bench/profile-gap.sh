#!/usr/bin/env bash
# Where POST /v1/designs spends the CPU the echo floor does not: the packaged service and then the echo floor
# (bench/e2e.sh's floor, answering the service's own recorded answers), each under the same wrk load of the six
# e2e scenarios, each with a JFR recording (jcmd JFR.start/JFR.stop) of the measured part only; prints both CPU profiles by area and by method
# (bench/jfr_top.py) and each process's CPU per request. Loopback only; bounded: PROFILE_WARMUP_SECONDS (default 10)
# of unrecorded load, then PROFILE_SECONDS (default 10, at most 60) recorded, per server.
#   bench/profile-gap.sh                 PROFILE_SECONDS=5 PROFILE_WARMUP_SECONDS=5 bench/profile-gap.sh
set -euo pipefail
cd "$(dirname "$0")/.."

port=${LOOPWRIGHT_PORT:-18181}
seconds=${PROFILE_SECONDS:-10}
warmup_seconds=${PROFILE_WARMUP_SECONDS:-10}
connections=${PROFILE_CONNECTIONS:-16}
heap=256m
base="http://127.0.0.1:$port"
(( seconds >= 1 && seconds <= 60 && warmup_seconds >= 1 && warmup_seconds <= 60 )) \
  || { echo "PROFILE_SECONDS and PROFILE_WARMUP_SECONDS must be 1-60" >&2; exit 2; }
(( connections >= 2 && connections <= 256 )) || { echo "PROFILE_CONNECTIONS must be 2-256" >&2; exit 2; }
jar=service/target/loopwright.jar
bench_jar=bench/target/loopwright-bench.jar
[[ -f $jar ]] || mvn -B -q package -DskipTests -pl service -am
[[ -f $bench_jar ]] || mvn -B -q package -DskipTests -pl bench -am
command -v wrk >/dev/null 2>&1 || { echo "wrk is required (apt-get install wrk)" >&2; exit 2; }

source "$(dirname "$0")/service-jar.sh"
service_workdir
mapfile -t SCENARIOS < <(grep -v '^[[:space:]]*$' bench/src/main/resources/e2e-scenarios.ndjson)
lua_string() { python3 -c 'import json,sys; print(json.dumps(sys.argv[1]))' "$1"; }
{
  echo 'local bodies = {'
  for body in "${SCENARIOS[@]}"; do echo "  $(lua_string "$body"),"; done
  cat <<'LUA'
}
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
} > "$work/design.lua"

# JFR's profile settings with a CPU sample every millisecond per running Java thread (instead of 10 ms: a short run
# on a shared machine gets few time slices) and each thread's CPU load every second.
java_home=$(dirname "$(dirname "$(readlink -f "$(command -v java)")")")
sed -e '/"jdk.ExecutionSample"/,/<\/event>/ s/<setting name="period"[^>]*>[^<]*</<setting name="period">1 ms</' \
    -e '/"jdk.ThreadCPULoad"/,/<\/event>/ s/<setting name="period">[^<]*</<setting name="period">1 s</' \
    "$java_home/lib/jfr/profile.jfc" > "$work/cpu.jfc"
profile() { # NAME: load the server at $pid, then summarise its recording
  local before after requests
  wrk -t2 -c"$connections" -d"${warmup_seconds}s" -s "$work/design.lua" "$base/v1/designs" > /dev/null
  # JFR records the measured load only.
  jcmd "$pid" JFR.start name=gap settings="$work/cpu.jfc" filename="$work/$1.jfr" > /dev/null
  before=$(awk '{ sub(/^.*\) /, ""); print $12 + $13 }' "/proc/$pid/stat")
  requests=$(wrk -t2 -c"$connections" -d"${seconds}s" -s "$work/design.lua" "$base/v1/designs" \
    | awk '/requests in/ { print $1 }')
  after=$(awk '{ sub(/^.*\) /, ""); print $12 + $13 }' "/proc/$pid/stat")
  jcmd "$pid" JFR.stop name=gap > /dev/null
  echo "== $1: $requests requests in ${seconds}s, $(awk -v t=$((after - before)) -v hz="$(getconf CLK_TCK)" -v n="$requests" \
    'BEGIN { printf "%.1f us CPU per request", 1e6 * t / hz / n }')"
  python3 bench/jfr_top.py "$work/$1.jfr" "${PROFILE_TOP:-20}"
}

echo "load before: $(uptime)"
service_start_tries=120 service_start "$heap" "$base" LOOPWRIGHT_PORT="$port"
mkdir "$work/responses"
for i in "${!SCENARIOS[@]}"; do
  curl -fsS -o "$work/responses/$i.json" -H 'Content-Type: application/json' --data-binary "${SCENARIOS[i]}" "$base/v1/designs"
done
profile service
service_stop
echo_floor_start "$heap" "$base" "$port" "$work"/responses/*.json
profile echo_floor
service_stop
echo "load after: $(uptime)"
