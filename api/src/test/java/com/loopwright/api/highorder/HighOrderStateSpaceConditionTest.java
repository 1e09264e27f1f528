package com.loopwright.api.highorder;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.loopwright.api.endpoint.Answer;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.StreamSupport;
import org.ejml.data.Complex_F64;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.SingularOps_DDRM;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.interfaces.decomposition.EigenDecomposition_F64;
import org.junit.jupiter.api.Test;

/** An order-3 state space whose controllability matrix is ill-conditioned states its condition and warns. */
class HighOrderStateSpaceConditionTest {

    private static final double[][] A = {{-10, 0, 0}, {0, -20, 0}, {0, 0, -30}};
    /** Nearly the eigenvector e_1 of A, so [B2, A B2, A^2 B2] is nearly singular. */
    private static final double[] B2 = {1, 1e-4, 1e-4};

    /**
     * Outside references: the condition number from an SVD of [B2, A B2, A^2 B2] formed here (EJML, common
     * practice), and the closed-loop poles eig(A - B2 plantGain) against the response's target poles (pole
     * placement: the gain on x must place the same poles as the companion gain).
     */
    @Test
    void conditionNoteAndPlantGainPlacesThePoles() {
        String body = "{\"plant\":{\"stateSpace\":{\"a\":[[-10,0,0],[0,-20,0],[0,0,-30]],\"b2\":[1,1e-4,1e-4],"
                + "\"b1\":[1,1e-4,1e-4],\"output\":[1,1,1]}},\"spec\":{\"settlingTime\":0.1,\"overshootPercent\":1}}";
        Answer outcome = Answer.highOrder(body.getBytes(StandardCharsets.UTF_8));
        assertEquals(200, outcome.status(), () -> outcome.body().toString());
        JsonNode coordinates = outcome.body().at("/coordinates");

        DMatrixRMaj wx = new DMatrixRMaj(3, 3);
        double[] column = B2.clone();
        for (int j = 0; j < 3; j++) {
            for (int i = 0; i < 3; i++) {
                wx.set(i, j, column[i]);
            }
            column = new double[] {A[0][0] * column[0], A[1][1] * column[1], A[2][2] * column[2]};
        }
        double[] s = SingularOps_DDRM.singularValues(wx);
        double max = Math.max(s[0], Math.max(s[1], s[2]));
        double min = Math.min(s[0], Math.min(s[1], s[2]));
        double condition = coordinates.at("/controllabilityCondition").asDouble();
        assertEquals(max / min, condition, 1e-6 * condition);
        assertTrue(condition > 1e6, "condition " + condition);
        assertTrue(StreamSupport.stream(outcome.body().at("/notes").spliterator(), false)
                .map(JsonNode::asText)
                .anyMatch(note -> note.contains("controllability matrix") && note.contains("plantGain")));

        DMatrixRMaj closed = new DMatrixRMaj(A);
        for (int i = 0; i < 3; i++) {
            for (int j = 0; j < 3; j++) {
                closed.add(i, j, -B2[i] * coordinates.at("/plantGain/" + j).asDouble());
            }
        }
        EigenDecomposition_F64<DMatrixRMaj> eig = DecompositionFactory_DDRM.eig(3, false);
        assertTrue(eig.decompose(closed));
        List<double[]> targets = new ArrayList<>();
        outcome.body()
                .at("/target/dominantPoles")
                .forEach(p -> targets.add(
                        new double[] {p.get("re").asDouble(), p.get("im").asDouble()}));
        outcome.body()
                .at("/target/auxiliaryPoles")
                .forEach(p -> targets.add(
                        new double[] {p.get("re").asDouble(), p.get("im").asDouble()}));
        for (int i = 0; i < 3; i++) {
            Complex_F64 lambda = eig.getEigenvalue(i);
            double nearest = Double.POSITIVE_INFINITY;
            for (double[] t : targets) {
                nearest = Math.min(nearest, Math.hypot(lambda.real - t[0], lambda.imaginary - t[1]));
            }
            assertTrue(nearest < 1e-6 * lambda.getMagnitude(), "pole " + lambda + " off the targets by " + nearest);
        }
    }

    @Test
    void companionRequestHasNoCondition() {
        String body = "{\"plant\":{\"denominator\":[1,200.48,96,0],\"numerator\":[0.0666667,1],\"b\":80000,"
                + "\"disturbance\":[0,400,0]},\"spec\":{\"settlingTime\":0.3,\"overshootPercent\":1.5},"
                + "\"auxiliaryPoles\":{\"poles\":[{\"re\":-250,\"im\":0}]}}";
        Answer outcome = Answer.highOrder(body.getBytes(StandardCharsets.UTF_8));
        assertEquals(200, outcome.status(), () -> outcome.body().toString());
        assertTrue(outcome.body().at("/coordinates/controllabilityCondition").isMissingNode());
    }
}
