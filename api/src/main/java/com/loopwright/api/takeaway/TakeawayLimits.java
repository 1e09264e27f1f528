package com.loopwright.api.takeaway;

import com.loopwright.solver.pipeline.ExportPipeline;

/** Ranges of the plot and controller-export fields (documented in openapi.yaml). */
public final class TakeawayLimits {

    public static final double MIN_SAMPLE_PERIOD = ExportPipeline.MIN_SAMPLE_PERIOD;
    public static final double MAX_SAMPLE_PERIOD = ExportPipeline.MAX_SAMPLE_PERIOD;
    /** Largest actuator limit in u units (any realistic drive or valve command is far below). */
    public static final double MAX_ACTUATOR_LIMIT = 1e9;

    private TakeawayLimits() {}
}
