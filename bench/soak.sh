#!/usr/bin/env bash
# Soak test, on loopback only, bounded in count and time (at most 170 s in all, usually under a minute).
#
# Starts service/target/loopwright.jar under -Xmx256m (built if missing), then runs the SoakTest of the service
# module against it: 5 rounds of mixed load, each the golden corpus's open requests replayed 3 times (designs,
# batches, order-n designs, fits, verifications with Monte Carlo, plots, controller exports; 4 requests in flight),
# each round at most 1500 requests and 30 s. It fails when any answer is a 5xx, differs from its recorded status or breaks openapi.yaml,
# or when the resident memory (VmRSS in /proc/PID/status) after round 3 exceeds round 1's by more than 10 %.
# The heap is committed and touched at start (-Xms = -Xmx, -XX:+AlwaysPreTouch): G1 otherwise commits it region by
# region as the load grows (+18 % VmRSS from round 1 to 3 with no leak, +1 % pre-touched), so VmRSS growth measures
# what lives outside the heap (code cache, metaspace, threads, buffers); a heap leak ends in errors under -Xmx.
# Prints each round's requests, seconds, 5xx count and VmRSS.
#
# Settings (environment):
#   LOOPWRIGHT_PORT   port for the service (default 18191)
#   SOAK_HEAP         -Xmx of the service (default 256m)
# Needs JDK 17, Maven (the test runs offline from the built reactor) and curl.
set -euo pipefail
cd "$(dirname "$0")/.."

port=${LOOPWRIGHT_PORT:-18191}
heap=${SOAK_HEAP:-256m}
base="http://127.0.0.1:$port"
command -v curl >/dev/null 2>&1 || { echo "curl is required" >&2; exit 2; }

jar=service/target/loopwright.jar
[[ -f $jar ]] || mvn -B -q package -DskipTests -pl service -am

source "$(dirname "$0")/service-jar.sh"
service_workdir

SERVICE_JAVA_OPTS="-Xms$heap -XX:+AlwaysPreTouch" \
  service_start "$heap" "$base" LOOPWRIGHT_PORT="$port" LOOPWRIGHT_LOG_LEVEL=WARN
echo "soak: service pid $pid, -Xmx$heap, VmRSS at start $(awk '/^VmRSS/ {print $2, $3}' "/proc/$pid/status")"

# The reactor's compiled classes (test-compile is up to date after a build) and the one test; timeout is the
# backstop for the time promise.
status=0
timeout 160 mvn -B -o -q -pl service -am test-compile surefire:test -Dtest=SoakTest \
  -Dsurefire.failIfNoSpecifiedTests=false -Dloopwright.soak.url="$base" -Dloopwright.soak.pid="$pid" \
  -Dspotless.check.skip=true > "$work/soak.out" 2>&1 || status=$?
grep -ho 'soak: .*' "$work/soak.out" service/target/surefire-reports/com.loopwright.service.SoakTest-output.txt \
  2>/dev/null || true
if [[ $status -ne 0 ]]; then
  echo "soak: FAILED (exit $status)" >&2
  grep -E 'FAIL|expected|Error|soak:' "$work/soak.out" | head -40 >&2 || true
  exit 1
fi
kill -0 "$pid" 2>/dev/null || { echo "service died during the soak:" >&2; tail -20 "$work/service.log" >&2; exit 1; }
grep -q 'Tests run: 1, Failures: 0, Errors: 0, Skipped: 0' \
  service/target/surefire-reports/com.loopwright.service.SoakTest.txt \
  || { echo "soak: the soak test did not run" >&2; exit 1; }
echo "soak: 1 passed, 0 failed"
