# Sourced by the bench scripts: a scratch directory and a service jar started on loopback, both cleaned up on exit.
#   service_workdir                      sets $work (removed on exit, with the service stopped first)
#   service_start HEAP BASE [VAR=value]  starts $jar with -Xmx HEAP and the given environment, log in
#                                        $work/service.log, sets $pid, waits for BASE/health up to
#                                        $service_start_tries x 0.25 s (default 40: 10 s)
service_workdir() {
  work=$(mktemp -d)
  pid=
  trap service_cleanup EXIT
}

service_cleanup() {
  if [[ -n $pid ]]; then kill "$pid" 2>/dev/null || true; wait "$pid" 2>/dev/null || true; fi
  rm -rf "$work"
}

service_start() {
  local heap=$1 base=$2
  shift 2
  env "$@" java -Xmx"$heap" -jar "$jar" > "$work/service.log" 2>&1 &
  pid=$!
  for _ in $(seq 1 "${service_start_tries:-40}"); do
    curl -fsS "$base/health" >/dev/null 2>&1 && return 0
    kill -0 "$pid" 2>/dev/null || { echo "service exited:" >&2; cat "$work/service.log" >&2; exit 1; }
    sleep 0.25
  done
  curl -fsS "$base/health" >/dev/null || { echo "service did not come up on $base" >&2; exit 1; }
}
