package com.loopwright.solver.riccati;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.junit.jupiter.api.Test;

class RiccatiResidualTest {

    @Test
    void exactSolutionHasZeroResidual() {
        // source: direct substitution; a = -1, r = -1, q = 3, p = 1: -1 - 1 - 1 + 3 = 0
        assertEquals(0.0, RiccatiResidual.relative(scalar(-1), scalar(-1), scalar(3), scalar(1)));
        // source: direct substitution; A = diag(-1, -2), R = 0, Q = diag(2, 4), P = I:
        // A'P + PA = diag(-2, -4) = -Q
        DMatrixRMaj a = new DMatrixRMaj(new double[][] {{-1, 0}, {0, -2}});
        DMatrixRMaj q = new DMatrixRMaj(new double[][] {{2, 0}, {0, 4}});
        assertEquals(0.0, RiccatiResidual.relative(a, new DMatrixRMaj(2, 2), q, CommonOps_DDRM.identity(2)));
    }

    @Test
    void matchesDefinitionEvaluatedByHand() {
        // source: the definition; a = -1, r = 1, q = 1, p = 2: terms A'P = -2, PA = -2, PRP = 4, Q = 1,
        // residual |-2 - 2 + 4 + 1| / (2 + 2 + 4 + 1) = 1/9
        assertEquals(1.0 / 9.0, RiccatiResidual.relative(scalar(-1), scalar(1), scalar(1), scalar(2)), 1e-16);
        // source: the definition; A = [[0, 1], [0, 0]], R = 0, Q = 0, P = I:
        // A'P = [[0, 0], [1, 0]], PA = [[0, 1], [0, 0]], sum has norm sqrt(2), denominator 1 + 1
        DMatrixRMaj a = new DMatrixRMaj(new double[][] {{0, 1}, {0, 0}});
        DMatrixRMaj zero = new DMatrixRMaj(2, 2);
        assertEquals(Math.sqrt(2) / 2, RiccatiResidual.relative(a, zero, zero, CommonOps_DDRM.identity(2)), 1e-16);
    }

    @Test
    void zeroDenominatorGivesZero() {
        DMatrixRMaj zero = new DMatrixRMaj(3, 3);
        assertEquals(0.0, RiccatiResidual.relative(zero, zero, zero, zero));
    }

    @Test
    void rejectsBadShapesAndNonFiniteEntries() {
        DMatrixRMaj i2 = CommonOps_DDRM.identity(2);
        assertThrows(
                IllegalArgumentException.class, () -> RiccatiResidual.relative(i2, i2, i2, CommonOps_DDRM.identity(3)));
        assertThrows(IllegalArgumentException.class, () -> RiccatiResidual.relative(new DMatrixRMaj(2, 3), i2, i2, i2));
        assertThrows(
                IllegalArgumentException.class,
                () -> RiccatiResidual.relative(i2, i2, scalar(Double.POSITIVE_INFINITY), i2));
        assertThrows(
                IllegalArgumentException.class,
                () -> RiccatiResidual.relative(scalar(1e300), scalar(1e300), scalar(1), scalar(1e300)));
    }

    private static DMatrixRMaj scalar(double value) {
        return new DMatrixRMaj(new double[][] {{value}});
    }
}
