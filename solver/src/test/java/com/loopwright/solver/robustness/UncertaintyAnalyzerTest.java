package com.loopwright.solver.robustness;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.plant.CanonicalPlant;
import org.junit.jupiter.api.Test;

class UncertaintyAnalyzerTest {

    private final UncertaintyAnalyzer analyzer = new UncertaintyAnalyzer();
    private static final AcceptanceLimits LIMITS = new AcceptanceLimits(0.165, null, 1.65, 0.02);

    /** Inertia -5%..+5% (b and d scale with 1/J), friction a1 +-20%, a small spring a0 in [0, 30]. */
    private static ParameterBox box() {
        CanonicalPlant p = IndexingAxis.PLANT;
        return new ParameterBox(
                0, 30, 0.8 * p.a1(), 1.2 * p.a1(), p.b() / 1.05, p.b() / 0.95, p.d() / 1.05, p.d() / 0.95);
    }

    @Test
    void cornersContainTheAnalyticWorstOvershoot() {
        // With the gains fixed the loop is s^2 + (a1 + b k2) s + (a0 + b k1): zeta = (a1 + b k2)/(2 sqrt(a0 + b k1)).
        // zeta falls with a0, rises with a1, and d zeta/db has the sign of k2 a0 + b k1 k2/2 - a1 k1/2 > 0 here,
        // so the least damped case is (a0 max, a1 min, b min), and its overshoot is
        // exp(-pi zeta / sqrt(1 - zeta^2)) (any control textbook's second-order step response).
        UncertaintyReport report =
                analyzer.analyze(box(), IndexingAxis.GAINS, 1, LIMITS, IndexingAxis.performanceOutput(), 200, 11);
        assertEquals(16, report.cornerCount());
        CanonicalPlant worst = report.overshootPercent().worstAt();
        ParameterBox b = box();
        assertEquals(b.a0Max(), worst.a0(), 0);
        assertEquals(b.a1Min(), worst.a1(), 0);
        assertEquals(b.bMin(), worst.b(), 0);
        FeedbackGains g = IndexingAxis.GAINS;
        double zeta = (worst.a1() + worst.b() * g.velocityGain())
                / (2 * Math.sqrt(worst.a0() + worst.b() * g.positionGain()));
        double overshoot = 100 * Math.exp(-Math.PI * zeta / Math.sqrt(1 - zeta * zeta));
        // the loop has no zero (reference enters as b kr r), so the textbook formula is exact
        assertEquals(overshoot, report.overshootPercent().max(), 1e-6);
        assertTrue(report.overshootPercent().min() <= report.overshootPercent().median());
        assertTrue(
                report.overshootPercent().median() <= report.overshootPercent().max());
    }

    @Test
    void monteCarloWithTheSameSeedIsBitForBitReproducible() {
        UncertaintyReport first =
                analyzer.analyze(box(), IndexingAxis.GAINS, 1, LIMITS, IndexingAxis.performanceOutput(), 60, 2024);
        UncertaintyReport second =
                analyzer.analyze(box(), IndexingAxis.GAINS, 1, LIMITS, IndexingAxis.performanceOutput(), 60, 2024);
        UncertaintyReport other =
                analyzer.analyze(box(), IndexingAxis.GAINS, 1, LIMITS, IndexingAxis.performanceOutput(), 60, 2025);
        // records compare doubles by their bits (Double.compare), so equals is bit-for-bit
        assertEquals(first, second);
        assertEquals(
                Double.doubleToRawLongBits(first.settlingTime().median()),
                Double.doubleToRawLongBits(second.settlingTime().median()));
        assertNotEquals(first.settlingTime().median(), other.settlingTime().median());
    }

    @Test
    void fractionAndWorstCaseAreConsistent() {
        UncertaintyReport report =
                analyzer.analyze(box(), IndexingAxis.GAINS, 1, LIMITS, IndexingAxis.performanceOutput(), 100, 5);
        assertTrue(
                report.meetingFraction() > 0 && report.meetingFraction() < 1,
                "the box straddles the limits: " + report.meetingFraction());
        assertTrue(!report.worstCase().meetsSpec());
        assertEquals(0, report.unstableCount());
        // an unstable corner is counted and is the worst case: a0 = -100 makes a0 + b k1 < 0
        UncertaintyReport unstable = analyzer.analyze(
                new ParameterBox(-1000, 0, 0.48, 0.48, 400, 400, 400, 400),
                IndexingAxis.GAINS,
                1,
                LIMITS,
                IndexingAxis.performanceOutput(),
                0,
                1);
        assertEquals(1, unstable.unstableCount());
        assertTrue(!unstable.worstCase().stable());
    }
}
