#!/usr/bin/env bash
# Fairness under load, on loopback only, bounded in time (at most 60 s in all).
#
# Starts service/target/loopwright.jar (built if missing), then runs bench/fairness/FairnessLoad.java: one client
# sends the most expensive batches the compute budget allows (24 items of 2000 Monte Carlo samples each, 48864 of
# the 50000 work units a request may cost) back to back, while another sends single designs one at a time. Prints
# the single designs' p50 and p99 without and with the batches, the batches' line statuses, and exits non-zero when
# the loaded p99 is not under FAIRNESS_FACTOR times the unloaded p99 or any single design gets a 5xx.
#
# Settings (environment):
#   LOOPWRIGHT_PORT        port for the service (default 18190)
#   FAIRNESS_WARMUP_SECONDS, FAIRNESS_UNLOADED_SECONDS, FAIRNESS_LOADED_SECONDS  phases, 1-20 s each
#                          (defaults 4, 6, 15)
#   FAIRNESS_FACTOR        allowed p99 ratio (default 10)
#   FAIRNESS_HEAP          -Xmx of the service (default 256m)
# Needs JDK 17 and curl.
set -euo pipefail
cd "$(dirname "$0")/.."

port=${LOOPWRIGHT_PORT:-18190}
warmup=${FAIRNESS_WARMUP_SECONDS:-4}
unloaded=${FAIRNESS_UNLOADED_SECONDS:-6}
loaded=${FAIRNESS_LOADED_SECONDS:-15}
factor=${FAIRNESS_FACTOR:-10}
heap=${FAIRNESS_HEAP:-256m}
base="http://127.0.0.1:$port"
for phase in "$warmup" "$unloaded" "$loaded"; do
  (( phase >= 1 && phase <= 20 )) || { echo "each FAIRNESS_*_SECONDS must be 1-20" >&2; exit 2; }
done
(( warmup + unloaded + loaded <= 40 )) || { echo "the phases may last at most 40 s together" >&2; exit 2; }
command -v curl >/dev/null 2>&1 || { echo "curl is required" >&2; exit 2; }

jar=service/target/loopwright.jar
[[ -f $jar ]] || mvn -B -q package -DskipTests -pl service -am

source "$(dirname "$0")/service-jar.sh"
service_workdir

service_start "$heap" "$base" LOOPWRIGHT_PORT="$port" LOOPWRIGHT_LOG_FORMAT=text

echo "service: $(curl -fsS "$base/metrics" | grep -c '^loopwright_' || true) metric lines; $(nproc) processors"
# The load driver is bounded by its phases; timeout is the backstop for the 60 s promise.
timeout 48 java bench/fairness/FairnessLoad.java "$base" "$warmup" "$unloaded" "$loaded" "$factor"
