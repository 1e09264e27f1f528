package com.loopwright.solver.integral;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.solver.design.GammaChoice;
import com.loopwright.solver.design.HighOrderDesign;
import com.loopwright.solver.design.RiccatiSolution;
import com.loopwright.solver.design.SpecProposal;
import com.loopwright.solver.design.SpecQuantity;
import com.loopwright.solver.pipeline.LoopStructure;
import com.loopwright.solver.pipeline.RealLoopPipeline;
import com.loopwright.solver.pipeline.RealLoopReport;
import com.loopwright.solver.pipeline.SolverFailure;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.plant.CompanionPlant;
import com.loopwright.solver.riccati.HamiltonianRiccatiSolver;
import com.loopwright.solver.spec.DesignSpec;
import com.loopwright.solver.spec.TimeSpec;
import java.util.Arrays;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.interfaces.decomposition.EigenDecomposition_F64;
import org.hipparchus.linear.MatrixUtils;
import org.hipparchus.linear.RealMatrix;
import org.hipparchus.linear.RiccatiEquationSolverImpl;
import org.junit.jupiter.api.Test;

/**
 * Integral action on our vertical axis: a 12 kg carriage on a linear motor, m x'' + c x' = kF i + F_load with
 * c = 30 N s/m and kF = 40 N/A, so a0 = 0, a1 = c/m = 2.5 1/s, b = kF/m = 3.333 m/(s^2 A), d = 1/m. The load is
 * gravity on the carriage, F_load = -m g = -117.7 N.
 */
class IntegralActionTest {

    static final CanonicalPlant AXIS = new CanonicalPlant(0, 30.0 / 12, 40.0 / 12, 1.0 / 12);
    static final double GRAVITY_LOAD_NEWTONS = -12 * 9.80665;
    /** 2% overshoot (zeta ~ 0.78, above 1/sqrt(2)), 0.4 s to the 2% band. */
    static final DesignSpec SPEC = new DesignSpec(0.02, new TimeSpec.SettlingTime(0.4, 0.02));

    private final RealLoopPipeline pipeline = new RealLoopPipeline();

    static RealLoopReport design(LoopStructure structure) {
        return new RealLoopPipeline()
                .design(RealLoopPipeline.Request.canonical(
                        AXIS, SPEC, new GammaChoice.MarginOverMinimum(1.2), structure, GRAVITY_LOAD_NEWTONS));
    }

    @Test
    void augmentedPlantIsTheOrderThreeCompanionPlantWithAPoleAtTheOrigin() {
        CompanionPlant augmented = IntegralAugmentation.augment(IntegralAugmentation.companionOf(AXIS));
        assertEquals(3, augmented.order());
        assertTrue(Arrays.equals(new double[] {0, AXIS.a0(), AXIS.a1()}, augmented.denominator()));
        assertTrue(Arrays.equals(new double[] {0, 0, AXIS.d()}, augmented.disturbance()));
    }

    @Test
    void augmentedRiccatiSolutionMatchesTheHamiltonianSolverAndHipparchus() {
        HighOrderDesign design = design(LoopStructure.withIntegralAction()).design();
        CompanionPlant plant = design.plant();
        double[] rho2 = design.solution().weightsSquared();
        DMatrixRMaj q = CommonOps_DDRM.diag(rho2);
        double gamma = design.gamma();
        // R = B1 B1'/gamma^2 - B2 B2' (method.md section 1)
        DMatrixRMaj r = new DMatrixRMaj(3, 3);
        r.set(2, 2, plant.disturbance()[2] * plant.disturbance()[2] / (gamma * gamma) - plant.b() * plant.b());
        RiccatiSolution numeric = new HamiltonianRiccatiSolver().solve(plant.stateMatrix(), r, q);
        DMatrixRMaj p = design.solution().p();
        assertEquals(0, relativeDifference(numeric.p(), p), 1e-8, "numeric Hamiltonian solver");
        // Hipparchus solves A'P + PA - P B Rh^-1 B' P + Q = 0; the disturbance is matched, so with
        // k = b^2 - d^2/gamma^2 > 0 the quadratic term is -B Rh^-1 B' with B = e_3 and Rh = 1/k.
        double k = -r.get(2, 2);
        assertTrue(k > 0);
        RealMatrix hipparchus = new RiccatiEquationSolverImpl(
                        MatrixUtils.createRealMatrix(rows(plant.stateMatrix())),
                        MatrixUtils.createRealMatrix(new double[][] {{0}, {0}, {1}}),
                        MatrixUtils.createRealDiagonalMatrix(rho2),
                        MatrixUtils.createRealMatrix(new double[][] {{1 / k}}))
                .getP();
        assertEquals(0, relativeDifference(new DMatrixRMaj(hipparchus.getData()), p), 1e-7, "Hipparchus");
    }

    @Test
    void closedLoopHasTheDominantPairAndTheIntegralPoleAtFourTimesItsRealPart() {
        RealLoopReport report = design(LoopStructure.withIntegralAction());
        double zeta = report.target().dampingRatio();
        double wn = report.target().naturalFrequencyRadPerSec();
        assertEquals(4 * -zeta * wn, report.law().integralPoleRadPerSec(), 1e-12 * wn);
        // X1/R = b (kr s + ki)/(...): the zero -ki/kr sits on the integral pole (method.md section 7)
        assertEquals(
                report.law().integralPoleRadPerSec(),
                -report.law().integralGain() / report.law().referenceGain(),
                1e-9 * wn);
        double[] k = report.law().stateGain();
        // characteristic polynomial s^3 + (a1 + b k2) s^2 + (a0 + b k1) s + b ki against (s^2 + 2 zeta wn s + wn^2)(s -
        // p)
        double p = report.law().integralPoleRadPerSec();
        double b = AXIS.b();
        assertEquals(2 * zeta * wn - p, AXIS.a1() + b * k[1], 1e-9 * wn * wn);
        assertEquals(wn * wn - 2 * zeta * wn * p, AXIS.a0() + b * k[0], 1e-9 * wn * wn);
        assertEquals(-wn * wn * p, b * report.law().integralGain(), 1e-9 * wn * wn * wn);
    }

    @Test
    void stepSpecsHoldExactlyWithIntegralActionAsWithThePlainDesign() {
        for (LoopStructure structure :
                new LoopStructure[] {LoopStructure.plain(), LoopStructure.withIntegralAction()}) {
            RealLoopReport report = design(structure);
            assertTrue(report.specCheck().met(), structure.toString());
            assertEquals(0, report.specCheck().settlingResidual(), RealLoopPipeline.SETTLING_TOLERANCE);
            assertEquals(0, report.specCheck().overshootResidualPoints(), RealLoopPipeline.OVERSHOOT_TOLERANCE_POINTS);
            assertEquals(0, report.stateFeedbackStep().steadyStateError(), 1e-9);
        }
    }

    @Test
    void certificateHoldsForTheAugmentedLoop() {
        RealLoopReport report = design(LoopStructure.withIntegralAction());
        assertTrue(report.stateFeedbackNorm().attainedGain() <= report.design().gamma() * (1 + 1e-9));
        assertNull(report.outputFeedback());
        assertTrue(report.stateFeedbackMargins().closedLoopStable());
        assertTrue(report.stateFeedbackMargins().phaseMarginDegrees() > 30);
    }

    @Test
    void loadStepLeavesNoOffsetWithIntegralActionAndTheTextbookOffsetWithout() {
        RealLoopReport plain = design(LoopStructure.plain());
        // final-value theorem on the plain loop (textbook): x1(inf) = d w0 / (a0 + b k1)
        double expected = AXIS.d()
                * GRAVITY_LOAD_NEWTONS
                / (AXIS.a0() + AXIS.b() * plain.law().stateGain()[0]);
        assertEquals(expected, plain.loadStep().steadyOffset(), 1e-12 * Math.abs(expected));
        assertEquals(expected, plain.loadStep().simulatedFinalOutput(), 1e-6 * Math.abs(expected));

        RealLoopReport integral = design(LoopStructure.withIntegralAction());
        double peak = integral.loadStep().peakDeviation();
        assertTrue(peak > 0);
        // with the integrator the final-value theorem gives 0: s X1(s) -> 0 because b ki sits in the denominator only
        assertEquals(0, integral.loadStep().steadyOffset(), 1e-12 * peak);
        // the window ends 14 slowest time constants in: e^-14 ~ 8e-7 of the slowest mode is left
        assertEquals(0, integral.loadStep().simulatedFinalOutput(), 1e-5 * peak);
        assertTrue(integral.loadStep().recoveryTimeSeconds() > 0);
        assertTrue(
                integral.loadStep().recoveryTimeSeconds() < integral.loadStep().horizonSeconds());
        System.out.printf(
                "vertical axis: plain offset %.4g m, integral peak %.4g m recovered (2%%) after %.4g s, gamma %.4g%n",
                expected,
                peak,
                integral.loadStep().recoveryTimeSeconds(),
                integral.design().gamma());
    }

    @Test
    void loadStepPeakAndRecoveryTimeAgreeWithAnIndependentDormandPrinceSimulation() {
        RealLoopReport report = design(LoopStructure.withIntegralAction());
        double[] k = report.law().stateGain();
        double ki = report.law().integralGain();
        double w0 = GRAVITY_LOAD_NEWTONS;
        // plant, integrator and law written equation by equation, r = 0, load w0 from t = 0
        org.hipparchus.ode.OrdinaryDifferentialEquation ode = new org.hipparchus.ode.OrdinaryDifferentialEquation() {
            @Override
            public int getDimension() {
                return 3;
            }

            @Override
            public double[] computeDerivatives(double t, double[] s) {
                double u = ki * s[2] - k[0] * s[0] - k[1] * s[1];
                return new double[] {s[1], -AXIS.a0() * s[0] - AXIS.a1() * s[1] + AXIS.b() * u + AXIS.d() * w0, -s[0]};
            }
        };
        org.hipparchus.ode.nonstiff.DormandPrince853Integrator integrator =
                new org.hipparchus.ode.nonstiff.DormandPrince853Integrator(1e-12, 1e-2, 1e-13, 1e-13);
        double recovery = report.loadStep().recoveryTimeSeconds();
        double band = com.loopwright.solver.design.LoadStepResponse.RECOVERY_BAND_FRACTION
                * report.loadStep().peakDeviation();
        double step = report.loadStep().horizonSeconds() / (report.loadStep().samples() - 1);
        org.hipparchus.ode.ODEState state = new org.hipparchus.ode.ODEState(0, new double[3]);
        double peak = 0;
        double lastOutside = 0;
        int points = 20_000;
        double end = 3 * recovery;
        for (int i = 1; i <= points; i++) {
            double t = end * i / points;
            org.hipparchus.ode.ODEStateAndDerivative next = integrator.integrate(ode, state, t);
            double y = next.getPrimaryState()[0];
            peak = Math.max(peak, Math.abs(y));
            if (Math.abs(y) > band) {
                lastOutside = t;
            }
            state = new org.hipparchus.ode.ODEState(next.getTime(), next.getPrimaryState());
        }
        assertEquals(peak, report.loadStep().peakDeviation(), 1e-4 * peak);
        // both resolve the last exit to their own grids
        assertEquals(lastOutside, recovery, step + end / points);
    }

    @Test
    void infeasibleAugmentedDesignIsASolverFailureWithAComputedProposal() {
        // 10% overshoot: zeta ~ 0.59 < 1/sqrt(2), outside the region of an axis without stiffness (method.md sec. 6)
        DesignSpec tooLively = new DesignSpec(0.10, new TimeSpec.SettlingTime(0.4, 0.02));
        RealLoopPipeline.Request request = RealLoopPipeline.Request.canonical(
                AXIS, tooLively, new GammaChoice.MarginOverMinimum(1.2), LoopStructure.withIntegralAction(), -1);
        SolverFailure failure = assertThrows(SolverFailure.class, () -> pipeline.design(request));
        assertEquals(SolverFailure.Kind.INFEASIBLE_SPEC, failure.kind());
        assertFalse(failure.infeasibility().proposals().isEmpty());
        SpecProposal proposal = failure.infeasibility().proposals().get(0);
        assertEquals(SpecQuantity.OVERSHOOT_PERCENT, proposal.quantity());
        // the proposal is computed: designing it succeeds
        RealLoopReport accepted = pipeline.design(RealLoopPipeline.Request.canonical(
                AXIS,
                tooLively.withOvershoot(proposal.value() / 100),
                new GammaChoice.MarginOverMinimum(1.2),
                LoopStructure.withIntegralAction(),
                -1));
        assertTrue(accepted.specCheck().met());
    }

    @Test
    void canonicalPlantWithoutDisturbanceInputIsAPlantModelFailureNotAnUncheckedError() {
        CanonicalPlant noLoadInput = new CanonicalPlant(0, 2.5, 40.0 / 12, 0);
        SolverFailure failure = assertThrows(
                SolverFailure.class,
                () -> RealLoopPipeline.Request.canonical(
                        noLoadInput,
                        SPEC,
                        new GammaChoice.MarginOverMinimum(1.2),
                        LoopStructure.withIntegralAction(),
                        1));
        assertEquals(SolverFailure.Kind.PLANT_MODEL, failure.kind());
        assertEquals("d", failure.subject());
    }

    static double relativeDifference(DMatrixRMaj a, DMatrixRMaj b) {
        DMatrixRMaj difference = a.copy();
        CommonOps_DDRM.subtractEquals(difference, b);
        return org.ejml.dense.row.NormOps_DDRM.normF(difference) / org.ejml.dense.row.NormOps_DDRM.normF(b);
    }

    static double[][] rows(DMatrixRMaj m) {
        double[][] rows = new double[m.numRows][m.numCols];
        for (int i = 0; i < m.numRows; i++) {
            for (int j = 0; j < m.numCols; j++) {
                rows[i][j] = m.get(i, j);
            }
        }
        return rows;
    }

    static double largestRealPart(DMatrixRMaj m) {
        EigenDecomposition_F64<DMatrixRMaj> eig = DecompositionFactory_DDRM.eig(m.numRows, false);
        assertTrue(eig.decompose(m.copy()));
        double max = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < eig.getNumberOfEigenvalues(); i++) {
            max = Math.max(max, eig.getEigenvalue(i).real);
        }
        return max;
    }
}
