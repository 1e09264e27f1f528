package com.loopwright.api.result;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.loopwright.api.endpoint.Answer;
import java.nio.charset.StandardCharsets;
import java.util.Set;
import java.util.TreeSet;
import org.junit.jupiter.api.Test;

/**
 * One design result shape for every order: the order-2 result (POST /v1/designs) and the order-n result (POST
 * /v1/designs/high-order) name the same members the same, and differ only by the documented extras listed here.
 */
class SharedResultNamesTest {

    /** The pick-and-place axis of the README, order 2. */
    private static final String ORDER_TWO =
            "{\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":400,\"d\":400},"
                    + "\"spec\":{\"settlingTime\":0.15,\"overshootPercent\":1.5}}";

    /** The same axis behind a current loop, order 3, highest power first. */
    private static final String ORDER_THREE = "{\"plant\":{\"denominator\":[1,200.48,96,0],"
            + "\"numerator\":[0.0666667,1],\"b\":80000,\"disturbance\":[0,400,0]},\"spec\":{\"settlingTime\":0.3,"
            + "\"overshootPercent\":1.5},\"auxiliaryPoles\":{\"poles\":[{\"re\":-250,\"im\":0}]},"
            + "\"matchSpecs\":true}";

    /** Order-2 extras at the top level (robustness only when verify is asked for). */
    private static final Set<String> TOP_ORDER_TWO_EXTRAS = Set.of("plant", "model", "robustness");

    private static final Set<String> TOP_ORDER_N_EXTRAS = Set.of("order", "coordinates", "specMatching");
    private static final Set<String> TARGET_ORDER_TWO_EXTRAS = Set.of("handbookNaturalFrequency", "bindingSpecs");
    private static final Set<String> RICCATI_ORDER_N_EXTRAS =
            Set.of("reciprocalCondition", "newtonSteps", "bisectionSteps");
    private static final Set<String> VERIFICATION_ORDER_TWO_EXTRAS = Set.of("positionPerDisturbanceBound");
    private static final Set<String> VERIFICATION_ORDER_N_EXTRAS = Set.of("peakDisturbanceGainRelativeTolerance");

    @Test
    void bothOrdersNameTheSharedMembersTheSame() {
        JsonNode two = design(Answer.design(ORDER_TWO));
        JsonNode n = design(Answer.highOrder(ORDER_THREE.getBytes(StandardCharsets.UTF_8)));
        assertSameNames(two, n, "", TOP_ORDER_TWO_EXTRAS, TOP_ORDER_N_EXTRAS);
        assertSameNames(two, n, "/target", TARGET_ORDER_TWO_EXTRAS, Set.of());
        assertSameNames(two, n, "/riccati", Set.of(), RICCATI_ORDER_N_EXTRAS);
        assertSameNames(two, n, "/riccati/numeric", Set.of(), Set.of());
        assertSameNames(two, n, "/gammaBounds/0", Set.of(), Set.of());
        assertSameNames(two, n, "/gammaIntervals/0", Set.of(), Set.of());
        assertSameNames(two, n, "/gain", Set.of(), Set.of());
        assertSameNames(two, n, "/simulated", Set.of(), Set.of());
        assertSameNames(two, n, "/verification", VERIFICATION_ORDER_TWO_EXTRAS, VERIFICATION_ORDER_N_EXTRAS);
        assertSameNames(two, n, "/verification/specChecks/0", Set.of(), Set.of());
        assertSameNames(two, n, "/target/dominantPoles/0", Set.of(), Set.of());
        // the extras each order documents are really there (robustness only with verify)
        assertTrue(names(two).containsAll(Set.of("plant", "model")), names(two).toString());
        assertTrue(names(n).containsAll(TOP_ORDER_N_EXTRAS), names(n).toString());
        assertTrue(names(two.at("/target")).containsAll(TARGET_ORDER_TWO_EXTRAS));
        assertTrue(names(n.at("/riccati")).containsAll(RICCATI_ORDER_N_EXTRAS));
        assertTrue(names(two.at("/verification")).containsAll(VERIFICATION_ORDER_TWO_EXTRAS));
        assertTrue(names(n.at("/verification")).containsAll(VERIFICATION_ORDER_N_EXTRAS));
        assertEquals(two.get("notes").size(), two.get("noteCodes").size());
        assertEquals(n.get("notes").size(), n.get("noteCodes").size());
    }

    /** The same quantity has the same shape: lists where order n has lists, the same condition names. */
    @Test
    void sharedMembersHaveTheSameShape() {
        JsonNode two = design(Answer.design(ORDER_TWO));
        JsonNode n = design(Answer.highOrder(ORDER_THREE.getBytes(StandardCharsets.UTF_8)));
        for (String pointer : new String[] {
            "/weights",
            "/gain/k",
            "/riccati/p",
            "/riccati/numeric/p",
            "/target/characteristicPolynomial",
            "/target/auxiliaryPoles",
            "/gammaBounds",
            "/gammaIntervals"
        }) {
            assertTrue(two.at(pointer).isArray() && n.at(pointer).isArray(), pointer);
        }
        assertEquals(2, two.at("/weights").size());
        assertEquals(2, two.at("/gain/k").size());
        assertEquals(0, two.at("/target/auxiliaryPoles").size());
        assertEquals(3, n.at("/gain/k").size());
        assertEquals(1, n.at("/target/auxiliaryPoles").size());
        // both polynomials are monic and highest power first
        assertEquals(1.0, two.at("/target/characteristicPolynomial/0").asDouble(), 0);
        assertEquals(1.0, n.at("/target/characteristicPolynomial/0").asDouble(), 0);
        assertEquals(4, n.at("/target/characteristicPolynomial").size());
        Set<String> conditions = new TreeSet<>();
        two.get("gammaBounds").forEach(b -> conditions.add(b.get("condition").asText()));
        n.get("gammaBounds").forEach(b -> conditions.add(b.get("condition").asText()));
        for (String condition : conditions) {
            assertTrue(condition.matches("[a-z][A-Za-z0-9]*"), "camelCase condition: " + condition);
        }
        assertTrue(conditions.contains("weightReal"), conditions.toString());
    }

    /**
     * Order 2: the characteristic polynomial [1, 2 zeta wn, wn^2] of the target equals the closed loop the gains
     * make, s^2 + (a1 + b k2) s + (a0 + b k1) (textbook pole placement for x1' = x2, x2' = -a0 x1 - a1 x2 + b u).
     */
    @Test
    void orderTwoPolynomialIsTheClosedLoopOfTheGains() {
        JsonNode two = design(Answer.design(ORDER_TWO));
        double k1 = two.at("/gain/k/0").asDouble();
        double k2 = two.at("/gain/k/1").asDouble();
        JsonNode poly = two.at("/target/characteristicPolynomial");
        assertEquals(0.48 + 400 * k2, poly.get(1).asDouble(), 1e-9 * poly.get(1).asDouble());
        assertEquals(400 * k1, poly.get(2).asDouble(), 1e-9 * poly.get(2).asDouble());
        assertEquals(
                two.at("/riccati/p/0/1").asDouble(), two.at("/riccati/p/1/0").asDouble(), 0);
        // the order-2 feasible set is [gammaMin, unbounded), bounded below by the binding requirement
        assertEquals(
                two.get("gammaMin").asDouble(),
                two.at("/gammaIntervals/0/lower").asDouble(),
                0);
        assertTrue(two.at("/gammaIntervals/0/unbounded").asBoolean());
        JsonNode binding = null;
        for (JsonNode bound : two.get("gammaBounds")) {
            if (bound.get("binding").asBoolean()) {
                binding = bound;
            }
        }
        assertTrue(binding != null, two.get("gammaBounds").toString());
        assertEquals(binding.get("condition"), two.at("/gammaIntervals/0/lowerBinding/condition"));
        assertEquals(binding.get("state"), two.at("/gammaIntervals/0/lowerBinding/state"));
    }

    private static JsonNode design(Answer answer) {
        assertEquals(200, answer.status(), () -> String.valueOf(answer.body()));
        return answer.body();
    }

    private static void assertSameNames(
            JsonNode two, JsonNode n, String pointer, Set<String> orderTwoExtras, Set<String> orderNExtras) {
        Set<String> twoNames = names(two.at(pointer));
        Set<String> nNames = names(n.at(pointer));
        twoNames.removeAll(orderTwoExtras);
        nNames.removeAll(orderNExtras);
        twoNames.remove("trace");
        nNames.remove("trace");
        assertEquals(twoNames, nNames, "shared members of " + (pointer.isEmpty() ? "the result" : pointer));
    }

    private static Set<String> names(JsonNode node) {
        assertTrue(node.isObject(), "an object: " + node);
        Set<String> names = new TreeSet<>();
        node.fieldNames().forEachRemaining(names::add);
        return names;
    }
}
