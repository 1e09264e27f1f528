package com.loopwright.solver.pipeline;

import static org.junit.jupiter.api.Assertions.*;

import com.loopwright.solver.design.GammaChoice;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.spec.DesignSpec;
import com.loopwright.solver.spec.TimeSpec;
import org.junit.jupiter.api.Test;

/**
 * The caller's law checked as it runs. Scenario: our vertical axis (12 kg carriage, 30 N s/m of friction, force
 * command; the load, its weight, enters through d = 1/m).
 */
class LoopCheckPipelineTest {

    static final CanonicalPlant AXIS = new CanonicalPlant(0, 30.0 / 12, 40.0 / 12, 1.0 / 12);
    static final DesignSpec SPEC = new DesignSpec(0.02, new TimeSpec.SettlingTime(0.4, 0.02));
    static final ObserverChoice.Kalman ENCODER = ObserverChoice.Kalman.fromResolution(25, 1e-4, 1e-3);

    private final LoopCheckPipeline checks = new LoopCheckPipeline();

    /** The designed law and observer, checked as a caller's: the same loop, the same figures. */
    @Test
    void designedLawCheckedAsTheCallersGivesTheDesignsFigures() {
        RealLoopReport design = new RealLoopPipeline()
                .design(RealLoopPipeline.Request.canonical(
                        AXIS,
                        SPEC,
                        new GammaChoice.MarginOverMinimum(1.2),
                        new LoopStructure(true, 4, LoopStructure.Measurement.POSITION, ENCODER),
                        -12 * 9.80665));
        LoopCheckPipeline.Report check = checks.check(new LoopCheckPipeline.Request(
                AXIS,
                design.law().stateGain(),
                design.law().integralGain(),
                design.law().referenceGain(),
                null,
                ENCODER,
                null,
                null,
                -12 * 9.80665,
                0.02,
                0.4));
        assertArrayEquals(design.observer().gain(), check.observerGain(), 0);
        assertEquals(
                design.outputFeedback().noiseToCommandGain().value(),
                check.noiseToCommandGain().value(),
                1e-9 * check.noiseToCommandGain().value());
        assertEquals(
                design.outputFeedback().step().settlingTimeSeconds(),
                check.step().settlingTimeSeconds(),
                1e-9);
        assertEquals(design.loadStep().peakDeviation(), check.loadStep().peakDeviation(), 1e-12);
        assertEquals(
                0, check.loadStep().steadyOffset(), 1e-12 * check.loadStep().peakDeviation());
    }

    /**
     * Full state, no integrator: the peak gain from w to x1 of d / (s^2 + (a1 + b k2) s + a0 + b k1) is its DC gain
     * d / (a0 + b k1) when zeta &gt;= 1/sqrt(2) (no resonant peak; second-order frequency response, Ogata, Modern
     * Control Engineering, from memory), and the load offset is d w0 / (a0 + b k1) (final-value theorem).
     */
    @Test
    void plainLawMatchesTheSecondOrderFormulas() {
        double k1 = 300;
        double k2 = 20; // s^2 + 69.2 s + 1000: zeta = 1.09
        LoopCheckPipeline.Report check = checks.check(new LoopCheckPipeline.Request(
                AXIS, new double[] {k1, k2}, 0, k1, null, null, null, null, 5, 0.02, null));
        double dc = AXIS.d() / (AXIS.a0() + AXIS.b() * k1);
        assertEquals(dc, check.peakDisturbanceGain().value(), 1e-9 * dc);
        assertEquals(5 * dc, check.loadStep().steadyOffset(), 1e-12 * dc);
        // the window covers 14 slowest time constants: e^-14 ~ 1e-6 of the slow mode is left
        assertEquals(5 * dc, check.loadStep().simulatedFinalOutput(), 1e-5 * 5 * dc);
        assertNull(check.noiseToCommandGain());
        assertFalse(check.law().integralAction());
    }

    /**
     * An integral gain far too large for the state gains: s^3 + (a1 + b k2) s^2 + b k1 s + b ki fails Routh's test
     * when b ki &gt; (a1 + b k2) b k1 (Routh-Hurwitz, third order, from memory).
     */
    @Test
    void destabilizingIntegralGainIsAnUnstableLoopFailure() {
        double k1 = 300;
        double k2 = 20;
        double limit = (AXIS.a1() + AXIS.b() * k2) * k1; // b ki < (a1 + b k2) b k1
        SolverFailure failure = assertThrows(
                SolverFailure.class,
                () -> checks.check(new LoopCheckPipeline.Request(
                        AXIS, new double[] {k1, k2}, 1.5 * limit, k1, null, null, null, null, 1, 0.02, null)));
        assertEquals(SolverFailure.Kind.UNSTABLE_LOOP, failure.kind());
        // just inside the bound the loop runs and holds the load without offset
        LoopCheckPipeline.Report stable = checks.check(new LoopCheckPipeline.Request(
                AXIS, new double[] {k1, k2}, 0.5 * limit, k1, null, null, null, null, 1, 0.02, null));
        assertTrue(stable.margins().closedLoopStable());
        assertEquals(0, stable.loadStep().steadyOffset(), 1e-12);
    }

    @Test
    void plantWithoutDisturbanceInputIsAPlantModelFailureAtD() {
        SolverFailure failure = assertThrows(
                SolverFailure.class,
                () -> checks.check(new LoopCheckPipeline.Request(
                        new CanonicalPlant(0, 2.5, 3, 0),
                        new double[] {300, 20},
                        0,
                        300,
                        null,
                        null,
                        null,
                        null,
                        1,
                        0.02,
                        null)));
        assertEquals(SolverFailure.Kind.PLANT_MODEL, failure.kind());
        assertEquals("d", failure.subject());
    }
}
