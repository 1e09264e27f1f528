package com.loopwright.api.exchange;

import com.loopwright.api.mapping.RobustnessResponseMapper;
import com.loopwright.api.problem.FieldError;
import com.loopwright.api.problem.Problem;
import com.loopwright.api.problem.ProblemType;
import com.loopwright.api.request.ValidatedVerify;
import com.loopwright.api.response.RobustnessResponse;
import com.loopwright.solver.cancel.ComputationCancelledException;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.robustness.AcceptanceLimits;
import com.loopwright.solver.robustness.CapExceededException;
import com.loopwright.solver.loop.FeedbackGains;
import com.loopwright.solver.robustness.RobustnessReport;
import com.loopwright.solver.robustness.RobustnessVerifier;
import com.loopwright.solver.robustness.UnstableLoopException;
import java.util.List;
import org.ejml.data.DMatrixRMaj;

/** Runs the robustness checks of one loop and maps the result, or the failure as a problem. Stateless. */
final class RobustnessRunner {

    /** Either a response or a problem. */
    record Result(RobustnessResponse response, Problem problem) {
    }

    private final RobustnessVerifier verifier = new RobustnessVerifier();
    private final RobustnessResponseMapper mapper = new RobustnessResponseMapper();

    /**
     * @param limits  the spec as given; the tolerance in {@code verify} widens it before judging
     * @param rho1    position weight of z (null: z = x1)
     * @param prefix  JSON pointer of the verify object in the request
     */
    Result run(CanonicalPlant plant, FeedbackGains gains, double stepSize, AcceptanceLimits limits, Double rho1,
               Double rho2, Double gamma, ValidatedVerify verify, String prefix) {
        DMatrixRMaj output = rho1 == null ? new DMatrixRMaj(new double[][] {{1, 0}})
                : new DMatrixRMaj(new double[][] {{rho1, 0}, {0, rho2},
                    {-gains.positionGain(), -gains.velocityGain()}});
        AcceptanceLimits judged = RobustnessResponseMapper.widened(limits, verify.toleranceFraction());
        try {
            RobustnessReport report = verifier.verify(plant, gains, stepSize, judged, output, gamma, verify.options());
            return new Result(mapper.toResponse(report, limits, 100 * verify.toleranceFraction(), stepSize,
                    rho1 == null ? "x1" : "z = [rho1 x1, rho2 x2, u]", gamma, verify.options().seriesPoints()), null);
        } catch (CapExceededException e) {
            String pointer = switch (e.option()) {
                case SAMPLE_PERIOD -> prefix + "/sampling/samplePeriod";
                case INPUT_DELAY -> prefix + "/inputDelay";
                case DISTURBANCE_TIMING -> prefix + "/disturbances/" + e.index();
            };
            return new Result(null, ProblemType.CAP_EXCEEDED.problem(e.getMessage(),
                    List.of(new FieldError(pointer, e.getMessage())), List.of()));
        } catch (UnstableLoopException e) {
            return new Result(null, ProblemType.UNSTABLE_LOOP.problem(e.getMessage(),
                    List.of(new FieldError("/gain", e.getMessage())), List.of()));
        } catch (ComputationCancelledException e) {
            throw e; // the deadline passed: stop, there is nobody to answer
        } catch (RuntimeException e) {
            // overflow, a norm iteration at its cap, an unmeasurable step: numbers outside double precision
            return new Result(null, ProblemType.UNVERIFIABLE_DESIGN.problem("a robustness check could not be computed"
                    + " in double precision: " + e.getMessage(), List.of(), List.of()));
        }
    }
}
