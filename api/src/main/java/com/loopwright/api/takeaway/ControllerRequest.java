package com.loopwright.api.takeaway;

import com.loopwright.api.design.DesignRequest;

/**
 * Body of POST /v1/designs/controllers/{format}.
 *
 * @param design              the design request, exactly as POST /v1/designs takes it
 * @param samplePeriod period of the controller's cyclic task [s]
 * @param actuatorLimit        actuator limit |u| the generated code clamps to [u units]
 */
public record ControllerRequest(DesignRequest design, Double samplePeriod, Double actuatorLimit) {}
