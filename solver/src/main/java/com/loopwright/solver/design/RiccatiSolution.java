package com.loopwright.solver.design;

import java.util.Objects;
import org.ejml.data.DMatrixRMaj;

/**
 * Stabilizing solution of {@code A'P + PA + PRP + Q = 0}.
 *
 * @param p symmetric n x n stabilizing solution ({@code A + RP} Hurwitz); stored and returned as copies
 * @param relativeResidual the relative Riccati residual (riccati.RiccatiResidual#relative) of P for the
 *                         equation that was solved
 * @param iterations number of matrix-sign-function Newton iterations performed
 */
public record RiccatiSolution(DMatrixRMaj p, double relativeResidual, int iterations) {

    public RiccatiSolution {
        Objects.requireNonNull(p, "p");
        if (p.numRows != p.numCols) {
            throw new IllegalArgumentException("P must be square, got " + p.numRows + "x" + p.numCols);
        }
        if (!Double.isFinite(relativeResidual) || relativeResidual < 0) {
            throw new IllegalArgumentException("relative residual must be finite and >= 0, got " + relativeResidual);
        }
        if (iterations < 0) {
            throw new IllegalArgumentException("iterations must be >= 0, got " + iterations);
        }
        p = p.copy();
    }

    /** Returns a copy of the solution matrix; mutating it does not affect this record. */
    @Override
    public DMatrixRMaj p() {
        return p.copy();
    }
}
