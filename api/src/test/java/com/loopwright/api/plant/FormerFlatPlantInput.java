package com.loopwright.api.plant;

import java.util.List;

/**
 * The plant record as it was before the sealed wire model, kept verbatim as the oracle of
 * {@link PlantDecodingEquivalenceTest}: decoding through it is the behaviour the recorded answers were made with.
 *
 * <p>Former documentation: the plant as sent by the caller (nullable until validated). Without {@code form} (or with
 * {@code "form": "canonical"}) it is the canonical coefficients of x1' = x2, x2' = -a0 x1 - a1 x2 + b u + d w.
 * Otherwise {@code form} selects one description and only that description's fields may be present:
 * <ul>
 *   <li>{@code rotaryAxis}: inertia, viscousFriction, torqueConstant, optional gearRatio;</li>
 *   <li>{@code massSpringDamper}: mass, damping, stiffness;</li>
 *   <li>{@code secondOrderTransferFunction}: gain, naturalFrequency, dampingRatio, or numerator and
 *       denominator; optional disturbanceNumerator;</li>
 *   <li>{@code stateSpace}: a (2 x 2), b2, b1.</li>
 * </ul>
 */
record FormerFlatPlantInput(
        String form,
        Double a0,
        Double a1,
        Double b,
        Double d,
        Double inertia,
        Double viscousFriction,
        Double torqueConstant,
        Double gearRatio,
        Double mass,
        Double damping,
        Double stiffness,
        Double gain,
        Double naturalFrequency,
        Double dampingRatio,
        List<Double> numerator,
        List<Double> denominator,
        Double disturbanceNumerator,
        List<List<Double>> a,
        List<Double> b2,
        List<Double> b1) {

    /** The canonical coefficients, without a form. */
    FormerFlatPlantInput(Double a0, Double a1, Double b, Double d) {
        this(
                null, a0, a1, b, d, null, null, null, null, null, null, null, null, null, null, null, null, null, null,
                null, null);
    }
}
