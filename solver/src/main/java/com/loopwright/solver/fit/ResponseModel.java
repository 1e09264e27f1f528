package com.loopwright.solver.fit;

import com.loopwright.solver.cancel.Cancellation;
import com.loopwright.solver.plant.FitOptions;
import com.loopwright.solver.plant.StepTestData;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.hipparchus.linear.Array2DRowRealMatrix;
import org.hipparchus.linear.ArrayRealVector;
import org.hipparchus.linear.RealMatrix;
import org.hipparchus.linear.RealVector;
import org.hipparchus.optim.nonlinear.vector.leastsquares.MultivariateJacobianFunction;
import org.hipparchus.util.Pair;

/**
 * The model y(t) = y0 + K A S(wn (t - t0)), t0 = t_step + theta, and its Jacobian: dy/dK = A S,
 * dy/dwn = K A (t - t0) S'(tau), dy/dtheta = -K A wn S'(tau), dy/dy0 = 1 (tau = wn (t - t0)); dy/dzeta by
 * central differences (S is smooth through zeta = 1, see {@link UnitStepShape}).
 *
 * <p>Parameters in the order K, wn, zeta, then theta when it is free, then y0 when it is estimated. With the
 * dead time held at a given value (one point of the dead-time profile) theta is not a parameter.
 * The box the search stays in: wn at least {@link #minNaturalFrequency()}, zeta in [{@link #MIN_DAMPING_RATIO},
 * {@link StepResponseFitter#MAX_DAMPING_RATIO}], theta in [0, record duration].
 */
final class ResponseModel implements MultivariateJacobianFunction {

    /** Smallest damping ratio the search visits (a lossless oscillator is not a step-test result). */
    static final double MIN_DAMPING_RATIO = 1e-4;

    private static final double ZETA_STEP = 1e-6;
    /** An estimate within this fraction of the box width (or record duration) of a bound sits on it. */
    private static final double AT_BOUND_TOLERANCE = 1e-9;

    private final double[] t;
    private final double stepTime;
    private final double amplitude;
    private final boolean freeDeadTime;
    private final boolean holding;
    private final double heldDeadTime;
    private final boolean estimateOffset;
    private final double durationSeconds;
    private final double minNaturalFrequency;

    private ResponseModel(
            double[] t,
            double stepTime,
            double amplitude,
            boolean freeDeadTime,
            boolean holding,
            double heldDeadTime,
            boolean estimateOffset) {
        this.t = t;
        this.stepTime = stepTime;
        this.amplitude = amplitude;
        this.freeDeadTime = freeDeadTime;
        this.holding = holding;
        this.heldDeadTime = heldDeadTime;
        this.estimateOffset = estimateOffset;
        this.durationSeconds = t[t.length - 1] - stepTime;
        // Slower than one radian over a thousand records is not identifiable from this record.
        this.minNaturalFrequency = 1e-3 / Math.max(durationSeconds, 1e-12);
    }

    /** The model of the fit: theta is a parameter when the options estimate it, otherwise 0. */
    ResponseModel(StepTestData data, FitOptions options) {
        this(
                data.timeSeconds(),
                data.stepTimeSeconds(),
                data.stepAmplitude(),
                options.estimateDeadTime(),
                false,
                0,
                options.estimateInitialOffset());
    }

    /** The same model with the dead time held at deadTimeSeconds (not a parameter). */
    ResponseModel holdingDeadTime(double deadTimeSeconds) {
        return new ResponseModel(t, stepTime, amplitude, false, true, deadTimeSeconds, estimateOffset);
    }

    /** A point of this model in the layout of the fit it serves (a held dead time becomes a parameter). */
    double[] fullLayout(double[] point) {
        if (!holding) {
            return point.clone();
        }
        double[] full = new double[point.length + 1];
        System.arraycopy(point, 0, full, 0, 3);
        full[3] = heldDeadTime;
        if (estimateOffset) {
            full[4] = point[3];
        }
        return full;
    }

    int parameterCount() {
        return 3 + (freeDeadTime ? 1 : 0) + (estimateOffset ? 1 : 0);
    }

    double durationSeconds() {
        return durationSeconds;
    }

    double minNaturalFrequency() {
        return minNaturalFrequency;
    }

    double deadTime(double[] point) {
        return freeDeadTime ? point[3] : heldDeadTime;
    }

    double initialOffset(double[] point) {
        return estimateOffset ? point[point.length - 1] : 0;
    }

    String[] names() {
        List<String> names = new ArrayList<>(List.of("gain", "naturalFrequency", "dampingRatio"));
        if (freeDeadTime) {
            names.add("deadTime");
        }
        if (estimateOffset) {
            names.add("initialOffset");
        }
        return names.toArray(String[]::new);
    }

    /** Lowest value each parameter can physically take (intervals are clipped to it). */
    double[] physicalLowerBounds() {
        double[] lower = new double[parameterCount()];
        lower[0] = Double.NEGATIVE_INFINITY;
        lower[1] = 0;
        lower[2] = 0;
        if (freeDeadTime) {
            lower[3] = 0;
        }
        if (estimateOffset) {
            lower[lower.length - 1] = Double.NEGATIVE_INFINITY;
        }
        return lower;
    }

    /** Highest value each parameter can take in the search (intervals are clipped to it). */
    double[] upperBounds() {
        double[] upper = new double[parameterCount()];
        Arrays.fill(upper, Double.POSITIVE_INFINITY);
        upper[2] = StepResponseFitter.MAX_DAMPING_RATIO;
        if (freeDeadTime) {
            upper[3] = durationSeconds;
        }
        return upper;
    }

    /** The point moved into the search box (the Levenberg-Marquardt parameter validator). */
    RealVector clamp(RealVector point) {
        double[] x = point.toArray();
        x[1] = Math.max(x[1], minNaturalFrequency);
        x[2] = Math.min(Math.max(x[2], MIN_DAMPING_RATIO), StepResponseFitter.MAX_DAMPING_RATIO);
        if (freeDeadTime) {
            x[3] = Math.min(Math.max(x[3], 0), durationSeconds);
        }
        return new ArrayRealVector(x, false);
    }

    /** Which parameters sit on a bound of the search box (the fit is then a constrained optimum there). */
    boolean[] atBound(double[] x) {
        boolean[] at = new boolean[x.length];
        at[1] = x[1] <= minNaturalFrequency * (1 + AT_BOUND_TOLERANCE);
        at[2] = x[2] <= MIN_DAMPING_RATIO * (1 + AT_BOUND_TOLERANCE)
                || x[2] >= StepResponseFitter.MAX_DAMPING_RATIO * (1 - AT_BOUND_TOLERANCE);
        if (freeDeadTime) {
            at[3] = x[3] <= AT_BOUND_TOLERANCE * durationSeconds || x[3] >= durationSeconds * (1 - AT_BOUND_TOLERANCE);
        }
        return at;
    }

    @Override
    public Pair<RealVector, RealMatrix> value(RealVector point) {
        Cancellation.checkpoint(); // one model evaluation is the fit's unit of cancellation
        double[] x = point.toArray();
        int p = x.length;
        double gain = x[0];
        double wn = x[1];
        double zeta = x[2];
        double theta = deadTime(x);
        double y0 = initialOffset(x);
        double h = ZETA_STEP * Math.max(zeta, 1e-2);
        double[] values = new double[t.length];
        double[][] jacobian = new double[t.length][p];
        for (int i = 0; i < t.length; i++) {
            double elapsed = t[i] - stepTime - theta;
            double tau = wn * elapsed;
            double s = UnitStepShape.step(tau, zeta);
            double ds = UnitStepShape.impulse(tau, zeta);
            values[i] = y0 + gain * amplitude * s;
            jacobian[i][0] = amplitude * s;
            jacobian[i][1] = gain * amplitude * Math.max(elapsed, 0) * ds;
            jacobian[i][2] = gain
                    * amplitude
                    * (UnitStepShape.step(tau, zeta + h) - UnitStepShape.step(tau, zeta - h))
                    / (2 * h);
            if (freeDeadTime) {
                jacobian[i][3] = -gain * amplitude * wn * ds;
            }
            if (estimateOffset) {
                jacobian[i][p - 1] = 1;
            }
        }
        return new Pair<>(new ArrayRealVector(values, false), new Array2DRowRealMatrix(jacobian, false));
    }
}
