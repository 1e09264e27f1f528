package com.loopwright.api.takeaway;

import com.loopwright.api.design.DesignRequest;

/**
 * Body of POST /v1/designs/plots/{figure}.
 *
 * @param design       the design request, exactly as POST /v1/designs takes it
 * @param actuatorLimit optional actuator limit |u| drawn on the control-effort figure [u units]
 */
public record PlotRequest(DesignRequest design, Double actuatorLimit) {}
