package com.loopwright.api.verification;

/**
 * The plant of POST /v1/verifications: the canonical coefficients of x1' = x2, x2' = -a0 x1 - a1 x2 + b u + d w with
 * {@code "form": "canonical"}, the same object as the canonical plant of POST /v1/designs. Gains the caller already
 * has act on exactly these states, so no other form is taken here; the form is required all the same, so that one
 * plant object is valid on both endpoints.
 *
 * @param form the plant form; must be "canonical"
 * @param a0   stiffness coefficient [1/s^2]
 * @param a1   damping coefficient [1/s]
 * @param b    actuator input gain
 * @param d    disturbance input gain
 */
public record VerificationPlantInput(String form, Double a0, Double a1, Double b, Double d) {

    /** The one form this endpoint takes. */
    static final String CANONICAL_FORM = "canonical";
}
