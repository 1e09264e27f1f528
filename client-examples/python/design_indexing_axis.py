#!/usr/bin/env python3
"""Designs the packaging-line indexing axis (README scenario) and fetches its Structured Text controller.

Standard library only. Usage: python3 design_indexing_axis.py [base-url]  (default http://localhost:8080)
With LOOPWRIGHT_API_KEY set, the key is sent as "Authorization: Bearer <key>". A 503 is retried after its
Retry-After (at most 3 attempts, at most 10 s each). A problem answer (RFC 9457) is printed with its field errors
and proposals, and the exit status is non-zero.
Exit status 0 only for a certified design whose exported controller carries the same gains.
"""
import json
import os
import sys
import time
import urllib.error
import urllib.request

DESIGN = {"plant": {"form": "canonical", "a0": 0, "a1": 0.48, "b": 400, "d": 400},
          "spec": {"settlingTime": 0.15, "overshootPercent": 1.5}}


MAX_ATTEMPTS = 3
MAX_WAIT_SECONDS = 10


def headers():
    """JSON, and the key from the environment as a bearer token when it is set (never printed)."""
    result = {"Content-Type": "application/json"}
    key = os.environ.get("LOOPWRIGHT_API_KEY", "").strip()
    if key:
        result["Authorization"] = "Bearer " + key
    return result


def retry_after_seconds(value):
    """Retry-After in seconds (RFC 9110), capped; an HTTP date or a missing header waits 1 s."""
    return min(int(value), MAX_WAIT_SECONDS) if value and value.strip().isdigit() else 1


def post(base, path, body):
    """POST JSON; a 503 is retried after Retry-After, at most MAX_ATTEMPTS times in all."""
    for attempt in range(1, MAX_ATTEMPTS + 1):
        request = urllib.request.Request(base + path, data=json.dumps(body).encode("utf-8"), headers=headers(),
                                         method="POST")
        try:
            with urllib.request.urlopen(request, timeout=10) as response:
                return response.status, response.headers.get_content_type(), response.read().decode("utf-8")
        except urllib.error.HTTPError as error:
            reply = error.code, error.headers.get_content_type(), error.read().decode("utf-8")
            if error.code != 503 or attempt == MAX_ATTEMPTS:
                return reply
            seconds = retry_after_seconds(error.headers.get("Retry-After"))
            print("HTTP 503 (overloaded): retrying in %d s (attempt %d of %d)" % (seconds, attempt + 1, MAX_ATTEMPTS),
                  file=sys.stderr)
            time.sleep(seconds)
    raise AssertionError("unreachable: the loop returns on its last attempt")


def fail_with_problem(status, text):
    """Prints an RFC 9457 problem (status, title, detail, field errors, proposals) and exits non-zero."""
    try:
        problem = json.loads(text)
    except ValueError:
        problem = None
    if not isinstance(problem, dict) or "title" not in problem:
        sys.exit("HTTP %d: %s" % (status, text[:2000]))
    print("HTTP %d %s: %s" % (status, problem["title"], problem.get("detail", "")), file=sys.stderr)
    for error in problem.get("errors") or []:
        print("  field %s: %s" % (error.get("pointer"), error.get("detail")), file=sys.stderr)
    for proposal in problem.get("proposals") or []:
        note = " (%s)" % proposal["note"] if proposal.get("note") else ""
        print("  proposal %s = %r%s" % (proposal.get("pointer"), proposal.get("value"), note), file=sys.stderr)
    sys.exit(1)


def main():
    base = sys.argv[1] if len(sys.argv) > 1 else os.environ.get("LOOPWRIGHT_URL", "http://localhost:8080")
    status, _, text = post(base, "/v1/designs", DESIGN)
    if status != 200:
        fail_with_problem(status, text)
    design = json.loads(text)
    if not design["verification"]["certified"]:
        sys.exit("the design is not certified")
    gain = design["gain"]
    print("u = %.6g*r - (%.6g*x1 + %.6g*x2), gamma = %.6g" % (gain["referenceGain"], gain["k"][0], gain["k"][1],
                                                            design["gamma"]))
    status, media, st = post(base, "/v1/designs/controllers/structured-text",
                             {"design": DESIGN, "samplePeriod": 0.001, "actuatorLimit": 3})
    if status != 200:
        fail_with_problem(status, st)
    if media != "text/plain" or "END_FUNCTION_BLOCK" not in st:
        sys.exit("controller export failed: HTTP %d %s" % (status, st[:200]))
    if ("KY_1 : LREAL := %r;" % gain["k"][0]) not in st:
        sys.exit("the exported block does not carry k1 = %r" % gain["k"][0])
    print("Structured Text: %d lines, position gain line: %s"
          % (st.count("\n"), next(line.strip() for line in st.splitlines() if "KY_1 :" in line)))


if __name__ == "__main__":
    main()
