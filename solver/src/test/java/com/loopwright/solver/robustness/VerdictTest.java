package com.loopwright.solver.robustness;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.solver.design.GridMetrics;
import org.junit.jupiter.api.Test;

/** The three outcomes of a judged step, as the verification reported them before they had a type of their own. */
class VerdictTest {

    private static final AcceptanceLimits NONE = new AcceptanceLimits(null, null, null, 0.02);
    private static final AcceptanceLimits OVERSHOOT_5 = new AcceptanceLimits(null, null, 5.0, 0.02);

    @Test
    void stepsAreJudgedOnlyAgainstGivenLimits() {
        GridMetrics calm = new GridMetrics(0.1, 0.3, 2.0, 1.0);
        GridMetrics wild = new GridMetrics(0.1, 0.3, 20.0, 1.0);
        assertEquals(Verdict.NOT_JUDGED, Verdict.ofStep(NONE, calm));
        assertEquals(Verdict.MET, Verdict.ofStep(OVERSHOOT_5, calm));
        assertEquals(Verdict.NOT_MET, Verdict.ofStep(OVERSHOOT_5, wild));
    }

    /** A diverged simulation has no metrics: it fails every given limit and is not judged without limits. */
    @Test
    void aDivergedStepFailsOnlyWhenSomethingIsJudged() {
        assertEquals(Verdict.NOT_MET, Verdict.ofStep(OVERSHOOT_5, null));
        assertEquals(Verdict.NOT_JUDGED, Verdict.ofStep(NONE, null));
        assertTrue(Verdict.NOT_MET.failed());
        assertFalse(Verdict.NOT_JUDGED.failed());
        assertFalse(Verdict.MET.failed());
    }
}
