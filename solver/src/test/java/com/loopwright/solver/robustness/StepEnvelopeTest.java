package com.loopwright.solver.robustness;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.spec.NormalizedStepResponse;
import org.junit.jupiter.api.Test;

class StepEnvelopeTest {

    private static final CanonicalPlant AXIS = new CanonicalPlant(0, 0.48, 400, 400);
    // The indexing-axis design's gains (README example): k1 = kr = 1.5723, k2 = 0.0992069.
    private static final FeedbackGains GAINS =
            new FeedbackGains(1.572298492880701, 0.09920692688762654, 1.572298492880701);

    /**
     * With a0 = 0 and only b varying, each parameter set is a second-order loop with wn^2 = b k1,
     * 2 zeta wn = a1 + b k2 and unit DC gain, so its step is the analytic response (source: the standard
     * second-order step response, any control textbook). Without interior samples the band is exactly the
     * pointwise min/max over the nominal plant and the two corners.
     */
    @Test
    void cornersOnlyBandIsTheEnvelopeOfTheAnalyticCornerResponses() {
        ParameterBox box = new ParameterBox(0, 0, 0.48, 0.48, 320, 480, 400, 400);
        StepEnvelope.Band band = new StepEnvelope().sweep(box, AXIS, GAINS, 1, 0.45, 600, 0, 1);
        assertEquals(2, band.drawnCases());
        assertEquals(0, band.unstableCases());
        double[] t = band.timeSeconds();
        for (int k = 0; k < t.length; k++) {
            double lo = Double.POSITIVE_INFINITY;
            double hi = Double.NEGATIVE_INFINITY;
            for (double b : new double[] {320, 400, 480}) {
                double wn = Math.sqrt(b * GAINS.positionGain());
                double zeta = (0.48 + b * GAINS.velocityGain()) / (2 * wn);
                double y = new NormalizedStepResponse(zeta).at(wn * t[k]);
                lo = Math.min(lo, y);
                hi = Math.max(hi, y);
            }
            assertEquals(lo, band.lowerX1()[k], 1e-9, "t=" + t[k]);
            assertEquals(hi, band.upperX1()[k], 1e-9, "t=" + t[k]);
        }
    }

    @Test
    void interiorSamplesStayInsideTheBandAndAreReproducible() {
        ParameterBox box = new ParameterBox(0, 0, 0.3, 0.6, 320, 480, 400, 400);
        StepEnvelope envelope = new StepEnvelope();
        StepEnvelope.Band corners = envelope.sweep(box, AXIS, GAINS, 1, 0.45, 300, 0, 3);
        StepEnvelope.Band sampled = envelope.sweep(box, AXIS, GAINS, 1, 0.45, 300, 50, 3);
        assertEquals(54, sampled.drawnCases());
        for (int k = 0; k < 300; k++) {
            assertTrue(sampled.lowerX1()[k] <= corners.lowerX1()[k] + 1e-15);
            assertTrue(sampled.upperX1()[k] >= corners.upperX1()[k] - 1e-15);
            assertTrue(
                    sampled.lowerX1()[k] <= sampled.nominalX1()[k] && sampled.nominalX1()[k] <= sampled.upperX1()[k]);
        }
        assertArrayEquals(
                sampled.upperX1(),
                envelope.sweep(box, AXIS, GAINS, 1, 0.45, 300, 50, 3).upperX1());
    }

    // Hurwitz test of the 2x2 companion matrix: a0 + b k1 > 0 and a1 + b k2 > 0 (any linear systems text).
    @Test
    void unstableParameterSetsAreCountedAndAllUnstableIsAnError() {
        ParameterBox partly = new ParameterBox(-800, 0, 0.48, 0.48, 400, 400, 400, 400);
        StepEnvelope.Band band = new StepEnvelope().sweep(partly, AXIS, GAINS, 1, 0.45, 300, 0, 1);
        assertEquals(1, band.unstableCases());
        assertEquals(1, band.drawnCases());
        ParameterBox all = new ParameterBox(-2000, -1000, 0.48, 0.48, 400, 400, 400, 400);
        assertThrows(UnstableLoopException.class, () -> new StepEnvelope().sweep(all, AXIS, GAINS, 1, 0.45, 300, 0, 1));
    }
}
