package com.loopwright.solver.riccati;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import com.loopwright.solver.design.RiccatiSolution;
import org.ejml.data.DMatrixRMaj;
import org.junit.jupiter.api.Test;

class RiccatiSolutionTest {

    @Test
    void copiesMatrixOnConstructionAndAccess() {
        DMatrixRMaj p = new DMatrixRMaj(new double[][] {{2, 1}, {1, 3}});
        RiccatiSolution solution = new RiccatiSolution(p, 1e-16, 7);
        p.set(0, 0, -99);
        assertEquals(2.0, solution.p().get(0, 0));
        solution.p().set(0, 0, -99);
        assertEquals(2.0, solution.p().get(0, 0));
    }

    @Test
    void rejectsInvalidComponents() {
        DMatrixRMaj p = new DMatrixRMaj(2, 2);
        assertThrows(IllegalArgumentException.class, () -> new RiccatiSolution(new DMatrixRMaj(2, 3), 0, 1));
        assertThrows(IllegalArgumentException.class, () -> new RiccatiSolution(p, Double.NaN, 1));
        assertThrows(IllegalArgumentException.class, () -> new RiccatiSolution(p, -1, 1));
        assertThrows(IllegalArgumentException.class, () -> new RiccatiSolution(p, 0, -1));
        assertThrows(NullPointerException.class, () -> new RiccatiSolution(null, 0, 1));
    }
}
