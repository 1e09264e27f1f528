#!/usr/bin/env bash
# Designs the gains of a packaging-line indexing axis: 0.15 s settling (2% band), at most 1.5% overshoot.
# Usage: client-examples/curl/design-indexing-axis.sh [base-url]   (default http://localhost:8080)
# With LOOPWRIGHT_API_KEY set, the key is sent as "Authorization: Bearer <key>" (read by curl from a file
# descriptor, so it never shows in the process list). A 503 is retried after its Retry-After (at most 3 attempts,
# at most 10 s each). A problem answer is printed with its fields and proposals (jq when installed, else raw).
# Fails (non-zero exit) unless the service answers 200 with a certified design.
set -euo pipefail
base="${1:-${LOOPWRIGHT_URL:-http://localhost:8080}}"
request='{"plant":{"form":"canonical","a0":0,"a1":0.48,"b":400,"d":400},"spec":{"settlingTime":0.15,"overshootPercent":1.5}}'
max_attempts=3
max_wait_seconds=10
work=$(mktemp -d)
trap 'rm -rf "$work"' EXIT

# The header file curl reads with -H @file: the bearer line, or nothing without a key.
auth_header() {
  if [ -n "${LOOPWRIGHT_API_KEY:-}" ]; then printf 'Authorization: Bearer %s\n' "$LOOPWRIGHT_API_KEY"; fi
}

# Prints an RFC 9457 problem: status, title, detail, then each field error and each proposal.
print_problem() {
  local status=$1 body=$2
  if command -v jq >/dev/null 2>&1 && jq -e 'type == "object" and has("title")' "$body" >/dev/null 2>&1; then
    jq -r --arg status "$status" '"HTTP \($status) \(.title): \(.detail // "")",
      (.errors[]? | "  field \(.pointer): \(.detail)"),
      (.proposals[]? | "  proposal \(.pointer) = \(.value)" + (if .note then " (\(.note))" else "" end))' "$body" >&2
  else
    echo "HTTP $status: $(head -c 2000 "$body")" >&2
  fi
}

for attempt in $(seq 1 $max_attempts); do
  status=$(curl -sS --max-time 10 -o "$work/body" -D "$work/headers" -w '%{http_code}' \
    -H @<(auth_header) -H 'Content-Type: application/json' -d "$request" "$base/v1/designs")
  if [ "$status" != 503 ] || [ "$attempt" -ge $max_attempts ]; then
    break
  fi
  # Retry-After in seconds (RFC 9110); an HTTP date or a missing header waits 1 s; never more than the cap.
  seconds=$(tr -d '\r' < "$work/headers" | sed -n 's/^[Rr]etry-[Aa]fter: *\([0-9][0-9]*\) *$/\1/p' | head -n 1)
  seconds=${seconds:-1}
  if [ ${#seconds} -gt 3 ] || [ "$seconds" -gt $max_wait_seconds ]; then seconds=$max_wait_seconds; fi
  echo "HTTP 503 (overloaded): retrying in $seconds s (attempt $((attempt + 1)) of $max_attempts)" >&2
  sleep "$seconds"
done

if [ "$status" != 200 ]; then
  print_problem "$status" "$work/body"
  exit 1
fi
cat "$work/body"
echo
case "$(cat "$work/body")" in
  *'"certified":true'*) echo "certified design received" >&2 ;;
  *) echo "the design is not certified" >&2; exit 1 ;;
esac
