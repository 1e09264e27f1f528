package com.loopwright.solver.spec;

/**
 * Unit step response of wn^2/(s^2 + 2 zeta wn s + wn^2) in normalized time tau = wn t, for any zeta > 0:
 * <pre>
 *   zeta &lt; 1:  y = 1 - exp(-zeta tau)/s sin(s tau + acos zeta),   s = sqrt(1 - zeta^2)
 *   zeta = 1:  y = 1 - exp(-tau)(1 + tau)
 *   zeta &gt; 1:  y = 1 - (r2 exp(-r1 tau) - r1 exp(-r2 tau))/(r2 - r1),   r1,2 = zeta -+ sqrt(zeta^2 - 1)
 * </pre>
 * and its rate dy/dtau, the impulse response e^(-zeta tau) sin(s tau)/s, tau e^(-tau) and
 * (exp(-r1 tau) - exp(-r2 tau))/(r2 - r1) (r1 r2 = 1) in the same three cases.
 */
public final class NormalizedStepResponse {

    /** Below this distance from 1 the critically damped formula is used (its neighbours lose digits there). */
    private static final double CRITICAL_TOLERANCE = 1e-7;

    private final double dampingRatio;
    /** s = sqrt(1 - zeta^2) and acos zeta (underdamped), computed once: root finders evaluate y many times. */
    private final double dampedRatio;

    private final double phase;

    public NormalizedStepResponse(double dampingRatio) {
        if (!(dampingRatio > 0) || !Double.isFinite(dampingRatio)) {
            throw new IllegalArgumentException("damping ratio must be positive and finite: " + dampingRatio);
        }
        this.dampingRatio = dampingRatio;
        this.dampedRatio = dampingRatio < 1 ? Math.sqrt(1 - dampingRatio * dampingRatio) : 0;
        this.phase = dampingRatio < 1 ? Math.acos(dampingRatio) : 0;
    }

    public double dampingRatio() {
        return dampingRatio;
    }

    /** True when the response oscillates about its final value (zeta &lt; 1). */
    public boolean underdamped() {
        return dampingRatio < 1 - CRITICAL_TOLERANCE;
    }

    /** Damped frequency over wn, sqrt(1 - zeta^2), for the underdamped case. */
    public double dampedFrequencyRatio() {
        return dampedRatio;
    }

    /** y(tau) for tau &gt;= 0. */
    public double at(double tau) {
        double zeta = dampingRatio;
        if (underdamped()) {
            return 1 - Math.exp(-zeta * tau) / dampedRatio * Math.sin(dampedRatio * tau + phase);
        }
        if (dampingRatio <= 1 + CRITICAL_TOLERANCE) {
            return 1 - Math.exp(-tau) * (1 + tau);
        }
        double root = Math.sqrt(zeta * zeta - 1);
        double r1 = zeta - root;
        double r2 = zeta + root;
        return 1 - (r2 * Math.exp(-r1 * tau) - r1 * Math.exp(-r2 * tau)) / (r2 - r1);
    }

    /** acos zeta, the phase of the underdamped response (0 otherwise), computed once. */
    public double phase() {
        return phase;
    }

    /** True when zeta is within the critical tolerance of 1, where the critically damped formulas are used. */
    public boolean criticallyDamped() {
        return !underdamped() && dampingRatio <= 1 + CRITICAL_TOLERANCE;
    }

    /** dy/dtau for tau &gt;= 0 (the impulse response of the normalized loop). */
    public double rate(double tau) {
        double zeta = dampingRatio;
        if (underdamped()) {
            return Math.exp(-zeta * tau) / dampedRatio * Math.sin(dampedRatio * tau);
        }
        if (criticallyDamped()) {
            return tau * Math.exp(-tau);
        }
        double root = Math.sqrt(zeta * zeta - 1);
        double r1 = 1 / (zeta + root);
        double r2 = zeta + root;
        return (Math.exp(-r1 * tau) - Math.exp(-r2 * tau)) / (r2 - r1);
    }

    /** Normalized time of the k-th extremum (k &gt;= 1) of the underdamped response: tau_k = k pi / s. */
    public double extremumTime(int k) {
        return k * Math.PI / dampedFrequencyRatio();
    }
}
