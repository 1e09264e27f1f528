package com.loopwright.bench;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.api.endpoint.Reply;
import com.loopwright.api.json.StrictJson;
import com.loopwright.solver.design.HInfinityNorm;
import com.loopwright.solver.norm.HInfinityNormCalculator;
import com.loopwright.solver.spec.TargetDynamics;
import org.junit.jupiter.api.Test;

/**
 * The benchmarks time real work only if their inputs are the intended ones and both sides of each comparison
 * reach the stated accuracy. These checks run in mvn verify; the benchmarks themselves do not.
 */
class BenchmarkFixturesTest {

    @Test
    void scenarioIsTheReadmeIndexingAxis() {
        // source: the README worked example (dampingRatio 0.80075, naturalFrequency 25.078 rad/s).
        TargetDynamics target = Scenarios.indexingAxisTarget();
        assertEquals(0.80075, target.dampingRatio(), 5e-6);
        assertEquals(25.078, target.naturalFrequencyRadPerSec(), 5e-4);
    }

    @Test
    void bothSimulatorsMatchTheAnalyticStepAndZeroOrderHoldIsNotTheLessAccurate() {
        // source: analytic underdamped second-order step response (see StepAccuracy).
        TargetDynamics target = Scenarios.indexingAxisTarget();
        StepSimulationBenchmark benchmark = new StepSimulationBenchmark();
        benchmark.setUp();
        double zohError =
                StepAccuracy.maxOutputError(target, benchmark.zeroOrderHold().output());
        double dormandPrinceError = StepAccuracy.maxOutputError(target, benchmark.dormandPrince());
        assertEquals(StepAccuracy.SAMPLES, benchmark.dormandPrince().length);
        assertTrue(zohError < 1e-12, "ZOH error " + zohError);
        assertTrue(dormandPrinceError < 1e-10, "Dormand-Prince error " + dormandPrinceError);
        // The speed comparison is conservative: the reference is given the easier job.
        assertTrue(zohError <= dormandPrinceError, zohError + " vs " + dormandPrinceError);
    }

    @Test
    void stepMetricsBenchmarkMeasuresTheSpecBack() {
        // source: the README indexing-axis spec (2% settling in 0.15 s, 1.5% overshoot); the spec inversion is
        // exact, so the measured response of the target loop must return both to rounding.
        StepMetricsBenchmark benchmark = new StepMetricsBenchmark();
        benchmark.setUp();
        var metrics = benchmark.measure();
        assertEquals(Scenarios.SETTLING_TIME_SECONDS, metrics.settlingTimeSeconds(), 1e-12);
        assertEquals(1.5, metrics.overshootPercent(), 1e-9);
        assertEquals(StepAccuracy.STEP_SIZE, metrics.finalValue(), 1e-14);
    }

    @Test
    void bothRiccatiSolversReachRoundoffOnTheBenchmarkProblems() {
        // reference: Hipparchus RiccatiEquationSolverImpl on the same (A, B, Q, Rc).
        for (int n : new int[] {2, 4, 8}) {
            RiccatiBenchmark.RiccatiComparison comparison =
                    RiccatiBenchmark.RiccatiComparison.of(RiccatiCase.ofOrder(n));
            assertTrue(comparison.relativeDifference() < 1e-10, "n = " + n + ": " + comparison);
            assertTrue(comparison.ourResidual() < 1e-14, "n = " + n + ": " + comparison);
            assertTrue(comparison.referenceResidual() < 1e-14, "n = " + n + ": " + comparison);
        }
    }

    @Test
    void bothNormRoutesAgreeOnTheBenchmarkLoop() {
        // independent routes: Hamiltonian level-set iteration (a certified upper end at most a factor
        // 1 + RELATIVE_TOLERANCE above the norm, and the gain attained at its peak frequency below it) and the
        // exact two-state peak gain
        HInfinityNormBenchmark benchmark = new HInfinityNormBenchmark();
        HInfinityNorm iterated = benchmark.closedLoopNorm();
        double exact = benchmark.twoStatePeakGain().value();
        assertTrue(
                exact <= iterated.value() * (1 + 1e-14)
                        && exact >= iterated.attainedGain() * (1 - 1e-14)
                        && iterated.value() <= exact * (1 + HInfinityNormCalculator.RELATIVE_TOLERANCE + 1e-14),
                exact + " vs " + iterated);
    }

    @Test
    void exchangeBenchmarkRequestProducesACertifiedDesign() throws Exception {
        ObjectMapper mapper = StrictJson.newMapper();
        Reply outcome = new DesignBenchmark().jsonEncode();
        assertEquals(200, outcome.status());
        JsonNode body = mapper.readTree(outcome.body());
        assertTrue(body.at("/verification/certified").asBoolean(), body.toString());
        assertTrue(outcome.body().length > 1000);
    }

    @Test
    void issue18WorkloadsDesignAndTheMonteCarloCoversTheBox() {
        // the benchmark times real work only if the requests design (a 422 would be a cheap early exit)
        RobustnessBenchmark benchmark = new RobustnessBenchmark();
        assertTrue(benchmark.robustDesignJson().ok());
        assertTrue(benchmark.order8SpecMatchedJson().ok());
        assertEquals(16, benchmark.monteCarlo2000().cornerCount());
        assertEquals(2000, benchmark.monteCarlo2000().sampleCount());
        assertEquals(1.0, benchmark.robustDesign200().uncertainty().meetingFraction());
    }
}
