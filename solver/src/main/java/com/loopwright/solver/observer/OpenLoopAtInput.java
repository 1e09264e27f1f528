package com.loopwright.solver.observer;

import org.ejml.data.DMatrixRMaj;

/**
 * The loop broken at the plant input: the plant driven by an injected input u_p, the controller (integrator,
 * observer, law) computing its command u_c; L(s) = -u_c / u_p = -command (sI - a)^-1 input.
 *
 * @param a       N x N
 * @param input   N x 1
 * @param command 1 x N
 */
public record OpenLoopAtInput(DMatrixRMaj a, DMatrixRMaj input, DMatrixRMaj command) {
    public OpenLoopAtInput {
        a = a.copy();
        input = input.copy();
        command = command.copy();
    }

    @Override
    public DMatrixRMaj a() {
        return a.copy();
    }

    @Override
    public DMatrixRMaj input() {
        return input.copy();
    }

    @Override
    public DMatrixRMaj command() {
        return command.copy();
    }
}
