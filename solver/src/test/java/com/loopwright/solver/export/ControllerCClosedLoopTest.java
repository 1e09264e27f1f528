package com.loopwright.solver.export;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import com.loopwright.solver.design.SampledLaw;
import com.loopwright.solver.discrete.ClosedLoopSimulator;
import com.loopwright.solver.discrete.ControllerFixtures;
import com.loopwright.solver.discrete.ControllerSettings;
import com.loopwright.solver.discrete.ControllerStep;
import com.loopwright.solver.discrete.DiscreteController;
import com.loopwright.solver.discrete.DiscreteControllers;
import com.loopwright.solver.discrete.Scenario;
import com.loopwright.solver.pipeline.DesignReport;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The exported C is the designed controller: compiled with gcc and run in closed loop against the exact ZOH plant,
 * it agrees sample by sample with the service's own simulation ({@link ClosedLoopSimulator}).
 */
class ControllerCClosedLoopTest {

    /** Double agreement, relative to the run's peak |value| (signals cross zero; the issue asks 1e-9). */
    static final double DOUBLE_RELATIVE = 1e-9;
    /**
     * Float agreement, relative to the run's peak: float's unit roundoff 6e-8 on the constants and on each of the
     * roughly 20 operations per sample, propagated through the closed loop's impulse response (a sum of |h| of
     * order 10 to 100 for the observer gains of 200 rad/s at 1 ms), gives errors of order 1e-5; the clamp and status
     * edges fall on the same samples in these scenarios (checked). Measured worst case over the 15 runs:
     * 4.8e-6 (integrator, saturation scenario); 1e-4 keeps a factor 20.
     */
    static final double FLOAT_RELATIVE = 1e-4;
    /** Random samples comparing the plain law with today's law. */
    static final int LAW_SAMPLES = 10_000;

    @TempDir
    Path dir;

    @Test
    void doubleCAgreesWithTheSimulationInEveryScenario() throws Exception {
        assumeTrue(CClosedLoop.gccPresent(), "gcc is not installed");
        for (ControllerExportFixtures.Case c : ControllerExportFixtures.cases()) {
            Path sub =
                    Files.createDirectory(dir.resolve("double" + c.controller().stateCount()));
            Path exe = compile(sub, c, Precision.DOUBLE);
            for (Scenario s : ControllerFixtures.scenarios()) {
                double[][] java = simulate(c, s);
                double[][] gcc = CClosedLoop.run(exe, s, 2);
                double worst = compare(java, gcc, DOUBLE_RELATIVE, true, c.name() + ", " + s.name());
                System.out.printf("C double vs Java, %s, %s: worst relative %.3g%n", c.name(), s.name(), worst);
            }
        }
    }

    @Test
    void floatCAgreesWithinTheFloatTolerance() throws Exception {
        assumeTrue(CClosedLoop.gccPresent(), "gcc is not installed");
        for (ControllerExportFixtures.Case c : ControllerExportFixtures.cases()) {
            Path sub =
                    Files.createDirectory(dir.resolve("float" + c.controller().stateCount()));
            Path exe = compile(sub, c, Precision.SINGLE);
            for (Scenario s : ControllerFixtures.scenarios()) {
                double[][] java = simulate(c, s);
                double[][] gcc = CClosedLoop.run(exe, s, 2);
                double worst = compare(java, gcc, FLOAT_RELATIVE, true, c.name() + ", " + s.name());
                System.out.printf("C float vs Java double, %s, %s: worst relative %.3g%n", c.name(), s.name(), worst);
            }
        }
    }

    /** Two prefixes compile into one program (several axes in one project). */
    @Test
    void twoAxesLinkTogether() throws Exception {
        assumeTrue(CClosedLoop.gccPresent(), "gcc is not installed");
        ControllerExportFixtures.Case c = ControllerExportFixtures.cases().get(2);
        ControllerCWriter w = new ControllerCWriter();
        ControllerCWriter.Pair a1 =
                w.write(ControllerExportFixtures.header(), c.controller(), c.options("Axis1", Precision.DOUBLE));
        ControllerCWriter.Pair a2 =
                w.write(ControllerExportFixtures.header(), c.controller(), c.options("Axis2", Precision.SINGLE));
        for (ControllerCWriter.Pair p : new ControllerCWriter.Pair[] {a1, a2}) {
            Files.writeString(dir.resolve(p.headerFileName()), p.header());
            Files.writeString(dir.resolve(p.sourceFileName()), p.source());
        }
        Files.writeString(
                dir.resolve("main.c"),
                "#include \"Axis1.h\"\n#include \"Axis2.h\"\nint main(void)\n{\n"
                        + "    Axis1_state a;\n    Axis2_state b;\n    double y1[1] = {0.0};\n    float y2[1] = {0.0f};\n"
                        + "    Axis1_init(&a);\n    Axis2_init(&b);\n"
                        + "    return (int)(Axis1_step(&a, 1, 0.0, y1, 1.0, AXIS1_SAMPLE_PERIOD_S, 0)\n"
                        + "        + Axis2_step(&b, 1, 0.0f, y2, 1.0f, AXIS2_SAMPLE_PERIOD_S, 0));\n}\n");
        java.util.List<String> cmd = new java.util.ArrayList<>(java.util.List.of("gcc"));
        cmd.addAll(CClosedLoop.FLAGS);
        cmd.addAll(java.util.List.of("-o", "two", "Axis1.c", "Axis2.c", "main.c"));
        Process p = new ProcessBuilder(cmd)
                .directory(dir.toFile())
                .redirectErrorStream(true)
                .start();
        String log = new String(p.getInputStream().readAllBytes());
        assertTrue(p.waitFor(CClosedLoop.TIMEOUT_SECONDS, java.util.concurrent.TimeUnit.SECONDS));
        assertEquals(0, p.exitValue(), log);
    }

    /**
     * The plain factory is today's law: with symmetric limits, no bias and gain scale 1 the command equals
     * {@link SampledLaw#command} bit for bit, for the README indexing axis, saturated or not.
     */
    @Test
    void plainLawIsTodaysEmulatedLaw() {
        DesignReport report = IndexingAxis.report();
        double limit = 2.5;
        SampledLaw law = new SampledLawDesigner().emulate(report.design(), 1e-3, -limit, limit);
        DiscreteController d = DiscreteControllers.fromStateFeedback(
                law.samplePeriod(), law.positionGain(), law.velocityGain(), law.referenceGain());
        ControllerStep step = new ControllerStep(d, ControllerSettings.symmetric(limit, 2));
        SplittableRandom random = new SplittableRandom(17);
        int clamped = 0;
        for (int i = 0; i < LAW_SAMPLES; i++) {
            // ranges of 3 limits per gain: both the linear and the clamped regime occur
            double r = random.nextDouble(-3, 3) * limit / law.referenceGain();
            double x1 = random.nextDouble(-3, 3) * limit / law.positionGain();
            double x2 = random.nextDouble(-3, 3) * limit / law.velocityGain();
            double today = law.command(r, x1, x2);
            double generic =
                    step.step(true, r, new double[] {x1, x2}, 1.0, 1e-3).command();
            assertEquals(today, generic, 0.0, "r " + r + " x1 " + x1 + " x2 " + x2);
            if (Math.abs(today) == limit) {
                clamped++;
            }
        }
        assertTrue(clamped > LAW_SAMPLES / 20 && clamped < LAW_SAMPLES - LAW_SAMPLES / 20, "both regimes: " + clamped);
    }

    private Path compile(Path sub, ControllerExportFixtures.Case c, Precision precision) throws Exception {
        ControllerCWriter.Pair pair = new ControllerCWriter()
                .write(ControllerExportFixtures.header(), c.controller(), c.options("Axis1", precision));
        return CClosedLoop.compile(
                sub,
                pair,
                precision,
                c.controller(),
                c.settings(),
                ControllerFixtures.a(),
                ControllerFixtures.b2(),
                c.measured());
    }

    static double[][] simulate(ControllerExportFixtures.Case c, Scenario s) {
        return new ClosedLoopSimulator()
                .run(c.controller(), c.settings(), ControllerFixtures.a(), ControllerFixtures.b2(), c.measured(), s);
    }

    /**
     * Columns compared relative to each column's peak over the run; status compared exactly when asked.
     *
     * @return the worst relative difference seen
     */
    static double compare(double[][] expected, double[][] actual, double relative, boolean status, String what) {
        assertEquals(expected.length, actual.length, what);
        int columns = expected[0].length;
        double worst = 0;
        for (int col = 0; col < columns - 1; col++) {
            double peak = 0;
            for (double[] row : expected) {
                peak = Math.max(peak, Math.abs(row[col]));
            }
            assertTrue(peak > 0, what + ": column " + col + " is identically zero");
            for (int k = 0; k < expected.length; k++) {
                double diff = Math.abs(expected[k][col] - actual[k][col]) / peak;
                worst = Math.max(worst, diff);
                assertTrue(
                        diff <= relative,
                        what + ": sample " + k + " column " + col + ": " + expected[k][col] + " vs " + actual[k][col]);
            }
        }
        if (status) {
            for (int k = 0; k < expected.length; k++) {
                assertEquals(expected[k][columns - 1], actual[k][columns - 1], 0.0, what + ": status at " + k);
            }
        }
        return worst;
    }
}
