package com.loopwright.solver.robustness;

import com.loopwright.solver.plant.CanonicalPlant;
import java.util.ArrayList;
import java.util.List;

/**
 * Closed intervals for the plant parameters a0, a1, b, d (lo == hi for a fixed parameter). A b interval must not
 * contain 0.
 */
public record ParameterBox(
        double a0Min, double a0Max, double a1Min, double a1Max, double bMin, double bMax, double dMin, double dMax) {

    public ParameterBox {
        double[] all = {a0Min, a0Max, a1Min, a1Max, bMin, bMax, dMin, dMax};
        for (double v : all) {
            if (!Double.isFinite(v)) {
                throw new IllegalArgumentException("parameter bounds must be finite");
            }
        }
        if (a0Min > a0Max || a1Min > a1Max || bMin > bMax || dMin > dMax) {
            throw new IllegalArgumentException("each parameter range needs min <= max");
        }
        if (bMin <= 0 && bMax >= 0) {
            throw new IllegalArgumentException("the actuator gain range must not contain 0");
        }
    }

    /** The nominal plant as a degenerate box. */
    public static ParameterBox of(CanonicalPlant plant) {
        return new ParameterBox(
                plant.a0(), plant.a0(), plant.a1(), plant.a1(), plant.b(), plant.b(), plant.d(), plant.d());
    }

    double[] lows() {
        return new double[] {a0Min, a1Min, bMin, dMin};
    }

    double[] highs() {
        return new double[] {a0Max, a1Max, bMax, dMax};
    }

    /** Number of parameters with a non-degenerate range. */
    int varyingCount() {
        int count = 0;
        double[] lo = lows();
        double[] hi = highs();
        for (int i = 0; i < 4; i++) {
            if (lo[i] < hi[i]) {
                count++;
            }
        }
        return count;
    }

    /** The corners, in binary order over (a0, a1, b, d) low/high of the varying parameters (1 when none varies). */
    public List<CanonicalPlant> corners() {
        double[] lo = lows();
        double[] hi = highs();
        List<Integer> varying = new ArrayList<>();
        for (int i = 0; i < 4; i++) {
            if (lo[i] < hi[i]) {
                varying.add(i);
            }
        }
        List<CanonicalPlant> corners = new ArrayList<>();
        for (int mask = 0; mask < (1 << varying.size()); mask++) {
            double[] p = lo.clone();
            for (int bit = 0; bit < varying.size(); bit++) {
                int index = varying.get(bit);
                p[index] = (mask >> bit & 1) == 1 ? hi[index] : lo[index];
            }
            corners.add(plant(p));
        }
        return corners;
    }

    public static CanonicalPlant plant(double[] p) {
        return new CanonicalPlant(p[0], p[1], p[2], p[3]);
    }
}
