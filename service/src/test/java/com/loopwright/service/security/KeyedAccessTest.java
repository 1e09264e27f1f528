package com.loopwright.service.security;

import static org.junit.jupiter.api.Assertions.assertDoesNotThrow;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.service.http.ProblemException;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * A request whose body the gate withheld (no accepted key when it arrived) is never handed to a handler: 401/403 by
 * the keys in force, and 503 with Retry-After when a rotation between the gate and the application made its key
 * accepted (a race seen once in CI as a 500).
 */
class KeyedAccessTest {

    private static final String OLD_KEY = "old-key-0123456789abcdef";
    private static final String NEW_KEY = "new-key-0123456789abcdef";

    @Test
    void aWithheldBodyWhoseKeyBecameAcceptedIsA503ToSendAgain() {
        ApiKeys keys = new ApiKeys(List.of(OLD_KEY));
        KeyedAccess access = new KeyedAccess(keys, null);
        // the gate refused NEW_KEY; the keys are rotated before the application sees the request
        keys.replace(List.of(NEW_KEY));
        ProblemException e = assertThrows(ProblemException.class, () -> access.refuseWithheld(true, null, NEW_KEY));
        assertEquals(503, e.problem().status());
        assertEquals("1", e.headers().get("Retry-After"));
        assertTrue(e.problem().detail().contains("send it again"), e.problem().detail());
    }

    @Test
    void aWithheldBodyIsRefusedByTheKeysInForce() {
        KeyedAccess access = new KeyedAccess(new ApiKeys(List.of(OLD_KEY)), null);
        assertEquals(
                403,
                assertThrows(ProblemException.class, () -> access.refuseWithheld(true, null, NEW_KEY))
                        .problem()
                        .status());
        assertEquals(
                401,
                assertThrows(ProblemException.class, () -> access.refuseWithheld(true, null, null))
                        .problem()
                        .status());
        assertDoesNotThrow(() -> access.refuseWithheld(false, null, null));
    }
}
