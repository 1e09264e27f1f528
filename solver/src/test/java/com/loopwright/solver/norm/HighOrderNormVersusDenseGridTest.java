package com.loopwright.solver.norm;

import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.solver.design.GammaChoice;
import com.loopwright.solver.design.HInfinityNorm;
import com.loopwright.solver.design.HighOrderDesign;
import com.loopwright.solver.design.SpecMatch;
import com.loopwright.solver.highorder.HighOrderDesigner;
import com.loopwright.solver.highorder.SpecMatcher;
import com.loopwright.solver.plant.CompanionPlant;
import com.loopwright.solver.spec.AuxiliaryPlacement;
import com.loopwright.solver.spec.DesignSpec;
import com.loopwright.solver.spec.DesiredPoles;
import com.loopwright.solver.spec.SpecInverter;
import com.loopwright.solver.spec.TargetDynamics;
import com.loopwright.solver.spec.TimeSpec;
import java.util.Random;
import org.ejml.data.Complex_F64;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.interfaces.decomposition.EigenDecomposition_F64;
import org.junit.jupiter.api.Test;

/**
 * Issue 12, done-when: the certified norm of seeded random order-n designs (n = 3..8, with and without plant
 * zeros, disturbances that do not enter where u does) against an independent dense-grid-plus-Brent evaluation
 * ({@link DenseGridPeak}: Hipparchus LU and SVD on a log grid, each local maximum refined by Hipparchus' Brent
 * optimizer). The designs come from the solver's order-n path: spec inversion (or {@link SpecMatcher} on every
 * {@value #MATCH_EVERY}-th trial), auxiliary placement, {@link HighOrderDesigner}; rejected requests are counted
 * and skipped. The norm must be at least the reference peak and the grid maximum (less rounding), at most the
 * stated tolerance above it, and its frequency a local maximum.
 */
class HighOrderNormVersusDenseGridTest {

    /** Accepted designs required. */
    static final int REQUIRED_DESIGNS = 200;
    /** Cap on trials (requests, accepted or rejected). */
    static final int MAX_TRIALS = 600;
    /** Every this-many-th trial matches the simulated specs first (the costlier path). */
    static final int MATCH_EVERY = 10;
    /**
     * Relative frequency of orders 3..8 among the trials: every order is covered, the costlier high orders a little
     * less often (the design's feasible-gamma search grows with n), so the test stays well under 20 s of CPU.
     */
    static final int[] ORDER_WEIGHTS = {30, 25, 15, 12, 10, 8};
    /** Spec matching (a simulation per Newton step) only up to this order. */
    static final int MAX_MATCHED_ORDER = 5;
    /** Grid points per system, log-spaced over 4 decades either side of the closed-loop poles. */
    static final int GRID_POINTS = 800;

    private final HInfinityNormCalculator calculator = new HInfinityNormCalculator();
    private final HighOrderDesigner designer = new HighOrderDesigner();
    private final SpecMatcher matcher = new SpecMatcher();

    @Test
    void certifiedNormBracketsTheDenseGridPeak() {
        long cpuStart = java.lang.management.ManagementFactory.getThreadMXBean().getCurrentThreadCpuTime();
        Random random = new Random(1212L);
        int accepted = 0;
        int rejected = 0;
        int matched = 0;
        int withZeros = 0;
        double worstExcess = 0.0;
        int[] orders = new int[CompanionPlant.MAX_ORDER + 1];
        for (int trial = 0; trial < MAX_TRIALS && accepted < REQUIRED_DESIGNS; trial++) {
            int n = order(random);
            boolean zeros = random.nextBoolean();
            CompanionPlant plant = randomPlant(n, zeros, random);
            double settling = Math.pow(10, -1.5 + 2.5 * random.nextDouble());
            double overshootPercent = 0.2 + 4 * random.nextDouble();
            DesignSpec spec = new DesignSpec(overshootPercent / 100, new TimeSpec.SettlingTime(settling, 0.02));
            AuxiliaryPlacement placement = new AuxiliaryPlacement.RealPartMultiple(2 + 4 * random.nextDouble());
            HighOrderDesign design;
            boolean match = trial % MATCH_EVERY == 0 && n <= MAX_MATCHED_ORDER;
            try {
                TargetDynamics target;
                if (match) {
                    SpecMatch result = matcher.match(plant, spec, placement, 1.0, 10);
                    target = result.target();
                } else {
                    target = new SpecInverter().invert(spec).target();
                }
                DesiredPoles poles = placement.place(target, n);
                design = designer.design(plant, poles, new GammaChoice.MarginOverMinimum(1.2));
            } catch (RuntimeException e) {
                rejected++;
                continue;
            }
            accepted++;
            matched += match ? 1 : 0;
            withZeros += zeros ? 1 : 0;
            orders[n]++;

            // closed loop A - B2 K, z = [diag(rho) z; u] with u = -K z (as the verifier forms it)
            DMatrixRMaj a = plant.stateMatrix();
            double[] k = design.gain();
            double[] rho = design.weights();
            DMatrixRMaj c = new DMatrixRMaj(n + 1, n);
            for (int j = 0; j < n; j++) {
                a.add(n - 1, j, -plant.b() * k[j]);
                c.set(j, j, rho[j]);
                c.set(n, j, -k[j]);
            }
            DMatrixRMaj b = plant.disturbanceInput();
            HInfinityNorm norm = calculator.compute(a, b, c);
            double[] range = poleRange(a);
            DenseGridPeak.Peak reference = DenseGridPeak.of(a, b, c, range[0] * 1e-4, range[1] * 1e4, GRID_POINTS);
            String where = "trial " + trial + ", n = " + n;
            try {
                HInfinityNormRegressionTest.assertCertifiedAgainst(reference, norm);
                HInfinityNormRegressionTest.assertLocalMaximum(new IndependentFrequencyResponse(a, b, c), norm);
            } catch (AssertionError e) {
                throw new AssertionError(where + ": " + e.getMessage(), e);
            }
            worstExcess = Math.max(worstExcess, norm.value() / reference.gain() - 1);
        }
        System.out.printf(
                "order-n norms vs dense grid: %d accepted (%d spec-matched, %d with zeros), %d rejected,"
                        + " worst (norm / reference - 1) %.3e, orders 3..8 %s, %.1f s CPU%n",
                accepted,
                matched,
                withZeros,
                rejected,
                worstExcess,
                java.util.Arrays.toString(java.util.Arrays.copyOfRange(orders, 3, 9)),
                1e-9 * (java.lang.management.ManagementFactory.getThreadMXBean().getCurrentThreadCpuTime() - cpuStart));
        for (int order = 3; order <= CompanionPlant.MAX_ORDER; order++) {
            assertTrue(orders[order] > 0, "no accepted design of order " + order);
        }
        assertTrue(accepted >= REQUIRED_DESIGNS, "only " + accepted + " designs accepted, " + rejected + " rejected");
    }

    private static int order(Random random) {
        int total = 0;
        for (int w : ORDER_WEIGHTS) {
            total += w;
        }
        int draw = random.nextInt(total);
        for (int i = 0; i < ORDER_WEIGHTS.length; i++) {
            draw -= ORDER_WEIGHTS[i];
            if (draw < 0) {
                return CompanionPlant.MIN_ORDER + 1 + i;
            }
        }
        return CompanionPlant.MAX_ORDER;
    }

    /**
     * Poles of magnitude 10^U(-1, 2), stable or not; with zeros, a numerator of degree 1..n-1 with real zeros of
     * either sign (c_0 != 0); a disturbance with at least one entry above the last state (where u enters).
     */
    private static CompanionPlant randomPlant(int n, boolean zeros, Random random) {
        double[] poly = {1.0};
        int index = 0;
        while (index < n) {
            double magnitude = Math.pow(10, -1 + 3 * random.nextDouble());
            if (index + 2 <= n && random.nextBoolean()) {
                double zeta = -0.3 + 1.3 * random.nextDouble();
                poly = multiply(poly, new double[] {magnitude * magnitude, 2 * zeta * magnitude, 1});
                index += 2;
            } else {
                double sign = random.nextDouble() < 0.8 ? 1 : -1;
                poly = multiply(poly, new double[] {sign * magnitude, 1});
                index++;
            }
        }
        double[] denominator = java.util.Arrays.copyOf(poly, n);
        double[] numerator = new double[n];
        numerator[0] = 1.0;
        if (zeros) {
            int degree = 1 + random.nextInt(n - 1);
            double[] zpoly = {1.0};
            for (int i = 0; i < degree; i++) {
                double z = Math.pow(10, -1 + 3 * random.nextDouble()) * (random.nextDouble() < 0.8 ? 1 : -1);
                zpoly = multiply(zpoly, new double[] {1, 1 / z}); // (1 + s/z), c_0 = 1
            }
            System.arraycopy(zpoly, 0, numerator, 0, zpoly.length);
        }
        double[] disturbance = new double[n];
        disturbance[random.nextInt(n - 1)] = Math.pow(10, -1 + 4 * random.nextDouble());
        if (random.nextBoolean()) {
            disturbance[n - 1] = Math.pow(10, -1 + 4 * random.nextDouble());
        }
        if (random.nextBoolean()) {
            disturbance[random.nextInt(n)] += random.nextGaussian();
        }
        return new CompanionPlant(denominator, numerator, Math.pow(10, -2 + 3 * random.nextDouble()), disturbance);
    }

    /** Coefficients low order first. */
    private static double[] multiply(double[] p, double[] q) {
        double[] r = new double[p.length + q.length - 1];
        for (int i = 0; i < p.length; i++) {
            for (int j = 0; j < q.length; j++) {
                r[i + j] += p[i] * q[j];
            }
        }
        return r;
    }

    /** Smallest and largest pole magnitudes of A. */
    private static double[] poleRange(DMatrixRMaj a) {
        EigenDecomposition_F64<DMatrixRMaj> eig = DecompositionFactory_DDRM.eig(a.numRows, false);
        assertTrue(eig.decompose(a.copy()));
        double low = Double.POSITIVE_INFINITY;
        double high = 0;
        for (int i = 0; i < eig.getNumberOfEigenvalues(); i++) {
            Complex_F64 lambda = eig.getEigenvalue(i);
            low = Math.min(low, lambda.getMagnitude());
            high = Math.max(high, lambda.getMagnitude());
        }
        return new double[] {low, high};
    }
}
