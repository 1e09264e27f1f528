package com.loopwright.solver.designspace;

import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.spec.NormalizedRiseTime;
import com.loopwright.solver.spec.NormalizedSettlingTime;
import com.loopwright.solver.spec.OvershootDamping;

/**
 * Step figures of a two-state loop from its characteristic polynomial s^2 + c1 s + c0 (c0 = a0 + b k1,
 * c1 = a1 + b k2), exact and without a simulation: the loop from r to x1 has no zero, so its step is the final
 * value times the normalized step of zeta_c = c1/(2 sqrt c0) in time wn_c t, wn_c = sqrt c0; the overshoot is
 * OS(zeta_c), the settling time T(zeta_c)/wn_c and the rise time R(zeta_c)/wn_c, the same inversion the spec step
 * uses; the peak command is {@link PeakCommand}.
 *
 * @param stable           c0 &gt; 0 and c1 &gt; 0
 * @param timeSeconds      settling (or rise) time, null when unstable or not measurable in double precision
 * @param overshootPercent overshoot [%], null when unstable
 * @param peakControl      peak |u| of the step, null when unstable
 */
record TwoStateStep(boolean stable, Double timeSeconds, Double overshootPercent, Double peakControl) {

    static final TwoStateStep UNSTABLE = new TwoStateStep(false, null, null, null);

    /**
     * @param settling     true: the settling time to the band; false: the 10-90% rise time
     * @param stepSize     the reference step; the peak command scales with its magnitude
     */
    static TwoStateStep of(
            CanonicalPlant plant, FeedbackGains gains, boolean settling, double bandFraction, double stepSize) {
        double c0 = plant.a0() + plant.b() * gains.positionGain();
        double c1 = plant.a1() + plant.b() * gains.velocityGain();
        if (!(c0 > 0 && c1 > 0) || !Double.isFinite(c0) || !Double.isFinite(c1)) {
            return UNSTABLE;
        }
        double wn = Math.sqrt(c0);
        double zeta = c1 / (2 * wn);
        double overshoot = zeta < 1 ? 100 * OvershootDamping.overshoot(zeta) : 0;
        Double time;
        try {
            double normalized = settling ? NormalizedSettlingTime.of(zeta, bandFraction) : NormalizedRiseTime.of(zeta);
            time = Double.isFinite(normalized / wn) ? normalized / wn : null;
        } catch (IllegalArgumentException e) {
            time = null; // a damping ratio too small for the root finder: not measurable
        }
        double peak = Math.abs(stepSize) * PeakCommand.ofUnitStep(plant, gains);
        return new TwoStateStep(true, time, overshoot, Double.isFinite(peak) ? peak : null);
    }
}
