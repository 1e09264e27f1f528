package com.loopwright.solver.frequency;

import com.loopwright.solver.design.BodeSeries;
import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.design.FrequencyPoint;
import com.loopwright.solver.design.LoopMargins;
import com.loopwright.solver.loop.LoopMatrices;
import com.loopwright.solver.plant.CanonicalPlant;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * The one frequency analyzer of the loop broken at the plant input: Bode data of any rational loop on a logarithmic
 * grid, and the gain, phase and delay margins, peak sensitivity, bandwidth and frequency response of the canonical
 * second-order loop in closed form (the numbers of verifications and of the Bode figure's markers).
 */
public final class LoopFrequencyAnalyzer {

    /** Largest number of grid points. */
    public static final int MAX_POINTS = 4000;
    /** Smallest number of grid points. */
    public static final int MIN_POINTS = 2;
    /** Cap on frequency response points returned with the margins. */
    public static final int MAX_RESPONSE_POINTS = 500;

    /** Samples L(j w) on {@code points} log-spaced frequencies from {@code lowRadPerSec} to {@code highRadPerSec}. */
    public BodeSeries sample(RationalLoop loop, double lowRadPerSec, double highRadPerSec, int points) {
        double[] w = grid(lowRadPerSec, highRadPerSec, points);
        double[] magnitude = new double[points];
        double[] phase = new double[points];
        for (int i = 0; i < points; i++) {
            double[] l = loop.at(w[i]);
            magnitude[i] = 20 * Math.log10(Math.hypot(l[0], l[1]));
            double wrapped = Math.toDegrees(Math.atan2(l[1], l[0]));
            if (i == 0) {
                // Start in (-360, 0]: the convention for loops with integrators and lags.
                phase[i] = wrapped > 0 ? wrapped - 360 : wrapped;
            } else {
                // Unwrap: choose the branch nearest the previous sample.
                double step = wrapped - phase[i - 1];
                phase[i] = wrapped - 360 * Math.rint(step / 360);
            }
            if (!Double.isFinite(magnitude[i]) || !Double.isFinite(phase[i])) {
                throw new IllegalArgumentException(
                        "L(jw) is not finite at w = " + w[i] + " rad/s (a pole on the axis)");
            }
        }
        return new BodeSeries(w, magnitude, phase);
    }

    /**
     * Margins of the canonical loop L(s) = b (k1 + k2 s)/(s^2 + a1 s + a0) in closed form (the formulas are in
     * {@link SecondOrderLoopResponse}): every gain crossover counts, phase and delay margins follow
     * {@link CrossoverMargins} like the Bode figure; the gain margin and the gain reduction margin are 1/|L| at the
     * phase crossovers w = 0 and w^2 = a0 - k1 a1 / k2 below and above 0 dB; the peak sensitivity is searched on a
     * log grid of {@value SecondOrderLoopResponse#SENSITIVITY_GRID} points three decades either side of the poles.
     *
     * @param responsePoints number of log-spaced points in the returned response, 0 to {@value #MAX_RESPONSE_POINTS}
     */
    public LoopMargins margins(CanonicalPlant plant, FeedbackGains gains, int responsePoints) {
        if (responsePoints < 0 || responsePoints > MAX_RESPONSE_POINTS) {
            throw new IllegalArgumentException("responsePoints must be 0 to " + MAX_RESPONSE_POINTS);
        }
        double a0 = plant.a0();
        double a1 = plant.a1();
        double b = plant.b();
        double k1 = gains.positionGain();
        double k2 = gains.velocityGain();

        List<Double> roots =
                SecondOrderLoopResponse.positiveRoots(1, a1 * a1 - 2 * a0 - b * b * k2 * k2, a0 * a0 - b * b * k1 * k1);
        double[] crossovers = new double[roots.size()];
        double[] phases = new double[roots.size()];
        for (int i = 0; i < crossovers.length; i++) {
            crossovers[i] = Math.sqrt(roots.get(i));
            phases[i] = SecondOrderLoopResponse.loopPhase(plant, gains, crossovers[i]);
        }
        Optional<CrossoverMargins> phaseMargins =
                CrossoverMargins.of(crossovers, phases, LoopMatrices.stable(plant, gains));
        Double crossover =
                phaseMargins.map(CrossoverMargins::crossoverRadPerSec).orElse(null);
        Double phaseMargin =
                phaseMargins.map(CrossoverMargins::phaseMarginDegrees).orElse(null);
        Double delayMargin =
                phaseMargins.map(CrossoverMargins::delayMarginSeconds).orElse(null);

        Double gainMargin = null;
        Double gainMarginFrequency = null;
        Double gainReduction = null;
        List<Double> phaseCrossovers = new ArrayList<>();
        phaseCrossovers.add(0.0);
        if (k2 != 0) {
            double s = a0 - k1 * a1 / k2;
            if (s > 0) {
                phaseCrossovers.add(Math.sqrt(s));
            }
        }
        for (double w : phaseCrossovers) {
            double[] l = SecondOrderLoopResponse.loop(plant, gains, w);
            if (!(l[0] < 0) || !Double.isFinite(l[0])) {
                continue; // real and positive (or at a pole): not a -180 degree crossing
            }
            double magnitude = Math.hypot(l[0], l[1]);
            if (magnitude < 1) {
                if (gainMargin == null || 1 / magnitude < gainMargin) {
                    gainMargin = 1 / magnitude;
                    gainMarginFrequency = w;
                }
            } else if (magnitude > 1) {
                gainReduction = gainReduction == null ? 1 / magnitude : Math.max(gainReduction, 1 / magnitude);
            }
        }

        double c0 = LoopMatrices.closedLoopStiffness(plant, gains);
        double c1 = LoopMatrices.closedLoopDamping(plant, gains);
        double p = c1 * c1 - 2 * c0;
        double bandwidthSquared = 0.5 * (-p + Math.hypot(p, 2 * c0));
        double bandwidth = Math.sqrt(bandwidthSquared);

        double center = Math.sqrt(Math.abs(c0));
        double low = center * Math.pow(10, -SecondOrderLoopResponse.DECADES_EACH_SIDE);
        double high = center * Math.pow(10, SecondOrderLoopResponse.DECADES_EACH_SIDE);
        if (crossover != null) {
            low = Math.min(low, crossover / 100);
            high = Math.max(high, crossover * 100);
        }
        double[] peak = SecondOrderLoopResponse.peakSensitivity(plant, gains, low, high);

        List<FrequencyPoint> response = new ArrayList<>(responsePoints);
        double previousPhase = Double.NaN;
        for (int i = 0; i < responsePoints; i++) {
            double w = responsePoints == 1 ? center : low * Math.pow(high / low, (double) i / (responsePoints - 1));
            double[] l = SecondOrderLoopResponse.loop(plant, gains, w);
            double phase = Math.toDegrees(Math.atan2(l[1], l[0]));
            if (!Double.isNaN(previousPhase)) {
                while (phase - previousPhase > 180) {
                    phase -= 360;
                }
                while (phase - previousPhase < -180) {
                    phase += 360;
                }
            }
            previousPhase = phase;
            double[] t = SecondOrderLoopResponse.closedLoop(plant, gains, w);
            response.add(new FrequencyPoint(
                    w,
                    20 * Math.log10(Math.hypot(l[0], l[1])),
                    phase,
                    20 * Math.log10(SecondOrderLoopResponse.sensitivity(plant, gains, w)),
                    20 * Math.log10(Math.hypot(t[0], t[1]))));
        }
        // L is strictly proper, so |S(j w)| -> 1 as w -> infinity: the supremum is at least 1
        boolean finitePeak = peak[1] > 1;
        return new LoopMargins(
                crossover,
                phaseMargin,
                delayMargin,
                gainMargin,
                gainMarginFrequency,
                gainReduction,
                finitePeak ? peak[1] : 1.0,
                finitePeak ? peak[0] : null,
                bandwidth,
                response);
    }

    static double[] grid(double low, double high, int points) {
        if (!(low > 0) || !Double.isFinite(high) || !(high > low)) {
            throw new IllegalArgumentException("need 0 < low < high, finite; got " + low + ", " + high);
        }
        if (points < MIN_POINTS || points > MAX_POINTS) {
            throw new IllegalArgumentException("points must be in [" + MIN_POINTS + ", " + MAX_POINTS + "]");
        }
        double[] w = new double[points];
        double logLow = Math.log(low);
        double span = Math.log(high) - logLow;
        for (int i = 0; i < points; i++) {
            w[i] = Math.exp(logLow + span * i / (points - 1));
        }
        w[0] = low;
        w[points - 1] = high;
        return w;
    }
}
