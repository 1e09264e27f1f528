package com.loopwright.solver.robustness;

import static org.junit.jupiter.api.Assertions.assertEquals;

import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.loop.LoopMatrices;
import com.loopwright.solver.simulation.DiscreteStateSpace;
import com.loopwright.solver.simulation.ZeroOrderHold;
import java.util.Arrays;
import org.ejml.data.Complex_F64;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.junit.jupiter.api.Test;

/** The direct discrete design places the poles of Ad - Bd K at e^(lambda Ts), checked by EJML eigenvalues. */
class DiscretePoleMatchingTest {

    @Test
    void discretePolesAreTheMappedContinuousPolesAndDcGainIsOne() {
        double ts = 0.004;
        FeedbackGains direct = new DiscretePoleMatching().design(IndexingAxis.PLANT, IndexingAxis.GAINS, ts);
        DiscreteStateSpace hold = ZeroOrderHold.discretize(
                LoopMatrices.openLoop(IndexingAxis.PLANT), LoopMatrices.actuatorInput(IndexingAxis.PLANT), ts);
        DMatrixRMaj closed = hold.ad();
        DMatrixRMaj bd = hold.bd();
        for (int i = 0; i < 2; i++) {
            closed.add(i, 0, -bd.get(i, 0) * direct.positionGain());
            closed.add(i, 1, -bd.get(i, 0) * direct.velocityGain());
        }
        Complex_F64[] discrete = LoopMatrices.poles(closed);
        Complex_F64[] continuous = LoopMatrices.poles(LoopMatrices.closedLoop(IndexingAxis.PLANT, IndexingAxis.GAINS));
        double[] expectedIm = new double[2];
        double[] actualIm = new double[2];
        for (int i = 0; i < 2; i++) {
            double r = Math.exp(continuous[i].real * ts);
            expectedIm[i] = r * Math.sin(continuous[i].imaginary * ts);
            actualIm[i] = discrete[i].imaginary;
            assertEquals(r * Math.cos(continuous[i].imaginary * ts), discrete[i].real, 1e-12);
        }
        Arrays.sort(expectedIm);
        Arrays.sort(actualIm);
        assertEquals(expectedIm[0], actualIm[0], 1e-10);
        assertEquals(expectedIm[1], actualIm[1], 1e-10);
        // x = A_cl,d x + Bd kr r at rest: x1 = r
        DMatrixRMaj m = CommonOps_DDRM.identity(2);
        CommonOps_DDRM.subtractEquals(m, closed);
        DMatrixRMaj x = new DMatrixRMaj(2, 1);
        DMatrixRMaj rhs = bd.copy();
        CommonOps_DDRM.scale(direct.referenceGain(), rhs);
        CommonOps_DDRM.solve(m, rhs, x);
        assertEquals(1, x.get(0, 0), 1e-10);
    }
}
