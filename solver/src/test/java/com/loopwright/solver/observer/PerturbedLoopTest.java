package com.loopwright.solver.observer;

import static org.junit.jupiter.api.Assertions.assertEquals;

import com.loopwright.solver.design.TrackingLaw;
import com.loopwright.solver.integral.IntegralAugmentation;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.plant.CompanionPlant;
import org.ejml.data.DMatrixRMaj;
import org.junit.jupiter.api.Test;

/**
 * The loop of a law designed for one plant running on another (the robust loop search's cases): the plant and
 * integrator rows follow the actual plant, the observer rows the model. Expected matrices written out by hand from
 * x1' = x2, x2' = -a0 x1 - a1 x2 + b u, xi' = r - x1, u = kr r + ki xi - k1 x1_hat - k2 x2_hat and the observer
 * x_hat' = A_m x_hat + B2_m u + L (x1 - x1_hat) (common practice: a certainty-equivalence observer).
 */
class PerturbedLoopTest {

    private static final CanonicalPlant MODEL = new CanonicalPlant(0, 0.48, 400, 400);
    private static final CanonicalPlant ACTUAL = new CanonicalPlant(0.5, 0.576, 266.7, 266.7);
    private static final TrackingLaw LAW = new TrackingLaw(new double[] {3.0, 0.2}, 40.0, 1.5, -80.0);
    private static final double[] L = {120, 3600};
    private static final double[] ROW = {1, 0};
    private static final double[] WEIGHTS = {1, 1, 1};

    @Test
    void theSamePlantGivesTheLoopOfTheDesign() {
        CompanionPlant p = IntegralAugmentation.companionOf(MODEL);
        LoopSystem same = OutputFeedbackLoop.closedOn(p, p, ROW, LAW, L, WEIGHTS);
        LoopSystem closed = OutputFeedbackLoop.closed(p, ROW, LAW, L, WEIGHTS);
        assertEquals(0, maxDifference(same.a(), closed.a()));
        assertEquals(0, maxDifference(same.reference(), closed.reference()));
    }

    @Test
    void fullStateIntegralLoopOnThePerturbedPlantIsWrittenOutByHand() {
        LoopSystem loop = OutputFeedbackLoop.closedOn(
                IntegralAugmentation.companionOf(ACTUAL),
                IntegralAugmentation.companionOf(MODEL),
                ROW,
                LAW,
                null,
                WEIGHTS);
        double b = ACTUAL.b();
        DMatrixRMaj expected = new DMatrixRMaj(new double[][] {
            {0, 1, 0}, {-ACTUAL.a0() - b * 3.0, -ACTUAL.a1() - b * 0.2, b * 40.0}, {-1, 0, 0}
        });
        assertEquals(0, maxDifference(expected, loop.a()), 1e-12);
        assertEquals(b * 1.5, loop.reference().get(1, 0), 1e-12);
        assertEquals(1, loop.reference().get(2, 0), 0);
    }

    @Test
    void observerRowsComputeWithTheModel() {
        LoopSystem loop = OutputFeedbackLoop.closedOn(
                IntegralAugmentation.companionOf(ACTUAL),
                IntegralAugmentation.companionOf(MODEL),
                ROW,
                LAW,
                L,
                WEIGHTS);
        // states [x1, x2, xi, x1_hat, x2_hat]
        DMatrixRMaj a = loop.a();
        double bm = MODEL.b();
        double ba = ACTUAL.b();
        // plant velocity row: the actual plant under u = kr r + ki xi - K x_hat
        assertEquals(-ACTUAL.a0(), a.get(1, 0), 1e-12);
        assertEquals(-ACTUAL.a1(), a.get(1, 1), 1e-12);
        assertEquals(ba * 40.0, a.get(1, 2), 1e-9);
        assertEquals(-ba * 3.0, a.get(1, 3), 1e-9);
        assertEquals(-ba * 0.2, a.get(1, 4), 1e-9);
        // observer velocity row: the model's A and b, L on the measured x1
        assertEquals(L[1], a.get(4, 0), 1e-12);
        assertEquals(bm * 40.0, a.get(4, 2), 1e-9);
        assertEquals(-MODEL.a0() - bm * 3.0 - L[1], a.get(4, 3), 1e-9);
        assertEquals(-MODEL.a1() - bm * 0.2, a.get(4, 4), 1e-9);
        assertEquals(bm * 1.5, loop.reference().get(4, 0), 1e-9);
        assertEquals(ba * 1.5, loop.reference().get(1, 0), 1e-9);
    }

    private static double maxDifference(DMatrixRMaj x, DMatrixRMaj y) {
        double largest = 0;
        for (int i = 0; i < x.getNumElements(); i++) {
            largest = Math.max(largest, Math.abs(x.get(i) - y.get(i)));
        }
        return largest;
    }
}
