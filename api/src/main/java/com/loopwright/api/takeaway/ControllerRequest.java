package com.loopwright.api.takeaway;

import com.loopwright.api.design.DesignRequest;

/**
 * Body of POST /v1/designs/controllers/{format}.
 *
 * @param design                 the design request, exactly as POST /v1/designs takes it
 * @param samplePeriod           period of the controller's cyclic task [s]
 * @param actuatorLimit          symmetric actuator limit |u| the generated code clamps to [u units]; or give
 * @param actuatorRange          the asymmetric command range instead
 * @param operatingPoint         the operating point (output y0, command u0); 0 and 0 if absent
 * @param prefix                 name prefix of the block, C functions, macros and file names; "LW" if absent
 * @param precision              "double" (LREAL/double, the default) or "single" (REAL/float)
 * @param periodTolerancePercent the measured task period is flagged beyond this deviation from samplePeriod [%];
 *                               10 if absent
 */
public record ControllerRequest(
        DesignRequest design,
        Double samplePeriod,
        Double actuatorLimit,
        ActuatorRange actuatorRange,
        OperatingPoint operatingPoint,
        String prefix,
        String precision,
        Double periodTolerancePercent) {}
