package com.loopwright.api.design;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.loopwright.api.endpoint.Answer;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import org.ejml.data.Complex_F64;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.interfaces.decomposition.EigenDecomposition_F64;
import org.junit.jupiter.api.Test;

/**
 * A state-space plant with integral action and/or position-only sensing: model.stateSpace.loopLaw states the law in
 * the caller's coordinates. Checked independently of the solver's transform: the loop is built here from the
 * request's own A and B2 and the returned K_x, ki, kr, L_x and c, and its eigenvalues must be the poles the response
 * reports for the law and the observer (separation principle: the output-feedback loop's eigenvalues are the
 * state-feedback poles and the observer poles; Franklin, Powell and Emami-Naeini, Feedback Control of Dynamic
 * Systems, ch. 7), and its DC gain from r to y must be 1.
 */
class StateSpaceLoopLawTest {

    // The README indexing axis in rotated and scaled coordinates x = S z, S = [[2, 1], [-1, 3]] (as
    // PlantFormExchangeTest): A = S Ac S^-1 with Ac = [[0, 1], [0, -0.48]], B2 = B1 = S [0, 400]'.
    private static final double[][] S = {{2, 1}, {-1, 3}};
    private static final double[][] S_INV = {{3 / 7.0, -1 / 7.0}, {1 / 7.0, 2 / 7.0}};
    private static final double[][] AC = {{0, 1}, {0, -0.48}};
    private static final double[] B2 = {400, 1200};

    private static double[][] a() {
        return multiply(multiply(S, AC), S_INV);
    }

    private static JsonNode design(String loop) {
        double[][] a = a();
        String body = ("{\"plant\":{\"form\":\"stateSpace\",\"a\":[[%s,%s],[%s,%s]],\"b2\":[400,1200],"
                        + "\"b1\":[400,1200]},\"spec\":{\"settlingTime\":0.4,\"overshootPercent\":1}" + loop + "}")
                .formatted(a[0][0], a[0][1], a[1][0], a[1][1]);
        Answer answer = Answer.design(body.getBytes(StandardCharsets.UTF_8));
        assertEquals(200, answer.status(), () -> answer.body().toString());
        return answer.body();
    }

    @Test
    void integralActionWithAnObserverRunsInTheCallersCoordinatesWithTheReportedPoles() {
        JsonNode body = design(",\"integralAction\":true,\"measurement\":\"position\","
                + "\"observer\":{\"method\":\"poleMultiple\",\"multiple\":5}");
        JsonNode law = body.at("/model/stateSpace/loopLaw");
        assertFalse(law.isMissingNode(), body.at("/model/stateSpace").toString());
        double[] k = vector(law.get("k"));
        double ki = law.get("integralGain").asDouble();
        double kr = law.get("referenceGain").asDouble();
        double[] l = vector(law.get("observerGain"));
        double[] c = vector(body.at("/model/stateSpace/trackedOutput"));
        assertEquals(body.at("/law/integralGain").asDouble(), ki, 0);
        assertTrue(body.at("/law/coordinates").asText().contains("model.stateSpace.loopLaw"));

        // state [x (2), xi, x_hat (2)]: x' = A x + B2 u, xi' = r - c x, x_hat' = A x_hat + B2 u + L c (x - x_hat),
        // u = kr r + ki xi - K x_hat
        double[][] a = a();
        DMatrixRMaj loop = new DMatrixRMaj(5, 5);
        DMatrixRMaj input = new DMatrixRMaj(5, 1);
        for (int i = 0; i < 2; i++) {
            for (int j = 0; j < 2; j++) {
                loop.set(i, j, a[i][j]);
                loop.set(i, 3 + j, -B2[i] * k[j]);
                loop.set(3 + i, j, l[i] * c[j]);
                loop.set(3 + i, 3 + j, a[i][j] - B2[i] * k[j] - l[i] * c[j]);
            }
            loop.set(i, 2, B2[i] * ki);
            loop.set(3 + i, 2, B2[i] * ki);
            loop.set(2, i, -c[i]);
            input.set(i, B2[i] * kr);
            input.set(3 + i, B2[i] * kr);
        }
        input.set(2, 1);
        List<double[]> expected = poles(body.at("/law/closedLoopPoles"));
        expected.addAll(poles(body.at("/observer/poles")));
        assertSamePoles(expected, eigenvalues(loop));
        assertEquals(1, dcGain(loop, input, new double[] {c[0], c[1], 0, 0, 0}), 1e-9);
    }

    @Test
    void integralActionWithFullStateRunsInTheCallersCoordinatesWithTheReportedPoles() {
        JsonNode body = design(",\"integralAction\":true");
        JsonNode law = body.at("/model/stateSpace/loopLaw");
        assertTrue(
                law.path("observerGain").isMissingNode()
                        || law.get("observerGain").isNull(),
                law.toString());
        double[] k = vector(law.get("k"));
        double ki = law.get("integralGain").asDouble();
        double kr = law.get("referenceGain").asDouble();
        double[] c = vector(body.at("/model/stateSpace/trackedOutput"));
        double[][] a = a();
        DMatrixRMaj loop = new DMatrixRMaj(3, 3);
        DMatrixRMaj input = new DMatrixRMaj(3, 1);
        for (int i = 0; i < 2; i++) {
            for (int j = 0; j < 2; j++) {
                loop.set(i, j, a[i][j] - B2[i] * k[j]);
            }
            loop.set(i, 2, B2[i] * ki);
            loop.set(2, i, -c[i]);
            input.set(i, B2[i] * kr);
        }
        input.set(2, 1);
        assertSamePoles(poles(body.at("/law/closedLoopPoles")), eigenvalues(loop));
        assertEquals(1, dcGain(loop, input, new double[] {c[0], c[1], 0}), 1e-9);
    }

    @Test
    void aPlainDesignHasNoCallerLoopLaw() {
        JsonNode view = design("").at("/model/stateSpace");
        assertFalse(view.isMissingNode());
        assertTrue(view.path("loopLaw").isMissingNode() || view.get("loopLaw").isNull(), view.toString());
    }

    /** y_inf = c x_inf with A x_inf = -B r for r = 1 (final-value theorem on a stable loop). */
    private static double dcGain(DMatrixRMaj a, DMatrixRMaj b, double[] c) {
        DMatrixRMaj x = new DMatrixRMaj(a.numRows, 1);
        DMatrixRMaj minusB = b.copy();
        CommonOps_DDRM.scale(-1, minusB);
        assertTrue(CommonOps_DDRM.solve(a, minusB, x));
        double y = 0;
        for (int i = 0; i < c.length; i++) {
            y += c[i] * x.get(i);
        }
        return y;
    }

    private static void assertSamePoles(List<double[]> expected, List<double[]> actual) {
        assertEquals(expected.size(), actual.size());
        Comparator<double[]> order =
                Comparator.<double[]>comparingDouble(p -> p[0]).thenComparingDouble(p -> p[1]);
        expected.sort(order);
        actual.sort(order);
        for (int i = 0; i < expected.size(); i++) {
            double scale = Math.hypot(expected.get(i)[0], expected.get(i)[1]);
            assertEquals(expected.get(i)[0], actual.get(i)[0], 1e-7 * scale, "re of pole " + i);
            assertEquals(expected.get(i)[1], actual.get(i)[1], 1e-7 * scale, "im of pole " + i);
        }
    }

    private static List<double[]> eigenvalues(DMatrixRMaj m) {
        EigenDecomposition_F64<DMatrixRMaj> eigen = DecompositionFactory_DDRM.eig(m.numRows, false);
        assertTrue(eigen.decompose(m.copy()));
        List<double[]> values = new ArrayList<>();
        for (int i = 0; i < eigen.getNumberOfEigenvalues(); i++) {
            Complex_F64 v = eigen.getEigenvalue(i);
            values.add(new double[] {v.real, v.imaginary});
        }
        return values;
    }

    private static List<double[]> poles(JsonNode array) {
        List<double[]> poles = new ArrayList<>();
        for (JsonNode p : array) {
            poles.add(new double[] {p.get("re").asDouble(), p.get("im").asDouble()});
        }
        return poles;
    }

    private static double[] vector(JsonNode array) {
        double[] v = new double[array.size()];
        for (int i = 0; i < v.length; i++) {
            v[i] = array.get(i).asDouble();
        }
        return v;
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
