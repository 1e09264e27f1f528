package com.loopwright.api.result;

import com.fasterxml.jackson.annotation.JsonInclude;
import java.util.List;

/**
 * The target closed-loop dynamics.
 *
 * @param dampingRatio             zeta of the dominant pair
 * @param naturalFrequency         wn of the dominant pair [rad/s]
 * @param dominantPoles            the dominant pair
 * @param auxiliaryPoles           the poles beyond the dominant pair (empty for an order-2 design)
 * @param characteristicPolynomial the closed-loop characteristic polynomial, highest power first, leading 1
 *                                 included: [1, alpha_{n-1}, ..., alpha_0]
 * @param handbookNaturalFrequency order 2 only: wn by the textbook rule of thumb, for comparison only
 * @param bindingSpecs             order 2 only: the specs met with equality by the target
 */
@JsonInclude(JsonInclude.Include.NON_NULL)
public record Target(
        double dampingRatio,
        double naturalFrequency,
        List<Pole> dominantPoles,
        List<Pole> auxiliaryPoles,
        List<Double> characteristicPolynomial,
        Double handbookNaturalFrequency,
        List<String> bindingSpecs) {
    public Target {
        dominantPoles = List.copyOf(dominantPoles);
        auxiliaryPoles = List.copyOf(auxiliaryPoles);
        characteristicPolynomial = List.copyOf(characteristicPolynomial);
        bindingSpecs = bindingSpecs == null ? null : List.copyOf(bindingSpecs);
    }
}
