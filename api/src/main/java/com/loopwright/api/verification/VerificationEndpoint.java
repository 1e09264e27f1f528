package com.loopwright.api.verification;

import com.loopwright.api.design.Cautions;
import com.loopwright.api.endpoint.Endpoint;
import com.loopwright.api.endpoint.FailureTable;
import com.loopwright.api.loop.LoopResponseMapper;
import com.loopwright.api.problem.Problem;
import com.loopwright.api.robustness.RobustnessResponse;
import com.loopwright.api.robustness.RobustnessResponseMapper;
import com.loopwright.solver.pipeline.LoopCheckPipeline;
import com.loopwright.solver.pipeline.RobustnessPipeline;
import com.loopwright.solver.robustness.RobustnessReport;

/** POST /v1/verifications: the robustness checks of a loop with the caller's gains. Stateless and thread-safe. */
public final class VerificationEndpoint
        implements Endpoint<VerificationRequest, ValidatedVerification, VerificationEndpoint.Result> {

    /**
     * @param robustness the checks of u = kr r - K x
     * @param loop       the law as it runs, or null when not asked for
     */
    public record Result(RobustnessReport robustness, LoopCheckPipeline.Report loop) {}

    private static final String POSITION_OUTPUT = "x1";
    private static final String WEIGHTED_OUTPUT = "z = [rho1 x1, rho2 x2, u]";

    private final VerificationRequestValidator validator = new VerificationRequestValidator();
    private final RobustnessPipeline robustness = new RobustnessPipeline();
    private final RobustnessResponseMapper responses = new RobustnessResponseMapper();
    private final LoopCheckPipeline loops = new LoopCheckPipeline();
    private final LoopResponseMapper loopResponses = new LoopResponseMapper();

    @Override
    public Class<VerificationRequest> requestType() {
        return VerificationRequest.class;
    }

    @Override
    public ValidatedVerification validate(VerificationRequest request) {
        return validator.validate(request);
    }

    @Override
    public Result compute(ValidatedVerification v) {
        RobustnessReport checked = robustness.check(
                v.plant(),
                v.gains(),
                v.stepSize(),
                v.limits(),
                v.rho1(),
                v.rho2(),
                v.gamma(),
                v.verify().options(),
                v.verify().toleranceFraction());
        return new Result(checked, v.loop() == null ? null : loops.check(v.loop()));
    }

    @Override
    public Object respond(ValidatedVerification v, Result result) {
        String performanceOutput = v.rho1() == null ? POSITION_OUTPUT : WEIGHTED_OUTPUT;
        RobustnessResponse checks = responses.toResponse(
                result.robustness(),
                v.limits(),
                100 * v.verify().toleranceFraction(),
                v.stepSize(),
                performanceOutput,
                v.gamma(),
                v.verify().options().seriesPoints());
        return new VerificationResponse(
                new RobustnessResponse.PlantView(
                        v.plant().a0(), v.plant().a1(), v.plant().b(), v.plant().d()),
                new RobustnessResponse.GainView(
                        v.gains().positionGain(),
                        v.gains().velocityGain(),
                        v.gains().referenceGain()),
                checks,
                Cautions.ALL,
                result.loop() == null ? null : loopResponses.toCheck(result.loop(), v.gamma(), performanceOutput));
    }

    @Override
    public Problem nonFinite(String pointer) {
        return FailureTable.unverifiable(
                "the verification's " + (pointer.isEmpty() ? "result" : pointer) + " is outside double precision");
    }
}
