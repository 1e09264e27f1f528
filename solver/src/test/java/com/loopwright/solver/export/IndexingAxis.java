package com.loopwright.solver.export;

import com.loopwright.solver.design.GammaChoice;
import com.loopwright.solver.pipeline.DesignReport;
import com.loopwright.solver.pipeline.LoopDesigner;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.spec.DesignSpec;
import com.loopwright.solver.spec.TimeSpec;

/** The README's packaging-line indexing axis, designed once for the export tests. */
final class IndexingAxis {

    static final CanonicalPlant PLANT = new CanonicalPlant(0, 0.48, 400, 400);

    private IndexingAxis() {}

    static DesignReport report() {
        return new LoopDesigner()
                .design(
                        PLANT,
                        new DesignSpec(0.015, new TimeSpec.SettlingTime(0.15, 0.02)),
                        new GammaChoice.MarginOverMinimum(1.2),
                        1,
                        0.02);
    }
}
