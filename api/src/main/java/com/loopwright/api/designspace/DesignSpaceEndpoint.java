package com.loopwright.api.designspace;

import com.loopwright.api.endpoint.Endpoint;
import com.loopwright.api.endpoint.FailureContext;
import com.loopwright.api.endpoint.FailureTable;
import com.loopwright.api.problem.Problem;

/** POST /v1/design-spaces: the map as JSON. Stateless and thread-safe. */
public final class DesignSpaceEndpoint
        implements Endpoint<DesignSpaceRequest, ValidatedDesignSpace, DesignSpaceComputation.Result> {

    private final DesignSpaceValidator validator = new DesignSpaceValidator();
    private final DesignSpaceComputation computation = new DesignSpaceComputation();
    private final DesignSpaceResponseMapper responses = new DesignSpaceResponseMapper();

    @Override
    public Class<DesignSpaceRequest> requestType() {
        return DesignSpaceRequest.class;
    }

    @Override
    public ValidatedDesignSpace validate(DesignSpaceRequest request) {
        return validator.validate(request);
    }

    @Override
    public DesignSpaceComputation.Result compute(ValidatedDesignSpace validated) {
        return computation.compute(validated);
    }

    @Override
    public Object respond(ValidatedDesignSpace validated, DesignSpaceComputation.Result result) {
        return responses.toResponse(result.map(), result.spec());
    }

    @Override
    public Problem nonFinite(String pointer) {
        return FailureTable.unverifiable("the map's " + pointer + " is outside double precision");
    }

    @Override
    public FailureContext failureContext(ValidatedDesignSpace validated) {
        return context(validated);
    }

    /** Pointers of the map's failures: its time axis. */
    static FailureContext context(ValidatedDesignSpace validated) {
        String time = validated == null || validated.grid().settlingAxis() ? "/settlingTime" : "/riseTime";
        return FailureContext.ROOT.withTimeSpec(time);
    }
}
