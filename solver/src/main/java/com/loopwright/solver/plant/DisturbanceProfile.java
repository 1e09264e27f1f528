package com.loopwright.solver.plant;

import java.util.SplittableRandom;

/**
 * A disturbance w(t) entering as d w. The simulation holds w constant over each grid step of width h at
 * {@link #heldValue}: step and pulse edges and random level changes fall on grid points (times rounded to the
 * grid), the sinusoid is held at its value in the middle of each step. Reported energies and gains refer to
 * exactly this held signal.
 */
public sealed interface DisturbanceProfile {

    /** w on grid step [k h, (k + 1) h). */
    double[] heldValues(int steps, double h);

    /** Time after which w is constant (recovery is measured from it), or -1 for persistent profiles. */
    double settledFromSeconds();

    /** w jumps from 0 to amplitude at startSeconds and stays. */
    record Step(double amplitude, double startSeconds) implements DisturbanceProfile {
        public double[] heldValues(int steps, double h) {
            double[] w = new double[steps];
            long first = Math.round(startSeconds / h);
            for (int k = 0; k < steps; k++) {
                w[k] = k >= first ? amplitude : 0;
            }
            return w;
        }

        public double settledFromSeconds() {
            return startSeconds;
        }
    }

    /** w = amplitude on [startSeconds, startSeconds + durationSeconds), else 0. */
    record Pulse(double amplitude, double startSeconds, double durationSeconds) implements DisturbanceProfile {
        public double[] heldValues(int steps, double h) {
            double[] w = new double[steps];
            long first = Math.round(startSeconds / h);
            long end = Math.max(first + 1, Math.round((startSeconds + durationSeconds) / h));
            for (int k = 0; k < steps; k++) {
                w[k] = k >= first && k < end ? amplitude : 0;
            }
            return w;
        }

        public double settledFromSeconds() {
            return startSeconds + durationSeconds;
        }
    }

    /** w = amplitude sin(frequency t) from t = 0. */
    record Sinusoid(double amplitude, double frequencyRadPerSec) implements DisturbanceProfile {
        public double[] heldValues(int steps, double h) {
            double[] w = new double[steps];
            for (int k = 0; k < steps; k++) {
                w[k] = amplitude * Math.sin(frequencyRadPerSec * (k + 0.5) * h);
            }
            return w;
        }

        public double settledFromSeconds() {
            return -1;
        }
    }

    /**
     * Bounded random levels: uniform in [-amplitude, amplitude], a new level every holdSeconds (at least one grid
     * step), from a seeded generator so that the same seed gives the same signal bit for bit.
     */
    record BoundedRandom(double amplitude, double holdSeconds, long seed) implements DisturbanceProfile {
        public double[] heldValues(int steps, double h) {
            double[] w = new double[steps];
            SplittableRandom random = new SplittableRandom(seed);
            long hold = Math.max(1, Math.round(holdSeconds / h));
            double level = 0;
            for (int k = 0; k < steps; k++) {
                if (k % hold == 0) {
                    level = amplitude * (2 * random.nextDouble() - 1);
                }
                w[k] = level;
            }
            return w;
        }

        public double settledFromSeconds() {
            return -1;
        }
    }
}
