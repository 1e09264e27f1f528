package com.loopwright.solver.robustness;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;

/** One seed means one set of parameter sets: the report and the figure draw from the same sampler. */
class ParameterSamplerTest {

    // A tank-level loop whose valve gain and outflow coefficient are known to +-20% and +-10%.
    private static final ParameterBox TANK = new ParameterBox(0.04, 0.06, 0.7, 0.77, 0.8, 1.2, 0.5, 0.5);

    @Test
    void samplesAreInsideTheBoxAndReproducible() {
        ParameterSampler first = new ParameterSampler(TANK, 42);
        ParameterSampler again = new ParameterSampler(TANK, 42);
        for (int s = 0; s < 500; s++) {
            double[] p = first.next();
            assertArrayEquals(p, again.next(), "same seed, same sample " + s);
            for (int i = 0; i < 4; i++) {
                assertTrue(p[i] >= TANK.lows()[i] && p[i] <= TANK.highs()[i], "inside the box: " + s + "/" + i);
            }
            assertEquals(0.5, p[3], 0.0, "a fixed parameter stays fixed");
        }
    }

    /**
     * Regression: the uncertainty-band figure drew with java.util.Random and the robustness report with
     * SplittableRandom from the same seed, so the two showed different parameter sets for one request. No class of
     * the robustness package but ParameterSampler may construct a generator.
     */
    @Test
    void noOtherRobustnessClassConstructsARandomGenerator() throws IOException {
        Path main = Path.of("src", "main", "java", "com", "loopwright", "solver", "robustness");
        try (Stream<Path> files = Files.walk(main)) {
            List<Path> offenders = files.filter(f -> f.toString().endsWith(".java"))
                    .filter(f -> !f.getFileName().toString().equals("ParameterSampler.java"))
                    .filter(f -> {
                        try {
                            String text = Files.readString(f);
                            return text.contains("new Random(") || text.contains("new SplittableRandom(");
                        } catch (IOException e) {
                            throw new java.io.UncheckedIOException(e);
                        }
                    })
                    .toList();
            assertEquals(List.of(), offenders);
        }
    }
}
