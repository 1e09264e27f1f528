package com.loopwright.api.highorder;

import com.loopwright.api.robustness.ParameterRangeInput;
import java.util.List;

/**
 * The robust member of a high-order request: the order-n law that meets the spec on every corner and seeded Monte
 * Carlo sample of a box over the companion coefficients (nullable until validated).
 *
 * @param uncertainty   the companion box (required)
 * @param actuatorLimit every case's max |u| must stay at or below this, u units (optional)
 */
public record HighOrderRobustInput(HighOrderUncertaintyInput uncertainty, Double actuatorLimit) {

    /**
     * Ranges of the companion plant's coefficients (absent or null: fixed at nominal), Monte Carlo count and seed.
     *
     * @param denominator       one range per coefficient of plant.denominator, in its order (highest power first,
     *                          the same length); spreadPercent 0 or null keeps one fixed, the leading 1 always
     * @param b                 the range of the input gain
     * @param monteCarloSamples seeded samples inside the box besides the corners
     * @param seed              their generator's seed
     */
    public record HighOrderUncertaintyInput(
            List<ParameterRangeInput> denominator, ParameterRangeInput b, Integer monteCarloSamples, Long seed) {}
}
