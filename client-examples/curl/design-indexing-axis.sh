#!/usr/bin/env bash
# Designs the gains of a packaging-line indexing axis: 0.15 s settling (2% band), at most 1.5% overshoot.
# Usage: client-examples/curl/design-indexing-axis.sh [base-url]   (default http://localhost:8080)
# Fails (non-zero exit) unless the service answers 200 with a certified design.
set -euo pipefail
base="${1:-${LOOPWRIGHT_URL:-http://localhost:8080}}"
body=$(curl -sS --fail-with-body --max-time 10 \
  -H 'Content-Type: application/json' \
  -d '{"plant":{"a0":0,"a1":0.48,"b":400,"d":400},"spec":{"settlingTime":0.15,"overshootPercent":1.5}}' \
  "$base/v1/designs")
echo "$body"
case "$body" in
  *'"certified":true'*) echo "certified design received" >&2 ;;
  *) echo "the design is not certified" >&2; exit 1 ;;
esac
