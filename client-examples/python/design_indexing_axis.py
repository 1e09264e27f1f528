#!/usr/bin/env python3
"""Designs the packaging-line indexing axis (README scenario) and fetches its Structured Text controller.

Standard library only. Usage: python3 design_indexing_axis.py [base-url]  (default http://localhost:8080)
Exit status 0 only for a certified design whose exported controller carries the same gains.
"""
import json
import os
import sys
import urllib.error
import urllib.request

DESIGN = {"plant": {"a0": 0, "a1": 0.48, "b": 400, "d": 400},
          "spec": {"settlingTime": 0.15, "overshootPercent": 1.5}}


def post(base, path, body):
    request = urllib.request.Request(base + path, data=json.dumps(body).encode("utf-8"),
                                     headers={"Content-Type": "application/json"}, method="POST")
    try:
        with urllib.request.urlopen(request, timeout=10) as response:
            return response.status, response.headers.get_content_type(), response.read().decode("utf-8")
    except urllib.error.HTTPError as error:
        return error.code, error.headers.get_content_type(), error.read().decode("utf-8")


def main():
    base = sys.argv[1] if len(sys.argv) > 1 else os.environ.get("LOOPWRIGHT_URL", "http://localhost:8080")
    status, _, text = post(base, "/v1/designs", DESIGN)
    if status != 200:
        sys.exit("HTTP %d: %s" % (status, text))
    design = json.loads(text)
    if not design["verification"]["certified"]:
        sys.exit("the design is not certified")
    gain = design["gain"]
    print("u = %.6g*r - (%.6g*x1 + %.6g*x2), gamma = %.6g" % (gain["referenceGain"], gain["k1"], gain["k2"],
                                                            design["gamma"]))
    status, media, st = post(base, "/v1/designs/controllers/structured-text",
                             {"design": DESIGN, "samplePeriodSeconds": 0.001, "commandLimit": 3})
    if status != 200 or media != "text/plain" or "END_FUNCTION_BLOCK" not in st:
        sys.exit("controller export failed: HTTP %d %s" % (status, st[:200]))
    if ("K_POSITION : LREAL := %r;" % gain["k1"]) not in st:
        sys.exit("the exported block does not carry k1 = %r" % gain["k1"])
    print("Structured Text: %d lines, first constant line: %s"
          % (st.count("\n"), next(line.strip() for line in st.splitlines() if "K_POSITION" in line)))


if __name__ == "__main__":
    main()
