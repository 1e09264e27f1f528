package com.loopwright.solver.robustness;

import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.simulation.LinearLoop;
import com.loopwright.solver.simulation.StepResponse;
import com.loopwright.solver.simulation.StepSimulator;
import java.util.ArrayList;
import java.util.List;
import org.ejml.data.DMatrixRMaj;

/**
 * The band the step response of x1 sweeps when the plant parameters range over a box and the gains stay fixed:
 * at every sample time the lowest and highest x1 over all corners of the box plus seeded uniform samples
 * inside it. A parameter set whose loop is unstable (a0 + b k1 &lt;= 0 or a1 + b k2 &lt;= 0, the Hurwitz test
 * of a 2x2 companion matrix) is counted and left out of the band.
 */
public final class StepEnvelope {

    /** Cap on the interior samples drawn on a figure (corners are at most 16 more). */
    public static final int MAX_INTERIOR_SAMPLES = 200;

    private final StepSimulator simulator = new StepSimulator();

    /**
     * @param interiorSamples seeded uniform samples inside the box, 0 to {@value #MAX_INTERIOR_SAMPLES}
     * @throws UnstableLoopException when no parameter set of the box gives a stable loop
     */
    public Band sweep(
            ParameterBox box,
            CanonicalPlant nominal,
            FeedbackGains gains,
            double stepSize,
            double horizonSeconds,
            int samples,
            int interiorSamples,
            long seed) {
        if (interiorSamples < 0 || interiorSamples > MAX_INTERIOR_SAMPLES) {
            throw new IllegalArgumentException("interior samples must be from 0 to " + MAX_INTERIOR_SAMPLES);
        }
        List<CanonicalPlant> plants = new ArrayList<>();
        double[] lo = box.lows();
        double[] hi = box.highs();
        for (int mask = 0; mask < 16; mask++) {
            double[] p = new double[4];
            boolean duplicate = false;
            for (int i = 0; i < 4; i++) {
                boolean high = (mask >> i & 1) == 1;
                duplicate |= high && lo[i] == hi[i];
                p[i] = high ? hi[i] : lo[i];
            }
            if (!duplicate) {
                plants.add(ParameterBox.plant(p));
            }
        }
        // The same samples as the robustness report for this seed (its first interiorSamples).
        ParameterSampler sampler = new ParameterSampler(box, seed);
        for (int s = 0; s < interiorSamples; s++) {
            plants.add(ParameterBox.plant(sampler.next()));
        }
        double[] nominalX1 =
                response(nominal, gains, stepSize, horizonSeconds, samples).output();
        double[] lower = nominalX1.clone();
        double[] upper = nominalX1.clone();
        double[] time = null;
        int unstable = 0;
        int drawn = 0;
        for (CanonicalPlant plant : plants) {
            if (!(plant.a0() + plant.b() * gains.positionGain() > 0
                    && plant.a1() + plant.b() * gains.velocityGain() > 0)) {
                unstable++;
                continue;
            }
            StepResponse step = response(plant, gains, stepSize, horizonSeconds, samples);
            time = step.timeSeconds();
            double[] x1 = step.output();
            for (int k = 0; k < x1.length; k++) {
                lower[k] = Math.min(lower[k], x1[k]);
                upper[k] = Math.max(upper[k], x1[k]);
            }
            drawn++;
        }
        if (drawn == 0) {
            throw new UnstableLoopException("every corner and sample of the parameter box gives an unstable loop");
        }
        return new Band(time, lower, upper, nominalX1, drawn, unstable);
    }

    private StepResponse response(
            CanonicalPlant plant, FeedbackGains gains, double stepSize, double horizon, int samples) {
        double b = plant.b();
        LinearLoop loop = new LinearLoop(
                new DMatrixRMaj(new double[][] {
                    {0, 1}, {-plant.a0() - b * gains.positionGain(), -plant.a1() - b * gains.velocityGain()}
                }),
                new DMatrixRMaj(new double[][] {{0}, {b * gains.referenceGain()}}),
                new DMatrixRMaj(new double[][] {{1, 0}}),
                new DMatrixRMaj(new double[][] {{-gains.positionGain(), -gains.velocityGain()}}),
                gains.referenceGain());
        return simulator.simulate(loop, stepSize, horizon, samples);
    }

    /**
     * @param timeSeconds  sample times
     * @param lowerX1      lowest x1 over the drawn parameter sets (and the nominal plant)
     * @param upperX1      highest x1
     * @param nominalX1    x1 of the nominal plant
     * @param drawnCases   parameter sets in the band
     * @param unstableCases parameter sets left out because their loop is unstable
     */
    public record Band(
            double[] timeSeconds,
            double[] lowerX1,
            double[] upperX1,
            double[] nominalX1,
            int drawnCases,
            int unstableCases) {
        public Band {
            timeSeconds = timeSeconds.clone();
            lowerX1 = lowerX1.clone();
            upperX1 = upperX1.clone();
            nominalX1 = nominalX1.clone();
        }

        @Override
        public double[] timeSeconds() {
            return timeSeconds.clone();
        }

        @Override
        public double[] lowerX1() {
            return lowerX1.clone();
        }

        @Override
        public double[] upperX1() {
            return upperX1.clone();
        }

        @Override
        public double[] nominalX1() {
            return nominalX1.clone();
        }
    }
}
