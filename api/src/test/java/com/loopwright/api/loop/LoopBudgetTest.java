package com.loopwright.api.loop;

import static org.junit.jupiter.api.Assertions.assertEquals;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.api.design.ComputeBudget;
import org.junit.jupiter.api.Test;

/** The cost model charges the loop sections before anything runs (docs/limits-and-budgets.md, Cost model). */
class LoopBudgetTest {

    private final ComputeBudget budget = new ComputeBudget();
    private final ObjectMapper json = new ObjectMapper();

    private long units(String body) throws Exception {
        return budget.designUnits(json.readTree(body));
    }

    @Test
    void integralActionAndTheObserverAreCharged() throws Exception {
        String plant = "\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":1,\"b\":1,\"d\":1},"
                + "\"spec\":{\"settlingTime\":1,\"overshootPercent\":2}";
        assertEquals(ComputeBudget.DESIGN_UNITS, units("{" + plant + "}"));
        assertEquals(
                ComputeBudget.DESIGN_UNITS + ComputeBudget.LOOP_UNITS,
                units("{" + plant + ",\"integralAction\":true}"));
        assertEquals(
                ComputeBudget.DESIGN_UNITS + ComputeBudget.LOOP_UNITS + ComputeBudget.OBSERVER_UNITS,
                units("{" + plant + ",\"measurement\":\"position\"}"));
        assertEquals(
                ComputeBudget.DESIGN_UNITS + ComputeBudget.LOOP_UNITS + ComputeBudget.OBSERVER_UNITS,
                units("{" + plant + ",\"integralAction\":true,\"measurement\":\"position\"}"));
        assertEquals(ComputeBudget.DESIGN_UNITS, units("{" + plant + ",\"integralAction\":false}"));
    }
}
