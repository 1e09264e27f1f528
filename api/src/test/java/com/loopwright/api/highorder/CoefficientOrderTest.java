package com.loopwright.api.highorder;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.loopwright.api.endpoint.Answer;
import java.nio.charset.StandardCharsets;
import java.util.List;
import org.junit.jupiter.api.Test;

/** Wire polynomials are highest power first with the leading coefficient; the solver keeps lowest first. */
class CoefficientOrderTest {

    /** s^3 + 6 s^2 + 11 s + 6 = (s + 1)(s + 2)(s + 3) (multiplied out by hand). */
    @Test
    void denominatorRoundTripsThroughTheSolverOrder() {
        double[] solver = CoefficientOrder.fromMonicHighestFirst(new double[] {1, 6, 11, 6});
        assertArrayEquals(new double[] {6, 11, 6}, solver);
        assertEquals(List.of(1.0, 6.0, 11.0, 6.0), CoefficientOrder.monicHighestFirst(solver));
    }

    /** 0.5 s + 1, right-aligned in a third-order plant: c_0 = 1, c_1 = 0.5, c_2 = 0. */
    @Test
    void numeratorIsRightAligned() {
        double[] solver = CoefficientOrder.numeratorLowestFirst(new double[] {0.5, 1}, 3);
        assertArrayEquals(new double[] {1, 0.5, 0}, solver);
        assertEquals(List.of(0.5, 1.0), CoefficientOrder.numeratorHighestFirst(solver));
    }

    /**
     * The same plant in the new order designs like the solver's own order: s^3 + 6 s^2 + 11 s + 6 echoes back as
     * sent, and its closed loop is the target polynomial (the golden case high-order-special-00).
     */
    @Test
    void requestAndResponseUseTheSameOrder() {
        Answer answer = Answer.highOrder(("{\"plant\":{\"denominator\":[1,6,11,6],\"numerator\":[1],\"b\":1,"
                        + "\"disturbance\":[0,0,1]},\"spec\":{\"settlingTime\":3,\"overshootPercent\":2},"
                        + "\"auxiliaryPoles\":{\"poles\":[{\"re\":-8,\"im\":0}]}}")
                .getBytes(StandardCharsets.UTF_8));
        assertEquals(200, answer.status(), () -> String.valueOf(answer.body()));
        JsonNode body = answer.body();
        assertEquals("[1.0,6.0,11.0,6.0]", body.at("/coordinates/denominator").toString());
        assertEquals("[1.0]", body.at("/coordinates/numerator").toString());
        // companion closed loop: s^3 + (a2 + b k3) s^2 + (a1 + b k2) s + (a0 + b k1), b = 1
        JsonNode poly = body.at("/target/characteristicPolynomial");
        assertEquals(
                6 + body.at("/gain/k/2").asDouble(),
                poly.get(1).asDouble(),
                1e-9 * poly.get(1).asDouble());
        assertEquals(
                11 + body.at("/gain/k/1").asDouble(),
                poly.get(2).asDouble(),
                1e-9 * poly.get(2).asDouble());
        assertEquals(
                6 + body.at("/gain/k/0").asDouble(),
                poly.get(3).asDouble(),
                1e-9 * poly.get(3).asDouble());
        // the per-spec checks add up to the pipeline's own verdict (here the settling time misses: 3.138 s > 3 s)
        boolean all = true;
        for (JsonNode check : body.at("/verification/specChecks")) {
            all &= check.get("met").asBoolean();
        }
        assertEquals(body.at("/verification/specsMet").asBoolean(), all);
        assertEquals("settlingTime", body.at("/verification/specChecks/1/spec").asText());
        assertEquals(false, body.at("/verification/specChecks/1/met").asBoolean());
    }

    /** A leading coefficient other than 1 is a 422 at /plant/denominator/0 that says the polynomial is monic. */
    @Test
    void nonMonicDenominatorIsA422AtItsLeadingCoefficient() {
        Answer answer = Answer.highOrder(("{\"plant\":{\"denominator\":[2,12,22,12],\"b\":1,"
                        + "\"disturbance\":[0,0,1]},\"spec\":{\"settlingTime\":3,\"overshootPercent\":2}}")
                .getBytes(StandardCharsets.UTF_8));
        assertEquals(422, answer.status());
        var error = answer.problem().errors().get(0);
        assertEquals("/plant/denominator/0", error.pointer());
        assertTrue(error.detail().contains("monic"), error.detail());
    }

    /** Zero and a fraction typed as a percentage get the same advice as POST /v1/designs. */
    @Test
    void overshootAdviceIsTheOrderTwoAdvice() {
        for (String overshoot : new String[] {"0", "0.0005"}) {
            String spec = "\"spec\":{\"settlingTime\":3,\"overshootPercent\":" + overshoot + "}";
            Answer high = Answer.highOrder(
                    ("{\"plant\":{\"denominator\":[1,6,11,6],\"b\":1," + "\"disturbance\":[0,0,1]}," + spec + "}")
                            .getBytes(StandardCharsets.UTF_8));
            Answer two = Answer.design(
                    "{\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":400,\"d\":400}," + spec + "}");
            assertEquals(two.status(), high.status());
            String advice = detail(two);
            assertTrue(advice.contains(overshoot.equals("0") ? "critically damped" : "fraction"), advice);
            assertEquals(advice, detail(high));
        }
    }

    private static String detail(Answer answer) {
        for (var error : answer.problem().errors()) {
            if (error.pointer().equals("/spec/overshootPercent")) {
                return error.detail();
            }
        }
        throw new AssertionError("no overshoot error: " + answer.text());
    }
}
