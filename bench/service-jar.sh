# Sourced by the bench scripts: a scratch directory and a service jar started on loopback, both cleaned up on exit.
#   service_workdir                      sets $work (removed on exit, with the service stopped first)
#   service_start HEAP BASE [VAR=value]  starts $jar with -Xmx HEAP (and $SERVICE_JAVA_OPTS) and the given environment, log in
#                                        $work/service.log, sets $pid, waits for BASE/health up to
#                                        $service_start_tries x 0.25 s (default 40: 10 s)
#   service_stop                         stops the process started last ($pid) and waits for it to end
#   echo_floor_start HEAP BASE PORT RESPONSE...
#                                        starts the echo floor of bench/e2e.sh (com.loopwright.bench.EchoFloor in
#                                        $bench_jar, default bench/target/loopwright-bench.jar) on 127.0.0.1:PORT
#                                        with -Xmx HEAP, answering POST /v1/designs with the RESPONSE files in turn;
#                                        log in $work/echo.log, sets $pid, waits for BASE/health like service_start
service_workdir() {
  work=$(mktemp -d)
  pid=
  trap service_cleanup EXIT
}

service_cleanup() {
  service_stop
  rm -rf "$work"
}

service_stop() {
  if [[ -n $pid ]]; then kill "$pid" 2>/dev/null || true; wait "$pid" 2>/dev/null || true; fi
  pid=
}

service_start() {
  local heap=$1 base=$2
  shift 2
  # shellcheck disable=SC2086 # SERVICE_JAVA_OPTS is a list of JVM options
  env "$@" java -Xmx"$heap" ${SERVICE_JAVA_OPTS:-} -jar "$jar" > "$work/service.log" 2>&1 &
  pid=$!
  service_wait "$base" "$work/service.log"
}

echo_floor_start() {
  local heap=$1 base=$2 port=$3
  shift 3
  # shellcheck disable=SC2086 # SERVICE_JAVA_OPTS is a list of JVM options
  java -Xmx"$heap" ${SERVICE_JAVA_OPTS:-} -cp "${bench_jar:-bench/target/loopwright-bench.jar}" com.loopwright.bench.EchoFloor "$port" "$@" \
    > "$work/echo.log" 2>&1 &
  pid=$!
  service_wait "$base" "$work/echo.log"
}

service_wait() { # BASE LOG: waits for BASE/health while the process $pid lives
  local base=$1 log=$2
  for _ in $(seq 1 "${service_start_tries:-40}"); do
    curl -fsS "$base/health" >/dev/null 2>&1 && return 0
    kill -0 "$pid" 2>/dev/null || { echo "process exited:" >&2; cat "$log" >&2; exit 1; }
    sleep 0.25
  done
  curl -fsS "$base/health" >/dev/null || { echo "nothing came up on $base" >&2; exit 1; }
}
