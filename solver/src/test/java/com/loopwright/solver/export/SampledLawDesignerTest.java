package com.loopwright.solver.export;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.solver.design.ClosedFormDesign;
import com.loopwright.solver.design.SampledLaw;
import com.loopwright.solver.pipeline.DesignReport;
import com.loopwright.solver.simulation.LinearLoop;
import com.loopwright.solver.simulation.StepResponse;
import com.loopwright.solver.simulation.StepSimulator;
import org.ejml.data.Complex_F64;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.interfaces.decomposition.EigenDecomposition_F64;
import org.junit.jupiter.api.Test;

class SampledLawDesignerTest {

    private final SampledLawDesigner designer = new SampledLawDesigner();

    /** The 2 x 2 closed form of the spectral radius against EJML's general eigen decomposition. */
    @Test
    void spectralRadiusMatchesEjmlEigenvalues() {
        double[][] cases = {{0.9, 0.1, -0.2, 0.8}, {0.5, 0.4, 0.3, 0.2}, {1.1, 0, 0, -0.3}, {0, 1, -0.98, 1.9}};
        for (double[] m : cases) {
            EigenDecomposition_F64<DMatrixRMaj> eig = DecompositionFactory_DDRM.eig(2, false);
            assertTrue(eig.decompose(new DMatrixRMaj(new double[][] {{m[0], m[1]}, {m[2], m[3]}})));
            double expected = 0;
            for (int i = 0; i < 2; i++) {
                Complex_F64 z = eig.getEigenvalue(i);
                expected = Math.max(expected, Math.hypot(z.real, z.imaginary));
            }
            assertEquals(expected, SampledLawDesigner.spectralRadius(m[0], m[1], m[2], m[3]), 1e-12);
        }
    }

    /**
     * At a short period the sampled loop's poles approach e^(s T) of the continuous poles (common practice:
     * the emulated law keeps the continuous poles to first order in T), |z| = e^(-zeta wn T).
     */
    @Test
    void shortPeriodKeepsTheContinuousPoles() {
        ClosedFormDesign design = IndexingAxis.report().design();
        double period = 1e-4;
        SampledLaw law = designer.emulate(design, period, -10, 10);
        double zeta = design.target().dampingRatio();
        double wn = design.target().naturalFrequencyRadPerSec();
        assertEquals(Math.exp(-zeta * wn * period), law.sampledSpectralRadius(), 2e-5);
        assertEquals(wn * period, law.periodPerTimeConstant(), 1e-15);
    }

    /**
     * Independent route: with a generous limit and a 0.1 ms period, the sampled step stays within 1% of the
     * continuous loop simulated by StepSimulator (exact ZOH of the continuous closed loop).
     */
    @Test
    void sampledStepFollowsTheContinuousStep() {
        DesignReport report = IndexingAxis.report();
        ClosedFormDesign d = report.design();
        double period = 1e-4;
        SampledLaw law = designer.emulate(d, period, -1e6, 1e6);
        int steps = 3000;
        double[][] sampled = new SampledLawSimulator().run(IndexingAxis.PLANT, law, 1, steps);
        double b = IndexingAxis.PLANT.b();
        LinearLoop loop = new LinearLoop(
                new DMatrixRMaj(new double[][] {{0, 1}, {-b * d.positionGain(), -0.48 - b * d.velocityGain()}}),
                new DMatrixRMaj(new double[][] {{0}, {b * d.referenceGain()}}),
                new DMatrixRMaj(new double[][] {{1, 0}}),
                new DMatrixRMaj(new double[][] {{-d.positionGain(), -d.velocityGain()}}),
                d.referenceGain());
        StepResponse continuous = new StepSimulator().simulate(loop, 1, period * (steps - 1), steps);
        double worst = 0;
        for (int k = 0; k < steps; k++) {
            worst = Math.max(worst, Math.abs(sampled[k][0] - continuous.output()[k]));
        }
        assertTrue(worst < 0.01, "largest position difference " + worst);
        assertEquals(1, sampled[steps - 1][0], 0.02); // inside the 2% band two settling times after the step
    }

    @Test
    void clampHoldsTheActuatorLimit() {
        SampledLaw law = designer.emulate(IndexingAxis.report().design(), 1e-3, -0.5, 0.5);
        double[][] rows = new SampledLawSimulator().run(IndexingAxis.PLANT, law, 1, 500);
        for (double[] row : rows) {
            assertTrue(Math.abs(row[2]) <= 0.5);
        }
        assertEquals(0.5, rows[0][2], 0);
    }

    @Test
    void tooLongOrBadPeriodsAndLimitsAreRejected() {
        ClosedFormDesign design = IndexingAxis.report().design();
        SampledLawException tooLong =
                assertThrows(SampledLawException.class, () -> designer.emulate(design, 0.05, -1, 1));
        assertTrue(tooLong.aboutSamplePeriod());
        assertThrows(SampledLawException.class, () -> designer.emulate(design, 0, -1, 1));
        assertThrows(SampledLawException.class, () -> designer.emulate(design, Double.NaN, -1, 1));
        SampledLawException limit = assertThrows(SampledLawException.class, () -> designer.emulate(design, 1e-3, 0, 0));
        assertTrue(!limit.aboutSamplePeriod());
    }
}
