package com.loopwright.api.highorder;

import com.loopwright.api.endpoint.Endpoint;
import com.loopwright.api.endpoint.FailureTable;
import com.loopwright.api.loop.LoopResponseMapper;
import com.loopwright.api.problem.Problem;
import com.loopwright.solver.pipeline.HighOrderPipeline;
import com.loopwright.solver.pipeline.HighOrderRobustPipeline;
import com.loopwright.solver.pipeline.HighOrderRobustReport;
import com.loopwright.solver.pipeline.RealLoopPipeline;
import com.loopwright.solver.pipeline.RealLoopReport;

/** POST /v1/designs/high-order: the order-n design of a companion plant or a state space. Stateless. */
public final class HighOrderEndpoint
        implements Endpoint<HighOrderDesignRequest, ValidatedHighOrderDesign, HighOrderEndpoint.Result> {

    /** The law's coordinates: the companion states of the request. */
    private static final String COMPANION_COORDINATES = "companion z = [z1 .. zn] of the request";

    private final HighOrderRequestValidator validator = new HighOrderRequestValidator();
    private final HighOrderPipeline pipeline = new HighOrderPipeline();
    private final RealLoopPipeline realLoops = new RealLoopPipeline();
    private final HighOrderResponseMapper responses = new HighOrderResponseMapper();
    private final LoopResponseMapper loopResponses = new LoopResponseMapper();
    private final HighOrderRobustPipeline robustPipeline = new HighOrderRobustPipeline();
    private final HighOrderRobustMapper robustResponses = new HighOrderRobustMapper();

    /**
     * @param design the plain order-n design
     * @param loop   the loop with integral action and/or an observer, or null when not asked for
     * @param robust the robust design over the companion box (its design is {@code design}), or null
     */
    public record Result(HighOrderPipeline.Result design, RealLoopReport loop, HighOrderRobustReport robust) {}

    @Override
    public Class<HighOrderDesignRequest> requestType() {
        return HighOrderDesignRequest.class;
    }

    @Override
    public ValidatedHighOrderDesign validate(HighOrderDesignRequest request) {
        return validator.validate(request);
    }

    @Override
    public Result compute(ValidatedHighOrderDesign input) {
        ValidatedHighOrderDesign.StateSpace ss = input.stateSpace();
        HighOrderPipeline.Request request = new HighOrderPipeline.Request(
                input.plant(),
                ss == null ? null : new HighOrderPipeline.StateSpace(ss.a(), ss.b2(), ss.b1(), ss.output()),
                input.spec(),
                input.auxiliary(),
                input.matchSpecs(),
                input.gammaChoice(),
                input.stepSize(),
                input.bandFraction(),
                input.maxUndershootPercent());
        ValidatedHighOrderRobust robust = input.robust();
        RealLoopPipeline.Request loopRequest = input.loop() == null
                ? null
                : new RealLoopPipeline.Request(
                        input.plant(),
                        input.spec(),
                        input.auxiliary(),
                        input.gammaChoice(),
                        input.loop().structure(),
                        input.loop().loadStepSize(),
                        input.maxUndershootPercent());
        if (robust != null) {
            HighOrderRobustReport report = loopRequest == null
                    ? robustPipeline.design(
                            request, robust.box(), robust.samples(), robust.seed(), robust.actuatorLimit())
                    : robustPipeline.designLoop(
                            request,
                            loopRequest,
                            robust.box(),
                            robust.samples(),
                            robust.seed(),
                            robust.actuatorLimit());
            return new Result(report.design(), report.judgedLoop(), report);
        }
        HighOrderPipeline.Result design = pipeline.design(request);
        RealLoopReport loop = loopRequest == null ? null : realLoops.design(loopRequest);
        return new Result(design, loop, null);
    }

    @Override
    public Object respond(ValidatedHighOrderDesign input, Result result) {
        return responses.toResponse(
                input,
                result.design(),
                result.loop() == null
                        ? null
                        : loopResponses.toSections(
                                result.loop(),
                                COMPANION_COORDINATES,
                                lawFormula(result.loop()),
                                input.loop().samplePeriod()),
                result.robust() == null ? null : robustResponses.toResponse(result.robust(), input.stepSize()));
    }

    @Override
    public Problem nonFinite(String pointer) {
        return FailureTable.unverifiable(
                "the design's " + (pointer.isEmpty() ? "result" : pointer) + " is outside double precision");
    }

    private static String lawFormula(RealLoopReport loop) {
        String state = loop.observer() == null ? "sum(k_i*z_i)" : "sum(k_i*z_i_hat)";
        return loop.law().integralAction() ? "u = kr*r + ki*xi - " + state + ", xi' = r - y" : "u = kr*r - " + state;
    }
}
