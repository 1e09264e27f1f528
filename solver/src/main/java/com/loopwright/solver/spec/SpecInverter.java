package com.loopwright.solver.spec;

/**
 * Specs to (zeta, wn) by exact inversion: zeta from the overshoot formula, then wn = T(zeta)/t where T is the
 * exact normalized settling or rise time of the analytic step response.
 */
public final class SpecInverter {

    /** Handbook 10-90% rise time of a second-order loop, tr ~ 1.8/wn (common practice, from memory). */
    static final double HANDBOOK_RISE_CONSTANT = 1.8;

    public SpecInversion invert(DesignSpec spec) {
        double zeta = OvershootDamping.dampingRatio(spec.overshootFraction());
        TimeSpec timeSpec = spec.timeSpec();
        if (timeSpec instanceof TimeSpec.SettlingTime settling) {
            var analysis = NormalizedSettlingTime.analyse(zeta, settling.bandFraction());
            double wn = analysis.normalizedTime() / settling.seconds();
            double handbookWn = Math.log(1 / settling.bandFraction()) / (zeta * settling.seconds());
            return new SpecInversion(new TargetDynamics(zeta, wn), handbookWn, analysis.bandTouchLogDistance());
        }
        double wn = timeSpec.normalizedTime(zeta) / timeSpec.seconds();
        return new SpecInversion(new TargetDynamics(zeta, wn), HANDBOOK_RISE_CONSTANT / timeSpec.seconds(), 0);
    }
}
