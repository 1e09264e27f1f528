package com.loopwright.solver.norm;

import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.ejml.dense.row.SingularOps_DDRM;
import org.ejml.dense.row.factory.LinearSolverFactory_DDRM;
import org.ejml.interfaces.linsol.LinearSolverDense;

/**
 * Largest singular value of G(jw) = C (jwI - A)^-1 B in real arithmetic.
 *
 * <p>With X = Xr + j Xi, (jwI - A) X = B is the real system [[-A, -wI], [wI, -A]] [Xr; Xi] = [B; 0].
 * The real embedding [[Gr, -Gi], [Gi, Gr]] of G = Gr + j Gi has the singular values of G, each
 * twice, so sigma_max(G) is its largest singular value.
 */
final class FrequencyResponse {

    private final DMatrixRMaj a;
    private final DMatrixRMaj b;
    private final DMatrixRMaj c;

    FrequencyResponse(DMatrixRMaj a, DMatrixRMaj b, DMatrixRMaj c) {
        this.a = a.copy();
        this.b = b.copy();
        this.c = c.copy();
    }

    double maxSingularValue(double frequency) {
        int n = a.numRows;
        int inputs = b.numCols;
        int outputs = c.numRows;
        DMatrixRMaj shifted = new DMatrixRMaj(2 * n, 2 * n);
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                shifted.set(i, j, -a.get(i, j));
                shifted.set(n + i, n + j, -a.get(i, j));
            }
            shifted.set(i, n + i, -frequency);
            shifted.set(n + i, i, frequency);
        }
        DMatrixRMaj rhs = new DMatrixRMaj(2 * n, inputs);
        CommonOps_DDRM.insert(b, rhs, 0, 0);
        LinearSolverDense<DMatrixRMaj> solver = LinearSolverFactory_DDRM.lu(2 * n);
        if (!solver.setA(shifted)) {
            throw new NormComputationException("jwI - A is singular at w = " + frequency + " rad/s");
        }
        DMatrixRMaj x = new DMatrixRMaj(2 * n, inputs);
        solver.solve(rhs, x);

        DMatrixRMaj realPart = new DMatrixRMaj(outputs, inputs);
        DMatrixRMaj imaginaryPart = new DMatrixRMaj(outputs, inputs);
        CommonOps_DDRM.mult(c, CommonOps_DDRM.extract(x, 0, n, 0, inputs), realPart);
        CommonOps_DDRM.mult(c, CommonOps_DDRM.extract(x, n, 2 * n, 0, inputs), imaginaryPart);

        DMatrixRMaj embedding = new DMatrixRMaj(2 * outputs, 2 * inputs);
        CommonOps_DDRM.insert(realPart, embedding, 0, 0);
        CommonOps_DDRM.insert(realPart, embedding, outputs, inputs);
        CommonOps_DDRM.insert(imaginaryPart, embedding, outputs, 0);
        CommonOps_DDRM.scale(-1.0, imaginaryPart);
        CommonOps_DDRM.insert(imaginaryPart, embedding, 0, inputs);

        double largest = 0.0;
        for (double s : SingularOps_DDRM.singularValues(embedding)) {
            largest = Math.max(largest, s);
        }
        if (!Double.isFinite(largest)) {
            throw new NormComputationException("sigma_max(G(jw)) is not finite at w = " + frequency + " rad/s");
        }
        return largest;
    }
}
