package com.loopwright.api.designspace;

import com.loopwright.api.endpoint.Endpoint;
import com.loopwright.api.endpoint.FailureContext;
import com.loopwright.api.endpoint.FailureTable;
import com.loopwright.api.endpoint.Text;
import com.loopwright.api.plot.DesignSpaceFigure;
import com.loopwright.api.problem.Problem;

/** POST /v1/design-spaces/figure: the map drawn as SVG. Stateless and thread-safe. */
public final class DesignSpaceFigureEndpoint
        implements Endpoint<DesignSpaceRequest, ValidatedDesignSpace, DesignSpaceComputation.Result> {

    static final String SVG = "image/svg+xml";

    private final DesignSpaceValidator validator = new DesignSpaceValidator();
    private final DesignSpaceComputation computation = new DesignSpaceComputation();
    private final DesignSpaceFigure figures = new DesignSpaceFigure();

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
        return new Text(SVG, figures.draw(result.map(), validated.options().actuatorLimit(), result.spec()));
    }

    @Override
    public Problem nonFinite(String pointer) {
        return FailureTable.unverifiable("the map's " + pointer + " is outside double precision");
    }

    @Override
    public Problem unwritable(IllegalArgumentException failure) {
        return FailureTable.unverifiable("the map could not be drawn: " + failure.getMessage());
    }

    @Override
    public FailureContext failureContext(ValidatedDesignSpace validated) {
        return DesignSpaceEndpoint.context(validated);
    }
}
