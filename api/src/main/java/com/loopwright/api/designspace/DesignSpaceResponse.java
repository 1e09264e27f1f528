package com.loopwright.api.designspace;

import com.fasterxml.jackson.annotation.JsonInclude;
import java.util.List;

/**
 * Body of a 200 from POST /v1/design-spaces.
 *
 * @param timeSpec            the time axis: settlingTime or riseTime
 * @param settlingBandPercent the settling band of every cell [%]
 * @param timeCount           columns (time values)
 * @param overshootCount      rows (overshoot values)
 * @param boxCases            parameter sets each feasible cell was judged on (0 without uncertainty)
 * @param cells               row by row (overshoot rows, time columns): cell (row, column) at row x timeCount +
 *                            column
 * @param fastest             per overshoot row, the fastest feasible time spec
 * @param conditions          each reason met in the map once, with its meaning and how many cells it stops
 * @param spec                the requested spec judged as a cell, when given
 * @param cautions            the cautions of every design
 */
@JsonInclude(JsonInclude.Include.NON_NULL)
public record DesignSpaceResponse(
        String timeSpec,
        double settlingBandPercent,
        int timeCount,
        int overshootCount,
        int boxCases,
        List<DesignSpaceCellResponse> cells,
        List<FastestTime> fastest,
        List<ConditionCount> conditions,
        DesignSpaceCellResponse spec,
        List<String> cautions) {

    public DesignSpaceResponse {
        cells = List.copyOf(cells);
        fastest = List.copyOf(fastest);
        conditions = List.copyOf(conditions);
        cautions = List.copyOf(cautions);
    }

    /**
     * One cell (or the marked spec).
     *
     * @param settlingTime     the cell's settling time [s] (settlingTime axis)
     * @param riseTime         the cell's rise time [s] (riseTime axis)
     * @param overshootPercent the cell's overshoot [%]
     * @param feasible         a certified design exists within the actuator limit and the sample period
     * @param failedCondition  the first requirement that fails (absent when feasible)
     * @param state            for weightReal, the 1-based state (1 position, 2 velocity)
     * @param gammaMin         the infimum of the feasible gamma set, when some gamma completes the design
     * @param peakControl      peak |u| of the nominal step of stepSize
     * @param box              the design over the parameter box (feasible cells, with uncertainty)
     */
    @JsonInclude(JsonInclude.Include.NON_NULL)
    public record DesignSpaceCellResponse(
            Double settlingTime,
            Double riseTime,
            double overshootPercent,
            boolean feasible,
            String failedCondition,
            Integer state,
            Double gammaMin,
            double peakControl,
            BoxResponse box) {}

    /**
     * A cell's design over the parameter box, each case's step figures exact for its two-state loop.
     *
     * @param cases            corners plus samples
     * @param unstableCases    cases whose loop is unstable
     * @param settlingTime     worst settling time [s] over the stable cases (settlingTime axis)
     * @param riseTime         worst rise time [s] over the stable cases (riseTime axis)
     * @param overshootPercent worst overshoot [%] over the stable cases
     * @param peakControl      worst peak |u| over the stable cases
     * @param meetingFraction  fraction of the cases meeting the cell widened by tolerancePercent (and the actuator
     *                         limit when given)
     */
    @JsonInclude(JsonInclude.Include.NON_NULL)
    public record BoxResponse(
            int cases,
            int unstableCases,
            Double settlingTime,
            Double riseTime,
            Double overshootPercent,
            Double peakControl,
            double meetingFraction) {}

    /**
     * The fastest feasible time spec at one overshoot.
     *
     * @param overshootPercent the row's overshoot [%]
     * @param settlingTime     fastest feasible settling time [s] (settlingTime axis; absent when none is feasible)
     * @param riseTime         fastest feasible rise time [s] (riseTime axis)
     * @param limitedBy        what stops a faster spec; gridEdge when the grid's first column is feasible; for a
     *                         row without a feasible cell, why its slowest cell fails
     * @param state            for weightReal, the 1-based state
     */
    @JsonInclude(JsonInclude.Include.NON_NULL)
    public record FastestTime(
            double overshootPercent, Double settlingTime, Double riseTime, String limitedBy, Integer state) {}

    /**
     * One reason met in the map.
     *
     * @param condition the wire name (as failedCondition)
     * @param state     for weightReal, the 1-based state
     * @param meaning   what the requirement is, in words
     * @param cells     cells it stops
     */
    @JsonInclude(JsonInclude.Include.NON_NULL)
    public record ConditionCount(String condition, Integer state, String meaning, int cells) {}
}
