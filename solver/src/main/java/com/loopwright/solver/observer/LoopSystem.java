package com.loopwright.solver.observer;

import org.ejml.data.DMatrixRMaj;

/**
 * A closed loop as one state space x' = a x + reference r + disturbance w + noise v, with rows for the tracked
 * output y, the command u and the performance output z (weighted states and u). Every matrix is copied.
 *
 * @param a           closed-loop state matrix, N x N
 * @param reference   N x 1
 * @param disturbance N x 1 (B1 on the plant states)
 * @param noise       N x 1 (the observer gain on the observer states; zeros for full-state feedback)
 * @param output      1 x N, y
 * @param command     1 x N, u (the law has no feedthrough from w or v)
 * @param performance (m + 1) x N, z = [rho_i z_i; u]
 */
public record LoopSystem(
        DMatrixRMaj a,
        DMatrixRMaj reference,
        DMatrixRMaj disturbance,
        DMatrixRMaj noise,
        DMatrixRMaj output,
        DMatrixRMaj command,
        DMatrixRMaj performance) {

    public LoopSystem {
        a = a.copy();
        reference = reference.copy();
        disturbance = disturbance.copy();
        noise = noise.copy();
        output = output.copy();
        command = command.copy();
        performance = performance.copy();
    }

    @Override
    public DMatrixRMaj a() {
        return a.copy();
    }

    @Override
    public DMatrixRMaj reference() {
        return reference.copy();
    }

    @Override
    public DMatrixRMaj disturbance() {
        return disturbance.copy();
    }

    @Override
    public DMatrixRMaj noise() {
        return noise.copy();
    }

    @Override
    public DMatrixRMaj output() {
        return output.copy();
    }

    @Override
    public DMatrixRMaj command() {
        return command.copy();
    }

    @Override
    public DMatrixRMaj performance() {
        return performance.copy();
    }

    public int stateDimension() {
        return a.numRows;
    }
}
