package com.loopwright.bench;

import com.loopwright.api.design.DesignEndpoint;
import com.loopwright.api.endpoint.EndpointRunner;
import com.loopwright.api.endpoint.Reply;
import com.loopwright.api.highorder.HighOrderEndpoint;
import com.loopwright.api.json.StrictJson;
import com.loopwright.solver.design.ClosedFormDesign;
import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.design.GammaChoice;
import com.loopwright.solver.pipeline.RobustDesignPipeline;
import com.loopwright.solver.pipeline.RobustDesignReport;
import com.loopwright.solver.robustness.AcceptanceLimits;
import com.loopwright.solver.robustness.ParameterBox;
import com.loopwright.solver.robustness.UncertaintyAnalyzer;
import com.loopwright.solver.robustness.UncertaintyReport;
import java.nio.charset.StandardCharsets;
import java.util.concurrent.TimeUnit;
import org.ejml.data.DMatrixRMaj;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.State;

/**
 * The speed targets of issue 18 on the README indexing axis: the 2,000-sample Monte Carlo analysis of the design
 * (closed-form two-state metrics per case), the robust design over a 4-parameter box (a0 in [0, 30], friction
 * +-20%, inertia -20%..+50% so b and d in [266.7, 500]) with 200 samples, the same robust design as JSON bytes in
 * and out, and an order-8 spec-matched design as JSON bytes in and out.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
public class RobustnessBenchmark {

    /** a0 in [0, 30] 1/s^2, a1 +-20%, b and d from a load inertia of -20%..+50%. */
    public static final ParameterBox FOUR_PARAMETER_BOX =
            new ParameterBox(0, 30, 0.8 * 0.48, 1.2 * 0.48, 400 / 1.5, 400 / 0.8, 400 / 1.5, 400 / 0.8);

    /** The same box and 200 samples as a design request with a robust member. */
    public static final String ROBUST_REQUEST = "{\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":400,"
            + "\"d\":400},\"spec\":{\"settlingTime\":0.15,\"overshootPercent\":1.5},\"robust\":{\"uncertainty\":{"
            + "\"a0\":{\"lowest\":0,\"highest\":30},\"a1\":{\"spreadPercent\":20},\"b\":{\"lowest\":266.7,"
            + "\"highest\":500},\"d\":{\"lowest\":266.7,\"highest\":500},\"monteCarloSamples\":200,\"seed\":7}}}";

    /**
     * Order 8: s (s + 0.5)(s + 1)(s + 1.5)(s + 2)(s + 3)(s + 4)(s + 5) with b = 90 (unit DC gain of the stable
     * part), settling to 2% in 2 s with 2% overshoot, spec matching on.
     */
    public static final String ORDER_8_REQUEST = "{\"plant\":{\"denominator\":[1,17.0,115.75,406.25,787.75,836.75,"
            + "445.5,90.0,0.0],\"b\":90,\"numerator\":[1],\"disturbance\":[0,0,0,0,0,0,0,1]},"
            + "\"spec\":{\"settlingTime\":2.0,\"overshootPercent\":2.0},\"matchSpecs\":true}";

    private final UncertaintyAnalyzer analyzer = new UncertaintyAnalyzer();
    private final RobustDesignPipeline robust = new RobustDesignPipeline();
    private final EndpointRunner runner = new EndpointRunner(StrictJson.newMapper());
    private final DesignEndpoint designs = new DesignEndpoint();
    private final HighOrderEndpoint highOrder = new HighOrderEndpoint();
    private final byte[] robustRequest = ROBUST_REQUEST.getBytes(StandardCharsets.UTF_8);
    private final byte[] order8Request = ORDER_8_REQUEST.getBytes(StandardCharsets.UTF_8);
    private final ClosedFormDesign design = Scenarios.indexingAxisDesign();
    private final FeedbackGains gains =
            new FeedbackGains(design.positionGain(), design.velocityGain(), design.referenceGain());
    private final DMatrixRMaj output = new DMatrixRMaj(
            new double[][] {{design.rho1(), 0}, {0, design.rho2()}, {-design.positionGain(), -design.velocityGain()}});
    private final AcceptanceLimits limits = new AcceptanceLimits(0.15, null, 1.5, 0.02);

    @Benchmark
    public UncertaintyReport monteCarlo2000() {
        return analyzer.analyze(FOUR_PARAMETER_BOX, gains, 1, limits, output, 2000, 7);
    }

    @Benchmark
    public RobustDesignReport robustDesign200() {
        return robust.design(
                Scenarios.indexingAxisPlant(),
                Scenarios.indexingAxisSpec(),
                new GammaChoice.MarginOverMinimum(GammaChoice.MarginOverMinimum.DEFAULT_FACTOR),
                1,
                0.02,
                FOUR_PARAMETER_BOX,
                200,
                7,
                null);
    }

    @Benchmark
    public Reply robustDesignJson() {
        return ok(runner.run(designs, robustRequest));
    }

    @Benchmark
    public Reply order8SpecMatchedJson() {
        return ok(runner.run(highOrder, order8Request));
    }

    private static Reply ok(Reply reply) {
        if (!reply.ok()) {
            throw new IllegalStateException("the benchmark request must design: " + reply.problem());
        }
        return reply;
    }
}
