package com.loopwright.solver.simulation;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.Random;
import org.junit.jupiter.api.Test;

/** The unrolled two-state recursion and the recursion for any n. */
class StepRecursionTest {

    private static final int SAMPLES = 500;

    /** Same operations in the same order: the unrolled kernel must equal the general one bit for bit. */
    @Test
    void unrolledTwoStateRecursionEqualsTheGeneralOneBitForBit() {
        Random random = new Random(14);
        for (int trial = 0; trial < 50; trial++) {
            double[] ad = {
                random.nextGaussian() * 0.7,
                random.nextGaussian() * 0.7,
                random.nextGaussian() * 0.7,
                random.nextGaussian() * 0.7
            };
            double[] drive = {random.nextGaussian(), random.nextGaussian()};
            double[] c = {random.nextGaussian(), random.nextGaussian()};
            double[] k = {random.nextGaussian(), random.nextGaussian()};
            double feedthrough = random.nextGaussian();
            double[] unrolled = new double[4 * SAMPLES];
            double[] general = new double[4 * SAMPLES];
            double unrolledGuard = new TwoStateRecursion(ad, drive, c, k, feedthrough)
                    .run(SAMPLES, (i, x0, x1, y, u) -> {
                        unrolled[4 * i] = x0;
                        unrolled[4 * i + 1] = x1;
                        unrolled[4 * i + 2] = y;
                        unrolled[4 * i + 3] = u;
                    });
            double generalGuard = new StateRecursion(2, ad, drive, c, k, feedthrough).run(SAMPLES, (i, x, y, u) -> {
                general[4 * i] = x[0];
                general[4 * i + 1] = x[1];
                general[4 * i + 2] = y;
                general[4 * i + 3] = u;
            });
            assertArrayEquals(general, unrolled);
            assertEquals(generalGuard, unrolledGuard);
        }
    }

    /**
     * x+ = q x + (1 - q) from x_0 = 0 gives x_k = 1 - q^k (geometric series, textbook); the second state is idle.
     */
    @Test
    void firstOrderLagFollowsTheGeometricSeries() {
        double q = Math.exp(-0.01);
        double[] ad = {q, 0, 0, q};
        double[] drive = {1 - q, 0};
        double[] c = {1, 0};
        double[] k = {0, 0};
        for (boolean unrolled : new boolean[] {true, false}) {
            double[] y = new double[SAMPLES];
            if (unrolled) {
                new TwoStateRecursion(ad, drive, c, k, 0).run(SAMPLES, (i, x0, x1, out, u) -> y[i] = out);
            } else {
                new StateRecursion(2, ad, drive, c, k, 0).run(SAMPLES, (i, x, out, u) -> y[i] = out);
            }
            for (int i = 0; i < SAMPLES; i++) {
                assertEquals(1 - Math.pow(q, i), y[i], 1e-13);
            }
        }
    }
}
