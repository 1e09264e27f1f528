package com.loopwright.solver.loop;

import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.plant.CanonicalPlant;
import org.ejml.data.Complex_F64;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.interfaces.decomposition.EigenDecomposition_F64;

/**
 * The matrices of plant and loop: A = [[0, 1], [-a0, -a1]], B1 = [0, d]', B2 = [0, b]', K = [k1, k2],
 * A_cl = A - B2 K, and the step loop x' = A_cl x + B2 kr r.
 */
public final class LoopMatrices {

    /** Simulated window in slowest closed-loop time constants: e^-12 ~ 6e-6 of the initial mode is left. */
    public static final double HORIZON_PER_TIME_CONSTANT = 12;
    /** An overshoot peak below this fraction of the final value is not worth a longer window. */
    public static final double NEGLIGIBLE_EXTREMUM = 1e-15;
    /** The window reaches this factor past a late overshoot peak (the peak is an interior sample). */
    public static final double PEAK_ROOM = 1.25;
    /** Cap on the window extension, in base windows (a counted peak needs at most 2.9 x 1.25 of them). */
    public static final double MAX_HORIZON_EXTENSION = 4;

    private LoopMatrices() {}

    public static DMatrixRMaj openLoop(CanonicalPlant plant) {
        return new DMatrixRMaj(new double[][] {{0, 1}, {-plant.a0(), -plant.a1()}});
    }

    public static DMatrixRMaj actuatorInput(CanonicalPlant plant) {
        return new DMatrixRMaj(new double[][] {{0}, {plant.b()}});
    }

    public static DMatrixRMaj disturbanceInput(CanonicalPlant plant) {
        return new DMatrixRMaj(new double[][] {{0}, {plant.d()}});
    }

    public static DMatrixRMaj closedLoop(CanonicalPlant plant, FeedbackGains gains) {
        return new DMatrixRMaj(new double[][] {
            {0, 1}, {-plant.a0() - plant.b() * gains.positionGain(), -plant.a1() - plant.b() * gains.velocityGain()}
        });
    }

    /** Closed-loop stiffness c0 = a0 + b k1 and damping c1 = a1 + b k2 of s^2 + c1 s + c0. */
    public static double closedLoopStiffness(CanonicalPlant plant, FeedbackGains gains) {
        return plant.a0() + plant.b() * gains.positionGain();
    }

    public static double closedLoopDamping(CanonicalPlant plant, FeedbackGains gains) {
        return plant.a1() + plant.b() * gains.velocityGain();
    }

    /** s^2 + c1 s + c0 is Hurwitz iff c0 > 0 and c1 > 0 (Routh-Hurwitz for degree 2). */
    public static boolean stable(CanonicalPlant plant, FeedbackGains gains) {
        return closedLoopStiffness(plant, gains) > 0 && closedLoopDamping(plant, gains) > 0;
    }

    /** Final value of x1 for a unit reference: b kr / c0. */
    public static double unitStepFinalValue(CanonicalPlant plant, FeedbackGains gains) {
        return plant.b() * gains.referenceGain() / closedLoopStiffness(plant, gains);
    }

    public static Complex_F64[] poles(DMatrixRMaj a) {
        EigenDecomposition_F64<DMatrixRMaj> eig = DecompositionFactory_DDRM.eig(a.numRows, false);
        if (!eig.decompose(a.copy())) {
            throw new IllegalArgumentException("eigenvalues could not be computed");
        }
        Complex_F64[] values = new Complex_F64[a.numRows];
        for (int i = 0; i < values.length; i++) {
            values[i] = eig.getEigenvalue(i);
        }
        return values;
    }

    /**
     * The simulated window of a stable loop: HORIZON_PER_TIME_CONSTANT / min |Re lambda|, extended to contain the
     * step's overshoot peak. The x1 step response of b kr / (s^2 + c1 s + c0) has no zero, so it is monotone when
     * the poles are real, and when they are complex (sigma +- j wd) its extrema lie at t_k = k pi / wd with
     * deviations e^(-sigma t_k) of the final value, the largest at t_1 = pi / wd (textbook second-order step
     * response). A light damping with a slow oscillation can put t_1 beyond the base window; the window then
     * reaches PEAK_ROOM t_1 unless the peak is below NEGLIGIBLE_EXTREMUM. Since e^(-sigma t_1) &gt;= 1e-15 means
     * t_1 &lt;= 34.6 / sigma &lt; 2.9 base windows, the cap MAX_HORIZON_EXTENSION never cuts off a counted peak.
     * Extrema after the window deviate by less than e^-12 = 6e-6 of the final value, below the narrowest settling
     * band (0.1%), and are smaller than the first peak: they change no step metric.
     */
    public static double horizonSeconds(CanonicalPlant plant, FeedbackGains gains) {
        double slowest = Double.POSITIVE_INFINITY;
        for (Complex_F64 pole : poles(closedLoop(plant, gains))) {
            slowest = Math.min(slowest, Math.abs(pole.real));
        }
        return window(slowest, closedLoopDamping(plant, gains), closedLoopStiffness(plant, gains));
    }

    /**
     * The same window as {@link #horizonSeconds(CanonicalPlant, FeedbackGains)} for the stable loop
     * s^2 + c1 s + c0, with the slowest decay rate in closed form: sigma = c1/2 for complex poles, and
     * c0 / (sigma + sqrt(sigma^2 - c0)) (the smaller root, free of cancellation) for real ones.
     */
    public static double horizonSeconds(double damping, double stiffness) {
        double sigma = 0.5 * damping;
        double discriminant = sigma * sigma - stiffness;
        double slowest = discriminant <= 0 ? sigma : stiffness / (sigma + Math.sqrt(discriminant));
        return window(slowest, damping, stiffness);
    }

    private static double window(double slowest, double damping, double stiffness) {
        double base = HORIZON_PER_TIME_CONSTANT / slowest;
        double sigma = 0.5 * damping;
        double discriminant = sigma * sigma - stiffness;
        if (discriminant < 0 && sigma > 0) {
            double firstPeak = Math.PI / Math.sqrt(-discriminant);
            if (Math.exp(-sigma * firstPeak) > NEGLIGIBLE_EXTREMUM && PEAK_ROOM * firstPeak > base) {
                return Math.min(PEAK_ROOM * firstPeak, MAX_HORIZON_EXTENSION * base);
            }
        }
        return base;
    }

    /** max |lambda| of the closed loop [rad/s]. */
    public static double fastestPoleMagnitude(CanonicalPlant plant, FeedbackGains gains) {
        double fastest = 0;
        for (Complex_F64 pole : poles(closedLoop(plant, gains))) {
            fastest = Math.max(fastest, pole.getMagnitude());
        }
        return fastest;
    }

    /** max |Im lambda| of the closed loop [rad/s]. */
    public static double fastestOscillation(CanonicalPlant plant, FeedbackGains gains) {
        double fastest = 0;
        for (Complex_F64 pole : poles(closedLoop(plant, gains))) {
            fastest = Math.max(fastest, Math.abs(pole.imaginary));
        }
        return fastest;
    }
}
