package com.loopwright.solver.design;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.spec.TargetDynamics;
import java.util.List;
import java.util.OptionalDouble;
import org.junit.jupiter.api.Test;

/** The gamma bound types shared by the order-2 and the order-n designs. */
class GammaBoundTest {

    private final ClosedFormDesigner designer = new ClosedFormDesigner();

    /** The binding order-2 bound is the largest one, and gamma_min equals it (definition of gamma_min). */
    @Test
    void exactlyOneClosedFormBoundBindsAndItSetsGammaMin() {
        ClosedFormDesign design = designer.design(
                new CanonicalPlant(0, 0.48, 400, 400),
                new TargetDynamics(0.8, 30),
                new GammaChoice.MarginOverMinimum(1.2));
        List<GammaBound> bounds = design.gammaBounds();
        assertEquals(
                GammaCondition.CLOSED_FORM,
                bounds.stream().map(GammaBound::condition).toList());
        List<GammaBound> binding = bounds.stream().filter(GammaBound::binding).toList();
        assertEquals(1, binding.size());
        assertEquals(design.gammaMin(), binding.get(0).gammaLowerBound());
        for (GammaBound b : bounds) {
            assertTrue(b.gammaLowerBound() <= design.gammaMin());
            assertTrue(b.headroom().isPresent());
            assertEquals(0, b.stateIndex());
        }
    }

    /** Without a disturbance input (d = 0) every bound is 0 and none binds. */
    @Test
    void noBoundBindsWithoutADisturbanceInput() {
        ClosedFormDesign design = designer.design(
                new CanonicalPlant(4, 0.2, 2, 0), new TargetDynamics(0.8, 6), new GammaChoice.MarginOverMinimum(1.2));
        assertFalse(design.gammaBounds().stream().anyMatch(GammaBound::binding));
    }

    @Test
    void meaningsNameTheStateOnlyForPerStateConditions() {
        assertEquals("state weight rho_3 is real", GammaCondition.WEIGHT_REAL.meaning(3));
        assertThrows(IllegalStateException.class, GammaCondition.WEIGHT_REAL::meaning);
        assertEquals(GammaCondition.P_POSITIVE_DEFINITE.meaning(), GammaCondition.P_POSITIVE_DEFINITE.meaning(0));
        GammaBound orderN = new GammaBound(GammaCondition.WEIGHT_REAL, 2, 1.5, false, OptionalDouble.empty());
        assertEquals("state weight rho_2 is real", orderN.meaning());
        assertTrue(orderN.satisfiable());
        // order 2, D = 0 on a non-strict condition with d = 0 holds at equality; on a strict one it does not
        assertTrue(GammaBound.closedForm(GammaCondition.POSITION_WEIGHT_REAL, 0, 0, false)
                .satisfiable());
        assertFalse(
                GammaBound.closedForm(GammaCondition.P11_POSITIVE, 0, 0, false).satisfiable());
    }
}
