package com.loopwright.api.design;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.loopwright.api.endpoint.Answer;
import java.nio.charset.StandardCharsets;
import org.junit.jupiter.api.Test;

/**
 * A design through each plant description equals the design through the canonical coefficients its equation of
 * motion gives; non-physical descriptions are 422 problems that name the field; misplaced fields are 400s.
 */
class PlantFormExchangeTest {

    private static final String SPEC = "\"spec\":{\"settlingTime\":0.4,\"overshootPercent\":1}";

    private Answer post(String plant) {
        return Answer.design(("{\"plant\":" + plant + "," + SPEC + "}").getBytes(StandardCharsets.UTF_8));
    }

    private JsonNode ok(String plant) {
        Answer outcome = post(plant);
        assertEquals(200, outcome.status(), () -> outcome.body().toString());
        return outcome.body();
    }

    private static void assertSameDesign(JsonNode expected, JsonNode actual) {
        for (String pointer : new String[] {
            "/plant/a0",
            "/plant/a1",
            "/plant/b",
            "/plant/d",
            "/gain/k/0",
            "/gain/k/1",
            "/gain/referenceGain",
            "/riccati/p/0/0",
            "/riccati/p/0/1",
            "/riccati/p/1/1",
            "/gamma",
            "/weights/0",
            "/weights/1"
        }) {
            double e = expected.at(pointer).asDouble();
            assertEquals(e, actual.at(pointer).asDouble(), 1e-12 * Math.max(1, Math.abs(e)), pointer);
        }
        assertTrue(actual.at("/verification/certified").asBoolean());
    }

    // source: J q'' + c q' = N kt i + w divided by J (Newton's second law for rotation; Ogata ch. 3).
    // Scenario: a pick-and-place wrist axis, J = 0.004 kg m^2, c = 0.002 N m s/rad, kt = 0.12 N m/A, N = 10.
    @Test
    void rotaryAxisDesignsLikeItsCanonicalCoefficients() {
        JsonNode viaForm = ok("{\"form\":\"rotaryAxis\",\"inertia\":0.004,\"viscousFriction\":0.002,"
                + "\"torqueConstant\":0.12,\"gearRatio\":10}");
        JsonNode viaCanonical = ok("{\"form\":\"canonical\",\"a0\":0,\"a1\":%s,\"b\":%s,\"d\":%s}"
                .formatted(0.002 / 0.004, 10 * 0.12 / 0.004, 1 / 0.004));
        assertSameDesign(viaCanonical, viaForm);
        assertEquals("rotaryAxis", viaForm.at("/model/form").asText());
        assertEquals("A", viaForm.at("/model/units/u").asText());
        assertEquals(0, viaForm.at("/model/physicalLaw/setpointFeedforward").asDouble());
        assertEquals(
                viaForm.at("/gain/k/0").asDouble(),
                viaForm.at("/model/physicalLaw/positionGain").asDouble());
        assertEquals("canonical", viaCanonical.at("/model/form").asText());
    }

    // source: m y'' + c y' + k y = F + w divided by m (Ogata ch. 3). Scenario: a spring-loaded label-press ram.
    @Test
    void massSpringDamperDesignsLikeItsCanonicalCoefficientsAndHoldsTheSpring() {
        JsonNode viaForm = ok("{\"form\":\"massSpringDamper\",\"mass\":2.5,\"damping\":4,\"stiffness\":150}");
        JsonNode viaCanonical = ok("{\"form\":\"canonical\",\"a0\":%s,\"a1\":%s,\"b\":%s,\"d\":%s}"
                .formatted(150 / 2.5, 4 / 2.5, 1 / 2.5, 1 / 2.5));
        assertSameDesign(viaCanonical, viaForm);
        // kr = k1 + a0/b, and a0/b = k: the feedforward is the spring force per metre of setpoint.
        JsonNode law = viaForm.at("/model/physicalLaw");
        assertEquals(150, law.get("setpointFeedforward").asDouble(), 1e-10);
        assertEquals(
                law.get("referenceGain").asDouble(),
                law.get("positionGain").asDouble()
                        + law.get("setpointFeedforward").asDouble(),
                1e-10 * law.get("referenceGain").asDouble());
    }

    // source: K wn^2/(s^2 + 2 zeta wn s + wn^2) in phase variables (any control textbook). Tank-level loop.
    @Test
    void transferFunctionFormsDesignLikeTheirCanonicalCoefficients() {
        JsonNode viaGain = ok("{\"form\":\"secondOrderTransferFunction\",\"gain\":0.8,\"naturalFrequency\":0.5,"
                + "\"dampingRatio\":0.9}");
        JsonNode viaCoefficients =
                ok("{\"form\":\"secondOrderTransferFunction\",\"numerator\":[0.4]," + "\"denominator\":[2,1.8,0.5]}");
        JsonNode viaCanonical = ok("{\"form\":\"canonical\",\"a0\":0.25,\"a1\":0.9,\"b\":0.2,\"d\":0.2}");
        assertSameDesign(viaCanonical, viaGain);
        assertSameDesign(viaCanonical, viaCoefficients);
    }

    // The indexing axis of the README in rotated and scaled coordinates x = S z, S = [[2, 1], [-1, 3]].
    @Test
    void stateSpaceDesignsLikeItsCanonicalFormAndReturnsTheCallersCoordinates() {
        // A = S Ac S^-1, B2 = S [0, 400]', B1 = S [0, 400]' with Ac = [[0, 1], [0, -0.48]]; det S = 7.
        double[][] s = {{2, 1}, {-1, 3}};
        double[][] sInv = {{3 / 7.0, -1 / 7.0}, {1 / 7.0, 2 / 7.0}};
        double[][] ac = {{0, 1}, {0, -0.48}};
        double[][] a = multiply(multiply(s, ac), sInv);
        JsonNode viaForm = ok("{\"form\":\"stateSpace\",\"a\":[[%s,%s],[%s,%s]],\"b2\":[400,1200],\"b1\":[400,1200]}"
                .formatted(a[0][0], a[0][1], a[1][0], a[1][1]));
        // The tracked output is z1 of the original canonical form, the first row of S^-1 = [3/7, -1/7], scaled so
        // its largest entry is 1: z1 = (7/3) z1_original, so b = d = 400 * 7/3 (B1 = B2).
        double b = 400 * 7 / 3.0;
        JsonNode viaCanonical = ok("{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":%s,\"d\":%s}".formatted(b, b));
        assertEquals(0, viaForm.at("/plant/a0").asDouble(), 1e-12);
        assertSameDesign(viaCanonical, viaForm);
        JsonNode view = viaForm.at("/model/stateSpace");
        assertTrue(view.get("riccatiResidual").asDouble() < 1e-10, view.toString());
        assertEquals(2, view.get("closedLoopPoles").size());
        assertEquals(
                viaForm.at("/target/dominantPoles/0/re").asDouble(),
                view.at("/closedLoopPoles/0/re").asDouble(),
                1e-8 * viaForm.at("/target/naturalFrequency").asDouble());
    }

    @Test
    void nonPhysicalAndUnusableModelsAre422sThatNameTheField() {
        assertProblem(
                post("{\"form\":\"massSpringDamper\",\"mass\":-2,\"damping\":1,\"stiffness\":1}"), 422, "/plant/mass");
        assertProblem(post("{\"form\":\"stateSpace\",\"a\":[[-1,0],[0,-2]],\"b2\":[1,0]}"), 422, "/plant/b2");
        assertProblem(
                post("{\"form\":\"stateSpace\",\"a\":[[0,1],[0,-1]],\"b2\":[0,1],\"b1\":[1,0]}"), 422, "/plant/b1");
        assertProblem(
                post("{\"form\":\"secondOrderTransferFunction\",\"numerator\":[1,2]," + "\"denominator\":[1,1,1]}"),
                422,
                "/plant/numerator");
        assertProblem(
                post("{\"form\":\"rotaryAxis\",\"inertia\":1e-12,\"viscousFriction\":0," + "\"torqueConstant\":1}"),
                422,
                "/plant/inertia"); // b = d = 1/J = 1e12: J drives it
    }

    @Test
    void fieldsOfAnotherFormUnknownFormsAndBadShapesAre400s() {
        assertProblem(
                post("{\"form\":\"rotaryAxis\",\"mass\":1,\"inertia\":1,\"viscousFriction\":0,"
                        + "\"torqueConstant\":1}"),
                400,
                "/plant/mass");
        assertProblem(
                post("{\"form\":\"canonical\",\"a0\":0,\"a1\":1,\"b\":1,\"d\":1,\"inertia\":2}"),
                400,
                "/plant/inertia");
        assertProblem(post("{\"form\":\"flywheel\"}"), 400, "/plant/form");
        assertProblem(post("{\"form\":\"stateSpace\",\"a\":[[0,1],[0]],\"b2\":[0,1]}"), 400, "/plant/a/1");
        assertProblem(post("{\"form\":\"stateSpace\",\"a\":[[0,1],[0,1]],\"b2\":[0,null]}"), 400, "/plant/b2/1");
        assertProblem(post("{\"form\":\"massSpringDamper\",\"mass\":1,\"damping\":1}"), 400, "/plant/stiffness");
        assertProblem(
                post("{\"form\":\"rotaryAxis\",\"inertia\":1,\"viscousFriction\":0,\"torqueConstant\":1,"
                        + "\"spin\":3}"),
                400,
                "/plant/spin");
    }

    private static void assertProblem(Answer outcome, int status, String pointer) {
        assertEquals(status, outcome.status(), () -> outcome.body().toString());
        assertEquals(
                pointer,
                outcome.body().at("/errors/0/pointer").asText(),
                () -> outcome.body().toString());
    }

    private static double[][] multiply(double[][] x, double[][] y) {
        double[][] out = new double[2][2];
        for (int i = 0; i < 2; i++) {
            for (int j = 0; j < 2; j++) {
                out[i][j] = x[i][0] * y[0][j] + x[i][1] * y[1][j];
            }
        }
        return out;
    }
}
