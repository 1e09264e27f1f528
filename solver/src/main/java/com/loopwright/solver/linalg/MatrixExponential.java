package com.loopwright.solver.linalg;

import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.ejml.dense.row.factory.LinearSolverFactory_DDRM;
import org.ejml.interfaces.linsol.LinearSolverDense;

/**
 * The matrix exponential e^A of a small dense square matrix.
 *
 * <p>Method: Higham's 2005 scaling and squaring with diagonal [m/m] Pade approximants r_m.
 * With the 1-norm ||A||_1, the smallest degree m in {3, 5, 7, 9} with
 * ||A||_1 <= theta_m is used unscaled; otherwise A is scaled by 2^-s so that
 * ||2^-s A||_1 <= theta_13, the [13/13] approximant r_13 is evaluated and squared s times:
 * e^A ~ r_13(2^-s A)^(2^s).
 *
 * <p>Error bound: for ||2^-s A||_1 <= theta_m, r_m(2^-s A)^(2^s) = e^(A + dA) exactly with
 * ||dA||_1 <= u ||A||_1, u = 2^-53 the unit roundoff (backward error of the approximant in exact
 * arithmetic; the theta_m are the largest norms for which that holds). Rounding in the evaluation
 * and the squarings adds a forward error that grows with s and with the conditioning of e^A.
 */
public final class MatrixExponential {

    /** Largest accepted dimension n of an n x n argument. */
    public static final int MAX_DIMENSION = 32;

    /** Largest number s of squarings; ||A||_1 above theta_13 * 2^64 (about 1e20) is rejected. */
    public static final int MAX_SQUARINGS = 64;

    // theta_m for m = 3, 5, 7, 9: largest ||A||_1 with backward error <= 2^-53 (double precision).
    private static final double[] THETA_LOW_DEGREE = {
        1.495585217958292e-2, 2.539398330063230e-1, 9.504178996162932e-1, 2.097847961257068e0
    };
    private static final int[] LOW_DEGREES = {3, 5, 7, 9};
    private static final double THETA_13 = 5.371920351148152e0;

    // Coefficients b_0..b_m of the numerator p_m(x) = sum b_j x^j of the [m/m] Pade approximant of
    // e^x; the denominator is q_m(x) = p_m(-x). Integers, exact in double (all < 2^53 times a power of 2).
    private static final double[] PADE_3 = {120, 60, 12, 1};
    private static final double[] PADE_5 = {30240, 15120, 3360, 420, 30, 1};
    private static final double[] PADE_7 = {17297280, 8648640, 1995840, 277200, 25200, 1512, 56, 1};
    private static final double[] PADE_9 = {
        17643225600.0, 8821612800.0, 2075673600.0, 302702400.0, 30270240.0, 2162160.0, 110880.0, 3960.0, 90.0, 1.0
    };
    private static final double[] PADE_13 = {
        64764752532480000.0,
        32382376266240000.0,
        7771770303897600.0,
        1187353796428800.0,
        129060195264000.0,
        10559470521600.0,
        670442572800.0,
        33522128640.0,
        1323241920.0,
        40840800.0,
        960960.0,
        16380.0,
        182.0,
        1.0
    };

    private MatrixExponential() {}

    /**
     * Returns e^A as a new matrix; the argument is not modified.
     *
     * @param a square matrix, 1 <= n <= {@value #MAX_DIMENSION}, all entries finite
     * @throws IllegalArgumentException if a is null, not square, too large, has a non-finite entry,
     *     has a 1-norm needing more than {@value #MAX_SQUARINGS} squarings, or if e^A overflows
     */
    public static DMatrixRMaj of(DMatrixRMaj a) {
        validate(a);
        int n = a.numRows;
        double norm1 = inducedOneNorm(a);
        DMatrixRMaj result = null;
        for (int i = 0; i < LOW_DEGREES.length && result == null; i++) {
            if (norm1 <= THETA_LOW_DEGREE[i]) {
                result = lowDegreePade(a, padeCoefficients(LOW_DEGREES[i]));
            }
        }
        if (result == null) {
            int squarings = squaringsFor(norm1);
            DMatrixRMaj scaled = new DMatrixRMaj(n, n);
            // 2^-s is exact in binary floating point, so the scaling adds no rounding.
            CommonOps_DDRM.scale(Math.scalb(1.0, -squarings), a, scaled);
            result = degree13Pade(scaled);
            DMatrixRMaj square = new DMatrixRMaj(n, n);
            for (int k = 0; k < squarings; k++) {
                CommonOps_DDRM.mult(result, result, square);
                DMatrixRMaj swap = result;
                result = square;
                square = swap;
            }
        }
        for (double entry : result.data) {
            if (!Double.isFinite(entry)) {
                throw new IllegalArgumentException("e^A overflows double precision (||A||_1 = " + norm1 + ")");
            }
        }
        return result;
    }

    private static void validate(DMatrixRMaj a) {
        if (a == null) {
            throw new IllegalArgumentException("matrix must not be null");
        }
        if (a.numRows != a.numCols) {
            throw new IllegalArgumentException("matrix must be square, got " + a.numRows + " x " + a.numCols);
        }
        if (a.numRows < 1 || a.numRows > MAX_DIMENSION) {
            throw new IllegalArgumentException(
                    "matrix dimension must be in [1, " + MAX_DIMENSION + "], got " + a.numRows);
        }
        for (int i = 0; i < a.getNumElements(); i++) {
            if (!Double.isFinite(a.data[i])) {
                throw new IllegalArgumentException(
                        "matrix entry (" + i / a.numCols + ", " + i % a.numCols + ") is not finite: " + a.data[i]);
            }
        }
    }

    /** ||A||_1 = max_j sum_i |a_ij|, the norm that the theta_m bounds refer to. */
    private static double inducedOneNorm(DMatrixRMaj a) {
        double max = 0.0;
        for (int j = 0; j < a.numCols; j++) {
            double columnSum = 0.0;
            for (int i = 0; i < a.numRows; i++) {
                columnSum += Math.abs(a.unsafe_get(i, j));
            }
            max = Math.max(max, columnSum);
        }
        if (!Double.isFinite(max)) {
            throw new IllegalArgumentException("||A||_1 overflows double precision");
        }
        return max;
    }

    /** s = max(0, ceil(log2(||A||_1 / theta_13))), so that ||2^-s A||_1 <= theta_13. */
    private static int squaringsFor(double norm1) {
        int s = Math.max(0, (int) Math.ceil(Math.log(norm1 / THETA_13) / Math.log(2.0)));
        // Guard against log rounding: increase s until the scaled norm is really below theta_13.
        while (s <= MAX_SQUARINGS && Math.scalb(norm1, -s) > THETA_13) {
            s++;
        }
        if (s > MAX_SQUARINGS) {
            throw new IllegalArgumentException(
                    "||A||_1 = " + norm1 + " is too large: needs more than " + MAX_SQUARINGS + " squarings");
        }
        return s;
    }

    private static double[] padeCoefficients(int degree) {
        return switch (degree) {
            case 3 -> PADE_3;
            case 5 -> PADE_5;
            case 7 -> PADE_7;
            case 9 -> PADE_9;
            default -> throw new IllegalStateException("no Pade coefficients of degree " + degree);
        };
    }

    /**
     * r_m(A) for m <= 9: U = A * sum_k b_(2k+1) A^(2k), V = sum_k b_(2k) A^(2k),
     * r_m = (V - U)^-1 (V + U).
     */
    private static DMatrixRMaj lowDegreePade(DMatrixRMaj a, double[] b) {
        int n = a.numRows;
        DMatrixRMaj a2 = new DMatrixRMaj(n, n);
        CommonOps_DDRM.mult(a, a, a2);
        DMatrixRMaj evenPower = CommonOps_DDRM.identity(n);
        DMatrixRMaj oddSum = new DMatrixRMaj(n, n);
        DMatrixRMaj v = new DMatrixRMaj(n, n);
        DMatrixRMaj next = new DMatrixRMaj(n, n);
        int m = b.length - 1;
        for (int k = 0; 2 * k <= m; k++) {
            // evenPower = A^(2k)
            CommonOps_DDRM.addEquals(v, b[2 * k], evenPower);
            if (2 * k + 1 <= m) {
                CommonOps_DDRM.addEquals(oddSum, b[2 * k + 1], evenPower);
            }
            if (2 * k + 2 <= m) {
                CommonOps_DDRM.mult(evenPower, a2, next);
                DMatrixRMaj swap = evenPower;
                evenPower = next;
                next = swap;
            }
        }
        DMatrixRMaj u = new DMatrixRMaj(n, n);
        CommonOps_DDRM.mult(a, oddSum, u);
        return solveDenominator(u, v);
    }

    /**
     * r_13(A) evaluated with 6 matrix products and one linear solve:
     * U = A [A6 (b13 A6 + b11 A4 + b9 A2) + b7 A6 + b5 A4 + b3 A2 + b1 I],
     * V = A6 (b12 A6 + b10 A4 + b8 A2) + b6 A6 + b4 A4 + b2 A2 + b0 I.
     */
    private static DMatrixRMaj degree13Pade(DMatrixRMaj a) {
        double[] b = PADE_13;
        int n = a.numRows;
        DMatrixRMaj identity = CommonOps_DDRM.identity(n);
        DMatrixRMaj a2 = new DMatrixRMaj(n, n);
        DMatrixRMaj a4 = new DMatrixRMaj(n, n);
        DMatrixRMaj a6 = new DMatrixRMaj(n, n);
        CommonOps_DDRM.mult(a, a, a2);
        CommonOps_DDRM.mult(a2, a2, a4);
        CommonOps_DDRM.mult(a2, a4, a6);

        DMatrixRMaj inner = new DMatrixRMaj(n, n);
        DMatrixRMaj product = new DMatrixRMaj(n, n);

        // U
        combine(inner, b[13], a6, b[11], a4, b[9], a2, 0.0, identity);
        CommonOps_DDRM.mult(a6, inner, product);
        combine(inner, b[7], a6, b[5], a4, b[3], a2, b[1], identity);
        CommonOps_DDRM.addEquals(inner, product);
        DMatrixRMaj u = new DMatrixRMaj(n, n);
        CommonOps_DDRM.mult(a, inner, u);

        // V
        combine(inner, b[12], a6, b[10], a4, b[8], a2, 0.0, identity);
        DMatrixRMaj v = new DMatrixRMaj(n, n);
        CommonOps_DDRM.mult(a6, inner, v);
        combine(inner, b[6], a6, b[4], a4, b[2], a2, b[0], identity);
        CommonOps_DDRM.addEquals(v, inner);

        return solveDenominator(u, v);
    }

    /** target = c6 A6 + c4 A4 + c2 A2 + c0 I. */
    private static void combine(
            DMatrixRMaj target,
            double c6,
            DMatrixRMaj a6,
            double c4,
            DMatrixRMaj a4,
            double c2,
            DMatrixRMaj a2,
            double c0,
            DMatrixRMaj identity) {
        CommonOps_DDRM.scale(c6, a6, target);
        CommonOps_DDRM.addEquals(target, c4, a4);
        CommonOps_DDRM.addEquals(target, c2, a2);
        if (c0 != 0.0) {
            CommonOps_DDRM.addEquals(target, c0, identity);
        }
    }

    /** Solves (V - U) R = (V + U) for R by LU with partial pivoting. */
    private static DMatrixRMaj solveDenominator(DMatrixRMaj u, DMatrixRMaj v) {
        int n = u.numRows;
        DMatrixRMaj numerator = new DMatrixRMaj(n, n);
        DMatrixRMaj denominator = new DMatrixRMaj(n, n);
        CommonOps_DDRM.add(v, u, numerator);
        CommonOps_DDRM.subtract(v, u, denominator);
        LinearSolverDense<DMatrixRMaj> solver = LinearSolverFactory_DDRM.lu(n);
        if (!solver.setA(denominator)) {
            // q_m(A) is well conditioned for ||A||_1 <= theta_m, so this signals corrupted
            // input rather than a hard but valid case.
            throw new IllegalArgumentException("Pade denominator q_m(A) is singular");
        }
        DMatrixRMaj result = new DMatrixRMaj(n, n);
        solver.solve(numerator, result);
        return result;
    }
}
