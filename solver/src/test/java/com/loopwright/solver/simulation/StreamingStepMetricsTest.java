package com.loopwright.solver.simulation;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import com.loopwright.solver.design.StepMetrics;
import com.loopwright.solver.spec.DesignSpec;
import com.loopwright.solver.spec.SpecInverter;
import com.loopwright.solver.spec.TargetDynamics;
import com.loopwright.solver.spec.TimeSpec;
import java.lang.management.ManagementFactory;
import java.util.Random;
import java.util.function.BiFunction;
import java.util.function.Supplier;
import org.ejml.data.Complex_F64;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.interfaces.decomposition.EigenDecomposition_F64;
import org.junit.jupiter.api.Test;

/**
 * The streaming step metrics against the previous array-based implementation
 * ({@link ArrayStepMetricsOracle}, the old code kept in the test tree): the same samples, the
 * same x_k, Brent brackets and iterates and candidate order must give the same bits, and the
 * same exceptions with the same messages.
 */
class StreamingStepMetricsTest {

    private static final double BAND = 0.02;

    private final StepResponseMetrics metrics = new StepResponseMetrics();
    private final ArrayStepMetricsOracle oracle = new ArrayStepMetricsOracle();

    /** Counts of the outcomes compared. */
    private int measured;

    private int refused;

    @Test
    void randomTwoStateLoopsGiveTheArrayImplementationsBitsExactly() {
        // source: the previous implementation (ArrayStepMetricsOracle) as the oracle. 300 loops in
        // four kinds: Gaussian 2-state loops over three decades of speed; lightly damped
        // companion loops (zeta 0.005 .. 0.15: tens of peaks of z and of u, many maximum and
        // band-excursion candidates), with u the state feedback or the velocity; companion loops
        // within 1e-2 .. 1e-10 of critical damping; and loops whose m-th extremum (m = 1 .. 4,
        // m = 1 the overshoot peak) sits within 1e-1 .. 1e-12 relative of the band edge, from
        // |z(t_m) - 1| = exp(-m pi zeta / sqrt(1 - zeta^2)) (textbook second-order extrema).
        // Random grids put events anywhere between samples; some horizons are too short.
        Random random = new Random(8008L);
        for (int c = 0; c < 300; c++) {
            LinearLoop loop;
            double r = 1.0;
            double wn = Math.pow(10, 3 * random.nextDouble() - 1);
            switch (c % 4) {
                case 0 -> {
                    LinearLoop unit = SecondOrderLoops.randomStableLoop(9000L + c, 2, 0.02 + random.nextDouble());
                    DMatrixRMaj a = unit.a();
                    CommonOps_DDRM.scale(wn, a);
                    loop = new LinearLoop(a, unit.bRef(), unit.cOut(), unit.cControl(), unit.dControl());
                    r = random.nextGaussian();
                }
                case 1 -> {
                    double zeta = 0.005 + 0.145 * random.nextDouble();
                    loop = random.nextBoolean()
                            ? SecondOrderLoops.stateFeedbackLoop(zeta, wn)
                            : SecondOrderLoops.velocityAsControl(zeta, wn);
                    r = random.nextBoolean() ? 1.0 : -2.5 * random.nextDouble();
                }
                case 2 -> {
                    double offset = Math.pow(10, -2 - 8 * random.nextDouble());
                    loop = SecondOrderLoops.stateFeedbackLoop(1.0 + (random.nextBoolean() ? offset : -offset), wn);
                }
                default -> {
                    int m = 1 + random.nextInt(4);
                    double relative = (random.nextBoolean() ? 1 : -1) * Math.pow(10, -1 - 11 * random.nextDouble());
                    double d = -Math.log(BAND * (1 + relative)) / m;
                    double zeta = d / Math.sqrt(Math.PI * Math.PI + d * d);
                    loop = SecondOrderLoops.stateFeedbackLoop(zeta, wn);
                }
            }
            compare("2-state loop " + c, loop, r, random);
        }
        assertTrue(measured >= 250, measured + " of 300 measured");
        assertTrue(refused >= 5, refused + " refusals compared");
    }

    @Test
    void randomThreeAndFourStateLoopsGiveTheArrayImplementationsBitsExactly() {
        // source: the previous implementation (ArrayStepMetricsOracle) as the oracle, on 40 Gaussian
        // 3- and 4-state loops and 10 loops of a real mode under a lightly damped oscillation
        // (x1' = -p x1 + p r, (x2, x3)' = [[-s, w], [-w, -s]] (x2, x3) + (1, 1) r, y = x1 + g x2,
        // u = x3): a ripple with many peak candidates on z and u.
        Random random = new Random(8009L);
        for (int c = 0; c < 50; c++) {
            LinearLoop loop;
            if (c < 40) {
                loop = SecondOrderLoops.randomStableLoop(9500L + c, 3 + c % 2, 0.05 + random.nextDouble());
            } else {
                double p = 1 + 5 * random.nextDouble();
                double s = 0.2 + 0.5 * random.nextDouble();
                double w = 20 + 80 * random.nextDouble();
                double g = 0.2 + random.nextDouble();
                loop = new LinearLoop(
                        new DMatrixRMaj(new double[][] {{-p, 0, 0}, {0, -s, w}, {0, -w, -s}}),
                        new DMatrixRMaj(new double[][] {{p}, {1}, {1}}),
                        new DMatrixRMaj(new double[][] {{1, g, 0}}),
                        new DMatrixRMaj(new double[][] {{0, 0, 1}}),
                        0.0);
            }
            compare(loop.stateDimension() + "-state loop " + c, loop, random.nextGaussian(), random);
        }
        assertTrue(measured >= 40, measured + " of 50 measured");
    }

    @Test
    void refusalsAreTheArrayImplementationsRefusals() {
        // source: the previous implementation (ArrayStepMetricsOracle): the same exception class and
        // message, in the same order of checks, for the simulator's refusals (a control that
        // overflows double precision, a subnormal horizon whose sample times repeat) and the
        // metrics' (output below 90% at the horizon, outside the band at the horizon, a grid too
        // coarse for the oscillation, a zero final value).
        LinearLoop loop = SecondOrderLoops.stateFeedbackLoop(0.5, 2.0);
        LinearLoop hugeControl = new LinearLoop(
                new DMatrixRMaj(new double[][] {{-1, 0}, {0, -2}}),
                new DMatrixRMaj(new double[][] {{1}, {1}}),
                new DMatrixRMaj(new double[][] {{1, 0}}),
                new DMatrixRMaj(new double[][] {{1e308, 1e308}}),
                0.0);
        LinearLoop hugeControl3 = new LinearLoop(
                new DMatrixRMaj(new double[][] {{-1, 0, 0}, {0, -2, 0}, {0, 0, -3}}),
                new DMatrixRMaj(new double[][] {{1}, {1}, {1}}),
                new DMatrixRMaj(new double[][] {{1, 0, 0}}),
                new DMatrixRMaj(new double[][] {{1e308, 1e308, 0}}),
                0.0);
        LinearLoop velocityOutput = new LinearLoop(
                loop.a(), loop.bRef(), new DMatrixRMaj(new double[][] {{0, 1}}), loop.cControl(), loop.dControl());
        assertSameOutcome(
                "control overflow",
                () -> metrics.measure(hugeControl, 10, 10, 1000, BAND),
                () -> oracle.measure(hugeControl, 10, 10, 1000, BAND));
        assertSameOutcome(
                "control overflow, 3 states",
                () -> metrics.measure(hugeControl3, 10, 10, 1000, BAND),
                () -> oracle.measure(hugeControl3, 10, 10, 1000, BAND));
        assertSameOutcome(
                "subnormal horizon",
                () -> metrics.measure(loop, 1, 3.5e-321, 1000, BAND),
                () -> oracle.measure(loop, 1, 3.5e-321, 1000, BAND));
        assertSameOutcome(
                "not risen",
                () -> metrics.measure(loop, 1, 0.5, 500, BAND),
                () -> oracle.measure(loop, 1, 0.5, 500, BAND));
        assertSameOutcome(
                "not settled",
                () -> metrics.measure(loop, 1, 2.0, 500, BAND),
                () -> oracle.measure(loop, 1, 2.0, 500, BAND));
        LinearLoop fast = SecondOrderLoops.stateFeedbackLoop(0.3, 200.0);
        assertSameOutcome(
                "coarse grid",
                () -> metrics.measure(fast, 1, 10, 10, BAND),
                () -> oracle.measure(fast, 1, 10, 10, BAND));
        assertSameOutcome(
                "zero final value",
                () -> metrics.measure(velocityOutput, 1, 10, 500, BAND),
                () -> oracle.measure(velocityOutput, 1, 10, 500, BAND));
        assertEquals(0, measured);
        assertEquals(7, refused);
    }

    @Test
    void failuresBetweenSamplesComeAfterTheSimulatorsChecks() {
        // source: the previous implementation (ArrayStepMetricsOracle), which sampled first and only
        // then built the propagation and refined: a propagation that cannot be built, or that
        // fails on its first use (during the streaming rise scan), must give that failure for a
        // loop that simulates cleanly, and the simulator's overflow message for one that does not.
        BiFunction<LinearLoop, Double, SubIntervalPropagator> unbuildable = (loop, r) -> {
            throw new IllegalStateException("propagation unavailable");
        };
        BiFunction<LinearLoop, Double, SubIntervalPropagator> failing = (loop, r) -> (state, offset, tau, target) -> {
            throw new IllegalStateException("propagation failed at tau = " + tau);
        };
        LinearLoop clean = SecondOrderLoops.stateFeedbackLoop(0.5, 2.0);
        LinearLoop hugeControl = new LinearLoop(
                new DMatrixRMaj(new double[][] {{-1, 0}, {0, -2}}),
                new DMatrixRMaj(new double[][] {{1}, {1}}),
                new DMatrixRMaj(new double[][] {{1, 0}}),
                new DMatrixRMaj(new double[][] {{1e308, 1e308}}),
                0.0);
        for (BiFunction<LinearLoop, Double, SubIntervalPropagator> propagators :
                java.util.List.of(unbuildable, failing)) {
            for (LinearLoop loop : new LinearLoop[] {clean, hugeControl}) {
                assertSameOutcome(
                        "propagation failure",
                        () -> metrics.measure(loop, 10, 10, 1000, BAND, propagators),
                        () -> oracle.measure(loop, 10, 10, 1000, BAND, propagators));
            }
        }
        assertEquals(4, refused);
    }

    @Test
    void measuringTheIndexingAxisAllocatesOnlyPerEventMemory() {
        // source: common practice; HotSpot's per-thread allocation counter
        // (com.sun.management.ThreadMXBean.getThreadAllocatedBytes) around 2000 calls on the
        // packaging-line indexing axis (2% settling in 0.15 s, 1.5% overshoot, the target loop on
        // the service's 2000-sample grid over three settling times). Recording the samples took
        // about 100 KB per call; the streaming scans keep only the previous sample and the event
        // candidates.
        if (!(ManagementFactory.getThreadMXBean() instanceof com.sun.management.ThreadMXBean threads)
                || !threads.isThreadAllocatedMemorySupported()) {
            return;
        }
        TargetDynamics target = new SpecInverter()
                .invert(new DesignSpec(0.015, new TimeSpec.SettlingTime(0.15, 0.02)))
                .target();
        LinearLoop loop = SecondOrderLoops.stateFeedbackLoop(target.dampingRatio(), target.naturalFrequencyRadPerSec());
        double horizonSeconds = 3 * 0.15;
        int samples = 2000;
        double sink = 0;
        for (int i = 0; i < 3000; i++) {
            sink += metrics.measure(loop, 1.0, horizonSeconds, samples, BAND).settlingTimeSeconds();
        }
        long thread = Thread.currentThread().getId();
        int calls = 2000;
        long before = threads.getThreadAllocatedBytes(thread);
        for (int i = 0; i < calls; i++) {
            sink += metrics.measure(loop, 1.0, horizonSeconds, samples, BAND).settlingTimeSeconds();
        }
        long perCall = (threads.getThreadAllocatedBytes(thread) - before) / calls;
        assertTrue(Double.isFinite(sink));
        assertTrue(perCall < 8 * 1024, perCall + " bytes per call");
    }

    /**
     * Both implementations on one loop, with a random grid and horizon, by the closed-form
     * propagation and (for some 2-state loops) the general zero-order hold.
     */
    private void compare(String label, LinearLoop loop, double r, Random random) {
        double[] spectrum = slowestDecayAndFastestOscillation(loop.a());
        double horizonSeconds =
                (random.nextInt(10) == 0 ? 0.5 + 2.5 * random.nextDouble() : 6 + 10 * random.nextDouble())
                        / spectrum[0];
        int needed = (int) Math.ceil(horizonSeconds * spectrum[1] / 1.5) + 2;
        int samples =
                Math.min(StepSimulator.MAX_SAMPLES, Math.max(needed, 100 + random.nextInt(3000)) + random.nextInt(50));
        String where = label + " (r " + r + ", horizon " + horizonSeconds + " s, " + samples + " samples)";
        assertSameOutcome(
                where,
                () -> metrics.measure(loop, r, horizonSeconds, samples, BAND),
                () -> oracle.measure(loop, r, horizonSeconds, samples, BAND));
        if (loop.stateDimension() == 2 && random.nextInt(4) == 0) {
            BiFunction<LinearLoop, Double, SubIntervalPropagator> hold = HoldPropagator::new;
            assertSameOutcome(
                    where + " by the hold",
                    () -> metrics.measure(loop, r, horizonSeconds, samples, BAND, hold),
                    () -> oracle.measure(loop, r, horizonSeconds, samples, BAND, hold));
        }
    }

    /** The same metrics bit for bit, or the same exception class and message. */
    private void assertSameOutcome(String label, Supplier<StepMetrics> streaming, Supplier<StepMetrics> array) {
        StepMetrics expected;
        try {
            expected = array.get();
        } catch (RuntimeException e) {
            try {
                StepMetrics unexpected = streaming.get();
                fail(label + ": the array implementation threw " + e + ", the streaming one gave " + unexpected);
            } catch (RuntimeException actual) {
                assertEquals(e.getClass(), actual.getClass(), label);
                assertEquals(e.getMessage(), actual.getMessage(), label);
            }
            refused++;
            return;
        }
        StepMetrics actual = streaming.get();
        double[] want = values(expected);
        double[] got = values(actual);
        for (int i = 0; i < want.length; i++) {
            assertEquals(
                    Double.doubleToRawLongBits(want[i]),
                    Double.doubleToRawLongBits(got[i]),
                    label + ", metric " + i + ": " + actual + " vs " + expected);
        }
        measured++;
    }

    private static double[] values(StepMetrics m) {
        return new double[] {
            m.riseTimeSeconds(),
            m.settlingTimeSeconds(),
            m.overshootPercent(),
            m.peakTimeSeconds(),
            m.steadyStateError(),
            m.peakControl(),
            m.finalValue(),
            m.undershootPercent()
        };
    }

    /** min |Re lambda(A)| and max |Im lambda(A)| by EJML's eigenvalues. */
    private static double[] slowestDecayAndFastestOscillation(DMatrixRMaj a) {
        EigenDecomposition_F64<DMatrixRMaj> eigen = DecompositionFactory_DDRM.eig(a.numRows, false, false);
        assertTrue(eigen.decompose(a.copy()));
        double slowest = Double.POSITIVE_INFINITY;
        double fastest = 0;
        for (int i = 0; i < eigen.getNumberOfEigenvalues(); i++) {
            Complex_F64 eigenvalue = eigen.getEigenvalue(i);
            slowest = Math.min(slowest, Math.abs(eigenvalue.real));
            fastest = Math.max(fastest, Math.abs(eigenvalue.imaginary));
        }
        return new double[] {slowest, fastest};
    }
}
