package com.loopwright.solver.norm;

import org.ejml.data.DMatrixRMaj;
import org.hipparchus.optim.MaxEval;
import org.hipparchus.optim.nonlinear.scalar.GoalType;
import org.hipparchus.optim.univariate.BrentOptimizer;
import org.hipparchus.optim.univariate.SearchInterval;
import org.hipparchus.optim.univariate.UnivariateObjectiveFunction;
import org.hipparchus.optim.univariate.UnivariatePointValuePair;

/**
 * Independent reference for ||G||_inf (common practice): sigma_max(G(jw)) on a dense log-spaced grid (plus w = 0),
 * evaluated with Hipparchus only ({@link IndependentFrequencyResponse}), and every local maximum of the grid
 * refined by Hipparchus' Brent optimizer between its grid neighbours. Shares no code with the calculator.
 */
final class DenseGridPeak {

    /** Cap on Brent evaluations per local maximum. */
    static final int MAX_BRENT_EVALUATIONS = 300;

    record Peak(double frequency, double gain, double gridMaximum) {}

    private DenseGridPeak() {}

    /** Grid of {@code points} log-spaced frequencies from {@code low} to {@code high} [rad/s], then Brent. */
    static Peak of(DMatrixRMaj a, DMatrixRMaj b, DMatrixRMaj c, double low, double high, int points) {
        IndependentFrequencyResponse response = new IndependentFrequencyResponse(a, b, c);
        double[] w = new double[points + 1];
        double[] g = new double[points + 1];
        w[0] = 0.0;
        g[0] = response.maxSingularValue(0.0);
        for (int i = 0; i < points; i++) {
            w[i + 1] = low * Math.pow(high / low, i / (points - 1.0));
            g[i + 1] = response.maxSingularValue(w[i + 1]);
        }
        double gridMaximum = 0.0;
        for (double v : g) {
            gridMaximum = Math.max(gridMaximum, v);
        }
        double bestW = 0.0;
        double bestG = g[0];
        BrentOptimizer brent = new BrentOptimizer(1e-12, 1e-14 * high);
        for (int i = 1; i <= points; i++) {
            boolean localMax = g[i] >= g[i - 1] && (i == points || g[i] >= g[i + 1]);
            if (g[i] > bestG) {
                bestG = g[i];
                bestW = w[i];
            }
            if (localMax && i < points) {
                UnivariatePointValuePair refined = brent.optimize(
                        new MaxEval(MAX_BRENT_EVALUATIONS),
                        new UnivariateObjectiveFunction(response::maxSingularValue),
                        GoalType.MAXIMIZE,
                        new SearchInterval(w[i - 1], w[i + 1], w[i]));
                if (refined.getValue() > bestG) {
                    bestG = refined.getValue();
                    bestW = refined.getPoint();
                }
            }
        }
        return new Peak(bestW, bestG, gridMaximum);
    }
}
