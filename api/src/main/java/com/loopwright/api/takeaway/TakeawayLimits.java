package com.loopwright.api.takeaway;

import com.loopwright.solver.pipeline.ControllerOptions;
import com.loopwright.solver.pipeline.ExportPipeline;

/** Ranges of the plot and controller-export fields (documented in openapi.yaml). */
public final class TakeawayLimits {

    public static final double MIN_SAMPLE_PERIOD = ExportPipeline.MIN_SAMPLE_PERIOD;
    public static final double MAX_SAMPLE_PERIOD = ExportPipeline.MAX_SAMPLE_PERIOD;
    /** Largest actuator limit in u units (any realistic drive or valve command is far below). */
    public static final double MAX_ACTUATOR_LIMIT = 1e9;
    /** Largest |lowest|, |highest| of an actuator range and |command| of an operating point [u units]. */
    public static final double MAX_ACTUATOR_RANGE = MAX_ACTUATOR_LIMIT;
    /** Largest |output| of an operating point [x1 units]. */
    public static final double MAX_OPERATING_OUTPUT = 1e9;
    /** Largest period tolerance [%]: beyond half a period a task-overrun alarm says nothing (common practice). */
    public static final double MAX_PERIOD_TOLERANCE_PERCENT = 50;
    /** The period tolerance when the request states none [%]. */
    public static final double DEFAULT_PERIOD_TOLERANCE_PERCENT = 100 * ControllerOptions.DEFAULT_PERIOD_TOLERANCE;
    /** Longest name prefix. */
    public static final int MAX_PREFIX_LENGTH = ControllerOptions.MAX_PREFIX_LENGTH;
    /** The prefix when the request names none. */
    public static final String DEFAULT_PREFIX = ControllerOptions.DEFAULT_PREFIX;

    private TakeawayLimits() {}
}
