package com.loopwright.api.highorder;

import com.loopwright.solver.plant.CompanionPlant;
import com.loopwright.solver.spec.DesiredPoles;

/** Documented ranges of the high-order request (openapi.yaml states the same numbers; a test holds them together). */
public final class HighOrderLimits {

    public static final int MIN_ORDER = CompanionPlant.MIN_ORDER;
    public static final int MAX_ORDER = CompanionPlant.MAX_ORDER;
    public static final double MAX_ABS_COEFFICIENT = 1e8;
    public static final double MAX_ABS_DISTURBANCE = 1e8;
    public static final double MIN_REAL_PART_MULTIPLE = 1;
    public static final double MAX_REAL_PART_MULTIPLE = 100;
    public static final double DEFAULT_REAL_PART_MULTIPLE = DesiredPoles.DEFAULT_REAL_PART_MULTIPLE;
    public static final double MAX_POLE_MAGNITUDE = 1e6;
    public static final double MIN_UNDERSHOOT_PERCENT = 0.1;
    public static final double MAX_UNDERSHOOT_PERCENT = 1000;
    public static final double DEFAULT_MAX_UNDERSHOOT_PERCENT = 10;

    private HighOrderLimits() {}
}
