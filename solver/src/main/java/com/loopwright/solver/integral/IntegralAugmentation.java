package com.loopwright.solver.integral;

import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.plant.CompanionPlant;

/**
 * The plant with the integral of the tracking error as an extra state. For a companion plant whose tracked output
 * is y = c0 z1 (no plant zeros), the state z0 = -xi / c0 obeys z0' = z1 - r / c0, so with r = 0 the augmented
 * plant [z0, z1 .. zn] is again a companion plant, of order n + 1, with denominator [0, a0 .. a_{n-1}]: an extra
 * pole at s = 0. For the canonical plant that is [0, a0, a1] with z = [-xi, x1, x2].
 */
public final class IntegralAugmentation {

    private IntegralAugmentation() {}

    /** The canonical plant as a companion plant: denominator [a0, a1], output x1, disturbance [0, d]. */
    public static CompanionPlant companionOf(CanonicalPlant plant) {
        return new CompanionPlant(
                new double[] {plant.a0(), plant.a1()}, new double[] {1, 0}, plant.b(), new double[] {0, plant.d()});
    }

    /** True when the tracked output is c0 z1 with c0 != 0 (the form integral action is built for). */
    public static boolean outputWithoutZeros(CompanionPlant plant) {
        double[] c = plant.numerator();
        if (c[0] == 0) {
            return false;
        }
        for (int i = 1; i < c.length; i++) {
            if (c[i] != 0) {
                return false;
            }
        }
        return true;
    }

    /**
     * The augmented companion plant of order n + 1.
     *
     * @throws IllegalArgumentException when the output has zeros, or the order would exceed CompanionPlant.MAX_ORDER
     */
    public static CompanionPlant augment(CompanionPlant plant) {
        if (!outputWithoutZeros(plant)) {
            throw new IllegalArgumentException("integral action needs a tracked output c0 z1 without plant zeros");
        }
        int n = plant.order();
        if (n + 1 > CompanionPlant.MAX_ORDER) {
            throw new IllegalArgumentException(
                    "integral action adds a state: order " + n + " plus one exceeds " + CompanionPlant.MAX_ORDER);
        }
        double[] a = plant.denominator();
        double[] d = plant.disturbance();
        double[] denominator = new double[n + 1];
        double[] numerator = new double[n + 1];
        double[] disturbance = new double[n + 1];
        for (int i = 0; i < n; i++) {
            denominator[i + 1] = a[i];
            disturbance[i + 1] = d[i];
        }
        numerator[1] = plant.numerator()[0];
        return new CompanionPlant(denominator, numerator, plant.b(), disturbance);
    }
}
