package com.loopwright.solver.fit;

/**
 * One estimated parameter with its standard error and 95% confidence interval (estimate +- t_{0.975, n-p} se,
 * from the covariance s^2 (J'J)^-1 at the optimum).
 */
public record FittedParameter(String name, double estimate, double standardError, double lower95,
                              double upper95) {

    public boolean covers(double value) {
        return value >= lower95 && value <= upper95;
    }
}
