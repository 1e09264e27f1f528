package com.loopwright.solver.verify;

import com.loopwright.solver.design.ClosedFormDesign;
import com.loopwright.solver.design.HInfinityNorm;
import com.loopwright.solver.design.RiccatiSolution;
import com.loopwright.solver.design.StepMetrics;
import com.loopwright.solver.design.Verification;
import com.loopwright.solver.norm.TwoStatePeakGain;
import com.loopwright.solver.riccati.HamiltonianRiccatiSolver;
import com.loopwright.solver.riccati.RiccatiResidual;
import com.loopwright.solver.simulation.LinearLoop;
import com.loopwright.solver.simulation.StepResponseMetrics;
import com.loopwright.solver.spec.DesignSpec;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.ejml.dense.row.NormOps_DDRM;

/**
 * Checks a closed-form design by independent routes: the Riccati residual of the closed-form P, a numeric
 * Hamiltonian solve of the same equation, the closed-loop H-infinity norm from w to z (exact peak of the
 * two-state loop's gain, from the loop matrices alone), and a simulated step.
 */
public final class DesignVerifier {

    /** Numeric and closed-form P must agree to this relative Frobenius difference to certify. */
    public static final double AGREEMENT_TOLERANCE = 1e-6;
    /** Relative slack on hinfNorm &lt;= gamma for rounding (the norm of a design at its bound equals gamma). */
    public static final double NORM_TOLERANCE = 1e-8;

    private final HamiltonianRiccatiSolver riccatiSolver = new HamiltonianRiccatiSolver();
    private final TwoStatePeakGain normCalculator = new TwoStatePeakGain();
    private final StepResponseMetrics stepMetrics = new StepResponseMetrics();
    private final SpecCompliance compliance = new SpecCompliance();

    /**
     * @param stepSize     reference step, x1 units
     * @param bandFraction settling band for the simulated settling time
     * @param horizon      simulated time [s]
     * @param samples      samples of the simulation grid
     */
    public Verification verify(
            ClosedFormDesign design,
            DesignSpec spec,
            double stepSize,
            double bandFraction,
            double horizon,
            int samples) {
        DesignMatrices m = DesignMatrices.of(design);
        try {
            double closedFormResidual = RiccatiResidual.relative(m.a(), m.r(), m.q(), m.p());
            RiccatiSolution numeric = riccatiSolver.solve(m.a(), m.r(), m.q());
            DMatrixRMaj difference = new DMatrixRMaj(2, 2);
            CommonOps_DDRM.subtract(numeric.p(), m.p(), difference);
            double relativeDifference = NormOps_DDRM.normF(difference) / NormOps_DDRM.normF(m.p());
            HInfinityNorm norm = design.plant().d() == 0
                    ? new HInfinityNorm(0, 0, 0)
                    : normCalculator.compute(m.closedLoop(), m.b1(), m.performanceOutput());
            LinearLoop loop = new LinearLoop(
                    m.closedLoop(),
                    new DMatrixRMaj(new double[][] {{0}, {design.plant().b() * design.referenceGain()}}),
                    new DMatrixRMaj(new double[][] {{1, 0}}),
                    new DMatrixRMaj(new double[][] {{-design.positionGain(), -design.velocityGain()}}),
                    design.referenceGain());
            StepMetrics metrics = stepMetrics.measure(loop, stepSize, horizon, samples, bandFraction);
            boolean certified =
                    norm.value() <= design.gamma() * (1 + NORM_TOLERANCE) && relativeDifference <= AGREEMENT_TOLERANCE;
            return new Verification(
                    closedFormResidual,
                    numeric,
                    relativeDifference,
                    norm,
                    metrics,
                    compliance.check(spec, metrics),
                    certified);
        } catch (RuntimeException e) {
            throw new VerificationFailedException("an independent check could not be computed: " + e.getMessage(), e);
        }
    }
}
