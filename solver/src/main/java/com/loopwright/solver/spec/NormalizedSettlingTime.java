package com.loopwright.solver.spec;

import com.loopwright.solver.numeric.BracketedRoot;

/**
 * Exact normalized settling time T(zeta) = wn ts: the last time the unit-wn step response leaves the band
 * |y - 1| &lt;= band and never returns.
 *
 * <p>For zeta &lt; 1 the error y - 1 has extrema at tau_k = k pi / s of magnitude OS^k (OS the overshoot fraction),
 * and is monotone between them. If m peaks exceed the band, the last exit lies between tau_m and the next zero
 * of y - 1 at ((m + 1) pi - acos zeta)/s, where |y - 1| falls monotonically through the band edge; if none
 * exceeds it (m = 0), it is the first crossing of 1 - band on the initial rise. For zeta &gt;= 1 the response
 * is monotone and T is its crossing of 1 - band. T jumps wherever a peak just touches the band.
 */
public final class NormalizedSettlingTime {

    /** Cap on the peaks counted: with zeta &gt;= 1e-3 and band &gt;= 1e-4 there are fewer than 3000. */
    static final int MAX_PEAKS = 100_000;

    private NormalizedSettlingTime() {}

    /**
     * @param dampingRatio zeta &gt; 0
     * @param bandFraction settling band as a fraction of the final value, in (0, 1)
     */
    public static SettlingAnalysis analyse(double dampingRatio, double bandFraction) {
        return analyse(new NormalizedStepResponse(dampingRatio), bandFraction);
    }

    /** {@link #analyse(double, double)} of a response already built (its acos zeta is computed once). */
    public static SettlingAnalysis analyse(NormalizedStepResponse response, double bandFraction) {
        if (!(bandFraction > 0 && bandFraction < 1)) {
            throw new IllegalArgumentException("settling band must lie in (0, 1): " + bandFraction);
        }
        double dampingRatio = response.dampingRatio();
        if (!response.underdamped()) {
            double tau = MonotoneRise.crossing(response, 1 - bandFraction);
            return new SettlingAnalysis(tau, 0, 0);
        }
        double overshoot = OvershootDamping.overshoot(dampingRatio);
        int peaksOutside = 0;
        double peak = 1;
        while (peak * overshoot > bandFraction) {
            if (++peaksOutside > MAX_PEAKS) {
                throw new IllegalArgumentException("damping ratio too small for a settling time: " + dampingRatio);
            }
            peak *= overshoot;
        }
        // Log-distance of the nearest peak magnitude to the band edge: small means T is close to a jump.
        double nextPeak = peak * overshoot;
        double lastOutside = peaksOutside == 0 ? Double.POSITIVE_INFINITY : Math.log(peak / bandFraction);
        double proximity = Math.min(lastOutside, Math.log(bandFraction / nextPeak));
        if (peaksOutside == 0) {
            double tau = BracketedRoot.bisection(t -> response.at(t) - (1 - bandFraction), 0, response.extremumTime(1));
            return new SettlingAnalysis(tau, 0, proximity);
        }
        double s = response.dampedFrequencyRatio();
        double lo = response.extremumTime(peaksOutside);
        double zeroOfError = ((peaksOutside + 1) * Math.PI - response.phase()) / s;
        double tau = BracketedRoot.bisection(t -> Math.abs(response.at(t) - 1) - bandFraction, lo, zeroOfError);
        return new SettlingAnalysis(tau, peaksOutside, proximity);
    }

    /** Shorthand for {@code analyse(zeta, band).normalizedTime()}. */
    public static double of(double dampingRatio, double bandFraction) {
        return analyse(dampingRatio, bandFraction).normalizedTime();
    }

    /**
     * @param normalizedTime       wn ts
     * @param peaksOutsideBand      how many peaks of the error exceed the band before the last exit
     * @param bandTouchLogDistance  |ln(peak / band)| of the peak nearest the band edge (0 for zeta &gt;= 1,
     *                              where there are no peaks); below ~0.05 the settling time is close to a jump
     */
    public record SettlingAnalysis(double normalizedTime, int peaksOutsideBand, double bandTouchLogDistance) {}
}
