#!/usr/bin/env python3
"""A stand-in for the service that answers what an idle test service never does: 503 with Retry-After.

Used by .ci/run to check the client examples' retry and problem printing. Standard library only, loopback only.
Usage: python3 stub_service.py PORT MODE
  MODE retry-then-problem: the 1st, 3rd, 5th... POST get 503 (Retry-After: 1), the others a 422 problem with a
                           field error and a proposal (each client run makes exactly two requests).
  MODE always-overloaded:  every POST gets 503 (Retry-After: 1).
GET /stub/requests answers the number of POSTs seen. The stub stops by itself after MAX_LIFETIME_SECONDS.
"""
import json
import sys
import threading
from http.server import BaseHTTPRequestHandler, ThreadingHTTPServer

MAX_LIFETIME_SECONDS = 120
MAX_BODY_BYTES = 1 << 20
RETRY_AFTER_SECONDS = 1

OVERLOADED = {"type": "tag:loopwright.dev,2026:problem/service-overloaded", "title": "Service overloaded", "status": 503,
              "detail": "every design worker is busy; retry after the Retry-After delay",
              "instance": "/requests/stub-overloaded"}
INFEASIBLE = {"type": "tag:loopwright.dev,2026:problem/infeasible-spec", "title": "Infeasible spec", "status": 422,
              "detail": "with damping ratio 0.3579 below 1/sqrt(2) (overshoot above about 4.3%) no natural "
                        "frequency can fix it",
              "instance": "/requests/stub-infeasible",
              "errors": [{"pointer": "/spec/overshootPercent",
                          "detail": "overshoot above about 4.3% cannot be met by this plant"}],
              "proposals": [{"pointer": "/spec/overshootPercent", "value": 4.243970022728987,
                             "note": "keeps the time spec and moves the damping ratio just inside the feasible range"}]}


class Stub(BaseHTTPRequestHandler):
    posts = 0
    lock = threading.Lock()
    mode = "retry-then-problem"

    def do_POST(self):
        length = min(int(self.headers.get("Content-Length") or 0), MAX_BODY_BYTES)
        self.rfile.read(length)
        with Stub.lock:
            Stub.posts += 1
            count = Stub.posts
        if Stub.mode == "always-overloaded" or count % 2 == 1:
            self.answer(503, OVERLOADED, {"Retry-After": str(RETRY_AFTER_SECONDS)})
        else:
            self.answer(422, INFEASIBLE, {})

    def do_GET(self):
        if self.path == "/stub/requests":
            body = str(Stub.posts).encode("ascii")
            self.send_response(200)
            self.send_header("Content-Type", "text/plain")
            self.send_header("Content-Length", str(len(body)))
            self.end_headers()
            self.wfile.write(body)
        else:
            self.answer(404, {"title": "Not found", "status": 404, "detail": "only POSTs are stubbed"}, {})

    def answer(self, status, problem, headers):
        body = json.dumps(problem).encode("utf-8")
        self.send_response(status)
        self.send_header("Content-Type", "application/problem+json")
        self.send_header("Content-Length", str(len(body)))
        for name, value in headers.items():
            self.send_header(name, value)
        self.end_headers()
        self.wfile.write(body)

    def log_message(self, format, *args):
        pass


def main():
    port, Stub.mode = int(sys.argv[1]), sys.argv[2]
    if Stub.mode not in ("retry-then-problem", "always-overloaded"):
        sys.exit("unknown mode " + Stub.mode)
    server = ThreadingHTTPServer(("127.0.0.1", port), Stub)
    threading.Timer(MAX_LIFETIME_SECONDS, server.shutdown).start()
    server.serve_forever()


if __name__ == "__main__":
    main()
