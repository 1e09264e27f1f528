package com.loopwright.service;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import org.hipparchus.linear.Array2DRowRealMatrix;
import org.hipparchus.linear.ArrayRealVector;
import org.hipparchus.linear.LUDecomposition;
import org.hipparchus.linear.RealVector;
import org.hipparchus.ode.ODEState;
import org.hipparchus.ode.ODEStateAndDerivative;
import org.hipparchus.ode.OrdinaryDifferentialEquation;
import org.hipparchus.ode.nonstiff.DormandPrince853Integrator;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * The robust member of POST /v1/designs/high-order with integral action and position-only sensing (the loop that
 * runs judged over the box). Scenario, our own with invented parameters: a camera gimbal axis driven through its
 * motor current loop, theta/u = b / (s (s + c/J) (s + 1/tau)) with c/J = 2 1/s and a current lag 1/tau = 50 1/s,
 * so the companion denominator is [1, 52, 100, 0] and b = 500; the load torque enters at the third state. Only the
 * angle is measured (an encoder), the observer's poles at 4 x the controller poles, integral action on the angle.
 * The payload inertia and the current loop vary: a_2 = 52 +-10 %, a_1 = 100 +-30 %, b from 400 to 600.
 * Every case is checked by an independent route: the full output-feedback loop (perturbed plant, integrator,
 * observer on the nominal model) assembled here from the response's k, ki, kr and L and integrated by the adaptive
 * Dormand-Prince 8(5,3) method (Hipparchus); the zero steady offset under a constant load by the loop's equilibrium
 * solved by LU (final-value theorem, textbook); each corner's norm from w to z by a frequency sweep of that loop.
 */
class HighOrderRobustLoopEndpointTest extends LiveServerTest {

    private static final String PATH = "/v1/designs/high-order";
    private static final double A2 = 52;
    private static final double A1 = 100;
    private static final double B = 500;
    private static final double SETTLING = 0.6;
    private static final double OVERSHOOT = 2;
    private static final int SAMPLES = 30;
    private static final String GIMBAL = "\"plant\":{\"denominator\":[1,52,100,0],\"b\":500,\"disturbance\":[0,0,1]},"
            + "\"spec\":{\"settlingTime\":0.6,\"overshootPercent\":2}";
    private static final String LOOP = "\"integralAction\":true,\"measurement\":\"position\","
            + "\"observer\":{\"method\":\"poleMultiple\",\"multiple\":4}";
    private static final String BOX = "{\"denominator\":[null,{\"spreadPercent\":10},{\"spreadPercent\":30},null],"
            + "\"b\":{\"lowest\":400,\"highest\":600},\"monteCarloSamples\":30,\"seed\":11}";

    @Test
    void robustGimbalLoopWithIntegralActionAndEncoderMeetsTheSpecEverywhereByAnIndependentIntegration() {
        LiveServer.Reply reply =
                server.post(PATH, "{" + GIMBAL + "," + LOOP + ",\"robust\":{\"uncertainty\":" + BOX + "}}");
        assertEquals(200, reply.status(), reply.text());
        JsonNode body = reply.json();
        JsonNode robust = body.get("robust");
        assertEquals("integralActionPositionObserver", robust.get("judgedLoop").asText());
        assertTrue(robust.get("meetsEverywhere").asBoolean(), robust.toString());
        assertEquals(8, robust.get("cornerCount").asInt());
        // the loop sections of a non-robust loop design are there, at the chosen pair
        for (String section : List.of("law", "observer", "outputFeedback", "loadStep")) {
            assertNotNull(body.get(section), section);
        }
        assertEquals(
                robust.at("/nominalTarget/naturalFrequency").asDouble(),
                body.at("/target/naturalFrequency").asDouble(),
                0);
        // the corner norms are compared with the augmented design's gamma (the law's), not the plain one's
        assertEquals(body.at("/law/gamma").asDouble(), robust.get("gamma").asDouble(), 0);
        double[] k = doubles(body.at("/law/k"));
        double ki = body.at("/law/integralGain").asDouble();
        double kr = body.at("/law/referenceGain").asDouble();
        double[] l = doubles(body.at("/observer/gain"));
        assertEquals(3, k.length);
        assertEquals(3, l.length);
        // the corners: binary order over (a_2, a_1, b), the first ranged parameter the lowest bit (openapi.yaml)
        for (int mask = 0; mask < 8; mask++) {
            double[] plant = {
                (mask & 1) == 0 ? A2 * 0.9 : A2 * 1.1,
                (mask & 2) == 0 ? A1 * 0.7 : A1 * 1.3,
                (mask & 4) == 0 ? 400 : 600
            };
            JsonNode corner = robust.at("/corners/" + mask);
            assertEquals(plant[0], corner.at("/plant/denominator/1").asDouble(), 1e-12, "corner " + mask);
            assertEquals(plant[1], corner.at("/plant/denominator/2").asDouble(), 1e-12, "corner " + mask);
            assertEquals(plant[2], corner.at("/plant/b").asDouble(), 1e-12, "corner " + mask);
            double[] metrics = assertMeetsTheSpec(plant, k, ki, kr, l, "corner " + mask);
            // the judge's settling time agrees with this route to the grids' resolution (3 ts / 6000 here)
            assertEquals(metrics[0], corner.at("/metrics/settlingTime").asDouble(), 2e-3 * SETTLING, "corner " + mask);
            // the corner's norm against a frequency sweep of the loop assembled here (common practice: the peak of
            // |G(jw)| over a dense log grid, refined by golden-section search, never exceeds the certified bound)
            double certified = corner.get("hInfinityNorm").asDouble();
            double swept = sweptNorm(plant, k, ki, kr, l, doubles(body.at("/law/weights")));
            assertTrue(swept <= certified * (1 + 1e-9), "corner " + mask + ": " + swept + " > " + certified);
            assertTrue(swept >= certified * (1 - 1e-4), "corner " + mask + ": " + swept + " << " + certified);
            assertEquals(
                    certified <= robust.get("gamma").asDouble(),
                    corner.get("withinGamma").asBoolean());
            assertZeroSteadyOffset(plant, k, ki, kr, l, "corner " + mask);
        }
        // the samples, drawn as openapi.yaml states: one uniform per parameter in the order a_2, a_1, a_0, b
        SplittableRandom random = new SplittableRandom(11);
        for (int s = 0; s < SAMPLES; s++) {
            double a2 = A2 * 0.9 + A2 * 0.2 * random.nextDouble();
            double a1 = A1 * 0.7 + A1 * 0.6 * random.nextDouble();
            random.nextDouble(); // a_0 = 0, fixed
            double b = 400 + 200 * random.nextDouble();
            double[] plant = {a2, a1, b};
            assertMeetsTheSpec(plant, k, ki, kr, l, "sample " + s);
            assertZeroSteadyOffset(plant, k, ki, kr, l, "sample " + s);
        }
    }

    /** Integral action alone (full state): the judged loop is named so, and the nominal metrics are law.step's. */
    @Test
    void integralActionAloneIsJudgedAsTheLoopThatRuns() {
        LiveServer.Reply reply =
                server.post(PATH, "{" + GIMBAL + ",\"integralAction\":true,\"robust\":{\"uncertainty\":" + BOX + "}}");
        assertEquals(200, reply.status(), reply.text());
        JsonNode body = reply.json();
        assertEquals("integralAction", body.at("/robust/judgedLoop").asText());
        assertNull(body.get("observer"));
        assertTrue(body.at("/robust/meetsEverywhere").asBoolean());
        assertEquals(
                body.at("/law/step/settlingTime").asDouble(),
                body.at("/robust/priceOfRobustness/nominal/settlingTime").asDouble(),
                0);
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(
            delimiter = '|',
            value = {
                // the box ranges companion coefficients: a state space is refused at /robust
                "state space | {\"plant\":{\"stateSpace\":{\"a\":[[0,1],[0,-2]],\"b2\":[0,3],\"b1\":[0,1]}},"
                        + "\"spec\":{\"settlingTime\":2,\"overshootPercent\":5},\"integralAction\":true,"
                        + "\"robust\":{\"uncertainty\":{\"b\":{\"spreadPercent\":5}}}} | 400 | /robust",
                "matchSpecs | {GIMBAL,\"matchSpecs\":true,\"measurement\":\"position\",\"robust\":{\"uncertainty\":"
                        + "{\"b\":{\"spreadPercent\":5}}}} | 400 | /matchSpecs",
                "too many samples | {GIMBAL,\"measurement\":\"position\",\"robust\":{\"uncertainty\":"
                        + "{\"b\":{\"spreadPercent\":5},\"monteCarloSamples\":201}}} | 400"
                        + " | /robust/uncertainty/monteCarloSamples",
                "bad observer | {GIMBAL,\"measurement\":\"position\",\"observer\":{\"method\":\"poleMultiple\","
                        + "\"multiple\":-1},\"robust\":{\"uncertainty\":{\"b\":{\"spreadPercent\":5}}}} | 400"
                        + " | /observer/multiple",
                "b through zero | {GIMBAL,\"integralAction\":true,\"robust\":{\"uncertainty\":"
                        + "{\"b\":{\"lowest\":-1,\"highest\":1}}}} | 400 | /robust/uncertainty/b",
                // a box no pair meets: 422 (no pair of any damping ratio within the search meets it: at the overshoot)
                "box too wide | {GIMBAL,\"integralAction\":true,\"measurement\":\"position\",\"robust\":"
                        + "{\"uncertainty\":{\"denominator\":[null,{\"spreadPercent\":90},{\"spreadPercent\":90},"
                        + "null],\"b\":{\"lowest\":5,\"highest\":5000}}}} | 422 | /spec/overshootPercent",
                // integral action on an output with zeros: the plant's model cannot take it
                "output with zeros | {\"plant\":{\"denominator\":[1,52,100,0],\"numerator\":[1,3],\"b\":500,"
                        + "\"disturbance\":[0,0,1]},\"spec\":{\"settlingTime\":0.6,\"overshootPercent\":2},"
                        + "\"integralAction\":true,\"robust\":{\"uncertainty\":{\"b\":{\"spreadPercent\":5}}}}"
                        + " | 422 | ",
            })
    void hostileCombinationsAreProblemsAtTheirPointerNever500(String name, String body, int status, String pointer) {
        LiveServer.Reply reply = server.post(PATH, body.replace("{GIMBAL,", "{" + GIMBAL + ","));
        assertEquals(status, reply.status(), name + ": " + reply.text());
        if (pointer != null) {
            assertTrue(pointers(reply.json()).contains(pointer), name + ": " + reply.text());
        }
    }

    private static List<String> pointers(JsonNode problem) {
        List<String> out = new ArrayList<>();
        problem.path("errors").forEach(e -> out.add(e.get("pointer").asText()));
        return out;
    }

    private static double[] doubles(JsonNode array) {
        double[] out = new double[array.size()];
        for (int i = 0; i < out.length; i++) {
            out[i] = array.get(i).asDouble();
        }
        return out;
    }

    private static double[] assertMeetsTheSpec(
            double[] plant, double[] k, double ki, double kr, double[] l, String at) {
        double[] metrics = simulate(plant, k, ki, kr, l);
        // the grid resolves the last exit from the band to one step (3 ts / 6000)
        assertTrue(metrics[0] <= SETTLING * (1 + 1e-3), at + ": settling " + metrics[0]);
        assertTrue(metrics[1] <= OVERSHOOT + 1e-3, at + ": overshoot " + metrics[1]);
        return metrics;
    }

    /**
     * The full output-feedback loop on the perturbed plant {a_2, a_1, b} (a_0 = 0), state [z (3), xi, z_hat (3)]:
     * u = kr r + ki xi - k . z_hat; z' = A' z + b' e_3 u + e_3 w; y = z_1; xi' = r - y; z_hat' = A z_hat + b e_3 u +
     * L (y - z_hat_1) with the nominal A, b (the observer keeps the model it was designed on).
     */
    private static double[] derivative(
            double[] plant, double[] k, double ki, double kr, double[] l, double r, double w, double[] x) {
        double u = kr * r + ki * x[3] - k[0] * x[4] - k[1] * x[5] - k[2] * x[6];
        double y = x[0];
        double innovation = y - x[4];
        return new double[] {
            x[1],
            x[2],
            -plant[1] * x[1] - plant[0] * x[2] + plant[2] * u + w,
            r - y,
            x[5] + l[0] * innovation,
            x[6] + l[1] * innovation,
            -A1 * x[5] - A2 * x[6] + B * u + l[2] * innovation
        };
    }

    /**
     * {settling time to 2 %, overshoot %} of the unit reference step of the loop of {@link #derivative}, integrated
     * by Dormand-Prince 8(5,3) (Hipparchus) on a grid of 6000 steps over 3 settling times; the final value is r = 1
     * (integral action).
     */
    private static double[] simulate(double[] plant, double[] k, double ki, double kr, double[] l) {
        OrdinaryDifferentialEquation ode = new OrdinaryDifferentialEquation() {
            @Override
            public int getDimension() {
                return 7;
            }

            @Override
            public double[] computeDerivatives(double t, double[] x) {
                return derivative(plant, k, ki, kr, l, 1, 0, x);
            }
        };
        DormandPrince853Integrator integrator = new DormandPrince853Integrator(1e-12, 1e-2, 1e-12, 1e-12);
        ODEState state = new ODEState(0, new double[7]);
        int points = 6000;
        double end = 3 * SETTLING;
        double peak = 0;
        double lastOutside = 0;
        for (int i = 1; i <= points; i++) {
            double t = end * i / points;
            ODEStateAndDerivative next = integrator.integrate(ode, state, t);
            double y = next.getPrimaryState()[0];
            peak = Math.max(peak, y);
            if (Math.abs(y - 1) > 0.02) {
                lastOutside = t;
            }
            state = new ODEState(next.getTime(), next.getPrimaryState());
        }
        assertTrue(Math.abs(state.getPrimaryState()[0] - 1) < 1e-3, "settled by 3 ts");
        return new double[] {lastOutside, Math.max(0, 100 * (peak - 1))};
    }

    /** A_cl of the loop of {@link #derivative} (r = 0, w = 0), column j the derivative at the unit state e_j. */
    private static double[][] closedLoop(double[] plant, double[] k, double ki, double kr, double[] l) {
        double[][] a = new double[7][7];
        for (int j = 0; j < 7; j++) {
            double[] unit = new double[7];
            unit[j] = 1;
            double[] column = derivative(plant, k, ki, kr, l, 0, 0, unit);
            for (int i = 0; i < 7; i++) {
                a[i][j] = column[i];
            }
        }
        return a;
    }

    /**
     * max over w of |G(jw)|, G = C (jw I - A_cl)^-1 E from the load w to z = [-rho_1 xi, rho_2 z_1, rho_3 z_2,
     * rho_4 z_3, u] (the design's performance output with integral action, c0 = 1; u = ki xi - k . z_hat): one
     * input column, so the largest singular value is the vector 2-norm. A log grid of 4000 points from 1e-3 to 1e4
     * rad/s, refined by golden-section search around its best point (common practice).
     */
    private static double sweptNorm(double[] plant, double[] k, double ki, double kr, double[] l, double[] rho) {
        double[][] a = closedLoop(plant, k, ki, kr, l);
        double[] e = derivative(plant, k, ki, kr, l, 0, 1, new double[7]);
        double[][] c = new double[5][7];
        c[0][3] = -rho[0];
        for (int i = 0; i < 3; i++) {
            c[1 + i][i] = rho[1 + i];
            c[4][4 + i] = -k[i];
        }
        c[4][3] = ki;
        return FrequencySweep.peak(w -> gain(a, e, c, w));
    }

    /**
     * |C x| with (jw I - A) x = E, x = p + j q: the real system [-A, -w I; w I, -A] [p; q] = [E; 0], solved by LU.
     */
    private static double gain(double[][] a, double[] e, double[][] c, double w) {
        int n = a.length;
        double[][] m = new double[2 * n][2 * n];
        double[] rhs = new double[2 * n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                m[i][j] = -a[i][j];
                m[n + i][n + j] = -a[i][j];
            }
            m[i][n + i] = -w;
            m[n + i][i] = w;
            rhs[i] = e[i];
        }
        RealVector x = new LUDecomposition(new Array2DRowRealMatrix(m, false))
                .getSolver()
                .solve(new ArrayRealVector(rhs, false));
        double sum = 0;
        for (double[] row : c) {
            double re = 0;
            double im = 0;
            for (int j = 0; j < n; j++) {
                re += row[j] * x.getEntry(j);
                im += row[j] * x.getEntry(n + j);
            }
            sum += re * re + im * im;
        }
        return Math.sqrt(sum);
    }

    /**
     * Zero steady offset under a constant load (final-value theorem, textbook): the equilibrium of the loop with r =
     * 1 and w = 5, A_cl x = -f(0) with A_cl assembled column by column from the linear derivative, solved by LU; its
     * output is exactly r.
     */
    private static void assertZeroSteadyOffset(
            double[] plant, double[] k, double ki, double kr, double[] l, String at) {
        double[] offset = derivative(plant, k, ki, kr, l, 1, 5, new double[7]);
        double[][] a = closedLoop(plant, k, ki, kr, l);
        RealVector x = new LUDecomposition(new Array2DRowRealMatrix(a))
                .getSolver()
                .solve(new ArrayRealVector(offset).mapMultiply(-1));
        assertEquals(1, x.getEntry(0), 1e-9, at + ": steady output under a constant load");
    }
}
