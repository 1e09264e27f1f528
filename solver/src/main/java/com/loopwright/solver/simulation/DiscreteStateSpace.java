package com.loopwright.solver.simulation;

import org.ejml.data.DMatrixRMaj;

/**
 * A sampled linear system x[k+1] = ad x[k] + bd u[k], with u held constant over each sample
 * period of {@code samplePeriod}.
 *
 * @param ad state transition over one period, n x n
 * @param bd input matrix over one period, n x m
 * @param samplePeriod sample period T in seconds, finite and positive
 */
public record DiscreteStateSpace(DMatrixRMaj ad, DMatrixRMaj bd, double samplePeriod) {

    public DiscreteStateSpace {
        if (ad == null || bd == null) {
            throw new IllegalArgumentException("ad and bd must not be null");
        }
        if (ad.numRows != ad.numCols || ad.numRows < 1) {
            throw new IllegalArgumentException(
                    "ad must be square and non-empty, got " + ad.numRows + " x " + ad.numCols);
        }
        if (bd.numRows != ad.numRows || bd.numCols < 1) {
            throw new IllegalArgumentException(
                    "bd must be " + ad.numRows + " x m with m >= 1, got " + bd.numRows + " x " + bd.numCols);
        }
        if (!(samplePeriod > 0.0) || !Double.isFinite(samplePeriod)) {
            throw new IllegalArgumentException("samplePeriod must be finite and positive, got " + samplePeriod);
        }
        MatrixChecks.requireFinite(ad, "ad");
        MatrixChecks.requireFinite(bd, "bd");
        ad = ad.copy();
        bd = bd.copy();
    }

    /** Returns a copy of the state transition matrix. */
    @Override
    public DMatrixRMaj ad() {
        return ad.copy();
    }

    /** Returns a copy of the input matrix. */
    @Override
    public DMatrixRMaj bd() {
        return bd.copy();
    }

    /** Number n of states. */
    public int stateDimension() {
        return ad.numRows;
    }

    /** Number m of inputs. */
    public int inputCount() {
        return bd.numCols;
    }
}
