package com.loopwright.solver.robustness;

import com.loopwright.solver.design.ClosedFormDesign;
import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.design.GammaChoice;
import com.loopwright.solver.pipeline.LoopDesigner;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.spec.DesignSpec;
import com.loopwright.solver.spec.TimeSpec;
import org.ejml.data.DMatrixRMaj;

/** The README's packaging-line indexing axis (0.15 s settling, 1.5% overshoot) designed by the pipeline. */
public final class IndexingAxis {

    public static final CanonicalPlant PLANT = new CanonicalPlant(0, 0.48, 400, 400);
    public static final ClosedFormDesign DESIGN = new LoopDesigner()
            .design(
                    PLANT,
                    new DesignSpec(0.015, new TimeSpec.SettlingTime(0.15, 0.02)),
                    new GammaChoice.MarginOverMinimum(1.2),
                    1,
                    0.02)
            .design();
    public static final FeedbackGains GAINS =
            new FeedbackGains(DESIGN.positionGain(), DESIGN.velocityGain(), DESIGN.referenceGain());

    private IndexingAxis() {}

    /** z = [rho1 x1, rho2 x2, u] with u = -K x. */
    public static DMatrixRMaj performanceOutput() {
        return new DMatrixRMaj(
                new double[][] {{DESIGN.rho1(), 0}, {0, DESIGN.rho2()}, {-DESIGN.positionGain(), -DESIGN.velocityGain()}
                });
    }
}
