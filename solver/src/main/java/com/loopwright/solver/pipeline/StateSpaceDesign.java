package com.loopwright.solver.pipeline;

import com.loopwright.solver.spec.TargetDynamics;
import java.util.List;
import org.ejml.data.DMatrixRMaj;

/**
 * A canonical design expressed in the caller's coordinates x = T z:
 * <pre>
 *   P_x = T^-T P_z T^-1,  K_x = K_z T^-1,  Q_x = C1x'C1x = T^-T diag(rho1^2, rho2^2) T^-1,
 *   u = kr r - K_x x,  with r tracked by the output y = c x, c = first row of T^-1 (y = z1).
 * </pre>
 *
 * @param transform            T (x = T z)
 * @param p                    P in the caller's coordinates
 * @param gain                 K as a 1 x 2 row in the caller's coordinates
 * @param stateWeight          Q = C1'C1 in the caller's coordinates
 * @param trackedOutput        c as a 1 x 2 row: the output whose step response meets the specs
 * @param referenceGain        kr for unit DC gain from r to y of this law, from a linear solve of the caller's closed
 *                             loop (A - B2 K_x) x = -B2 (equals the canonical kr up to the conditioning of T)
 * @param relativeResidual     relative residual of P_x in the Riccati equation built from the caller's A, B1, B2
 * @param closedLoopPoles      eigenvalues of A - B2 K_x
 * @param controllabilityCondition cond_2 of C_x = [B2, A B2]; the caller-coordinate results may lose up to
 *                             log10 of it in digits ({@link com.loopwright.solver.plant.TwoStateModel#CONDITION_NOTE_THRESHOLD})
 * @param loopLaw              the law of the loop with integral action and/or an observer in these coordinates, null
 *                             when the design has no such loop
 */
public record StateSpaceDesign(
        DMatrixRMaj transform,
        DMatrixRMaj p,
        DMatrixRMaj gain,
        DMatrixRMaj stateWeight,
        DMatrixRMaj trackedOutput,
        double referenceGain,
        double relativeResidual,
        List<TargetDynamics.Pole> closedLoopPoles,
        double controllabilityCondition,
        CallerLoopLaw loopLaw) {

    public StateSpaceDesign {
        transform = transform.copy();
        p = p.copy();
        gain = gain.copy();
        stateWeight = stateWeight.copy();
        trackedOutput = trackedOutput.copy();
        closedLoopPoles = List.copyOf(closedLoopPoles);
    }

    @Override
    public DMatrixRMaj transform() {
        return transform.copy();
    }

    @Override
    public DMatrixRMaj p() {
        return p.copy();
    }

    @Override
    public DMatrixRMaj gain() {
        return gain.copy();
    }

    @Override
    public DMatrixRMaj stateWeight() {
        return stateWeight.copy();
    }

    @Override
    public DMatrixRMaj trackedOutput() {
        return trackedOutput.copy();
    }

    /** The same design with the loop's law in these coordinates. */
    public StateSpaceDesign withLoopLaw(CallerLoopLaw law) {
        return new StateSpaceDesign(
                transform,
                p,
                gain,
                stateWeight,
                trackedOutput,
                referenceGain,
                relativeResidual,
                closedLoopPoles,
                controllabilityCondition,
                law);
    }
}
