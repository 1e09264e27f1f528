package com.loopwright.solver.pipeline;

import org.ejml.data.DMatrixRMaj;

/**
 * The law of the loop with integral action and/or an observer, in the caller's state-space coordinates x = T z:
 * <pre>
 *   u = kr r + ki xi - K_x x_hat,   xi' = r - y,   y = c x,
 *   x_hat' = A x_hat + B2 u + L_x (y - c x_hat)   (position-only sensing; x_hat = x with full state),
 *   K_x = K_z T^-1,   L_x = T L_z,   c = first row of T^-1 (y = z1).
 * </pre>
 * ki and kr do not depend on the coordinates (xi integrates the same y).
 *
 * @param stateGain     K_x as a 1 x 2 row
 * @param integralGain  ki, null without integral action
 * @param referenceGain kr
 * @param observerGain  L_x as a 2 x 1 column, null with full-state sensing
 * @param trackedOutput c as a 1 x 2 row: the measured and tracked output
 */
public record CallerLoopLaw(
        DMatrixRMaj stateGain,
        Double integralGain,
        double referenceGain,
        DMatrixRMaj observerGain,
        DMatrixRMaj trackedOutput) {

    public CallerLoopLaw {
        stateGain = stateGain.copy();
        observerGain = observerGain == null ? null : observerGain.copy();
        trackedOutput = trackedOutput.copy();
    }

    @Override
    public DMatrixRMaj stateGain() {
        return stateGain.copy();
    }

    @Override
    public DMatrixRMaj observerGain() {
        return observerGain == null ? null : observerGain.copy();
    }

    @Override
    public DMatrixRMaj trackedOutput() {
        return trackedOutput.copy();
    }
}
