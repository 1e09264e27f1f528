#!/usr/bin/env python3
"""The script a user would write instead of calling Loopwright: one README design with a general-purpose scientific
library (SciPy), in a loop, timed per design. bench/e2e.sh runs it beside Loopwright's in-process design.

The design is the README's packaging-line indexing axis (a0 = 0, a1 = 0.48 1/s, b = d = 400; 2% settling in
0.15 s, 1.5% overshoot), with the weights and gamma Loopwright chose for it (its response to that request:
rho1, rho2, gamma = 1.2 gamma_min). Each design does what Loopwright's verification does with a general tool:

1. The Riccati solve, scipy.linalg.solve_continuous_are, of exactly the equation Loopwright solves for P
   (/work/shared/method.md section 1; the standard H-infinity state-feedback equation):

       A'P + PA + P (B1 B1'/gamma^2 - B2 B2') P + C1'C1 = 0,
       A = [[0, 1], [-a0, -a1]], B1 = [0, d]', B2 = [0, b]', C1'C1 = diag(rho1^2, rho2^2).

   SciPy solves A'X + XA - (XB) R^-1 (B'X) + Q = 0; with B = [B2 B1] and the indefinite R = diag(1, -gamma^2),
   B R^-1 B' = B2 B2' - B1 B1'/gamma^2, which is the equation above term by term (Q = C1'C1).
2. The gain K = B2'P (u = kr r - K x, kr = k1 so that the position follows a unit step with a0 = 0).
3. The closed-loop unit step, scipy.signal.step on the state-space loop (A - B2 K, B2 kr, [1, 0], 0), 2,000 points
   over three settling times (Loopwright's grid: 2,000 samples over 0.45 s).
4. The step metrics: overshoot, 10-90% rise time and 2% settling time (linear interpolation between samples).

Loopwright's own design does more per request (the spec inversion, the closed form, the gamma bounds, the
H-infinity norm of the loop, the exact refinement of every metric, JSON in and out), so the ratio is conservative.

The first design is checked against Loopwright's answer (P, the gain and the metrics); a mismatch exits with 1.
Settings: REFERENCE_SECONDS (default 10) of measured designs after REFERENCE_WARMUP_SECONDS (default 2);
at most MAX_DESIGNS designs. Run single-threaded: OPENBLAS_NUM_THREADS=1 (set here when unset).
Prints one line: RESULT designs=... cpu_us_per_design=... wall_us_per_design=... riccati_cpu_us=... step_cpu_us=...
"""
import os

# BLAS threads would spin on other cores and inflate the CPU time of a 2x2 problem; one thread, as measured.
for _name in ("OPENBLAS_NUM_THREADS", "OMP_NUM_THREADS", "MKL_NUM_THREADS"):
    os.environ.setdefault(_name, "1")

import sys  # noqa: E402
import time  # noqa: E402

import numpy as np  # noqa: E402
import scipy  # noqa: E402
from scipy import linalg, signal  # noqa: E402

# The README indexing axis and the weights and gamma of Loopwright's answer to it (POST /v1/designs, the README
# request; these are the full-precision values of its "weights" and "gamma").
A0, A1, B, D = 0.0, 0.48, 400.0, 400.0
RHO1, RHO2 = 1.4439968314553857, 0.026036728080385898
GAMMA = 2.527446244970738
SETTLING_TIME_S = 0.15
SETTLING_BAND = 0.02
SAMPLES = 2000
HORIZON_S = 3 * SETTLING_TIME_S
MAX_DESIGNS = 1_000_000

# Loopwright's answer to the same request, to check that the script computes the same design.
LOOPWRIGHT_P = np.array([[0.1334514883123196, 0.003930746232201752], [0.003930746232201752, 0.00024801731721906634]])
LOOPWRIGHT_K = np.array([1.572298492880701, 0.09920692688762654])
LOOPWRIGHT_RISE_S = 0.09850486376462218
LOOPWRIGHT_SETTLING_S = 0.15
LOOPWRIGHT_OVERSHOOT_PERCENT = 1.5

A = np.array([[0.0, 1.0], [-A0, -A1]])
B1 = np.array([[0.0], [D]])
B2 = np.array([[0.0], [B]])
Q = np.diag([RHO1**2, RHO2**2])
B_BOTH = np.hstack([B2, B1])
R_BOTH = np.diag([1.0, -(GAMMA**2)])
C_POSITION = np.array([[1.0, 0.0]])
TIMES = np.linspace(0.0, HORIZON_S, SAMPLES)


def riccati():
    """P of A'P + PA + P (B1 B1'/gamma^2 - B2 B2') P + C1'C1 = 0 (see the module comment)."""
    return linalg.solve_continuous_are(A, B_BOTH, Q, R_BOTH)


def first_crossing(t, y, level):
    """The first time y reaches level, interpolated between samples."""
    i = int(np.argmax(y >= level))
    if i == 0:
        return t[0]
    return t[i - 1] + (level - y[i - 1]) * (t[i] - t[i - 1]) / (y[i] - y[i - 1])


def step_metrics(t, y, final):
    """Overshoot [%], 10-90% rise time [s], settling time into the band around the final value [s]."""
    overshoot = max(0.0, 100.0 * (y.max() - final) / final)
    rise = first_crossing(t, y, 0.9 * final) - first_crossing(t, y, 0.1 * final)
    outside = np.nonzero(np.abs(y - final) > SETTLING_BAND * abs(final))[0]
    if outside.size == 0:
        settling = t[0]
    else:
        i = outside[-1]
        if i + 1 >= len(t):
            settling = float("inf")
        else:
            # interpolate the last exit from the band: |y - final| = band between samples i and i + 1
            e0, e1 = abs(y[i] - final), abs(y[i + 1] - final)
            band = SETTLING_BAND * abs(final)
            settling = t[i] + (e0 - band) * (t[i + 1] - t[i]) / (e0 - e1)
    return overshoot, rise, settling


def design():
    """One design: Riccati, gain, 2,000-point step, metrics. Returns (P, K, metrics, riccati CPU s, step CPU s)."""
    c0 = time.process_time()
    p = riccati()
    c1 = time.process_time()
    k = (B2.T @ p).ravel()
    closed = signal.StateSpace(A - B2 @ k.reshape(1, 2), B2 * k[0], C_POSITION, np.zeros((1, 1)))
    t, y = signal.step(closed, T=TIMES)
    final = float((-C_POSITION @ np.linalg.solve(A - B2 @ k.reshape(1, 2), B2 * k[0]))[0, 0])
    metrics = step_metrics(t, y, final)
    c2 = time.process_time()
    return p, k, metrics, c1 - c0, c2 - c1


def check(p, k, metrics):
    """The same design as Loopwright's: P and K to 1e-6 relative, metrics to within a sample step."""
    dt = HORIZON_S / (SAMPLES - 1)
    problems = []
    p_error = np.linalg.norm(p - LOOPWRIGHT_P) / np.linalg.norm(LOOPWRIGHT_P)
    k_error = np.linalg.norm(k - LOOPWRIGHT_K) / np.linalg.norm(LOOPWRIGHT_K)
    if not p_error < 1e-6:
        problems.append(f"P differs from Loopwright's by {p_error:.2e} (relative)")
    if not k_error < 1e-6:
        problems.append(f"K differs from Loopwright's by {k_error:.2e} (relative)")
    overshoot, rise, settling = metrics
    if abs(overshoot - LOOPWRIGHT_OVERSHOOT_PERCENT) > 0.01:
        problems.append(f"overshoot {overshoot:.4f}% vs {LOOPWRIGHT_OVERSHOOT_PERCENT}%")
    if abs(rise - LOOPWRIGHT_RISE_S) > dt:
        problems.append(f"rise time {rise:.6f} s vs {LOOPWRIGHT_RISE_S:.6f} s")
    if abs(settling - LOOPWRIGHT_SETTLING_S) > dt:
        problems.append(f"settling time {settling:.6f} s vs {LOOPWRIGHT_SETTLING_S} s")
    return problems, p_error


def seconds_setting(name, default):
    value = float(os.environ.get(name, default))
    if not 0 < value <= 600:
        sys.exit(f"{name} must be in (0, 600]: {value}")
    return value


def main():
    warmup_s = seconds_setting("REFERENCE_WARMUP_SECONDS", 2)
    measured_s = seconds_setting("REFERENCE_SECONDS", 10)
    p, k, metrics, _, _ = design()
    problems, p_error = check(p, k, metrics)
    if problems:
        print("reference design differs from Loopwright's: " + "; ".join(problems), file=sys.stderr)
        sys.exit(1)
    print(
        f"reference: scipy {scipy.__version__}, numpy {np.__version__}, OPENBLAS_NUM_THREADS="
        f"{os.environ['OPENBLAS_NUM_THREADS']}; same design as Loopwright (P relative difference {p_error:.1e}; "
        f"overshoot {metrics[0]:.4f}%, rise {metrics[1]:.5f} s, settling {metrics[2]:.5f} s)"
    )
    end = time.perf_counter() + warmup_s
    while time.perf_counter() < end:
        design()
    designs = 0
    riccati_cpu = step_cpu = 0.0
    cpu0, wall0 = time.process_time(), time.perf_counter()
    end = wall0 + measured_s
    while time.perf_counter() < end and designs < MAX_DESIGNS:
        _, _, _, r, s = design()
        riccati_cpu += r
        step_cpu += s
        designs += 1
    cpu, wall = time.process_time() - cpu0, time.perf_counter() - wall0
    print(
        f"RESULT designs={designs} cpu_us_per_design={1e6 * cpu / designs:.1f} "
        f"wall_us_per_design={1e6 * wall / designs:.1f} riccati_cpu_us={1e6 * riccati_cpu / designs:.1f} "
        f"step_cpu_us={1e6 * step_cpu / designs:.1f}"
    )


if __name__ == "__main__":
    main()
