package com.loopwright.solver.simulation;

import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.loop.LoopMatrices;
import com.loopwright.solver.plant.CanonicalPlant;
import org.ejml.data.DMatrixRMaj;

/**
 * A closed loop driven by a constant reference r, from x(0) = 0:
 * x' = a x + bRef r, y = cOut x, u = cControl x + dControl r.
 *
 * @param a closed-loop state matrix, n x n, 1 <= n <= {@value #MAX_STATE_DIMENSION}
 * @param bRef reference input vector, n x 1
 * @param cOut output row, 1 x n
 * @param cControl control row, 1 x n
 * @param dControl feedthrough from r to u
 */
public record LinearLoop(DMatrixRMaj a, DMatrixRMaj bRef, DMatrixRMaj cOut, DMatrixRMaj cControl, double dControl) {

    /** Largest state dimension: the block exponential of [[A, bRef], [0, 0]] is (n + 1) square. */
    public static final int MAX_STATE_DIMENSION = ZeroOrderHold.MAX_BLOCK_DIMENSION - 1;

    /**
     * The canonical plant under u = kr r - k1 x1 - k2 x2, seen from the reference: y = x1, u = -K x + kr r.
     */
    public static LinearLoop ofStep(CanonicalPlant plant, FeedbackGains gains) {
        return new LinearLoop(
                LoopMatrices.closedLoop(plant, gains),
                new DMatrixRMaj(new double[][] {{0}, {plant.b() * gains.referenceGain()}}),
                new DMatrixRMaj(new double[][] {{1, 0}}),
                new DMatrixRMaj(new double[][] {{-gains.positionGain(), -gains.velocityGain()}}),
                gains.referenceGain());
    }

    public LinearLoop {
        if (a == null) {
            throw new IllegalArgumentException("a must not be null");
        }
        int n = a.numRows;
        if (n < 1 || n > MAX_STATE_DIMENSION) {
            throw new IllegalArgumentException("state dimension must be in [1, " + MAX_STATE_DIMENSION + "], got " + n);
        }
        MatrixChecks.requireShape(a, n, n, "a");
        MatrixChecks.requireShape(bRef, n, 1, "bRef");
        MatrixChecks.requireShape(cOut, 1, n, "cOut");
        MatrixChecks.requireShape(cControl, 1, n, "cControl");
        MatrixChecks.requireFinite(a, "a");
        MatrixChecks.requireFinite(bRef, "bRef");
        MatrixChecks.requireFinite(cOut, "cOut");
        MatrixChecks.requireFinite(cControl, "cControl");
        if (!Double.isFinite(dControl)) {
            throw new IllegalArgumentException("dControl must be finite, got " + dControl);
        }
        a = a.copy();
        bRef = bRef.copy();
        cOut = cOut.copy();
        cControl = cControl.copy();
    }

    @Override
    public DMatrixRMaj a() {
        return a.copy();
    }

    @Override
    public DMatrixRMaj bRef() {
        return bRef.copy();
    }

    @Override
    public DMatrixRMaj cOut() {
        return cOut.copy();
    }

    @Override
    public DMatrixRMaj cControl() {
        return cControl.copy();
    }

    /** Number n of states. */
    public int stateDimension() {
        return a.numRows;
    }
}
