package com.loopwright.solver.simulation;

import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.design.StepMetrics;
import com.loopwright.solver.loop.LoopMatrices;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.spec.NormalizedRiseTime;
import com.loopwright.solver.spec.NormalizedSettlingTime;
import com.loopwright.solver.spec.NormalizedStepResponse;
import com.loopwright.solver.spec.OvershootDamping;

/**
 * The step metrics of the canonical plant under state feedback, without a time simulation: the same
 * {@link StepMetrics} as {@link StepResponseMetrics} measures on {@link LinearLoop#ofStep}, in closed form.
 *
 * <p>Math: the loop from r to y = x1 is b kr / (s^2 + c1 s + c0) with c1 = a1 + b k2, c0 = a0 + b k1 (no zero),
 * so with wn = sqrt(c0), zeta = c1 / (2 wn) and the final value y_inf = b kr r / c0, y(t) = y_inf z(wn t) where z is
 * the normalized step response of the spec step ({@link NormalizedStepResponse}). Hence, the definitions of
 * {@link StepResponseMetrics} (10-90% rise between first crossings, settling as the last exit from the band
 * |y - y_inf| &lt;= band |y_inf|, overshoot of the largest output in the window) give
 * <pre>
 *   tr = R(zeta) / wn,   ts = T(zeta, band) / wn,   OS = exp(-pi zeta / sqrt(1 - zeta^2)),   tp = pi / (wn s)
 * </pre>
 * with R and T the exact normalized rise and settling times the spec inversion uses ({@link NormalizedRiseTime},
 * {@link NormalizedSettlingTime}) and s = sqrt(1 - zeta^2). A response that does not overshoot (or whose first
 * peak lies beyond the window) has its largest value at the end of the window, so tp is the window length
 * {@link LoopMatrices#horizonSeconds(double, double)}, as in the simulation.
 *
 * <p>Control: u = kr r - k1 x1 - k2 x2 with x1 = y_inf z, x2 = y_inf wn z', so u = u_inf - y_inf g(tau) with
 * u_inf = kr r - k1 y_inf and g = alpha (z - 1) + beta z', alpha = k1, beta = k2 wn. Since z'' = -2 zeta z' - (z - 1),
 * g' = (alpha - 2 zeta beta) z' - beta (z - 1), whose zeros are
 * <ul>
 *   <li>zeta &lt; 1: (alpha - zeta beta) sin(s tau) + beta s cos(s tau) = 0, every pi / s; the deviations alternate
 *       in sign and shrink, so only the first two extrema can hold the largest |u|;</li>
 *   <li>zeta = 1: tau = beta / (beta - alpha);</li>
 *   <li>zeta &gt; 1: exp((r2 - r1) tau) = (alpha - beta r2) / (alpha - beta r1), r1,2 = zeta -+ sqrt(zeta^2 - 1).</li>
 * </ul>
 * The peak control is the largest |u| over u(0+) = kr r, these extrema inside the window and the window's end.
 * Undershoot is 0: z &gt;= 0 for a loop without a zero.
 *
 * <p>Stateless; costs a few root findings on the analytic response (microseconds).
 */
public final class TwoStateStepMetrics {

    private TwoStateStepMetrics() {}

    /**
     * @param plant the plant
     * @param gains the gains; the loop must be stable (c0, c1 &gt; 0)
     * @param stepSize reference step r, non-zero and finite
     * @param settlingBandFraction settling band as a fraction of |y_inf|, in (0, 1)
     * @throws IllegalArgumentException for an unstable loop, a zero or non-finite final value, or a damping ratio
     *     too small for a settling time
     */
    public static StepMetrics measure(
            CanonicalPlant plant, FeedbackGains gains, double stepSize, double settlingBandFraction) {
        double damping = LoopMatrices.closedLoopDamping(plant, gains);
        double stiffness = LoopMatrices.closedLoopStiffness(plant, gains);
        if (!(damping > 0 && stiffness > 0) || !Double.isFinite(damping) || !Double.isFinite(stiffness)) {
            throw new IllegalArgumentException("the closed loop s^2 + " + damping + " s + " + stiffness
                    + " is not stable, so the step response has no final value");
        }
        if (!(stepSize != 0 && Double.isFinite(stepSize))) {
            throw new IllegalArgumentException("stepSize must be non-zero and finite");
        }
        double wn = Math.sqrt(stiffness);
        double zeta = damping / (2 * wn);
        double finalValue = plant.b() * gains.referenceGain() * stepSize / stiffness;
        if (finalValue == 0 || !Double.isFinite(finalValue)) {
            throw new IllegalArgumentException(
                    "final value " + finalValue + ": rise, overshoot and settling relative to it are undefined");
        }
        NormalizedStepResponse response = new NormalizedStepResponse(zeta);
        double horizon = LoopMatrices.horizonSeconds(damping, stiffness);
        // one response for every root finding: its acos zeta (a slow library call) is computed once
        double rise = NormalizedRiseTime.of(response) / wn;
        double settling =
                NormalizedSettlingTime.analyse(response, settlingBandFraction).normalizedTime() / wn;
        double overshootPercent = 0;
        double peakTime = horizon;
        if (response.underdamped()) {
            double firstPeak = response.extremumTime(1) / wn;
            if (firstPeak <= horizon) {
                overshootPercent = 100 * OvershootDamping.overshoot(zeta);
                peakTime = firstPeak;
            }
        }
        double peakControl = peakControl(response, wn, horizon, gains, stepSize, finalValue);
        return new StepMetrics(
                rise, settling, overshootPercent, peakTime, stepSize - finalValue, peakControl, finalValue, 0);
    }

    /** max |u| over u(0+), the extrema of u inside the window and u at the window's end. */
    private static double peakControl(
            NormalizedStepResponse response,
            double wn,
            double horizonSeconds,
            FeedbackGains gains,
            double stepSize,
            double finalValue) {
        double alpha = gains.positionGain();
        double beta = gains.velocityGain() * wn;
        double settledControl = gains.referenceGain() * stepSize - alpha * finalValue;
        double windowEnd = wn * horizonSeconds;
        double peak = Math.abs(gains.referenceGain() * stepSize);
        peak = Math.max(peak, Math.abs(control(response, alpha, beta, settledControl, finalValue, windowEnd)));
        for (double tau : extremumTimes(response, alpha, beta)) {
            if (tau > 0 && tau <= windowEnd) {
                peak = Math.max(peak, Math.abs(control(response, alpha, beta, settledControl, finalValue, tau)));
            }
        }
        return peak;
    }

    /** u(tau) = u_inf - y_inf (alpha (z - 1) + beta z'). */
    private static double control(
            NormalizedStepResponse response,
            double alpha,
            double beta,
            double settledControl,
            double finalValue,
            double tau) {
        return settledControl - finalValue * (alpha * (response.at(tau) - 1) + beta * response.rate(tau));
    }

    /** The zeros of g' that can hold the largest |u| (NaN where there is none). */
    private static double[] extremumTimes(NormalizedStepResponse response, double alpha, double beta) {
        double zeta = response.dampingRatio();
        if (response.underdamped()) {
            double s = response.dampedFrequencyRatio();
            // (alpha - zeta beta) sin(theta) + beta s cos(theta) = R sin(theta + psi) = 0 at theta = k pi - psi
            double psi = Math.atan2(beta * s, alpha - zeta * beta);
            double theta = -psi;
            while (theta <= 0) { // psi in (-pi, pi]: at most two additions
                theta += Math.PI;
            }
            return new double[] {theta / s, (theta + Math.PI) / s};
        }
        if (response.criticallyDamped()) {
            return new double[] {beta / (beta - alpha)};
        }
        double root = Math.sqrt(zeta * zeta - 1);
        double r2 = zeta + root;
        double r1 = 1 / r2;
        double ratio = (alpha - beta * r2) / (alpha - beta * r1);
        return new double[] {ratio > 1 ? Math.log(ratio) / (r2 - r1) : Double.NaN};
    }
}
