package com.loopwright.solver.simulation;

import com.loopwright.solver.design.DenseTrajectory;
import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.loop.LoopMatrices;
import com.loopwright.solver.plant.CanonicalPlant;
import org.ejml.data.DMatrixRMaj;

/**
 * The reference step of a sampled controller on the continuous plant, with an input delay, observed between the
 * samples.
 *
 * <p>The controller samples x at t_k = k Ts and computes u_k = kr r - (k1 x1(t_k) + k2 x2(t_k)); a hold applies
 * u_k to the plant from t_k + tau to t_(k+1) + tau (u = 0 before the first value arrives). With
 * tau = m Ts + f, 0 &lt;= f &lt; Ts, the plant input on [t_k, t_(k+1)) is u_(k-m-1) before t_k + f and u_(k-m)
 * after it, so every sample interval is split at f and both pieces are propagated exactly by the plant's
 * zero-order hold: the delay is exact, not a Pade approximation. The state between samples is x(t_k + o) from
 * the exact hold over the offset o, on {@code substeps} equal offsets per interval.
 */
public final class DelayedSampledStepSimulator {

    /** Cap on simulated sample intervals. */
    public static final int MAX_SAMPLE_INTERVALS = 200_000;
    /** Cap on observation offsets inside one sample interval. */
    public static final int MAX_SUBSTEPS = 2_000;
    /** Target total number of observation points; each interval has at least {@link #MIN_SUBSTEPS}. */
    public static final int TARGET_POINTS = 20_000;

    public static final int MIN_SUBSTEPS = 4;

    /**
     * @throws IllegalArgumentException when the horizon needs more than {@value #MAX_SAMPLE_INTERVALS} intervals
     */
    public DenseTrajectory simulate(
            CanonicalPlant plant,
            FeedbackGains gains,
            double stepSize,
            double samplePeriod,
            double delaySeconds,
            double horizonSeconds) {
        double intervalsExact = Math.ceil(horizonSeconds / samplePeriod);
        if (!(intervalsExact <= MAX_SAMPLE_INTERVALS)) {
            throw new IllegalArgumentException("the horizon " + horizonSeconds + " s needs " + (long) intervalsExact
                    + " sample intervals of " + samplePeriod + " s, more than the cap " + MAX_SAMPLE_INTERVALS);
        }
        int intervals = Math.max(1, (int) intervalsExact);
        int substeps = Math.max(MIN_SUBSTEPS, Math.min(MAX_SUBSTEPS, TARGET_POINTS / intervals));
        int wholeDelay = (int) Math.floor(delaySeconds / samplePeriod);
        double fraction = delaySeconds - wholeDelay * samplePeriod;
        if (fraction >= samplePeriod) {
            wholeDelay++;
            fraction = 0;
        }
        DMatrixRMaj a = LoopMatrices.openLoop(plant);
        DMatrixRMaj b2 = LoopMatrices.actuatorInput(plant);
        // holds over each observation offset o_j = j Ts / substeps and over o_j - f for the offsets after f
        DMatrixRMaj[] adOffset = new DMatrixRMaj[substeps + 1];
        DMatrixRMaj[] bdOffset = new DMatrixRMaj[substeps + 1];
        DMatrixRMaj[] adAfter = new DMatrixRMaj[substeps + 1];
        DMatrixRMaj[] bdAfter = new DMatrixRMaj[substeps + 1];
        for (int j = 1; j <= substeps; j++) {
            double offset = samplePeriod * j / substeps;
            DiscreteStateSpace hold = ZeroOrderHold.discretize(a, b2, offset);
            adOffset[j] = hold.ad();
            bdOffset[j] = hold.bd();
            if (offset > fraction && fraction > 0) {
                DiscreteStateSpace after = ZeroOrderHold.discretize(a, b2, offset - fraction);
                adAfter[j] = after.ad();
                bdAfter[j] = after.bd();
            }
        }
        DMatrixRMaj adSplit = null;
        DMatrixRMaj bdSplit = null;
        if (fraction > 0) {
            DiscreteStateSpace split = ZeroOrderHold.discretize(a, b2, fraction);
            adSplit = split.ad();
            bdSplit = split.bd();
        }
        int points = intervals * substeps + 1;
        double[] t = new double[points];
        double[] x1 = new double[points];
        double[] x2 = new double[points];
        double[] u = new double[points];
        // controller outputs, u_k for k = 0..intervals-1; indices below 0 read as 0
        double[] computed = new double[intervals];
        double reference = gains.referenceGain() * stepSize;
        double[] x = {0, 0};
        int index = 0;
        for (int k = 0; k < intervals; k++) {
            computed[k] = reference - gains.positionGain() * x[0] - gains.velocityGain() * x[1];
            double before = held(computed, k - wholeDelay - 1);
            double after = held(computed, k - wholeDelay);
            double start = k * samplePeriod;
            if (k == 0) {
                t[0] = 0;
                x1[0] = 0;
                x2[0] = 0;
                u[0] = fraction > 0 ? before : after;
            }
            double[] atSplit = fraction > 0 ? CheckedHoldStep.apply(adSplit, bdSplit, x, before) : x;
            double[] end = x;
            for (int j = 1; j <= substeps; j++) {
                double offset = samplePeriod * j / substeps;
                double[] state;
                double input;
                if (fraction > 0 && offset <= fraction) {
                    state = CheckedHoldStep.apply(adOffset[j], bdOffset[j], x, before);
                    input = offset == fraction ? after : before;
                } else if (fraction > 0) {
                    state = CheckedHoldStep.apply(adAfter[j], bdAfter[j], atSplit, after);
                    input = after;
                } else {
                    state = CheckedHoldStep.apply(adOffset[j], bdOffset[j], x, after);
                    input = after;
                }
                index++;
                t[index] = start + offset;
                x1[index] = state[0];
                x2[index] = state[1];
                // at the interval end the next interval's input takes over; record the input just applied
                u[index] = input;
                end = state;
            }
            x = end;
        }
        return new DenseTrajectory(t, x1, x2, u, new double[points]);
    }

    private static double held(double[] computed, int k) {
        return k < 0 ? 0 : computed[k];
    }
}
