package com.loopwright.bench;

import com.loopwright.solver.design.ClosedFormDesign;
import com.loopwright.solver.design.ClosedFormDesigner;
import com.loopwright.solver.design.GammaChoice;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.spec.DesignSpec;
import com.loopwright.solver.spec.SpecInverter;
import com.loopwright.solver.spec.TargetDynamics;
import com.loopwright.solver.spec.TimeSpec;
import java.nio.charset.StandardCharsets;

/**
 * The workload every benchmark shares: the README's packaging-line indexing axis (a0 = 0, a1 = 0.48 1/s,
 * b = d = 400), settling to 2% in 0.15 s with at most 1.5% overshoot, default gamma margin 1.2.
 */
public final class Scenarios {

    /** The README request body, byte for byte the one the service receives. */
    public static final String INDEXING_AXIS_REQUEST =
            "{\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":400,\"d\":400},"
                    + "\"spec\":{\"settlingTime\":0.15,\"overshootPercent\":1.5}}";

    /** Settling time of the indexing axis spec [s]. */
    public static final double SETTLING_TIME_SECONDS = 0.15;

    private Scenarios() {}

    public static CanonicalPlant indexingAxisPlant() {
        return new CanonicalPlant(0, 0.48, 400, 400);
    }

    public static DesignSpec indexingAxisSpec() {
        return new DesignSpec(0.015, new TimeSpec.SettlingTime(SETTLING_TIME_SECONDS, 0.02));
    }

    /** Same overshoot, 10-90% rise time 0.1 s (the rise-time branch of the inversion). */
    public static DesignSpec indexingAxisRiseSpec() {
        return new DesignSpec(0.015, new TimeSpec.RiseTime(0.1));
    }

    public static TargetDynamics indexingAxisTarget() {
        return new SpecInverter().invert(indexingAxisSpec()).target();
    }

    public static ClosedFormDesign indexingAxisDesign() {
        return new ClosedFormDesigner()
                .design(
                        indexingAxisPlant(),
                        indexingAxisTarget(),
                        new GammaChoice.MarginOverMinimum(GammaChoice.MarginOverMinimum.DEFAULT_FACTOR));
    }

    public static byte[] indexingAxisRequestBytes() {
        return INDEXING_AXIS_REQUEST.getBytes(StandardCharsets.UTF_8);
    }
}
