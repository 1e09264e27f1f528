package com.loopwright.solver.designspace;

import static org.junit.jupiter.api.Assertions.assertEquals;

import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.design.StepMetrics;
import com.loopwright.solver.loop.LoopMatrices;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.simulation.LinearLoop;
import com.loopwright.solver.simulation.StepResponseMetrics;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

class PeakCommandTest {

    private final StepResponseMetrics simulation = new StepResponseMetrics();

    /**
     * The simulated peak |u| of the exact zero-order-hold step (refined between samples), the independent route.
     * The simulation ends at a finite horizon while the peak is a supremum over all t: when |u| creeps up to its
     * final value (a slow real pole), the supremum is |u_inf| = |kr - k1 b kr/(a0 + b k1)| (final-value theorem).
     */
    private double simulatedPeak(CanonicalPlant plant, FeedbackGains gains) {
        double horizon = LoopMatrices.horizonSeconds(plant, gains);
        StepMetrics metrics = simulation.measure(LinearLoop.ofStep(plant, gains), 1, horizon, 20_000, 0.02);
        double stiffness = plant.a0() + plant.b() * gains.positionGain();
        double finalCommand =
                gains.referenceGain() - gains.positionGain() * plant.b() * gains.referenceGain() / stiffness;
        return Math.max(metrics.peakControl(), Math.abs(finalCommand));
    }

    @Test
    void readmeAxisPeakIsTheReferenceGainAtTheStart() {
        // README example (indexing axis, 0.15 s, 1.5 %): the design response prints peakControl 1.5723 = kr
        CanonicalPlant plant = new CanonicalPlant(0, 0.48, 400, 400);
        FeedbackGains gains = new FeedbackGains(1.57230, 0.0992069, 1.57230);
        assertEquals(1.5723, PeakCommand.ofUnitStep(plant, gains), 1e-4);
        assertEquals(simulatedPeak(plant, gains), PeakCommand.ofUnitStep(plant, gains), 1e-6);
    }

    @Test
    void randomLoopsAgreeWithTheSimulatedPeak() {
        // independent route: exact ZOH simulation with refinement between samples (simulation/StepResponseMetrics)
        SplittableRandom random = new SplittableRandom(18);
        for (int i = 0; i < 300; i++) {
            double a0 = random.nextDouble(-20, 50);
            double a1 = random.nextDouble(-2, 10);
            double b = random.nextBoolean() ? random.nextDouble(0.5, 50) : -random.nextDouble(0.5, 50);
            double wn = random.nextDouble(1, 30);
            double zeta = random.nextDouble(0.15, 2.5);
            double k1 = (wn * wn - a0) / b;
            double k2 = (2 * zeta * wn - a1) / b;
            // kr: the design's wn^2/b, or an arbitrary one (the peak formula must not rely on it)
            double kr = random.nextBoolean() ? wn * wn / b : random.nextDouble(-3, 3);
            CanonicalPlant plant = new CanonicalPlant(a0, a1, b, 1);
            FeedbackGains gains = new FeedbackGains(k1, k2, kr);
            double expected = simulatedPeak(plant, gains);
            assertEquals(expected, PeakCommand.ofUnitStep(plant, gains), 1e-6 * Math.max(1, expected), "case " + i);
        }
    }

    @Test
    void doublePoleAndNearDoublePoleAgreeWithTheSimulation() {
        // critically damped and within 1e-9 of it: the double-pole branch and its neighbours (simulation as above)
        for (double zeta : new double[] {1.0, 1 + 1e-9, 1 - 1e-9, 1.01, 0.99}) {
            double wn = 7;
            CanonicalPlant plant = new CanonicalPlant(2, 1, 3, 0);
            FeedbackGains gains = new FeedbackGains((wn * wn - 2) / 3, (2 * zeta * wn - 1) / 3, 0.5);
            double expected = simulatedPeak(plant, gains);
            assertEquals(expected, PeakCommand.ofUnitStep(plant, gains), 1e-6 * Math.max(1, expected), "zeta " + zeta);
        }
    }
}
