package com.loopwright.solver.export;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.solver.design.GammaChoice;
import com.loopwright.solver.discrete.ClosedLoopSimulator;
import com.loopwright.solver.discrete.ControllerSettings;
import com.loopwright.solver.discrete.DiscreteController;
import com.loopwright.solver.discrete.Scenario;
import com.loopwright.solver.pipeline.ControllerExport;
import com.loopwright.solver.pipeline.ControllerOptions;
import com.loopwright.solver.pipeline.ControllerTexts;
import com.loopwright.solver.pipeline.ExportPipeline;
import com.loopwright.solver.pipeline.ExportProvenance;
import com.loopwright.solver.pipeline.LoopStructure;
import com.loopwright.solver.pipeline.ObserverChoice;
import com.loopwright.solver.pipeline.RealLoopPipeline;
import com.loopwright.solver.pipeline.RealLoopReport;
import com.loopwright.solver.pipeline.SolverFailure;
import com.loopwright.solver.spec.DesignSpec;
import com.loopwright.solver.spec.TimeSpec;
import java.util.Arrays;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * The export of a loop with integral action and position-only sensing (observer): discretized exactly, its sampled
 * loop checked, the integrator and observer in the code.
 */
class LoopExportTest {

    private final ExportPipeline pipeline = new ExportPipeline();

    private static RealLoopReport loop(boolean integral, LoopStructure.Measurement measurement) {
        ObserverChoice observer =
                measurement == LoopStructure.Measurement.POSITION ? new ObserverChoice.PoleMultiple(5) : null;
        return new RealLoopPipeline()
                .design(RealLoopPipeline.Request.canonical(
                        IndexingAxis.PLANT,
                        new DesignSpec(0.015, new TimeSpec.SettlingTime(0.15, 0.02)),
                        new GammaChoice.MarginOverMinimum(1.2),
                        new LoopStructure(
                                integral,
                                LoopStructure.withIntegralAction().integralPoleMultiple(),
                                measurement,
                                observer),
                        1));
    }

    private static ControllerOptions options(double period) {
        return new ControllerOptions(period, -3, 3, 0, 0, 0.1, "Lift", false);
    }

    /**
     * At a short period the sampled loop's slowest pole is e^(-zeta wn T) of the designed dominant pair (mapping
     * z = e^(s T), common practice; the integral pole at 4 x and the observer poles at 5 x the dominant real part
     * are faster by the separation principle of observer-based compensators, state-space control textbooks).
     */
    @Test
    void theSampledLoopKeepsTheDesignedPoles() {
        RealLoopReport loop = loop(true, LoopStructure.Measurement.POSITION);
        double sigma = loop.target().dampingRatio() * loop.target().naturalFrequencyRadPerSec();
        for (double period : new double[] {1e-4, 1e-3}) {
            ControllerExport export = pipeline.export(IndexingAxis.report(), loop, options(period));
            double radius = export.loop().orElseThrow().sampledSpectralRadius();
            // agreement to first order in T: the held command adds an O((sigma T)^2) difference
            assertEquals(Math.exp(-sigma * period), radius, Math.pow(sigma * period, 2), "T = " + period);
        }
    }

    /**
     * Integral action: under a constant load the position returns to the setpoint (final-value theorem: the
     * integrator's input r - y is zero at rest), in the service's own sampled simulation of the exported controller;
     * without integral action a load leaves an offset.
     */
    @Test
    void integralActionRemovesTheLoadOffset() {
        for (boolean integral : new boolean[] {true, false}) {
            RealLoopReport loop = loop(integral, LoopStructure.Measurement.POSITION);
            DiscreteController controller = pipeline.export(IndexingAxis.report(), loop, options(1e-3))
                    .loop()
                    .orElseThrow()
                    .controller();
            assertEquals(integral ? 3 : 2, controller.stateCount());
            int steps = 3000;
            double[] setpoint = new double[steps];
            double[] load = new double[steps];
            boolean[] enable = new boolean[steps];
            double[] gain = new double[steps];
            double[] period = new double[steps];
            Arrays.fill(setpoint, 0.01);
            Arrays.fill(load, 1000, steps, 0.5);
            Arrays.fill(enable, true);
            Arrays.fill(gain, 1);
            Arrays.fill(period, 1e-3);
            double[][] rows = new ClosedLoopSimulator()
                    .run(
                            controller,
                            ControllerSettings.symmetric(1e6, 1),
                            new double[][] {{0, 1}, {0, -0.48}},
                            new double[] {0, 400},
                            new double[][] {{1, 0}},
                            new Scenario("load", setpoint, load, enable, gain, period));
            double offset = rows[steps - 1][0] - 0.01;
            if (integral) {
                assertEquals(0, offset, 1e-6, "no offset with integral action");
            } else {
                assertTrue(Math.abs(offset) > 1e-3, "a load offset without it: " + offset);
            }
        }
    }

    /** The texts carry the integrator, the observer and the loop's gamma. */
    @Test
    void theTextsHoldTheIntegratorAndTheObserver() {
        RealLoopReport loop = loop(true, LoopStructure.Measurement.POSITION);
        ControllerTexts texts = pipeline.texts(
                pipeline.export(IndexingAxis.report(), loop, options(1e-3)),
                new ExportProvenance("Lift", "0.1.0-test", "sha256:ab", "plant", List.of(), List.of("caution")));
        assertTrue(texts.structuredText().contains("Integrator Q3 of r - y1; anti-windup by conditional integration"));
        assertTrue(texts.structuredText().contains("Y1 : LREAL;")
                && !texts.structuredText().contains("Y2 :"));
        assertTrue(texts.cHeader().contains("#define LIFT_STATE_COUNT 3"));
        assertTrue(texts.structuredText().contains("= " + loop.design().gamma()));
        new StructuredTextSubsetInterpreter(texts.structuredText()); // the subset the exporter emits
    }

    /** A period at which the slowest mode decays by under 0.1 % per sample is refused as about the period. */
    @Test
    void aRadiusAtOrAboveTheBoundIsRefused() {
        RealLoopReport loop = loop(true, LoopStructure.Measurement.FULL_STATE);
        SolverFailure failure =
                assertThrows(SolverFailure.class, () -> pipeline.export(IndexingAxis.report(), loop, options(2e-5)));
        assertEquals(SolverFailure.SAMPLE_PERIOD, failure.subject());
        assertTrue(failure.getMessage().contains("lengthen the period"), failure.getMessage());
    }
}
