package com.loopwright.service;

import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.api.design.ComputeBudget;
import com.loopwright.service.routes.BatchRoute;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;

/** The cap on a batch's items computing at once and its flush delay are the ones openapi.yaml documents. */
class BatchWindowContractTest {

    @Test
    void theDocumentedItemsInFlightCapIsTheCodes() throws Exception {
        String contract = Files.readString(Path.of("..", "openapi.yaml")).replaceAll("\\s+", " ");
        assertTrue(
                contract.contains("(at most " + BatchRoute.MAX_ITEMS_IN_FLIGHT + " per batch)"),
                "openapi.yaml must state the items-in-flight cap " + BatchRoute.MAX_ITEMS_IN_FLIGHT);
    }

    @Test
    void theDocumentedBorrowLimitIsTheCodes() throws Exception {
        String borrow = "estimated at most " + BatchRoute.BORROW_MAX_WORK_UNITS + " work units";
        for (String file : new String[] {"openapi.yaml", "README.md", "docs/limits-and-budgets.md"}) {
            String text = Files.readString(Path.of("..", file)).replaceAll("\\s+", " ");
            assertTrue(text.contains(borrow), file + " must state which batch items may borrow a worker: " + borrow);
        }
    }

    @Test
    void theDocumentedWorkCapAndCostModelAreTheCodes() throws Exception {
        String contract = Files.readString(Path.of("..", "openapi.yaml")).replaceAll("\\s+", " ");
        String limits =
                Files.readString(Path.of("..", "docs", "limits-and-budgets.md")).replaceAll("\\s+", " ");
        for (String text : new String[] {contract, limits}) {
            assertTrue(text.contains(ComputeBudget.MAX_REQUEST_WORK_UNITS + " work units"), "the work cap");
            assertTrue(
                    text.contains("a design " + ComputeBudget.DESIGN_UNITS + ", a verify object "
                            + ComputeBudget.VERIFY_UNITS + ", each uncertain case " + ComputeBudget.UNCERTAIN_CASE_UNITS
                            + " with " + ComputeBudget.CORNER_CASES + " corners, each disturbance "
                            + ComputeBudget.DISTURBANCE_UNITS + ", actuatorLimit " + ComputeBudget.SATURATION_UNITS
                            + ", sampling " + ComputeBudget.SAMPLING_UNITS + ", findLongest "
                            + ComputeBudget.LONGEST_PERIOD_UNITS
                            + ", inputDelay " + ComputeBudget.DELAY_UNITS + ", one per " + ComputeBudget.POINTS_PER_UNIT
                            + " frequency or time-series points"),
                    "the cost model");
        }
    }

    @Test
    void theDocumentedFlushDelayIsTheCodes() throws Exception {
        String contract = Files.readString(Path.of("..", "openapi.yaml")).replaceAll("\\s+", " ");
        assertTrue(
                contract.contains("finished lines are sent within " + BatchRoute.FLUSH_DELAY_MILLIS + " ms"),
                "openapi.yaml must state the flush delay " + BatchRoute.FLUSH_DELAY_MILLIS + " ms");
        String readme = Files.readString(Path.of("..", "README.md")).replaceAll("\\s+", " ");
        assertTrue(
                readme.contains("each sent at most " + BatchRoute.FLUSH_DELAY_MILLIS + " ms after it is ready"),
                "README.md must state the flush delay " + BatchRoute.FLUSH_DELAY_MILLIS + " ms");
    }
}
