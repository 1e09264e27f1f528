package com.loopwright.api.fit;

import com.loopwright.api.endpoint.Endpoint;
import com.loopwright.api.problem.FieldError;
import com.loopwright.api.problem.Problem;
import com.loopwright.api.problem.ProblemType;
import com.loopwright.solver.pipeline.FitPipeline;
import com.loopwright.solver.plant.StepFit;
import java.util.List;

/** POST /v1/models/fit: a plant model fitted to a recorded step test. Stateless and thread-safe. */
public final class FitEndpoint implements Endpoint<FitRequest, ValidatedFit, StepFit> {

    private static final String OUTPUT_POINTER = "/samples/output";

    private final FitRequestValidator validator = new FitRequestValidator();
    private final FitPipeline fitter = new FitPipeline();
    private final FitResponseMapper responses = new FitResponseMapper();

    @Override
    public Class<FitRequest> requestType() {
        return FitRequest.class;
    }

    @Override
    public ValidatedFit validate(FitRequest request) {
        return validator.validate(request);
    }

    @Override
    public StepFit compute(ValidatedFit fit) {
        return fitter.fit(fit.data(), fit.options());
    }

    @Override
    public Object respond(ValidatedFit fit, StepFit result) {
        return responses.toResponse(fit, result);
    }

    @Override
    public Problem nonFinite(String pointer) {
        return ProblemType.FIT_FAILED.problem(
                "the fitted " + pointer + " is outside double precision; rescale the" + " samples",
                List.of(new FieldError(OUTPUT_POINTER, "outside double precision")),
                List.of());
    }
}
