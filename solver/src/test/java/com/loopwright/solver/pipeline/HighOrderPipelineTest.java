package com.loopwright.solver.pipeline;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.junit.jupiter.api.Test;

/** The numerics the order-n front door took over from the api's mapping step. */
class HighOrderPipelineTest {

    @Test
    void gainOnThePlantStateIsTheCompanionGainTimesTheInverseTransform() {
        // Independent route (textbook linear algebra): K T^-1 with T^-1 from an explicit Gauss-Jordan inverse.
        DMatrixRMaj t = new DMatrixRMaj(new double[][] {{2, 1, 0}, {0, 1, 3}, {1, 0, 1}});
        double[] k = {1, 2, 3};
        DMatrixRMaj inverse = t.copy();
        CommonOps_DDRM.invert(inverse);
        DMatrixRMaj expected = new DMatrixRMaj(1, 3);
        CommonOps_DDRM.mult(new DMatrixRMaj(1, 3, true, k), inverse, expected);
        double[] lu = HighOrderPipeline.gainOnPlantState(t, k);
        for (int i = 0; i < k.length; i++) {
            assertEquals(expected.get(i), lu[i], 1e-14 * (1 + Math.abs(expected.get(i))));
        }
    }

    @Test
    void anOutputWithAZeroAtTheOriginIsRefusedBeforeAnyDesign() {
        // y = x2 = dx1/dt of x1'' + 3 x1' + 2 x1 = u: G(s) = s / (s^2 + 3 s + 2), no DC gain (textbook form).
        HighOrderPipeline.StateSpace derivative = new HighOrderPipeline.StateSpace(
                new DMatrixRMaj(new double[][] {{0, 1}, {-2, -3}}), new DMatrixRMaj(new double[][] {{0}, {1}}),
                new DMatrixRMaj(new double[][] {{0}, {1}}), new DMatrixRMaj(new double[][] {{0, 1}}));
        SolverFailure failure = assertThrows(
                SolverFailure.class,
                () -> new HighOrderPipeline()
                        .design(new HighOrderPipeline.Request(null, derivative, null, null, false, null, 1, 0.02, 0)));
        assertEquals(SolverFailure.Kind.NO_DC_GAIN, failure.kind());
    }
}
