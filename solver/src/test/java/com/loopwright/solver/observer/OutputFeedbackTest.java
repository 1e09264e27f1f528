package com.loopwright.solver.observer;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.design.GammaChoice;
import com.loopwright.solver.design.HInfinityNorm;
import com.loopwright.solver.design.LoopMargins;
import com.loopwright.solver.design.ObserverDesign;
import com.loopwright.solver.design.PlantInputMargins;
import com.loopwright.solver.design.TrackingLaw;
import com.loopwright.solver.frequency.LoopFrequencyAnalyzer;
import com.loopwright.solver.frequency.StateSpaceMargins;
import com.loopwright.solver.integral.IntegralAugmentation;
import com.loopwright.solver.norm.HInfinityNormCalculator;
import com.loopwright.solver.pipeline.LoopStructure;
import com.loopwright.solver.pipeline.ObserverChoice;
import com.loopwright.solver.pipeline.RealLoopPipeline;
import com.loopwright.solver.pipeline.RealLoopReport;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.plant.CompanionPlant;
import com.loopwright.solver.simulation.LinearLoop;
import com.loopwright.solver.simulation.StepResponse;
import com.loopwright.solver.simulation.StepSimulator;
import com.loopwright.solver.spec.AuxiliaryPlacement;
import com.loopwright.solver.spec.DesignSpec;
import com.loopwright.solver.spec.TargetDynamics;
import com.loopwright.solver.spec.TimeSpec;
import java.util.List;
import org.ejml.data.DMatrixRMaj;
import org.hipparchus.linear.MatrixUtils;
import org.hipparchus.linear.RealMatrix;
import org.hipparchus.linear.RiccatiEquationSolverImpl;
import org.hipparchus.ode.ODEState;
import org.hipparchus.ode.ODEStateAndDerivative;
import org.hipparchus.ode.OrdinaryDifferentialEquation;
import org.hipparchus.ode.nonstiff.DormandPrince853Integrator;
import org.junit.jupiter.api.Test;

/**
 * Position-only sensing. Scenarios: our vertical axis (12 kg carriage on a linear motor, gravity as the load, an
 * encoder of 0.1 mm resolution read every millisecond) and a tank-level loop of order 3 (a pump with a 2 s lag
 * feeding two tanks in series with 40 s and 60 s time constants, 0.5 m of level per unit pump command, the lower
 * level measured).
 */
class OutputFeedbackTest {

    static final CanonicalPlant AXIS = new CanonicalPlant(0, 30.0 / 12, 40.0 / 12, 1.0 / 12);
    static final DesignSpec AXIS_SPEC = new DesignSpec(0.02, new TimeSpec.SettlingTime(0.4, 0.02));
    /** Force noise of intensity 25 N^2 s at the load input; encoder 0.1 mm read every 1 ms. */
    static final ObserverChoice.Kalman ENCODER = ObserverChoice.Kalman.fromResolution(25, 1e-4, 1e-3);

    static final double TANK_A0 = 0.5 * 0.025 / 60;
    static final CompanionPlant TANK = new CompanionPlant(
            new double[] {TANK_A0, 0.5 * 0.025 + 0.5 / 60 + 0.025 / 60, 0.5 + 0.025 + 1.0 / 60},
            new double[] {0.5 * TANK_A0, 0, 0},
            1,
            new double[] {0, 0, 1});

    private final RealLoopPipeline pipeline = new RealLoopPipeline();

    static RealLoopReport axis(boolean integral, ObserverChoice observer) {
        return new RealLoopPipeline()
                .design(RealLoopPipeline.Request.canonical(
                        AXIS,
                        AXIS_SPEC,
                        new GammaChoice.MarginOverMinimum(1.2),
                        new LoopStructure(integral, 4, LoopStructure.Measurement.POSITION, observer),
                        -12 * 9.80665));
    }

    @Test
    void scalarKalmanGainMatchesTheHandSolution() {
        // x' = a x + w, y = x + v: 2 a Y - Y^2 / v + q = 0 gives Y = v (a + sqrt(a^2 + q / v)) and L = Y / v
        // (the scalar Kalman-Bucy filter, e.g. Anderson and Moore, Optimal Filtering, the continuous-time chapter)
        double a = -0.7;
        double q = 3;
        double v = 0.2;
        ObserverDesign design = new ObserverDesigner()
                .kalman(
                        new DMatrixRMaj(new double[][] {{a}}),
                        new DMatrixRMaj(new double[][] {{1}}),
                        new DMatrixRMaj(new double[][] {{1}}),
                        q,
                        v);
        double y = v * (a + Math.sqrt(a * a + q / v));
        assertEquals(y, design.errorCovariance().get(0, 0), 1e-12 * y);
        assertEquals(y / v, design.gain()[0], 1e-12 * y / v);
        // the error pole a - L = -sqrt(a^2 + q/v)
        assertEquals(-Math.sqrt(a * a + q / v), design.poles().get(0).re(), 1e-12);
    }

    @Test
    void kalmanGainOfTheAxisMatchesHipparchus() {
        CompanionPlant plant = IntegralAugmentation.companionOf(AXIS);
        // a noisier sensor than the encoder keeps the dual problem well scaled for Hipparchus' eigen solver
        ObserverChoice.Kalman sensor = new ObserverChoice.Kalman(25, 1e-6);
        ObserverDesign design = new ObserverDesigner()
                .kalman(
                        plant.stateMatrix(),
                        plant.disturbanceInput(),
                        plant.outputRow(),
                        sensor.processIntensity(),
                        sensor.measurementIntensity());
        // the dual LQ problem: Hipparchus solves A~'Y + Y A~ - Y B~ R~^-1 B~' Y + Q~ = 0 with A~ = A', B~ = C', R~ = v,
        // Q~ = q B1 B1'; then L = Y C' / v
        double d = AXIS.d();
        RealMatrix y = new RiccatiEquationSolverImpl(
                        MatrixUtils.createRealMatrix(new double[][] {{0, -AXIS.a0()}, {1, -AXIS.a1()}}),
                        MatrixUtils.createRealMatrix(new double[][] {{1}, {0}}),
                        MatrixUtils.createRealMatrix(new double[][] {{0, 0}, {0, sensor.processIntensity() * d * d}}),
                        MatrixUtils.createRealMatrix(new double[][] {{sensor.measurementIntensity()}}))
                .getP();
        double[] expected = {
            y.getEntry(0, 0) / sensor.measurementIntensity(), y.getEntry(1, 0) / sensor.measurementIntensity()
        };
        for (int i = 0; i < 2; i++) {
            assertEquals(expected[i], design.gain()[i], 1e-7 * Math.abs(expected[i]), "L" + i);
        }
        for (TargetDynamics.Pole p : design.poles()) {
            assertTrue(p.re() < 0);
        }
    }

    @Test
    void poleMultipleObserverPutsTheErrorPolesAtTheMultipleOfTheControllerPoles() {
        RealLoopReport report = axis(false, new ObserverChoice.PoleMultiple(5));
        ObserverDesign observer = report.observer();
        assertEquals(ObserverDesign.Method.POLE_MULTIPLE, observer.method());
        double zeta = report.target().dampingRatio();
        double wn = 5 * report.target().naturalFrequencyRadPerSec();
        // eigenvalues of A - L C (EJML) against -zeta wn +- j wn sqrt(1 - zeta^2) (Ackermann's formula, e.g. Ogata)
        for (TargetDynamics.Pole p : observer.poles()) {
            assertEquals(-zeta * wn, p.re(), 1e-8 * wn);
            assertEquals(wn * Math.sqrt(1 - zeta * zeta), Math.abs(p.im()), 1e-8 * wn);
        }
    }

    @Test
    void fullLoopStepIsTheStateFeedbackStepAndMeetsTheSpecsExactly() {
        for (ObserverChoice choice : new ObserverChoice[] {ENCODER, new ObserverChoice.PoleMultiple(5)}) {
            for (boolean integral : new boolean[] {false, true}) {
                RealLoopReport report = axis(integral, choice);
                String label = choice + " integral " + integral;
                assertNotNull(report.outputFeedback(), label);
                // separation: r drives plant and observer alike, so the estimation error stays zero
                assertEquals(0, report.outputFeedback().largestStepDifference(), 1e-9, label);
                assertTrue(report.specCheck().met(), label);
                assertEquals(0, report.specCheck().settlingResidual(), RealLoopPipeline.SETTLING_TOLERANCE, label);
                assertEquals(
                        0,
                        report.specCheck().overshootResidualPoints(),
                        RealLoopPipeline.OVERSHOOT_TOLERANCE_POINTS,
                        label);
                assertEquals(
                        report.stateFeedbackStep().settlingTimeSeconds(),
                        report.outputFeedback().step().settlingTimeSeconds(),
                        1e-6,
                        label);
            }
        }
    }

    @Test
    void assembledFullLoopAgreesWithAnIndependentSimulationOfPlantObserverAndLaw() {
        RealLoopReport report = axis(true, ENCODER);
        TrackingLaw law = report.law();
        double[] l = report.observer().gain();
        CompanionPlant plant = IntegralAugmentation.companionOf(AXIS);
        LoopSystem loop = OutputFeedbackLoop.closed(
                plant, plant.numerator(), law, l, report.design().weights());
        double horizon = 1.2;
        int samples = 241;
        StepResponse exact = new StepSimulator()
                .simulate(
                        new LinearLoop(loop.a(), loop.reference(), loop.output(), loop.command(), law.referenceGain()),
                        1,
                        horizon,
                        samples);
        // the same loop written equation by equation, integrated by Hipparchus Dormand-Prince 8(5,3)
        double a0 = AXIS.a0();
        double a1 = AXIS.a1();
        double b = AXIS.b();
        double[] k = law.stateGain();
        double r = 1;
        OrdinaryDifferentialEquation ode = new OrdinaryDifferentialEquation() {
            @Override
            public int getDimension() {
                return 5;
            }

            @Override
            public double[] computeDerivatives(double t, double[] s) {
                double x1 = s[0];
                double x2 = s[1];
                double xi = s[2];
                double e1 = s[3];
                double e2 = s[4];
                double u = law.referenceGain() * r + law.integralGain() * xi - k[0] * e1 - k[1] * e2;
                double innovation = x1 - e1;
                return new double[] {
                    x2,
                    -a0 * x1 - a1 * x2 + b * u,
                    r - x1,
                    e2 + l[0] * innovation,
                    -a0 * e1 - a1 * e2 + b * u + l[1] * innovation
                };
            }
        };
        DormandPrince853Integrator integrator = new DormandPrince853Integrator(1e-12, 1e-2, 1e-12, 1e-12);
        ODEState state = new ODEState(0, new double[5]);
        double worst = 0;
        for (int i = 1; i < samples; i++) {
            ODEStateAndDerivative next = integrator.integrate(ode, state, exact.timeAt(i));
            worst = Math.max(worst, Math.abs(next.getPrimaryState()[0] - exact.outputAt(i)));
            state = new ODEState(next.getTime(), next.getPrimaryState());
        }
        assertEquals(0, worst, 1e-8);
    }

    @Test
    void fullLoopNormAgreesWithADenseFrequencySweepAndIsNotClaimedAsTheCertificate() {
        RealLoopReport report = axis(true, ENCODER);
        CompanionPlant plant = IntegralAugmentation.companionOf(AXIS);
        LoopSystem loop = OutputFeedbackLoop.closed(
                plant,
                plant.numerator(),
                report.law(),
                report.observer().gain(),
                report.design().weights());
        HInfinityNorm hamiltonian = report.outputFeedback().disturbanceToPerformanceNorm();
        // dense sweep of |G(jw)| (one input, so sigma_max is the Euclidean norm of the column) on 20000 log points
        double sweep = 0;
        double sweepNoise = 0;
        int points = 20_000;
        for (int i = 0; i < points; i++) {
            double w = 1e-3 * Math.pow(1e8, (double) i / (points - 1));
            sweep = Math.max(sweep, columnGain(loop.a(), loop.disturbance(), loop.performance(), w));
            sweepNoise = Math.max(sweepNoise, columnGain(loop.a(), loop.noise(), loop.command(), w));
        }
        assertTrue(sweep <= hamiltonian.value() * (1 + 1e-9), "sweep " + sweep + " norm " + hamiltonian.value());
        assertEquals(hamiltonian.value(), sweep, 1e-4 * hamiltonian.value());
        HInfinityNorm noise = report.outputFeedback().noiseToCommandGain();
        assertTrue(sweepNoise <= noise.value() * (1 + 1e-9));
        assertEquals(noise.value(), sweepNoise, 1e-4 * noise.value());
        assertEquals(
                hamiltonian.attainedGain() > report.design().gamma(),
                report.outputFeedback().exceedsGamma());
        System.out.printf(
                "axis, integral + Kalman: gamma %.4g, state-feedback norm %.4g, full-loop norm %.4g, noise to command %.4g,"
                        + " phase margin %.3g deg (state feedback %.3g)%n",
                report.design().gamma(),
                report.stateFeedbackNorm().value(),
                hamiltonian.value(),
                noise.value(),
                report.outputFeedback().margins().phaseMarginDegrees(),
                report.stateFeedbackMargins().phaseMarginDegrees());
    }

    @Test
    void slowObserverRaisesTheFullLoopNormAboveGammaAndTheReportSaysSo() {
        RealLoopReport report = axis(true, new ObserverChoice.PoleMultiple(1));
        double full = report.outputFeedback().disturbanceToPerformanceNorm().attainedGain();
        System.out.printf(
                "axis, observer at 1x the controller poles: gamma %.4g, full-loop norm %.4g%n",
                report.design().gamma(), full);
        assertTrue(full > report.design().gamma(), "full-loop norm " + full);
        assertTrue(report.outputFeedback().exceedsGamma());
        assertTrue(report.stateFeedbackNorm().attainedGain() <= report.design().gamma() * (1 + 1e-9));
        assertTrue(report.notes().stream().anyMatch(n -> n.contains("does not cover the output-feedback loop")));
    }

    @Test
    void statePlantInputMarginsMatchTheClosedFormAnalyzerOnThePlainLoop() {
        RealLoopReport report = new RealLoopPipeline()
                .design(RealLoopPipeline.Request.canonical(
                        AXIS, AXIS_SPEC, new GammaChoice.MarginOverMinimum(1.2), LoopStructure.plain(), -1));
        double[] k = report.law().stateGain();
        LoopMargins closedForm = new LoopFrequencyAnalyzer()
                .margins(AXIS, new FeedbackGains(k[0], k[1], report.law().referenceGain()), 0);
        PlantInputMargins swept = report.stateFeedbackMargins();
        assertEquals(
                closedForm.crossoverRadPerSec(), swept.crossoverRadPerSec(), 1e-9 * closedForm.crossoverRadPerSec());
        assertEquals(closedForm.phaseMarginDegrees(), swept.phaseMarginDegrees(), 1e-6);
        assertEquals(closedForm.delayMarginSeconds(), swept.delayMarginSeconds(), 1e-8);
        assertEquals(closedForm.peakSensitivity(), swept.peakSensitivity(), 1e-3 * closedForm.peakSensitivity());
        // L(jw) of the state-space loop against the rational form b (k1 + k2 s)/(s^2 + a1 s + a0)
        CompanionPlant plant = IntegralAugmentation.companionOf(AXIS);
        OpenLoopAtInput open = OutputFeedbackLoop.atPlantInput(plant, plant.numerator(), report.law(), null);
        double w = 7.3;
        double[] l = StateSpaceMargins.at(open.a(), open.input(), open.command(), w);
        double[] rational = new com.loopwright.solver.frequency.RationalLoop(
                        new double[] {AXIS.b() * k[0], AXIS.b() * k[1]}, new double[] {AXIS.a0(), AXIS.a1(), 1})
                .at(w);
        assertEquals(rational[0], l[0], 1e-12 * Math.hypot(rational[0], rational[1]));
        assertEquals(rational[1], l[1], 1e-12 * Math.hypot(rational[0], rational[1]));
    }

    @Test
    void loadStepWithObserverAndIntegralActionLeavesNoOffset() {
        RealLoopReport report = axis(true, ENCODER);
        double peak = report.loadStep().peakDeviation();
        assertTrue(peak > 0);
        assertEquals(0, report.loadStep().steadyOffset(), 1e-12 * peak);
        assertEquals(0, report.loadStep().simulatedFinalOutput(), 1e-5 * peak);
        assertTrue(report.outputFeedback().margins().closedLoopStable());
        // without integral action an offset remains (the observer does not model the load, so its error settles at a
        // non-zero value too): the final-value theorem on the assembled loop against the simulated end value
        RealLoopReport plain = axis(false, ENCODER);
        assertTrue(
                Math.abs(plain.loadStep().steadyOffset()) > 1e-3,
                "offset " + plain.loadStep().steadyOffset());
        assertEquals(
                plain.loadStep().steadyOffset(),
                plain.loadStep().simulatedFinalOutput(),
                1e-5 * Math.abs(plain.loadStep().steadyOffset()));
    }

    @Test
    void orderThreeTankWithLevelOnlySensingKeepsTheStateFeedbackStepAndHasNoLoadOffset() {
        for (ObserverChoice choice :
                new ObserverChoice[] {new ObserverChoice.PoleMultiple(5), new ObserverChoice.Kalman(1e-4, 1e-6)}) {
            RealLoopReport report = pipeline.design(new RealLoopPipeline.Request(
                    TANK,
                    new DesignSpec(0.01, new TimeSpec.SettlingTime(100, 0.02)),
                    new AuxiliaryPlacement.Explicit(List.of(new TargetDynamics.Pole(-0.6, 0))),
                    new GammaChoice.MarginOverMinimum(1.2),
                    new LoopStructure(true, 4, LoopStructure.Measurement.POSITION, choice),
                    0.01,
                    1));
            assertEquals(4, report.design().plant().order());
            assertEquals(3, report.observer().gain().length);
            assertEquals(0, report.outputFeedback().largestStepDifference(), 1e-9);
            assertTrue(report.specCheck().met(), report.specCheck().toString());
            double peak = report.loadStep().peakDeviation();
            assertEquals(0, report.loadStep().simulatedFinalOutput(), 1e-5 * peak);
            assertTrue(
                    report.stateFeedbackNorm().attainedGain() <= report.design().gamma() * (1 + 1e-9));
            assertTrue(report.outputFeedback().margins().closedLoopStable());
        }
    }

    /** |C (jw I - A)^-1 b| by the real 2N x 2N solve of StateSpaceMargins' form, one output row at a time. */
    private static double columnGain(DMatrixRMaj a, DMatrixRMaj b, DMatrixRMaj c, double w) {
        double sum = 0;
        for (int row = 0; row < c.numRows; row++) {
            DMatrixRMaj one = new DMatrixRMaj(1, c.numCols);
            for (int j = 0; j < c.numCols; j++) {
                one.set(0, j, c.get(row, j));
            }
            double[] g = StateSpaceMargins.at(a, b, one, w);
            sum += g[0] * g[0] + g[1] * g[1];
        }
        return Math.sqrt(sum);
    }

    @SuppressWarnings("unused")
    private static final int NORM_LIMIT = HInfinityNormCalculator.MAX_STATE_DIMENSION;
}
