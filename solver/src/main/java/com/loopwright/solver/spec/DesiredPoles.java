package com.loopwright.solver.spec;

import java.util.ArrayList;
import java.util.List;

/**
 * The requested closed-loop poles: the dominant pair of the specs and n - 2 auxiliary poles. Complex auxiliary
 * poles come in conjugate pairs; every real part is negative.
 *
 * @param dominant  the dominant pair s^2 + 2 zeta wn s + wn^2
 * @param auxiliary the n - 2 auxiliary poles
 */
public record DesiredPoles(TargetDynamics dominant, List<TargetDynamics.Pole> auxiliary) {

    /** Auxiliary real poles sit at this multiple of the dominant real part unless the caller says otherwise. */
    public static final double DEFAULT_REAL_PART_MULTIPLE = 4;

    /** Two poles closer than this (relative) count as conjugates. */
    private static final double CONJUGATE_TOLERANCE = 1e-9;

    public DesiredPoles {
        auxiliary = List.copyOf(auxiliary);
        for (TargetDynamics.Pole pole : auxiliary) {
            if (!(pole.re() < 0) || !Double.isFinite(pole.re()) || !Double.isFinite(pole.im())) {
                throw new IllegalArgumentException("auxiliary poles need finite, negative real parts");
            }
        }
        if (unpairedIndex(auxiliary) >= 0) {
            throw new IllegalArgumentException("complex auxiliary poles must come in conjugate pairs");
        }
    }

    /** n - 2 real auxiliary poles at multiple x the dominant real part. */
    public static DesiredPoles atMultiple(TargetDynamics dominant, int order, double multiple) {
        if (!(multiple > 0) || !Double.isFinite(multiple)) {
            throw new IllegalArgumentException("the real-part multiple must be positive");
        }
        List<TargetDynamics.Pole> poles = new ArrayList<>();
        for (int i = 2; i < order; i++) {
            poles.add(new TargetDynamics.Pole(multiple * dominant.poleRealPart(), 0));
        }
        return new DesiredPoles(dominant, poles);
    }

    /** Index of the first complex pole without a conjugate partner, or -1. */
    public static int unpairedIndex(List<TargetDynamics.Pole> poles) {
        boolean[] used = new boolean[poles.size()];
        for (int i = 0; i < poles.size(); i++) {
            TargetDynamics.Pole p = poles.get(i);
            if (p.im() == 0 || used[i]) {
                continue;
            }
            int partner = -1;
            for (int j = 0; j < poles.size() && partner < 0; j++) {
                TargetDynamics.Pole q = poles.get(j);
                double scale = Math.hypot(p.re(), p.im());
                if (j != i
                        && !used[j]
                        && Math.abs(q.re() - p.re()) <= CONJUGATE_TOLERANCE * scale
                        && Math.abs(q.im() + p.im()) <= CONJUGATE_TOLERANCE * scale) {
                    partner = j;
                }
            }
            if (partner < 0) {
                return i;
            }
            used[i] = true;
            used[partner] = true;
        }
        return -1;
    }

    public int order() {
        return auxiliary.size() + 2;
    }

    /** All n poles, dominant pair first. */
    public List<TargetDynamics.Pole> all() {
        List<TargetDynamics.Pole> poles = new ArrayList<>(dominant.poles());
        poles.addAll(auxiliary);
        return poles;
    }

    /**
     * alpha_0 .. alpha_{n-1} of the monic polynomial prod (s - p_i), multiplied out by real factors: s - p for a
     * real pole, s^2 - 2 Re(p) s + |p|^2 for a conjugate pair (each pair taken once, at its upper member).
     */
    public double[] coefficients() {
        double[] poly = {1};
        poly = times(poly, new double[] {
            dominant.naturalFrequencyRadPerSec() * dominant.naturalFrequencyRadPerSec(),
            2 * dominant.dampingRatio() * dominant.naturalFrequencyRadPerSec(),
            1
        });
        for (TargetDynamics.Pole p : auxiliary) {
            if (p.im() == 0) {
                poly = times(poly, new double[] {-p.re(), 1});
            } else if (p.im() > 0) {
                poly = times(poly, new double[] {p.re() * p.re() + p.im() * p.im(), -2 * p.re(), 1});
            }
        }
        double[] alpha = new double[poly.length - 1];
        System.arraycopy(poly, 0, alpha, 0, alpha.length);
        return alpha;
    }

    /** Product of two polynomials given lowest coefficient first. */
    private static double[] times(double[] p, double[] q) {
        double[] r = new double[p.length + q.length - 1];
        for (int i = 0; i < p.length; i++) {
            for (int j = 0; j < q.length; j++) {
                r[i + j] += p[i] * q[j];
            }
        }
        return r;
    }
}
