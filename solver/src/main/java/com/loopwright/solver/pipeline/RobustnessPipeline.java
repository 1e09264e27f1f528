package com.loopwright.solver.pipeline;

import com.loopwright.solver.cancel.ComputationCancelledException;
import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.robustness.AcceptanceLimits;
import com.loopwright.solver.robustness.CapExceededException;
import com.loopwright.solver.robustness.RobustnessOptions;
import com.loopwright.solver.robustness.RobustnessReport;
import com.loopwright.solver.robustness.RobustnessVerifier;
import com.loopwright.solver.robustness.UnstableLoopException;
import org.ejml.data.DMatrixRMaj;

/**
 * The front door of the robustness checks of one loop: the performance output z, the acceptance limits widened
 * by the tolerance, and the verifier run. Every failure is a {@link SolverFailure}; a cancellation passes through.
 * Stateless and thread-safe.
 */
public final class RobustnessPipeline {

    private final RobustnessVerifier verifier = new RobustnessVerifier();

    /**
     * @param limits            the spec as given; judged widened by {@code toleranceFraction} of each limit
     * @param rho1              position weight of z = [rho1 x1, rho2 x2, u] (null: z = x1)
     * @param rho2              velocity weight of z (used with rho1)
     * @param gamma             the bound the disturbance gain is checked against, or null
     * @throws SolverFailure CAP_EXCEEDED (subject: the option, index: the list entry), UNSTABLE_LOOP, or
     *                       CHECK_NOT_COMPUTABLE when a number leaves double precision
     */
    public RobustnessReport check(
            CanonicalPlant plant,
            FeedbackGains gains,
            double stepSize,
            AcceptanceLimits limits,
            Double rho1,
            Double rho2,
            Double gamma,
            RobustnessOptions options,
            double toleranceFraction) {
        DMatrixRMaj output = rho1 == null
                ? new DMatrixRMaj(new double[][] {{1, 0}})
                : new DMatrixRMaj(
                        new double[][] {{rho1, 0}, {0, rho2}, {-gains.positionGain(), -gains.velocityGain()}});
        AcceptanceLimits judged = widened(limits, toleranceFraction);
        try {
            return verifier.verify(plant, gains, stepSize, judged, output, gamma, options);
        } catch (CapExceededException e) {
            throw SolverFailure.about(
                    SolverFailure.Kind.CAP_EXCEEDED, e.option().name(), e.index(), e.getMessage(), e);
        } catch (UnstableLoopException e) {
            throw SolverFailure.of(SolverFailure.Kind.UNSTABLE_LOOP, e.getMessage(), e);
        } catch (ComputationCancelledException e) {
            throw e; // the deadline passed: stop, there is nobody to answer
        } catch (RuntimeException e) {
            // overflow, a norm iteration at its cap, an unmeasurable step: numbers outside double precision
            throw SolverFailure.of(SolverFailure.Kind.CHECK_NOT_COMPUTABLE, e.getMessage(), e);
        }
    }

    /** The limits actually judged: each given limit times (1 + toleranceFraction). */
    public static AcceptanceLimits widened(AcceptanceLimits limits, double toleranceFraction) {
        return new AcceptanceLimits(
                scale(limits.settlingTimeSeconds(), 1 + toleranceFraction),
                scale(limits.riseTimeSeconds(), 1 + toleranceFraction),
                scale(limits.overshootPercent(), 1 + toleranceFraction),
                limits.bandFraction());
    }

    private static Double scale(Double value, double factor) {
        return value == null ? null : value * factor;
    }
}
