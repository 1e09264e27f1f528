package com.loopwright.solver.verify;

import com.loopwright.solver.design.SpecCheck;
import com.loopwright.solver.design.StepMetrics;
import com.loopwright.solver.spec.DesignSpec;
import com.loopwright.solver.spec.TimeSpec;
import java.util.List;

/**
 * Compares simulated metrics with the requested specs. The design meets both specs with equality, so the
 * comparison allows for rounding only: 1e-6 relative on times, 1e-6 percentage points on overshoot.
 */
public final class SpecCompliance {

    static final double TIME_TOLERANCE = 1e-6;
    static final double OVERSHOOT_TOLERANCE_POINTS = 1e-6;

    public List<SpecCheck> check(DesignSpec spec, StepMetrics metrics) {
        double requestedOvershoot = 100 * spec.overshootFraction();
        SpecCheck overshoot = new SpecCheck(
                "overshootPercent",
                requestedOvershoot,
                metrics.overshootPercent(),
                metrics.overshootPercent() <= requestedOvershoot + OVERSHOOT_TOLERANCE_POINTS);
        TimeSpec timeSpec = spec.timeSpec();
        boolean settling = timeSpec instanceof TimeSpec.SettlingTime;
        double simulatedTime = settling ? metrics.settlingTimeSeconds() : metrics.riseTimeSeconds();
        SpecCheck time = new SpecCheck(
                settling ? "settlingTime" : "riseTime",
                timeSpec.seconds(),
                simulatedTime,
                simulatedTime <= timeSpec.seconds() * (1 + TIME_TOLERANCE));
        return List.of(overshoot, time);
    }
}
