package com.loopwright.solver.plant;

/**
 * One estimated parameter with its standard error and 95% confidence interval: estimate +- t_{0.975, n-p} se
 * from the covariance s^2 (J'J)^-1 at the optimum, clipped to the values the parameter can take (a dead time
 * at its bound 0 gets the one-sided interval [0, t se]). When the data do not determine the parameter (J'J
 * singular in its direction) the standard error and both ends are NaN: there is no interval to report.
 */
public record FittedParameter(String name, double estimate, double standardError, double lower95, double upper95) {

    /** Whether the data determine the parameter, so that the standard error and interval exist. */
    public boolean determined() {
        return Double.isFinite(standardError);
    }

    /** Whether the interval contains the value (never for an undetermined parameter). */
    public boolean covers(double value) {
        return value >= lower95 && value <= upper95;
    }
}
