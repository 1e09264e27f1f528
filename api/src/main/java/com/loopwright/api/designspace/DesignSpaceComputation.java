package com.loopwright.api.designspace;

import com.loopwright.solver.design.DesignSpaceCell;
import com.loopwright.solver.design.DesignSpaceMap;
import com.loopwright.solver.pipeline.DesignSpacePipeline;

/** The map and the marked spec through the front door, shared by the JSON and the figure endpoint. */
final class DesignSpaceComputation {

    /** What the solver computed for one request: the map and the marked spec (or null). */
    record Result(DesignSpaceMap map, DesignSpaceCell spec) {}

    private final DesignSpacePipeline maps = new DesignSpacePipeline();

    Result compute(ValidatedDesignSpace request) {
        DesignSpaceMap map = maps.map(request.plant(), request.grid(), request.options());
        DesignSpaceCell spec = request.specTimeSeconds() == null
                ? null
                : maps.spec(
                        request.plant(),
                        request.grid(),
                        request.specTimeSeconds(),
                        request.specOvershootPercent(),
                        request.options());
        return new Result(map, spec);
    }
}
