package com.loopwright.api.verification;

import com.loopwright.api.design.Cautions;
import com.loopwright.api.endpoint.Endpoint;
import com.loopwright.api.endpoint.FailureTable;
import com.loopwright.api.problem.Problem;
import com.loopwright.api.robustness.RobustnessResponse;
import com.loopwright.api.robustness.RobustnessResponseMapper;
import com.loopwright.solver.pipeline.RobustnessPipeline;
import com.loopwright.solver.robustness.RobustnessReport;

/** POST /v1/verifications: the robustness checks of a loop with the caller's gains. Stateless and thread-safe. */
public final class VerificationEndpoint
        implements Endpoint<VerificationRequest, ValidatedVerification, RobustnessReport> {

    private static final String POSITION_OUTPUT = "x1";
    private static final String WEIGHTED_OUTPUT = "z = [rho1 x1, rho2 x2, u]";

    private final VerificationRequestValidator validator = new VerificationRequestValidator();
    private final RobustnessPipeline robustness = new RobustnessPipeline();
    private final RobustnessResponseMapper responses = new RobustnessResponseMapper();

    @Override
    public Class<VerificationRequest> requestType() {
        return VerificationRequest.class;
    }

    @Override
    public ValidatedVerification validate(VerificationRequest request) {
        return validator.validate(request);
    }

    @Override
    public RobustnessReport compute(ValidatedVerification v) {
        return robustness.check(
                v.plant(),
                v.gains(),
                v.stepSize(),
                v.limits(),
                v.rho1(),
                v.rho2(),
                v.gamma(),
                v.verify().options(),
                v.verify().toleranceFraction());
    }

    @Override
    public Object respond(ValidatedVerification v, RobustnessReport report) {
        RobustnessResponse checks = responses.toResponse(
                report,
                v.limits(),
                100 * v.verify().toleranceFraction(),
                v.stepSize(),
                v.rho1() == null ? POSITION_OUTPUT : WEIGHTED_OUTPUT,
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
                Cautions.ALL);
    }

    @Override
    public Problem nonFinite(String pointer) {
        return FailureTable.unverifiable(
                "the verification's " + (pointer.isEmpty() ? "result" : pointer) + " is outside double precision");
    }
}
