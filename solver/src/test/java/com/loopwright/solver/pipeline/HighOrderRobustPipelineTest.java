package com.loopwright.solver.pipeline;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.solver.design.GammaChoice;
import com.loopwright.solver.design.HighOrderDesign;
import com.loopwright.solver.design.StepMetrics;
import com.loopwright.solver.highorder.HighOrderVerifier;
import com.loopwright.solver.plant.CompanionPlant;
import com.loopwright.solver.robustness.AcceptanceLimits;
import com.loopwright.solver.robustness.CompanionBox;
import com.loopwright.solver.simulation.LinearLoop;
import com.loopwright.solver.spec.AuxiliaryPlacement;
import com.loopwright.solver.spec.DesignSpec;
import com.loopwright.solver.spec.TargetDynamics;
import com.loopwright.solver.spec.TimeSpec;
import java.util.List;
import org.ejml.data.Complex_F64;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.interfaces.decomposition.EigenDecomposition_F64;
import org.junit.jupiter.api.Test;

/**
 * The order-n robust design on a tank-level loop of our own (invented numbers): tank integrator, valve lag 5 s, sensor
 * lag 2 s, s (s + 0.2) (s + 0.5) = s^3 + 0.7 s^2 + 0.1 s, b = 0.05.
 */
class HighOrderRobustPipelineTest {

    private static final CompanionPlant TANK =
            new CompanionPlant(new double[] {0, 0.1, 0.7}, new double[] {1, 0, 0}, 0.05, new double[] {0, 0, 1});
    private static final DesignSpec SPEC = new DesignSpec(0.02, new TimeSpec.SettlingTime(1, 0.02));
    private static final AuxiliaryPlacement AUXILIARY = new AuxiliaryPlacement.RealPartMultiple(4);
    private static final GammaChoice GAMMA = new GammaChoice.MarginOverMinimum(1.2);

    /** a_2 (the valve lag) +-10 %, b +-20 %. */
    private static CompanionBox box() {
        return new CompanionBox(new double[] {0, 0.1, 0.63}, new double[] {0, 0.1, 0.77}, 0.04, 0.06);
    }

    private static HighOrderPipeline.Request request() {
        return new HighOrderPipeline.Request(TANK, null, SPEC, AUXILIARY, false, GAMMA, 1, 0.02, 10);
    }

    @Test
    void cornersAreInTheDocumentedBinaryOrderAndSamplesRepeatWithTheSeed() {
        // openapi.yaml HighOrderUncertaintyInput: the ranged parameters in the order a_2, a_1, a_0, b, the first
        // in the lowest bit
        List<CompanionPlant> corners = box().corners(TANK);
        assertEquals(4, corners.size());
        double[][] expected = {{0.63, 0.04}, {0.77, 0.04}, {0.63, 0.06}, {0.77, 0.06}};
        for (int i = 0; i < 4; i++) {
            assertEquals(expected[i][0], corners.get(i).denominator()[2], 0);
            assertEquals(0.1, corners.get(i).denominator()[1], 0);
            assertEquals(expected[i][1], corners.get(i).b(), 0);
        }
        List<CompanionPlant> a = box().samples(TANK, 30, 9);
        List<CompanionPlant> b = box().samples(TANK, 10, 9);
        for (int s = 0; s < 10; s++) {
            // a consumer that draws fewer samples sees a prefix of the same sequence
            assertEquals(a.get(s).b(), b.get(s).b(), 0);
            assertEquals(a.get(s).denominator()[2], b.get(s).denominator()[2], 0);
        }
        for (CompanionPlant p : a) {
            assertTrue(p.b() >= 0.04 && p.b() <= 0.06 && p.denominator()[2] >= 0.63 && p.denominator()[2] <= 0.77);
            assertEquals(0.1, p.denominator()[1], 0);
        }
        // the b range must not contain 0; at most 4 ranged parameters
        assertThrows(IllegalArgumentException.class, () -> new CompanionBox(new double[3], new double[3], -1, 1));
        assertThrows(
                IllegalArgumentException.class,
                () -> new CompanionBox(new double[] {0, 0, 0, 0}, new double[] {1, 1, 1, 1}, 1, 2));
    }

    @Test
    void theJudgeOnTheNominalPlantIsTheDesignsOwnVerifiedLoop() {
        HighOrderRobustSearch judge = new HighOrderRobustSearch(
                TANK, AUXILIARY, GAMMA, box(), 0, 1, new AcceptanceLimits(1.0, null, 2.0, 0.02), null, 1);
        HighOrderDesign design = judge.designAt(new TargetDynamics(0.78, 4.4));
        assertNotNull(design);
        // the loop the pole-placement formula builds (ClosedLoopStep: last row -alpha, kr = alpha_0 / (b c_0)),
        // verified by HighOrderVerifier: the same metrics and the same norm from w to z
        var verification = new HighOrderVerifier().verify(design, 1, 0.02, 1);
        StepMetrics judged = judge.metrics(design, TANK);
        StepMetrics verified = verification.step().metrics();
        assertEquals(verified.settlingTimeSeconds(), judged.settlingTimeSeconds(), 1e-4);
        assertEquals(verified.overshootPercent(), judged.overshootPercent(), 1e-4);
        assertEquals(verified.peakControl(), judged.peakControl(), 1e-9 * verified.peakControl());
        assertEquals(
                verification.norm().value(),
                judge.norm(design, TANK),
                1e-8 * verification.norm().value());
        // a slow pair has no design on this plant (the weighting cannot reach it): the judge says so with null
        assertNull(judge.designAt(new TargetDynamics(0.78, 0.05)));
    }

    @Test
    void thePerturbedLoopHasTheCharacteristicPolynomialOfThePerturbedCoefficients() {
        // the closed loop of u = -K z on a' and b' has the polynomial s^3 + sum (a'_j + b' k_j) s^j (companion form,
        // textbook)
        HighOrderRobustSearch judge = new HighOrderRobustSearch(
                TANK, AUXILIARY, GAMMA, box(), 0, 1, new AcceptanceLimits(1.0, null, 2.0, 0.02), null, 1);
        HighOrderDesign design = judge.designAt(new TargetDynamics(0.78, 4.4));
        CompanionPlant corner = box().corners(TANK).get(1);
        LinearLoop loop = HighOrderRobustSearch.loop(design, corner);
        double[] k = design.gain();
        double[] a = corner.denominator();
        EigenDecomposition_F64<DMatrixRMaj> eig = DecompositionFactory_DDRM.eig(3, false);
        assertTrue(eig.decompose(loop.a().copy()));
        for (int i = 0; i < 3; i++) {
            Complex_F64 s = eig.getEigenvalue(i);
            Complex_F64 p = new Complex_F64(1, 0);
            for (int j = 2; j >= 0; j--) {
                p = p.times(s).plus(new Complex_F64(a[j] + corner.b() * k[j], 0));
            }
            assertEquals(0, p.getMagnitude(), 1e-9 * Math.pow(s.getMagnitude(), 3) + 1e-9, "root " + i);
        }
    }

    @Test
    void theRobustDesignMeetsEveryCaseAndMovesTheTarget() {
        HighOrderRobustReport report = new HighOrderRobustPipeline().design(request(), box(), 30, 5, null);
        assertTrue(report.meetsEverywhere());
        assertEquals(4, report.corners().size());
        assertEquals(34, report.cases().size());
        for (HighOrderRobustReport.Case c : report.cases()) {
            assertTrue(c.metrics().settlingTimeSeconds() <= 1 && c.metrics().overshootPercent() <= 2);
        }
        assertTrue(report.design().design().poles().dominant().naturalFrequencyRadPerSec()
                > report.requestedTarget().naturalFrequencyRadPerSec());
        HighOrderRobustReport.Binding binding = report.binding();
        assertTrue(binding.ratio() <= 1 && binding.ratio() > 0.99, binding.toString());
        // a state space or spec matching is refused before anything runs
        HighOrderPipeline.Request matching =
                new HighOrderPipeline.Request(TANK, null, SPEC, AUXILIARY, true, GAMMA, 1, 0.02, 10);
        assertThrows(
                IllegalArgumentException.class,
                () -> new HighOrderRobustPipeline().design(matching, box(), 0, 1, null));
    }

    @Test
    void anActuatorLimitNoPairMeetsIsInfeasibleWithALongerSettlingTime() {
        SolverFailure failure = assertThrows(
                SolverFailure.class, () -> new HighOrderRobustPipeline().design(request(), box(), 0, 5, 2.0));
        assertEquals(SolverFailure.Kind.INFEASIBLE_SPEC, failure.kind());
        assertTrue(failure.infeasibility().proposals().get(0).value() > 1);
    }
}
