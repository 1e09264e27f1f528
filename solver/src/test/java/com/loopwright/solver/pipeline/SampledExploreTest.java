package com.loopwright.solver.pipeline;

import com.loopwright.solver.design.GammaChoice;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.robustness.ParameterBox;
import com.loopwright.solver.spec.DesignSpec;
import com.loopwright.solver.spec.TimeSpec;
import org.junit.jupiter.api.Test;

class SampledExploreTest {
    private static final CanonicalPlant AXIS = new CanonicalPlant(0, 0.48, 400, 400);
    private static final DesignSpec SPEC = new DesignSpec(0.015, new TimeSpec.SettlingTime(0.15, 0.02));
    private static final ParameterBox BOX =
            new ParameterBox(0, 0, 0.8 * 0.48, 1.2 * 0.48, 400 / 1.5, 400 / 0.8, 400 / 1.5, 400 / 0.8);

    @Test
    void explore() {
        RobustDesignPipeline p = new RobustDesignPipeline();
        GammaChoice g = new GammaChoice.MarginOverMinimum(GammaChoice.MarginOverMinimum.DEFAULT_FACTOR);
        for (Double ts : new Double[] {null, 0.001, 0.004, 0.008, 0.012, 0.02}) {
            for (int samples : new int[] {20, 200}) {
                long t0 = System.nanoTime();
                try {
                    RobustDesignReport r = p.design(AXIS, SPEC, g, 1, 0.02, BOX, samples, 7, null, ts);
                    System.out.println("T=" + ts + " n=" + samples + " target="
                            + r.report().design().target()
                            + " evals=" + r.search().evaluations() + " cases="
                            + r.search().caseEvaluations()
                            + " worst=" + r.worstMetrics() + " ms=" + (System.nanoTime() - t0) / 1e6);
                } catch (SolverFailure e) {
                    System.out.println("T=" + ts + " n=" + samples + " FAIL " + e.kind() + " " + e.subject() + " "
                            + e.getMessage()
                            + (e.infeasibility() == null
                                    ? ""
                                    : " " + e.infeasibility().proposals()) + " ms=" + (System.nanoTime() - t0) / 1e6);
                }
            }
        }
        for (Double ts : new Double[] {null, 0.002, 0.008}) {
            long t0 = System.nanoTime();
            try {
                RobustDesignReport r = p.designLoop(
                        AXIS,
                        SPEC,
                        g,
                        new LoopStructure(true, 4, LoopStructure.Measurement.FULL_STATE, null),
                        1,
                        1,
                        0.02,
                        BOX,
                        40,
                        7,
                        null,
                        ts);
                System.out.println("LOOP T=" + ts + " target=" + r.loop().target() + " evals="
                        + r.search().evaluations() + " cases=" + r.search().caseEvaluations() + " worst="
                        + r.worstMetrics() + " ms=" + (System.nanoTime() - t0) / 1e6);
            } catch (SolverFailure e) {
                System.out.println("LOOP T=" + ts + " FAIL " + e.kind() + " " + e.getMessage() + " ms="
                        + (System.nanoTime() - t0) / 1e6);
            }
        }
    }
}
