package com.loopwright.solver.spec;

/**
 * Specs to (zeta, wn) by exact inversion: zeta from the overshoot formula, then wn = T(zeta)/t where T is the
 * exact normalized settling or rise time of the analytic step response.
 */
public final class SpecInverter {

    /** Handbook 10-90% rise time of a second-order loop, tr ~ 1.8/wn (common practice, from memory). */
    static final double HANDBOOK_RISE_CONSTANT = 1.8;

    /**
     * When a response peak sits on the settling band edge to within this log-distance from inside (for
     * example 2% overshoot with a 2% band), rounding decides whether it leaves the band and the settling time
     * would jump by a half period. The overshoot is then lowered by this relative amount, which keeps every
     * spec met as an upper limit and puts the peak measurably inside the band.
     */
    static final double BAND_TOUCH_GUARD = 1e-6;

    public SpecInversion invert(DesignSpec spec) {
        double zeta = OvershootDamping.dampingRatio(spec.overshootFraction());
        TimeSpec timeSpec = spec.timeSpec();
        if (timeSpec instanceof TimeSpec.SettlingTime settling) {
            var analysis = NormalizedSettlingTime.analyse(zeta, settling.bandFraction());
            if (peakTouchesBandFromInside(spec.overshootFraction(), analysis, settling.bandFraction())) {
                zeta = OvershootDamping.dampingRatio(spec.overshootFraction() * (1 - BAND_TOUCH_GUARD));
                analysis = NormalizedSettlingTime.analyse(zeta, settling.bandFraction());
            }
            double wn = analysis.normalizedTime() / settling.seconds();
            double handbookWn = Math.log(1 / settling.bandFraction()) / (zeta * settling.seconds());
            return new SpecInversion(new TargetDynamics(zeta, wn), handbookWn, analysis.bandTouchLogDistance());
        }
        double wn = timeSpec.normalizedTime(zeta) / timeSpec.seconds();
        return new SpecInversion(new TargetDynamics(zeta, wn), HANDBOOK_RISE_CONSTANT / timeSpec.seconds(), 0);
    }

    /** The first peak not counted outside the band, OS^(m+1), lies within the guard below the band edge. */
    private static boolean peakTouchesBandFromInside(
            double overshoot, NormalizedSettlingTime.SettlingAnalysis analysis, double band) {
        double nextPeak = Math.pow(overshoot, analysis.peaksOutsideBand() + 1);
        return nextPeak <= band && Math.log(band / nextPeak) < BAND_TOUCH_GUARD;
    }
}
