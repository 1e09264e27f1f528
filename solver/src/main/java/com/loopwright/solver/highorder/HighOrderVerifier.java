package com.loopwright.solver.highorder;

import com.loopwright.solver.design.HInfinityNorm;
import com.loopwright.solver.design.HighOrderDesign;
import com.loopwright.solver.design.HighOrderStep;
import com.loopwright.solver.design.HighOrderVerification;
import com.loopwright.solver.design.RiccatiSolution;
import com.loopwright.solver.norm.HInfinityNormCalculator;
import com.loopwright.solver.plant.CompanionPlant;
import com.loopwright.solver.riccati.HamiltonianRiccatiSolver;
import com.loopwright.solver.verify.DesignVerifier;
import com.loopwright.solver.verify.VerificationFailedException;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.ejml.dense.row.NormOps_DDRM;

/** Re-solves the Riccati equation numerically, computes the closed-loop norm and simulates the step. */
public final class HighOrderVerifier {

    private final HamiltonianRiccatiSolver riccatiSolver = new HamiltonianRiccatiSolver();
    private final HInfinityNormCalculator normCalculator = new HInfinityNormCalculator();
    private final ClosedLoopStep step = new ClosedLoopStep();

    public HighOrderVerification verify(
            HighOrderDesign design, double stepSize, double bandFraction, double minimumHorizonSeconds) {
        CompanionPlant plant = design.plant();
        int n = plant.order();
        try {
            DMatrixRMaj a = plant.stateMatrix();
            DMatrixRMaj r = PoleMatchedRiccati.quadraticTerm(plant, 1 / (design.gamma() * design.gamma()));
            DMatrixRMaj q = PoleMatchedRiccati.weightMatrix(design.solution().weightsSquared());
            RiccatiSolution numeric = riccatiSolver.solve(a, r, q);
            DMatrixRMaj difference = numeric.p();
            CommonOps_DDRM.subtractEquals(difference, design.solution().p());
            double relativeDifference = NormOps_DDRM.normF(difference) / NormOps_DDRM.normF(numeric.p());
            // closed loop A - B2 K; z = [diag(rho) z; u] with u = -K z
            double[] k = design.gain();
            DMatrixRMaj closed = a.copy();
            DMatrixRMaj performance = new DMatrixRMaj(n + 1, n);
            double[] rho = design.weights();
            for (int j = 0; j < n; j++) {
                closed.add(n - 1, j, -plant.b() * k[j]);
                performance.set(j, j, rho[j]);
                performance.set(n, j, -k[j]);
            }
            HInfinityNorm norm = normCalculator.compute(closed, plant.disturbanceInput(), performance);
            HighOrderStep result = step.simulate(plant, design.poles(), stepSize, bandFraction, minimumHorizonSeconds);
            boolean certified = norm.value() <= design.gamma() * (1 + DesignVerifier.NORM_TOLERANCE)
                    && relativeDifference <= DesignVerifier.AGREEMENT_TOLERANCE;
            return new HighOrderVerification(numeric, relativeDifference, norm, result, certified);
        } catch (RuntimeException e) {
            throw new VerificationFailedException("an independent check could not be computed: " + e.getMessage(), e);
        }
    }
}
