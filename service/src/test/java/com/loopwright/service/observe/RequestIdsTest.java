package com.loopwright.service.observe;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;

import java.util.HashSet;
import java.util.Set;
import java.util.UUID;
import org.junit.jupiter.api.Test;

/** Issued request ids are random version-4 UUIDs (RFC 9562 layout: version nibble 4, variant bits 10). */
class RequestIdsTest {

    @Test
    void issuedIdsAreDistinctVersionFourUuids() {
        Set<String> seen = new HashSet<>();
        for (int i = 0; i < 10_000; i++) {
            String id = RequestIds.accept(null);
            UUID uuid = UUID.fromString(id);
            assertEquals(4, uuid.version(), id);
            assertEquals(2, uuid.variant(), id);
            assertEquals(uuid.toString(), id, "canonical lower-case form");
            seen.add(id);
        }
        assertEquals(10_000, seen.size(), "no repeats");
    }

    @Test
    void aPlainCallerIdIsKeptAndAnUnsafeOneReplaced() {
        assertEquals("conveyor-7", RequestIds.accept("conveyor-7"));
        assertNotEquals("bad id\n", RequestIds.accept("bad id\n"));
        assertEquals(4, UUID.fromString(RequestIds.accept("x".repeat(129))).version());
    }
}
