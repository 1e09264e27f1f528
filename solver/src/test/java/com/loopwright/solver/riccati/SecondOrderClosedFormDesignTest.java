package com.loopwright.solver.riccati;

import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.solver.design.RiccatiSolution;
import java.util.Arrays;
import java.util.Comparator;
import java.util.Random;
import org.ejml.data.Complex_F64;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.interfaces.decomposition.EigenDecomposition_F64;
import org.junit.jupiter.api.Test;

/**
 * The project's closed-form H-infinity state-feedback design for the second-order plant
 * x'' + a1 x' + a0 x = b u + d w must be reproduced by the numerical Riccati solver.
 *
 * <p>source: the project's method notes. With A = [[0, 1], [-a0, -a1]], B1 = [0, d]', B2 = [0, b]',
 * k = b^2 - d^2/gamma^2 and R = B1 B1'/gamma^2 - B2 B2' = diag(0, -k), matching the closed-loop
 * characteristic polynomial of A - B2 B2' P, s^2 + (a1 + b^2 p22) s + (a0 + b^2 p12), to
 * s^2 + 2 zeta wn s + wn^2 and reading the Riccati equation entry by entry gives
 * p12 = (wn^2 - a0)/b^2, p22 = (2 zeta wn - a1)/b^2, rho1^2 = 2 a0 p12 + k p12^2,
 * p11 = a1 p12 + a0 p22 + k p12 p22, rho2^2 = 2 a1 p22 - 2 p12 + k p22^2, with Q = diag(rho1^2, rho2^2).
 */
class SecondOrderClosedFormDesignTest {

    private final HamiltonianRiccatiSolver solver = new HamiltonianRiccatiSolver();

    /** One feasible random design: plant, target, chosen gamma and the closed-form P and Q. */
    private record Design(
            double a0,
            double a1,
            double b,
            double d,
            double zeta,
            double wn,
            double gamma,
            double k,
            DMatrixRMaj p,
            DMatrixRMaj q) {

        DMatrixRMaj a() {
            return new DMatrixRMaj(new double[][] {{0, 1}, {-a0, -a1}});
        }

        DMatrixRMaj r() {
            return new DMatrixRMaj(new double[][] {{0, 0}, {0, -k}});
        }
    }

    @Test
    void solverReproducesClosedFormOnRandomFeasibleDesigns() {
        Random random = new Random(424242L);
        double worstDifference = 0.0;
        double worstResidual = 0.0;
        double worstPoleError = 0.0;
        for (int trial = 0; trial < 250; trial++) {
            Design design = randomFeasibleDesign(random);
            RiccatiSolution solution = solver.solve(design.a(), design.r(), design.q());

            double difference = RiccatiTestSupport.relativeDifference(solution.p(), design.p());
            assertTrue(
                    difference < 1e-8,
                    () -> "closed form not reproduced, relative difference " + difference + " for " + design);
            worstDifference = Math.max(worstDifference, difference);
            worstResidual = Math.max(worstResidual, solution.relativeResidual());

            // closed loop A - B2 B2' P must have the roots of s^2 + 2 zeta wn s + wn^2:
            // -zeta wn +- j wn sqrt(1 - zeta^2) (quadratic formula, zeta < 1)
            DMatrixRMaj b2 = new DMatrixRMaj(new double[][] {{0}, {design.b()}});
            DMatrixRMaj closedLoop = design.a();
            DMatrixRMaj gain = new DMatrixRMaj(1, 2);
            CommonOps_DDRM.multTransA(b2, solution.p(), gain);
            CommonOps_DDRM.multAdd(-1.0, b2, gain, closedLoop);
            Complex_F64[] poles = eigenvaluesByImaginaryPart(closedLoop);
            double expectedReal = -design.zeta() * design.wn();
            double expectedImaginary = design.wn() * Math.sqrt(1 - design.zeta() * design.zeta());
            double poleError = Math.max(
                            Math.hypot(poles[0].real - expectedReal, poles[0].imaginary + expectedImaginary),
                            Math.hypot(poles[1].real - expectedReal, poles[1].imaginary - expectedImaginary))
                    / design.wn();
            assertTrue(
                    poleError < 1e-7,
                    () -> "closed-loop poles off by " + poleError + " (relative to wn) for " + design);
            worstPoleError = Math.max(worstPoleError, poleError);
        }
        System.out.printf(
                "closed form: worst relative P difference %.3e, worst residual %.3e, worst pole error/wn %.3e%n",
                worstDifference, worstResidual, worstPoleError);
    }

    private static Design randomFeasibleDesign(Random random) {
        for (int attempt = 0; attempt < 1000; attempt++) {
            double a0 = -5 + 25 * random.nextDouble();
            double a1 = 3 * random.nextDouble();
            double b = logUniform(0.5, 500, random);
            double d = logUniform(0.1, 500, random);
            double zeta = 0.72 + 0.27 * random.nextDouble();
            // smallest wn with wn^2 > |a0|, 2 zeta wn > a1 and, at gamma -> infinity (k = b^2),
            // rho2^2 b^2 = (4 zeta^2 - 2) wn^2 + 2 a0 - a1^2 > 0
            double wnSquaredMin = Math.max(
                    Math.abs(a0), Math.max(Math.pow(a1 / (2 * zeta), 2), (a1 * a1 - 2 * a0) / (4 * zeta * zeta - 2)));
            double wn = Math.sqrt(Math.max(wnSquaredMin, 1e-2)) * Math.pow(10, 0.05 + 1.5 * random.nextDouble());

            double p12 = (wn * wn - a0) / (b * b);
            double p22 = (2 * zeta * wn - a1) / (b * b);
            // every feasibility condition is alpha + beta k > 0 with beta > 0, so it is k > -alpha/beta
            double[][] conditions = {
                {2 * a0 * p12, p12 * p12}, // rho1^2 > 0
                {2 * a1 * p22 - 2 * p12, p22 * p22}, // rho2^2 > 0
                {a1 * p12 + a0 * p22, p12 * p22}, // p11 > 0
                {(a1 * p12 + a0 * p22) * p22 - p12 * p12, p12 * p22 * p22}, // det P > 0
                {a1, p22}, // a1 + k p22 > 0
                {a0, p12}, // a0 + k p12 > 0
            };
            double kMin = Double.NEGATIVE_INFINITY;
            for (double[] condition : conditions) {
                kMin = Math.max(kMin, -condition[0] / condition[1]);
            }
            if (!(kMin < b * b)) {
                continue;
            }
            // k = b^2 - d^2/gamma^2 increases with gamma; gamma_min gives k = kMin
            double gammaMin = d / Math.sqrt(b * b - kMin);
            double gamma = 1.2 * gammaMin;
            double k = b * b - d * d / (gamma * gamma);

            double p11 = a1 * p12 + a0 * p22 + k * p12 * p22;
            double rho1Squared = 2 * a0 * p12 + k * p12 * p12;
            double rho2Squared = 2 * a1 * p22 - 2 * p12 + k * p22 * p22;
            DMatrixRMaj p = new DMatrixRMaj(new double[][] {{p11, p12}, {p12, p22}});
            DMatrixRMaj q = new DMatrixRMaj(new double[][] {{rho1Squared, 0}, {0, rho2Squared}});
            assertTrue(
                    rho1Squared > 0
                            && rho2Squared > 0
                            && p11 > 0
                            && p11 * p22 - p12 * p12 > 0
                            && a1 + k * p22 > 0
                            && a0 + k * p12 > 0,
                    "generator bug: infeasible design");
            return new Design(a0, a1, b, d, zeta, wn, gamma, k, p, q);
        }
        throw new AssertionError("no feasible design found in 1000 attempts");
    }

    private static double logUniform(double low, double high, Random random) {
        return low * Math.pow(high / low, random.nextDouble());
    }

    private static Complex_F64[] eigenvaluesByImaginaryPart(DMatrixRMaj m) {
        EigenDecomposition_F64<DMatrixRMaj> eig = DecompositionFactory_DDRM.eig(m.numRows, false);
        assertTrue(eig.decompose(m.copy()));
        Complex_F64[] values = new Complex_F64[m.numRows];
        for (int i = 0; i < values.length; i++) {
            values[i] = eig.getEigenvalue(i);
        }
        Arrays.sort(values, Comparator.comparingDouble(c -> c.imaginary));
        return values;
    }
}
