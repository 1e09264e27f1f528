package com.loopwright.service;

import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.service.routes.BatchRoute;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;

/** The cap on a batch's items computing at once is the one openapi.yaml documents. */
class BatchWindowContractTest {

    @Test
    void theDocumentedItemsInFlightCapIsTheCodes() throws Exception {
        String contract = Files.readString(Path.of("..", "openapi.yaml")).replaceAll("\\s+", " ");
        assertTrue(contract.contains("(at most " + BatchRoute.MAX_ITEMS_IN_FLIGHT + " per batch)"),
                "openapi.yaml must state the items-in-flight cap " + BatchRoute.MAX_ITEMS_IN_FLIGHT);
    }
}
