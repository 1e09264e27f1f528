package com.loopwright.api.highorder;

import com.loopwright.api.endpoint.Endpoint;
import com.loopwright.api.endpoint.FailureTable;
import com.loopwright.api.problem.Problem;
import com.loopwright.solver.pipeline.HighOrderPipeline;

/** POST /v1/designs/high-order: the order-n design of a companion plant or a state space. Stateless. */
public final class HighOrderEndpoint
        implements Endpoint<HighOrderDesignRequest, ValidatedHighOrderDesign, HighOrderPipeline.Result> {

    private final HighOrderRequestValidator validator = new HighOrderRequestValidator();
    private final HighOrderPipeline pipeline = new HighOrderPipeline();
    private final HighOrderResponseMapper responses = new HighOrderResponseMapper();

    @Override
    public Class<HighOrderDesignRequest> requestType() {
        return HighOrderDesignRequest.class;
    }

    @Override
    public ValidatedHighOrderDesign validate(HighOrderDesignRequest request) {
        return validator.validate(request);
    }

    @Override
    public HighOrderPipeline.Result compute(ValidatedHighOrderDesign input) {
        ValidatedHighOrderDesign.StateSpace ss = input.stateSpace();
        return pipeline.design(new HighOrderPipeline.Request(
                input.plant(),
                ss == null ? null : new HighOrderPipeline.StateSpace(ss.a(), ss.b2(), ss.b1(), ss.output()),
                input.spec(),
                input.auxiliary(),
                input.matchSpecs(),
                input.gammaChoice(),
                input.stepSize(),
                input.bandFraction(),
                input.maxUndershootPercent()));
    }

    @Override
    public Object respond(ValidatedHighOrderDesign input, HighOrderPipeline.Result result) {
        return responses.toResponse(input, result);
    }

    @Override
    public Problem nonFinite(String pointer) {
        return FailureTable.unverifiable(
                "the design's " + (pointer.isEmpty() ? "result" : pointer) + " is outside double precision");
    }
}
