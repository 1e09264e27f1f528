package com.loopwright.solver.riccati;

import com.loopwright.solver.linalg.TwoByTwoSpectrum;
import java.util.OptionalDouble;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.interfaces.decomposition.EigenDecomposition_F64;

/** Largest real part of the eigenvalues of a real square matrix (closed form for 2 x 2). */
final class SpectralAbscissa {

    private SpectralAbscissa() {}

    /** Returns max Re(lambda_i(m)), or empty if the eigenvalue QR iteration failed. */
    static OptionalDouble of(DMatrixRMaj m) {
        if (m.numRows == 2) {
            return OptionalDouble.of(TwoByTwoSpectrum.of(m).abscissa());
        }
        EigenDecomposition_F64<DMatrixRMaj> eig = DecompositionFactory_DDRM.eig(m.numRows, false);
        if (!eig.decompose(m.copy())) {
            return OptionalDouble.empty();
        }
        double abscissa = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < eig.getNumberOfEigenvalues(); i++) {
            abscissa = Math.max(abscissa, eig.getEigenvalue(i).real);
        }
        return OptionalDouble.of(abscissa);
    }
}
