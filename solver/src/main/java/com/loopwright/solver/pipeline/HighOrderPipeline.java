package com.loopwright.solver.pipeline;

import com.loopwright.solver.design.GammaChoice;
import com.loopwright.solver.design.HighOrderDesign;
import com.loopwright.solver.design.HighOrderStep;
import com.loopwright.solver.design.HighOrderVerification;
import com.loopwright.solver.design.InfeasibleDesignException;
import com.loopwright.solver.design.SpecMatch;
import com.loopwright.solver.highorder.CompanionTransform;
import com.loopwright.solver.highorder.HighOrderDesigner;
import com.loopwright.solver.highorder.HighOrderVerifier;
import com.loopwright.solver.highorder.PoleMatchedRiccati;
import com.loopwright.solver.highorder.SpecMatcher;
import com.loopwright.solver.norm.HInfinityNormCalculator;
import com.loopwright.solver.plant.CompanionPlant;
import com.loopwright.solver.spec.AuxiliaryPlacement;
import com.loopwright.solver.spec.DesignSpec;
import com.loopwright.solver.spec.DesiredPoles;
import com.loopwright.solver.spec.SpecInverter;
import com.loopwright.solver.spec.TargetDynamics;
import com.loopwright.solver.spec.TimeSpec;
import com.loopwright.solver.verify.VerificationFailedException;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.ejml.dense.row.factory.LinearSolverFactory_DDRM;
import org.ejml.interfaces.linsol.LinearSolverDense;

/**
 * The front door of the order-n design: a state space is brought to companion form (and refused without DC gain),
 * the dominant target comes from matching the specs by simulation or from the closed-form inversion, the
 * auxiliary poles are placed, the pole-matched Riccati design is computed and verified. Every failure is a
 * {@link SolverFailure}. Stateless and thread-safe.
 */
public final class HighOrderPipeline {

    /**
     * The output has DC gain when |n0| > DC_GAIN_TOLERANCE * ||n|| for the companion numerator n (n0 its constant
     * coefficient): below that the zero at s = 0 is numerically exact and the reference cannot be scaled.
     */
    public static final double DC_GAIN_TOLERANCE = 1e-12;
    /** Relative tolerance of the verified H-infinity norm (the norm iteration's stopping rule). */
    public static final double NORM_RELATIVE_TOLERANCE = HInfinityNormCalculator.RELATIVE_TOLERANCE;
    /** The spec check's settling tolerance: simulated settling within ts (1 + this). */
    public static final double SETTLING_TOLERANCE = SpecMatcher.SETTLING_TOLERANCE;
    /** The spec check's overshoot tolerance: simulated overshoot within the spec plus this [percentage points]. */
    public static final double OVERSHOOT_TOLERANCE_POINTS = SpecMatcher.OVERSHOOT_TOLERANCE_POINTS;

    private final SpecMatcher matcher = new SpecMatcher();
    private final HighOrderDesigner designer = new HighOrderDesigner();
    private final HighOrderVerifier verifier = new HighOrderVerifier();

    /** The state space as sent: dx/dt = A x + B2 u + B1 w, tracked output y = c x. */
    public record StateSpace(DMatrixRMaj a, DMatrixRMaj b2, DMatrixRMaj b1, DMatrixRMaj output) {}

    /**
     * One order-n design request in solver terms.
     *
     * @param plant                the companion plant (ignored when stateSpace is given)
     * @param stateSpace           the state space to transform, or null
     * @param matchSpecs           true: match the specs by simulating the order-n loop; false: invert them in
     *                             closed form for the dominant pair
     * @param maxUndershootPercent the undershoot allowed while matching
     */
    public record Request(
            CompanionPlant plant,
            StateSpace stateSpace,
            DesignSpec spec,
            AuxiliaryPlacement auxiliary,
            boolean matchSpecs,
            GammaChoice gammaChoice,
            double stepSize,
            double bandFraction,
            double maxUndershootPercent) {}

    /**
     * @param transform                the companion transform of the state space, or null
     * @param match                    the spec match, or null when the specs were inverted in closed form
     * @param toPlant                  T of x = T z (the identity for a companion-form request)
     * @param plantGain                the gain on the caller's state x: K T^-1 (the companion gain without a
     *                                 transform)
     * @param controllabilityCondition the condition number of the controllability matrix, or null without a
     *                                 transform
     * @param specCheck                the simulated step against the specs
     */
    public record Result(
            CompanionTransform.Result transform,
            SpecMatch match,
            HighOrderDesign design,
            HighOrderVerification verification,
            DMatrixRMaj toPlant,
            double[] plantGain,
            Double controllabilityCondition,
            SpecCheck specCheck) {
        public Result {
            toPlant = toPlant.copy();
            plantGain = plantGain.clone();
        }

        /** True when the request was a state space brought to companion form (transform is then set). */
        public boolean fromStateSpace() {
            return transform != null;
        }

        @Override
        public DMatrixRMaj toPlant() {
            return toPlant.copy();
        }

        @Override
        public double[] plantGain() {
            return plantGain.clone();
        }
    }

    /**
     * The simulated step of the order-n loop against the specs.
     *
     * @param met                     settling within ts (1 + SpecMatcher.SETTLING_TOLERANCE), overshoot within the
     *                                spec plus SpecMatcher.OVERSHOOT_TOLERANCE_POINTS, undershoot within its cap
     * @param settlingResidual        simulated settling time / ts - 1
     * @param overshootResidualPoints simulated overshoot - the spec, in percentage points
     */
    public record SpecCheck(boolean met, double settlingResidual, double overshootResidualPoints) {}

    /**
     * @throws SolverFailure UNCONTROLLABLE or NO_DC_GAIN for the state space, INFEASIBLE_SPEC, UNVERIFIABLE,
     *                       or LOOP_NOT_SIMULABLE
     */
    public Result design(Request request) {
        return design(request, null);
    }

    /**
     * The design at a given dominant pair (the robust search's choice): neither matched nor inverted from the
     * specs, the auxiliary poles placed as requested; the spec check still judges the simulated step.
     *
     * @param target the dominant pair, or null to take it from the specs as {@link #design(Request)} does
     */
    public Result design(Request request, TargetDynamics target) {
        CompanionTransform.Result transform = null;
        CompanionPlant plant = request.plant();
        if (request.stateSpace() != null) {
            StateSpace ss = request.stateSpace();
            try {
                transform = new CompanionTransform().transform(ss.a(), ss.b2(), ss.b1(), ss.output());
            } catch (CompanionTransform.UncontrollableException e) {
                throw SolverFailure.of(SolverFailure.Kind.UNCONTROLLABLE, e.getMessage(), e);
            }
            plant = transform.plant();
            if (!(Math.abs(plant.numerator()[0]) > DC_GAIN_TOLERANCE * norm(plant.numerator()))) {
                throw SolverFailure.of(
                        SolverFailure.Kind.NO_DC_GAIN,
                        "the output has a zero at s = 0 (no DC gain)," + " so the reference cannot be scaled to it",
                        null);
            }
        }
        Partial result;
        try {
            SpecMatch match = null;
            if (target == null && request.matchSpecs()) {
                match = matcher.match(
                        plant, request.spec(), request.auxiliary(), request.stepSize(), request.maxUndershootPercent());
                target = match.target();
            } else if (target == null) {
                target = new SpecInverter().invert(request.spec()).target();
            }
            DesiredPoles poles = request.auxiliary().place(target, plant.order());
            HighOrderDesign design = designer.design(plant, poles, request.gammaChoice());
            HighOrderVerification verification = verifier.verify(
                    design,
                    request.stepSize(),
                    request.bandFraction(),
                    ((TimeSpec.SettlingTime) request.spec().timeSpec()).seconds());
            result = new Partial(match, design, verification);
        } catch (InfeasibleDesignException e) {
            throw SolverFailure.infeasible(e.infeasibility(), e);
        } catch (VerificationFailedException | PoleMatchedRiccati.SystemFailure e) {
            throw SolverFailure.of(SolverFailure.Kind.UNVERIFIABLE, e.getMessage(), e);
        } catch (IllegalArgumentException e) {
            // a simulation or eigenvalue step outside its range (for example a step response that never settles
            // inside the horizon): the design cannot be verified
            throw SolverFailure.of(SolverFailure.Kind.LOOP_NOT_SIMULABLE, e.getMessage(), e);
        }
        HighOrderDesign design = result.design();
        int n = design.plant().order();
        double[] k = design.gain();
        DMatrixRMaj toPlant = transform == null ? CommonOps_DDRM.identity(n) : transform.toPlant();
        double[] plantGain = k;
        Double controllabilityCondition = null;
        if (transform != null) {
            plantGain = gainOnPlantState(transform.toPlant(), k);
            controllabilityCondition = 1 / transform.reciprocalCondition();
        }
        return new Result(
                transform,
                result.match(),
                design,
                result.verification(),
                toPlant,
                plantGain,
                controllabilityCondition,
                specCheck(request, result.verification().step()));
    }

    private record Partial(SpecMatch match, HighOrderDesign design, HighOrderVerification verification) {}

    private static SpecCheck specCheck(Request request, HighOrderStep step) {
        double ts = ((TimeSpec.SettlingTime) request.spec().timeSpec()).seconds();
        double overshoot = 100 * request.spec().overshootFraction();
        boolean met = step.metrics().settlingTimeSeconds() <= ts * (1 + SpecMatcher.SETTLING_TOLERANCE)
                && step.metrics().overshootPercent() <= overshoot + SpecMatcher.OVERSHOOT_TOLERANCE_POINTS
                && step.undershootPercent() <= request.maxUndershootPercent();
        return new SpecCheck(
                met,
                step.metrics().settlingTimeSeconds() / ts - 1,
                step.metrics().overshootPercent() - overshoot);
    }

    /** K T^-1 from the LU solve T' x = K' (partial pivoting), not from an explicit inverse of T. */
    static double[] gainOnPlantState(DMatrixRMaj toPlant, double[] k) {
        int n = k.length;
        DMatrixRMaj transposed = new DMatrixRMaj(n, n);
        CommonOps_DDRM.transpose(toPlant, transposed);
        LinearSolverDense<DMatrixRMaj> lu = LinearSolverFactory_DDRM.lu(n);
        if (!lu.setA(transposed)) {
            throw new IllegalArgumentException("the transform to companion form is singular");
        }
        DMatrixRMaj x = new DMatrixRMaj(n, 1);
        lu.solve(new DMatrixRMaj(n, 1, true, k), x);
        return x.data.clone();
    }

    /** Euclidean norm, accumulated with hypot so that large coefficients do not overflow. */
    private static double norm(double[] v) {
        double s = 0;
        for (double x : v) {
            s = Math.hypot(s, x);
        }
        return s;
    }
}
