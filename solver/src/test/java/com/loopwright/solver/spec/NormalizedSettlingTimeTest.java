package com.loopwright.solver.spec;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class NormalizedSettlingTimeTest {

    /**
     * Independent route: sample the analytic response on a fine grid far past T and find the last sample
     * outside the band by brute force. source: the definition of settling time (last exit from the band).
     */
    private static double bruteForceSettling(double zeta, double band, double step) {
        NormalizedStepResponse y = new NormalizedStepResponse(zeta);
        // Past the envelope bound the error cannot leave the band: e^(-zeta tau)/s <= band for zeta < 1, and the
        // slow real pole zeta - sqrt(zeta^2 - 1) governs an overdamped loop (any control textbook).
        double slowRate = zeta < 1 ? zeta : zeta - Math.sqrt(zeta * zeta - 1);
        double spread = zeta < 1 ? Math.sqrt(1 - zeta * zeta) : 0.05;
        double horizon = 1.2 * Math.log(1 / (band * spread)) / slowRate + 1;
        double lastOutside = 0;
        for (double tau = 0; tau <= horizon; tau += step) {
            if (Math.abs(y.at(tau) - 1) > band) {
                lastOutside = tau;
            }
        }
        return lastOutside;
    }

    @Test
    void agreesWithBruteForceLastExitOverDampingAndBand() {
        double step = 1e-4;
        for (double band : new double[] {0.02, 0.05, 0.01}) {
            for (double zeta = 0.1; zeta < 1.6; zeta += 0.0371) {
                double exact = NormalizedSettlingTime.of(zeta, band);
                double brute = bruteForceSettling(zeta, band, step);
                assertEquals(brute, exact, 1.5 * step, "zeta=" + zeta + " band=" + band);
            }
        }
    }

    // source: definition; the error magnitude equals the band exactly at the last exit.
    @Test
    void errorSitsOnTheBandEdgeAtTheSettlingTime() {
        for (double zeta = 0.05; zeta < 2; zeta += 0.05) {
            double tau = NormalizedSettlingTime.of(zeta, 0.02);
            assertEquals(0.02, Math.abs(new NormalizedStepResponse(zeta).at(tau) - 1), 1e-12);
        }
    }

    // source: handbook rule ts ~ 4/(zeta wn) is off by up to about 30% for common specs (project method notes);
    // here it is checked only as a loose sanity bound over zeta in [0.3, 0.9].
    @Test
    void handbookRuleIsARoughEstimateOnly() {
        double worst = 0;
        for (double zeta = 0.3; zeta <= 0.9; zeta += 0.01) {
            double exact = NormalizedSettlingTime.of(zeta, 0.02);
            worst = Math.max(worst, Math.abs(4 / zeta - exact) / exact);
        }
        assertTrue(worst > 0.05 && worst < 0.45, "worst relative error of the handbook rule " + worst);
    }

    // source: T(zeta) jumps where a peak of |y - 1| just touches the band: at zeta where OS = band the first
    // overshoot peak leaves or stops leaving the band, removing a whole half period of settling time.
    @Test
    void jumpsWhereTheFirstPeakTouchesTheBand() {
        double touch = OvershootDamping.dampingRatio(0.02);
        double below = NormalizedSettlingTime.of(touch - 1e-6, 0.02);
        double above = NormalizedSettlingTime.of(touch + 1e-6, 0.02);
        assertTrue(below - above > 1.0, "jump " + (below - above));
        var justBelow = NormalizedSettlingTime.analyse(touch - 1e-6, 0.02);
        assertEquals(1, justBelow.peaksOutsideBand());
        assertTrue(justBelow.bandTouchLogDistance() < 1e-4);
    }
}
