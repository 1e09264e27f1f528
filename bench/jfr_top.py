#!/usr/bin/env python3
"""Summarises the CPU samples of a JFR recording (jdk.ExecutionSample, Java code on a CPU) for bench/profile-gap.sh:
the share of samples by area (inclusive: a sample counts for an area when any frame of its stack is in it, so the
shares overlap) and the top methods by self samples. Usage: jfr_top.py RECORDING.jfr [TOP]"""
import json
import re
import subprocess
import sys
from collections import Counter

# Areas of a design request, first match wins per frame; a stack counts once per area.
AREAS = [
    ("solver (design, Riccati, simulation, metrics)", ("com.loopwright.solver.",)),
    ("api: validation, mapping", ("com.loopwright.api.design.", "com.loopwright.api.plant.", "com.loopwright.api.validation.")),
    ("request digest (canonical JSON + SHA-256)", ("com.loopwright.api.endpoint.RequestDigest",)),
    ("Jackson read/write", ("com.fasterxml.jackson.",)),
    ("access log and logback", ("com.loopwright.service.observe.AccessLog", "ch.qos.logback.", "org.slf4j.")),
    ("metrics (Prometheus)", ("com.loopwright.service.observe.Metrics", "io.prometheus.")),
    ("compute pool hand-off", ("com.loopwright.service.compute.ComputePool", "java.util.concurrent.")),
    ("body gate", ("com.loopwright.service.http.RequestBodyGate",)),
    ("Javalin", ("io.javalin.",)),
    ("Jetty", ("org.eclipse.jetty.",)),
]
MAX_TOP = 60


def frames(event):
    for frame in event["values"]["stackTrace"]["frames"]:
        method = frame["method"]
        yield method["type"]["name"].replace("/", ".") + "." + method["name"]


def thread_groups(recording):
    """Average CPU load (user + system, share of the machine) per thread group over the recording: thread names with
    their numbers dropped (qtp pools, design workers, compiler threads, GC threads)."""
    out = subprocess.run(["jfr", "print", "--json", "--events", "jdk.ThreadCPULoad", recording],
                         check=True, capture_output=True, text=True).stdout
    loads, times = Counter(), set()
    for event in json.loads(out)["recording"]["events"]:
        values = event["values"]
        thread = values.get("eventThread") or {}
        name = thread.get("javaName") or thread.get("osName") or "?"
        group = re.sub(r"[0-9]+", "#", name)
        loads[group] += values["user"] + values["system"]
        times.add(values["startTime"][:19])
    return loads, max(1, len(times))


def main():
    recording = sys.argv[1]
    top = min(int(sys.argv[2]) if len(sys.argv) > 2 else 15, MAX_TOP)
    out = subprocess.run(["jfr", "print", "--json", "--events", "jdk.ExecutionSample", recording],
                         check=True, capture_output=True, text=True).stdout
    events = json.loads(out)["recording"]["events"]
    total = len(events)
    if total == 0:
        print("no samples")
        return
    self_counts, area_counts = Counter(), Counter()
    for event in events:
        stack = list(frames(event))
        if stack:
            self_counts[stack[0]] += 1
        hit = set()
        for name in stack:
            for area, prefixes in AREAS:
                if name.startswith(prefixes):
                    hit.add(area)
                    break
        area_counts.update(hit)
    print(f"{total} CPU samples")
    print("by area (inclusive, overlapping):")
    for area, _ in AREAS:
        print(f"  {100 * area_counts[area] / total:5.1f}%  {area}")
    loads, periods = thread_groups(recording)
    if loads:
        print("CPU load by thread group (share of the machine, averaged over the recording; JIT and GC included):")
        for group, load in loads.most_common(12):
            print(f"  {100 * load / periods:5.1f}%  {group}")
    print(f"top {top} methods by self samples:")
    for name, count in self_counts.most_common(top):
        print(f"  {100 * count / total:5.1f}%  {name}")


if __name__ == "__main__":
    main()
