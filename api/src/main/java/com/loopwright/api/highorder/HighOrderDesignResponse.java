package com.loopwright.api.highorder;

import com.fasterxml.jackson.annotation.JsonInclude;
import com.loopwright.api.loop.Law;
import com.loopwright.api.loop.LoadStep;
import com.loopwright.api.loop.Observer;
import com.loopwright.api.loop.OutputFeedback;
import com.loopwright.api.result.Gain;
import com.loopwright.api.result.GammaBound;
import com.loopwright.api.result.GammaInterval;
import com.loopwright.api.result.Riccati;
import com.loopwright.api.result.Simulated;
import com.loopwright.api.result.Target;
import com.loopwright.api.result.Verification;
import java.util.List;

/**
 * Body of a successful POST /v1/designs/high-order. Every matrix and gain is in the companion coordinates z of
 * the request (z_1 the output-side state, z_n the state u drives); gamma bounds the L2 gain from w to
 * z_perf = [rho_1 z_1, ..., rho_n z_n, u]. target, riccati, gammaBounds, gammaIntervals, weights, gain, simulated
 * and verification are the records every design result shares (package {@code api.result}); this order-n result
 * adds order, coordinates and specMatching. law, observer, outputFeedback and loadStep are present only when the
 * request asked for integral action or position-only sensing (observer and outputFeedback only for the latter);
 * robust only when the request had a box. Polynomial coefficients are highest power first.
 */
public record HighOrderDesignResponse(
        int order,
        Coordinates coordinates,
        Target target,
        SpecMatching specMatching,
        Riccati riccati,
        List<GammaBound> gammaBounds,
        List<GammaInterval> gammaIntervals,
        double gammaMin,
        double gamma,
        List<Double> weights,
        Gain gain,
        Simulated simulated,
        Verification verification,
        List<String> notes,
        List<String> noteCodes,
        List<String> cautions,
        @JsonInclude(JsonInclude.Include.NON_NULL) Law law,
        @JsonInclude(JsonInclude.Include.NON_NULL) Observer observer,
        @JsonInclude(JsonInclude.Include.NON_NULL) OutputFeedback outputFeedback,
        @JsonInclude(JsonInclude.Include.NON_NULL) LoadStep loadStep,
        @JsonInclude(JsonInclude.Include.NON_NULL) HighOrderRobustDesign robust) {

    public HighOrderDesignResponse {
        gammaBounds = List.copyOf(gammaBounds);
        gammaIntervals = List.copyOf(gammaIntervals);
        weights = List.copyOf(weights);
        notes = List.copyOf(notes);
        noteCodes = List.copyOf(noteCodes);
        if (notes.size() != noteCodes.size()) {
            throw new IllegalArgumentException("one code per note");
        }
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

    /** Spec matching: iterations and residuals (0 iterations and the formula residuals when not asked for). */
    public record SpecMatching(
            boolean enabled,
            int iterations,
            double settlingTimeResidual,
            double overshootResidualPoints,
            double startingDampingRatio,
            double startingNaturalFrequency) {}
}
