package com.loopwright.solver.highorder;

import com.loopwright.solver.cancel.Cancellation;
import com.loopwright.solver.design.HighOrderStep;
import com.loopwright.solver.design.Infeasibility;
import com.loopwright.solver.design.InfeasibleDesignException;
import com.loopwright.solver.design.SpecMatch;
import com.loopwright.solver.design.SpecProposal;
import com.loopwright.solver.design.SpecQuantity;
import com.loopwright.solver.plant.CompanionPlant;
import com.loopwright.solver.spec.AuxiliaryPlacement;
import com.loopwright.solver.spec.DesignSpec;
import com.loopwright.solver.spec.SpecInverter;
import com.loopwright.solver.spec.TargetDynamics;
import com.loopwright.solver.spec.TimeSpec;
import java.util.List;
import org.ejml.data.Complex_F64;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.interfaces.decomposition.EigenDecomposition_F64;

/**
 * Adjusts the dominant pair (zeta, wn) until the simulated settling time and overshoot of the actual closed loop
 * (zeros and auxiliary poles included) meet the specs: Newton on v = (zeta, ln wn) with a finite-difference
 * Jacobian and step halving, starting from the exact second-order inversion.
 *
 * <p>Before iterating, each real right-half-plane zero z is checked against the undershoot it forces: a stable
 * loop whose unit step settles into the band delta by ts undershoots by at least (1 - delta)/(e^{z ts} - 1)
 * (a standard bound for non-minimum-phase loops).
 */
public final class SpecMatcher {

    /** Cap on Newton iterations. */
    public static final int MAX_ITERATIONS = 25;
    /** Cap on step halvings per iteration. */
    static final int MAX_HALVINGS = 6;
    /** Converged when |ts_sim/ts - 1| is at most this ... */
    public static final double SETTLING_TOLERANCE = 1e-3;
    /** ... and |OS_sim - OS| at most this many percentage points. */
    public static final double OVERSHOOT_TOLERANCE_POINTS = 0.01;
    /** Relative finite-difference step on zeta and ln wn. */
    static final double DIFFERENCE_STEP = 1e-5;

    static final double MIN_DAMPING = 0.2;
    static final double MAX_DAMPING = 2.5;
    /** Largest change of zeta and of ln wn in one step. */
    static final double MAX_STEP = 0.25;

    private final ClosedLoopStep step = new ClosedLoopStep();

    /**
     * @param spec                 overshoot and a settling-time spec
     * @param maxUndershootPercent largest undershoot accepted [percent of the final value]
     * @throws InfeasibleDesignException when a right-half-plane zero forces more undershoot, or the iteration
     *                                   does not converge within its cap (the reason gives the residuals)
     */
    public SpecMatch match(
            CompanionPlant plant,
            DesignSpec spec,
            AuxiliaryPlacement placement,
            double stepSize,
            double maxUndershootPercent) {
        if (!(spec.timeSpec() instanceof TimeSpec.SettlingTime settling)) {
            throw new IllegalArgumentException("spec matching needs a settling-time spec");
        }
        double band = settling.bandFraction();
        double ts = settling.seconds();
        for (double zero : realRightHalfPlaneZeros(plant)) {
            double forced = 100 * (1 - band) / Math.expm1(zero * ts);
            if (forced > maxUndershootPercent) {
                double fastest = Math.log1p(100 * (1 - band) / maxUndershootPercent) / zero;
                throw new InfeasibleDesignException(new Infeasibility(
                        SpecQuantity.TIME_SPEC,
                        String.format(
                                "the plant's right-half-plane zero at +%.6g 1/s makes the output start the wrong way: settling"
                                        + " into the band by %.6g s forces at least %.4g%% undershoot, above the accepted"
                                        + " %.4g%% (maxUndershootPercent)",
                                zero, ts, forced, maxUndershootPercent),
                        List.of(new SpecProposal(
                                SpecQuantity.TIME_SPEC,
                                fastest,
                                String.format(
                                        "the shortest settling time whose forced undershoot is at most %.4g%%",
                                        maxUndershootPercent)))));
            }
        }
        TargetDynamics start = new SpecInverter().invert(spec).target();
        double targetOvershoot = 100 * spec.overshootFraction();
        double[] v = {start.dampingRatio(), Math.log(start.naturalFrequencyRadPerSec())};
        double[] f = residual(plant, placement, v, stepSize, band, ts, targetOvershoot);
        if (f == null) {
            throw notConverged(0, null, "the step response at the second-order starting point could not be measured");
        }
        int iteration = 0;
        while (!converged(f)) {
            Cancellation.checkpoint(); // one spec-matching iteration (three simulations)
            if (++iteration > MAX_ITERATIONS) {
                throw notConverged(MAX_ITERATIONS, f, "the iteration cap was reached");
            }
            double[][] jacobian = new double[2][2];
            for (int c = 0; c < 2; c++) {
                double[] w = v.clone();
                double h = DIFFERENCE_STEP * Math.max(1, Math.abs(v[c]));
                w[c] += h;
                double[] g = residual(plant, placement, w, stepSize, band, ts, targetOvershoot);
                if (g == null) {
                    throw notConverged(iteration, f, "the step response next to the iterate could not be measured");
                }
                jacobian[0][c] = (g[0] - f[0]) / h;
                jacobian[1][c] = (g[1] - f[1]) / h;
            }
            double det = jacobian[0][0] * jacobian[1][1] - jacobian[0][1] * jacobian[1][0];
            if (!(Math.abs(det) > 0) || !Double.isFinite(det)) {
                throw notConverged(iteration, f, "settling time and overshoot stopped responding to the dominant pair");
            }
            double[] delta = {
                -(jacobian[1][1] * f[0] - jacobian[0][1] * f[1]) / det,
                -(-jacobian[1][0] * f[0] + jacobian[0][0] * f[1]) / det
            };
            double length = Math.max(Math.abs(delta[0]), Math.abs(delta[1]));
            if (length > MAX_STEP) {
                delta[0] *= MAX_STEP / length;
                delta[1] *= MAX_STEP / length;
            }
            double current = size(f);
            double[] next = null;
            double[] nextF = null;
            for (int halving = 0; halving <= MAX_HALVINGS; halving++) {
                double[] w = {clamp(v[0] + delta[0]), v[1] + delta[1]};
                double[] g = residual(plant, placement, w, stepSize, band, ts, targetOvershoot);
                if (g != null && (size(g) < current || halving == MAX_HALVINGS)) {
                    next = w;
                    nextF = g;
                    break;
                }
                delta[0] /= 2;
                delta[1] /= 2;
            }
            if (next == null) {
                throw notConverged(iteration, f, "no step along the Newton direction could be measured");
            }
            v = next;
            f = nextF;
        }
        TargetDynamics target = new TargetDynamics(v[0], Math.exp(v[1]));
        HighOrderStep result = step.simulate(plant, placement.place(target, plant.order()), stepSize, band, ts);
        if (result.undershootPercent() > maxUndershootPercent) {
            throw new InfeasibleDesignException(new Infeasibility(
                    SpecQuantity.TIME_SPEC,
                    String.format(
                            "the matched loop undershoots by %.4g%%, above the accepted %.4g%% (maxUndershootPercent):"
                                    + " the plant's zeros pull the output the wrong way at this speed; allow a longer"
                                    + " settling time",
                            result.undershootPercent(), maxUndershootPercent),
                    List.of()));
        }
        return new SpecMatch(
                target,
                start,
                iteration,
                result.metrics().settlingTimeSeconds() / ts - 1,
                result.metrics().overshootPercent() - targetOvershoot,
                result);
    }

    /** Real zeros of c_0 + c_1 s + ... with positive real part (complex ones are not bounded here). */
    static double[] realRightHalfPlaneZeros(CompanionPlant plant) {
        double[] c = plant.numerator();
        int degree = c.length - 1;
        while (degree > 0 && c[degree] == 0) {
            degree--;
        }
        if (degree == 0) {
            return new double[0];
        }
        DMatrixRMaj companion = new DMatrixRMaj(degree, degree);
        for (int i = 0; i + 1 < degree; i++) {
            companion.set(i + 1, i, 1);
        }
        for (int i = 0; i < degree; i++) {
            companion.set(i, degree - 1, -c[i] / c[degree]);
        }
        EigenDecomposition_F64<DMatrixRMaj> eig = DecompositionFactory_DDRM.eig(degree, false);
        if (!eig.decompose(companion)) {
            return new double[0];
        }
        return java.util.stream.IntStream.range(0, eig.getNumberOfEigenvalues())
                .mapToObj(eig::getEigenvalue)
                .filter(z -> z.real > 0 && Math.abs(z.imaginary) <= 1e-9 * Math.max(1, Math.abs(z.real)))
                .mapToDouble(Complex_F64::getReal)
                .toArray();
    }

    private double[] residual(
            CompanionPlant plant,
            AuxiliaryPlacement placement,
            double[] v,
            double stepSize,
            double band,
            double ts,
            double targetOvershoot) {
        try {
            TargetDynamics target = new TargetDynamics(v[0], Math.exp(v[1]));
            HighOrderStep r = step.simulate(plant, placement.place(target, plant.order()), stepSize, band, ts);
            return new double[] {
                r.metrics().settlingTimeSeconds() / ts - 1, r.metrics().overshootPercent() - targetOvershoot
            };
        } catch (IllegalArgumentException e) {
            return null;
        }
    }

    private static boolean converged(double[] f) {
        return Math.abs(f[0]) <= SETTLING_TOLERANCE && Math.abs(f[1]) <= OVERSHOOT_TOLERANCE_POINTS;
    }

    private static double size(double[] f) {
        return Math.hypot(f[0] / SETTLING_TOLERANCE, f[1] / OVERSHOOT_TOLERANCE_POINTS);
    }

    private static double clamp(double zeta) {
        return Math.max(MIN_DAMPING, Math.min(MAX_DAMPING, zeta));
    }

    private static InfeasibleDesignException notConverged(int iterations, double[] f, String why) {
        SpecQuantity blamed =
                f == null || Math.abs(f[0]) / SETTLING_TOLERANCE >= Math.abs(f[1]) / OVERSHOOT_TOLERANCE_POINTS
                        ? SpecQuantity.TIME_SPEC
                        : SpecQuantity.OVERSHOOT_PERCENT;
        String residuals = f == null
                ? ""
                : String.format(
                        " (settling time off by %.3g%%, overshoot off by %.3g" + " percentage points)",
                        100 * f[0], f[1]);
        return new InfeasibleDesignException(new Infeasibility(
                blamed,
                "spec matching did not converge after "
                        + iterations + " iterations" + residuals + ": " + why
                        + "; the zeros and auxiliary poles keep the actual loop from meeting these specs",
                List.of()));
    }
}
