package com.loopwright.solver.spec;

/**
 * Exact (zeta, wn) for a spec, with the handbook estimate beside it.
 *
 * @param target                          the exact target dynamics
 * @param handbookNaturalFrequencyRadPerSec wn from the textbook rule of thumb for the same spec: the envelope rule
 *                                        ts = ln(1/band)/(zeta wn) (about 4/(zeta wn) at 2%) for a settling
 *                                        spec, tr = 1.8/wn for a rise-time spec
 * @param settlingBandTouchLogDistance    for a settling spec, |ln(peak/band)| of the response peak nearest the
 *                                        band edge (0 when zeta &gt;= 1 or for a rise-time spec); below
 *                                        {@link #BAND_TOUCH_WARNING} the settling time sits near a jump
 */
public record SpecInversion(
        TargetDynamics target, double handbookNaturalFrequencyRadPerSec, double settlingBandTouchLogDistance) {

    /** A peak within about 5% of the band edge makes the settling time jump for tiny changes in damping. */
    public static final double BAND_TOUCH_WARNING = 0.05;

    public boolean nearBandTouch() {
        return settlingBandTouchLogDistance > 0 && settlingBandTouchLogDistance < BAND_TOUCH_WARNING;
    }
}
