package com.loopwright.solver.norm;

import org.ejml.data.DMatrixRMaj;

/**
 * Diagonal similarity x = D x~ that balances the state coordinates of (A, B, C) before any eigenvalue or
 * frequency-response computation: A~ = D^-1 A D, B~ = D^-1 B, C~ = C D, so C~ (sI - A~)^-1 B~ = G(s) exactly.
 *
 * <p>Method (common practice for nonsymmetric eigenproblems, Parlett and Reinsch's balancing applied to the
 * system matrix [[A, B], [C, 0]] over the state indices only): for each state i, the 2-norm c of column i of
 * [A; C] and r of row i of [A, B], both without the diagonal entry, are brought together by d_i *= f with f the
 * power of two nearest sqrt(r / c); sweeps repeat until no factor changes. Powers of two scale without rounding.
 * A companion-form closed loop whose last row spans ten decades comes out with entries of the size of its poles,
 * which keeps the Hamiltonian eigenvalues accurate to O(eps) of the poles' scale.
 */
final class StateScaling {

    /** Cap on balancing sweeps over the n states (each sweep is O(n (n + m + p))). */
    static final int MAX_SWEEPS = 64;
    /** A state is rescaled only if the squared norms c^2 + r^2 drop below this fraction. */
    static final double IMPROVEMENT_FACTOR = 0.95;
    /** Largest binary exponent of one factor per sweep (keeps the scaling finite for any finite input). */
    static final int MAX_EXPONENT_PER_SWEEP = 60;

    private StateScaling() {}

    /** The balanced triple; the arguments are not changed. */
    record Balanced(DMatrixRMaj a, DMatrixRMaj b, DMatrixRMaj c) {}

    static Balanced balance(DMatrixRMaj a, DMatrixRMaj b, DMatrixRMaj c) {
        DMatrixRMaj as = a.copy();
        DMatrixRMaj bs = b.copy();
        DMatrixRMaj cs = c.copy();
        int n = as.numRows;
        for (int sweep = 0; sweep < MAX_SWEEPS; sweep++) {
            boolean changed = false;
            for (int i = 0; i < n; i++) {
                double column = 0.0;
                double row = 0.0;
                for (int j = 0; j < n; j++) {
                    if (j != i) {
                        column = Math.hypot(column, as.get(j, i));
                        row = Math.hypot(row, as.get(i, j));
                    }
                }
                for (int k = 0; k < cs.numRows; k++) {
                    column = Math.hypot(column, cs.get(k, i));
                }
                for (int k = 0; k < bs.numCols; k++) {
                    row = Math.hypot(row, bs.get(i, k));
                }
                if (column == 0.0 || row == 0.0) {
                    continue;
                }
                long exponent = Math.round(0.5 * (Math.log(row) - Math.log(column)) / Math.log(2.0));
                int e = (int) Math.max(-MAX_EXPONENT_PER_SWEEP, Math.min(MAX_EXPONENT_PER_SWEEP, exponent));
                if (e == 0) {
                    continue;
                }
                double f = Math.scalb(1.0, e);
                double before = column * column + row * row;
                double after = column * f * column * f + row / f * (row / f);
                if (!(after < IMPROVEMENT_FACTOR * before)) {
                    continue;
                }
                // d_i *= f: column i of [A; C] times f, row i of [A, B] divided by f
                for (int j = 0; j < n; j++) {
                    as.set(j, i, as.get(j, i) * f);
                    as.set(i, j, as.get(i, j) / f);
                }
                for (int k = 0; k < cs.numRows; k++) {
                    cs.set(k, i, cs.get(k, i) * f);
                }
                for (int k = 0; k < bs.numCols; k++) {
                    bs.set(i, k, bs.get(i, k) / f);
                }
                changed = true;
            }
            if (!changed) {
                break;
            }
        }
        return new Balanced(as, bs, cs);
    }
}
