#!/usr/bin/env bash
# Runs the JMH suite with the modest settings used for docs/benchmarks.md (one fork, 3 x 1 s warm-up,
# 5 x 1 s measurement) plus the allocation profiler, and records the machine load before and after.
#   bench/run-jmh.sh                         whole suite
#   bench/run-jmh.sh 'RiccatiBenchmark'      only benchmarks matching a regular expression
#   JMH_SMOKE=1 bench/run-jmh.sh             a quick check that every benchmark runs (1 x 100 ms each)
# Extra JMH options can follow the pattern, e.g. bench/run-jmh.sh StepSimulation -prof stack
set -euo pipefail
cd "$(dirname "$0")/.."

jar=bench/target/loopwright-bench.jar
if [[ ! -f $jar || ${JMH_BUILD:-0} == 1 ]]; then
  mvn -B -q package -DskipTests -pl bench -am
fi
pattern=${1:-.}
shift || true
if [[ ${JMH_SMOKE:-0} == 1 ]]; then
  settings=(-f 1 -wi 1 -i 1 -w 100ms -r 100ms)
else
  settings=(-f 1 -wi 3 -i 5 -w 1s -r 1s -prof gc)
fi
echo "load before: $(uptime)"
java -jar "$jar" "$pattern" "${settings[@]}" "$@"
echo "load after: $(uptime)"
