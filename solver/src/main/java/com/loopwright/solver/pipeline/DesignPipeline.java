package com.loopwright.solver.pipeline;

import com.loopwright.solver.design.ClosedFormDesign;
import com.loopwright.solver.design.GammaChoice;
import com.loopwright.solver.design.InfeasibleDesignException;
import com.loopwright.solver.design.SpecRanges;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.plant.TwoStateModel;
import com.loopwright.solver.spec.DesignSpec;
import com.loopwright.solver.verify.VerificationFailedException;

/**
 * The front door of the two-state design: the closed-form design with its independent verification
 * ({@link LoopDesigner}), and the results in the caller's state-space coordinates. Every failure is a
 * {@link SolverFailure}. Stateless and thread-safe.
 */
public final class DesignPipeline {

    private final LoopDesigner designer;

    /** @param ranges the spec ranges proposals are kept inside */
    public DesignPipeline(SpecRanges ranges) {
        this.designer = new LoopDesigner(ranges);
    }

    /**
     * @throws SolverFailure INFEASIBLE_SPEC with the proposals, or UNVERIFIABLE when a check cannot be computed
     */
    public DesignReport design(
            CanonicalPlant plant, DesignSpec spec, GammaChoice gammaChoice, double stepSize, double bandFraction) {
        try {
            return designer.design(plant, spec, gammaChoice, stepSize, bandFraction);
        } catch (InfeasibleDesignException e) {
            throw SolverFailure.infeasible(e.infeasibility(), e);
        } catch (VerificationFailedException e) {
            throw SolverFailure.of(SolverFailure.Kind.UNVERIFIABLE, e.getMessage(), e);
        }
    }

    /**
     * A two-state state space dx/dt = A x + B2 u + B1 w brought to the canonical second-order form (the
     * controllability transform is computed here, so a caller builds the model through the front door).
     *
     * @throws com.loopwright.solver.plant.PlantParameterException for an uncontrollable pair (A, B2), a B1 not
     *                                                             aligned with B2 or a non-finite transform
     */
    public static TwoStateModel stateSpacePlant(double[][] a, double[] b2, double[] b1) {
        return new TwoStateModel(a, b2, b1);
    }

    /**
     * The design in the coordinates of the caller's state-space model (transform, Riccati matrix, gain, closed-loop
     * poles and the residual there), or null when the plant was not given as a state space.
     */
    public StateSpaceDesign callerCoordinates(Object plantSource, ClosedFormDesign design) {
        return plantSource instanceof TwoStateModel model ? CallerCoordinates.of(model, design) : null;
    }

    /**
     * As {@link #callerCoordinates(Object, ClosedFormDesign)}, with the law of the loop with integral action and/or
     * an observer in the caller's coordinates too (when loop is not null).
     */
    public StateSpaceDesign callerCoordinates(Object plantSource, ClosedFormDesign design, RealLoopReport loop) {
        StateSpaceDesign view = callerCoordinates(plantSource, design);
        if (view == null || loop == null) {
            return view;
        }
        return view.withLoopLaw(
                CallerCoordinates.loopLaw((TwoStateModel) plantSource, design.plant(), loop.law(), loop.observer()));
    }
}
