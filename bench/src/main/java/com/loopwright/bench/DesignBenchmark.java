package com.loopwright.bench;

import com.loopwright.api.design.DesignEndpoint;
import com.loopwright.api.endpoint.EndpointRunner;
import com.loopwright.api.endpoint.Reply;
import com.loopwright.api.json.StrictJson;
import com.loopwright.solver.design.GammaChoice;
import com.loopwright.solver.pipeline.DesignReport;
import com.loopwright.solver.pipeline.LoopDesigner;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.State;

/**
 * One whole design: the solver pipeline alone (inversion, closed form, numeric Riccati, norm, 2,000-point
 * simulation with refined metrics), and the same request as bytes in, response bytes out through the strict
 * Jackson mapper, without HTTP, straight to bytes through the endpoint runner (jsonEncode).
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MICROSECONDS)
public class DesignBenchmark {

    private final LoopDesigner designer = new LoopDesigner();
    private final EndpointRunner runner = new EndpointRunner(StrictJson.newMapper());
    private final DesignEndpoint endpoint = new DesignEndpoint();
    private final byte[] request = Scenarios.indexingAxisRequestBytes();
    private final GammaChoice margin = new GammaChoice.MarginOverMinimum(GammaChoice.MarginOverMinimum.DEFAULT_FACTOR);

    @Benchmark
    public DesignReport solverPipeline() {
        return designer.design(Scenarios.indexingAxisPlant(), Scenarios.indexingAxisSpec(), margin, 1.0, 0.02);
    }

    /** The HTTP path: the same request, the response record written straight to bytes (no tree). */
    @Benchmark
    public Reply jsonEncode() {
        Reply outcome = runner.run(endpoint, request);
        if (!outcome.ok()) {
            throw new IllegalStateException("the benchmark request must design: " + outcome.problem());
        }
        return outcome;
    }
}
