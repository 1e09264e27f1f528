package com.loopwright.solver.simulation;

import org.ejml.data.DMatrixRMaj;

/** Argument checks shared by the simulation records. */
final class MatrixChecks {

    private MatrixChecks() {}

    static void requireFinite(DMatrixRMaj matrix, String name) {
        for (int i = 0; i < matrix.getNumElements(); i++) {
            if (!Double.isFinite(matrix.data[i])) {
                throw new IllegalArgumentException(name + " entry (" + i / matrix.numCols + ", " + i % matrix.numCols
                        + ") is not finite: " + matrix.data[i]);
            }
        }
    }

    static void requireShape(DMatrixRMaj matrix, int rows, int cols, String name) {
        if (matrix == null) {
            throw new IllegalArgumentException(name + " must not be null");
        }
        if (matrix.numRows != rows || matrix.numCols != cols) {
            throw new IllegalArgumentException(
                    name + " must be " + rows + " x " + cols + ", got " + matrix.numRows + " x " + matrix.numCols);
        }
    }
}
