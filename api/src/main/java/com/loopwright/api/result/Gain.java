package com.loopwright.api.result;

import java.util.List;

/**
 * The state-feedback law.
 *
 * @param k             the gains on the design states, one per state (order 2: [k1, k2])
 * @param referenceGain kr, which gives unit DC gain from the reference r to the tracked output
 * @param law           the law in words, e.g. u = kr*r - (k1*x1 + k2*x2)
 */
public record Gain(List<Double> k, double referenceGain, String law) {
    public Gain {
        k = List.copyOf(k);
    }
}
