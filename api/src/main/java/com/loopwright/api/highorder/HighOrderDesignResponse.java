package com.loopwright.api.highorder;

import com.fasterxml.jackson.annotation.JsonInclude;
import com.loopwright.api.design.DesignResponse;
import java.util.List;

/**
 * Body of a successful POST /v1/designs/high-order. Every matrix and gain is in the companion coordinates z of
 * the request (z_1 the output-side state, z_n the state u drives); gamma bounds the L2 gain from w to
 * z_perf = [rho_1 z_1, ..., rho_n z_n, u].
 */
public record HighOrderDesignResponse(
        int order,
        Coordinates coordinates,
        Target target,
        SpecMatching specMatching,
        Riccati riccati,
        List<Bound> gammaBounds,
        List<GammaInterval> gammaIntervals,
        double gammaMin,
        double gamma,
        List<Double> weights,
        Gain gain,
        Simulated simulated,
        Verification verification,
        List<String> notes,
        List<String> cautions) {

    public HighOrderDesignResponse {
        gammaBounds = List.copyOf(gammaBounds);
        gammaIntervals = List.copyOf(gammaIntervals);
        weights = List.copyOf(weights);
        notes = List.copyOf(notes);
        cautions = List.copyOf(cautions);
    }

    /**
     * The companion plant the design used and how it relates to the request's coordinates.
     *
     * @param frame     "companion" when the request gave the companion form, "stateSpace" when it was transformed
     * @param toPlant   T with x = T z (the identity for a companion request)
     * @param plantGain the gain in the request's coordinates, K T^-1: u = referenceGain r - plantGain . x
     * @param controllabilityCondition stateSpace frame only (else absent): 2-norm condition number of the
     *                  controllability matrix [B2, A B2, ...]; the plantGain may lose up to log10 of it in digits
     */
    public record Coordinates(
            String frame,
            List<Double> denominator,
            List<Double> numerator,
            double b,
            List<Double> disturbance,
            List<List<Double>> toPlant,
            List<Double> plantGain,
            @JsonInclude(JsonInclude.Include.NON_NULL) Double controllabilityCondition) {}

    /** The requested closed loop: dominant pair, auxiliary poles and the polynomial alpha_0 .. alpha_{n-1}. */
    public record Target(
            double dampingRatio,
            double naturalFrequency,
            List<DesignResponse.PoleView> dominantPoles,
            List<DesignResponse.PoleView> auxiliaryPoles,
            List<Double> polynomial) {}

    /** Spec matching: iterations and residuals (0 iterations and the formula residuals when not asked for). */
    public record SpecMatching(
            boolean enabled,
            int iterations,
            double settlingTimeResidual,
            double overshootResidualPoints,
            double startingDampingRatio,
            double startingNaturalFrequency) {}

    /** P in companion coordinates, from the pole-matched linear system, and the numeric re-solve. */
    public record Riccati(
            List<List<Double>> p,
            double residualNorm,
            double reciprocalCondition,
            int newtonSteps,
            int bisectionSteps,
            double numericRelativeDifference,
            double numericResidualNorm,
            int numericIterations) {}

    /** One lower bound on gamma; state is the 1-based index for a weight condition, else 0. */
    public record Bound(String condition, int state, String meaning, double gammaLowerBound, boolean binding) {}

    /**
     * One interval of the feasible gamma set: every gamma strictly between lower and upper completes the design.
     * upper and upperBinding are absent when the interval is unbounded (JSON has no infinity).
     */
    @JsonInclude(JsonInclude.Include.NON_NULL)
    public record GammaInterval(
            double lower, Double upper, boolean unbounded, IntervalEnd lowerBinding, IntervalEnd upperBinding) {}

    /** What ends an interval: a requirement (state is the 1-based index for a weight, else 0) or a search limit. */
    public record IntervalEnd(String condition, int state, String meaning) {}

    /** u = referenceGain r - sum k_j z_j. */
    public record Gain(List<Double> k, double referenceGain) {}

    /** Simulated step of the actual closed loop, zeros included. */
    public record Simulated(
            double riseTime,
            double settlingTime,
            double overshootPercent,
            double undershootPercent,
            double peakControl,
            double horizon,
            int samples) {}

    /**
     * Closed-loop H-infinity norm from w to z_perf, and whether the design is certified.
     *
     * @param hinfNorm                  certified upper bound: never below the true norm, at most a factor
     *                                  (1 + hinfNormRelativeTolerance) above it
     * @param peakFrequency             frequency [rad/s] of the largest evaluated gain, refined to a local maximum
     * @param hinfNormRelativeTolerance the relative tolerance of hinfNorm
     */
    public record Verification(
            double hinfNorm,
            double peakFrequency,
            double hinfNormRelativeTolerance,
            boolean certified,
            boolean specsMet) {}
}
