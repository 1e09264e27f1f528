package com.loopwright.solver.export;

import com.loopwright.solver.discrete.ControllerSettings;
import com.loopwright.solver.discrete.DiscreteController;
import com.loopwright.solver.discrete.Scenario;
import com.loopwright.solver.simulation.DiscreteStateSpace;
import com.loopwright.solver.simulation.ZeroOrderHold;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.ejml.data.DMatrixRMaj;

/**
 * Compiles an exported C pair with gcc and runs it in closed loop against the exact ZOH plant, the same plant
 * recursion as {@link com.loopwright.solver.discrete.ClosedLoopSimulator} (plant matrices and inputs passed as
 * hexadecimal floating literals, so both sides see the same bits).
 */
final class CClosedLoop {

    /** gcc's flags: the issue's -std=c99 -Wall -Werror, plus -Wextra -pedantic. */
    static final List<String> FLAGS = List.of("-std=c99", "-Wall", "-Wextra", "-pedantic", "-Werror");
    /** Longest compile or run [s]. */
    static final long TIMEOUT_SECONDS = 60;

    private CClosedLoop() {}

    /**
     * Whether gcc runs here; .ci/run installs gcc and sets LOOPWRIGHT_REQUIRE_GCC=1, which turns a missing gcc into
     * a failure instead of a skipped test.
     */
    static boolean gccPresent() {
        boolean present = gccRuns();
        if (!present && "1".equals(System.getenv("LOOPWRIGHT_REQUIRE_GCC"))) {
            throw new AssertionError("gcc is required (LOOPWRIGHT_REQUIRE_GCC=1) but missing");
        }
        return present;
    }

    private static boolean gccRuns() {
        try {
            Process p = new ProcessBuilder("gcc", "--version")
                    .redirectErrorStream(true)
                    .start();
            p.getInputStream().readAllBytes();
            return p.waitFor(TIMEOUT_SECONDS, TimeUnit.SECONDS) && p.exitValue() == 0;
        } catch (IOException e) {
            return false;
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            return false;
        }
    }

    /** Compiles the pair and the harness in dir; returns the executable. */
    static Path compile(
            Path dir,
            ControllerCWriter.Pair pair,
            Precision precision,
            DiscreteController controller,
            ControllerSettings settings,
            double[][] a,
            double[] b2,
            double[][] measured)
            throws IOException, InterruptedException {
        Files.writeString(dir.resolve(pair.headerFileName()), pair.header());
        Files.writeString(dir.resolve(pair.sourceFileName()), pair.source());
        String prefix = pair.sourceFileName().substring(0, pair.sourceFileName().length() - 2);
        Files.writeString(dir.resolve("harness.c"), harness(prefix, precision, controller, settings, a, b2, measured));
        Path exe = dir.resolve("closed_loop");
        List<String> cmd = new ArrayList<>(List.of("gcc"));
        cmd.addAll(FLAGS);
        cmd.addAll(List.of("-o", exe.toString(), pair.sourceFileName(), "harness.c"));
        Process p = new ProcessBuilder(cmd)
                .directory(dir.toFile())
                .redirectErrorStream(true)
                .start();
        String log = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        if (!p.waitFor(TIMEOUT_SECONDS, TimeUnit.SECONDS) || p.exitValue() != 0) {
            throw new AssertionError("gcc failed:\n" + log + "\n" + pair.source());
        }
        return exe;
    }

    /** Runs one scenario; rows {x (n), u, status} like the Java simulator. */
    static double[][] run(Path exe, Scenario s, int order) throws IOException, InterruptedException {
        StringBuilder in = new StringBuilder();
        for (int k = 0; k < s.steps(); k++) {
            in.append(s.enable()[k] ? 1 : 0)
                    .append(' ')
                    .append(Double.toHexString(s.setpoint()[k]))
                    .append(' ')
                    .append(Double.toHexString(s.load()[k]))
                    .append(' ')
                    .append(Double.toHexString(s.gainScale()[k]))
                    .append(' ')
                    .append(Double.toHexString(s.measuredPeriodSeconds()[k]))
                    .append('\n');
        }
        Process p = new ProcessBuilder(exe.toString()).redirectErrorStream(true).start();
        p.getOutputStream().write(in.toString().getBytes(StandardCharsets.US_ASCII));
        p.getOutputStream().close();
        String out = new String(p.getInputStream().readAllBytes(), StandardCharsets.US_ASCII);
        if (!p.waitFor(TIMEOUT_SECONDS, TimeUnit.SECONDS) || p.exitValue() != 0) {
            throw new AssertionError("the closed-loop run failed:\n" + out);
        }
        String[] lines = out.split("\n");
        if (lines.length != s.steps()) {
            throw new AssertionError("expected " + s.steps() + " lines, got " + lines.length + ":\n" + out);
        }
        double[][] rows = new double[s.steps()][];
        for (int k = 0; k < s.steps(); k++) {
            String[] f = lines[k].trim().split(" ");
            double[] row = new double[order + 2];
            for (int i = 0; i < order; i++) {
                row[i] = Double.parseDouble(f[2 + i]);
            }
            row[order] = Double.parseDouble(f[0]);
            row[order + 1] = Integer.parseInt(f[1]);
            rows[k] = row;
        }
        return rows;
    }

    private static String harness(
            String prefix,
            Precision precision,
            DiscreteController controller,
            ControllerSettings settings,
            double[][] a,
            double[] b2,
            double[][] measured) {
        int n = b2.length;
        int p = measured.length;
        DiscreteStateSpace plant = ZeroOrderHold.discretize(
                new DMatrixRMaj(a), new DMatrixRMaj(n, 1, true, b2), controller.samplePeriodSeconds());
        String real = precision.cType();
        StringBuilder c = new StringBuilder();
        c.append("#include <stdio.h>\n#include \"").append(prefix).append(".h\"\n\n");
        c.append("#define N ").append(n).append("\n#define P ").append(p).append("\n");
        c.append("static const double AD[N][N] = {");
        for (int i = 0; i < n; i++) {
            c.append(i > 0 ? ", " : "").append('{');
            for (int j = 0; j < n; j++) {
                c.append(j > 0 ? ", " : "").append(Double.toHexString(plant.ad().get(i, j)));
            }
            c.append('}');
        }
        c.append("};\nstatic const double BD[N] = {");
        for (int i = 0; i < n; i++) {
            c.append(i > 0 ? ", " : "").append(Double.toHexString(plant.bd().get(i, 0)));
        }
        c.append("};\nstatic const double CM[P][N] = {");
        for (int m = 0; m < p; m++) {
            c.append(m > 0 ? ", " : "").append('{');
            for (int j = 0; j < n; j++) {
                c.append(j > 0 ? ", " : "").append(Double.toHexString(measured[m][j]));
            }
            c.append('}');
        }
        c.append("};\nstatic const double Y0[P] = {");
        for (int m = 0; m < p; m++) {
            c.append(m > 0 ? ", " : "").append(Double.toHexString(settings.measurementBias()[m]));
        }
        c.append("};\nstatic const double U0 = ")
                .append(Double.toHexString(settings.commandBias()))
                .append(";\n\n");
        c.append("int main(void)\n{\n");
        c.append("    ").append(prefix).append("_state s;\n");
        c.append("    double x[N] = {0};\n    double next[N];\n");
        c.append("    int en;\n    double r, d, g, tm;\n    int i, j, m;\n");
        c.append("    ").append(prefix).append("_init(&s);\n");
        c.append("    while (scanf(\"%d %la %la %la %la\", &en, &r, &d, &g, &tm) == 5) {\n");
        c.append("        ").append(real).append(" y[P];\n");
        c.append("        unsigned int status = 0u;\n");
        c.append("        ").append(real).append(" u;\n");
        c.append("        double input;\n");
        c.append("        for (m = 0; m < P; m++) {\n");
        c.append("            double acc = 0.0;\n");
        c.append("            for (j = 0; j < N; j++) {\n                acc += CM[m][j] * x[j];\n            }\n");
        c.append("            y[m] = (").append(real).append(")(acc + Y0[m]);\n        }\n");
        c.append("        u = ")
                .append(prefix)
                .append("_step(&s, en, (")
                .append(real)
                .append(")r, y, (")
                .append(real)
                .append(")g, (")
                .append(real)
                .append(")tm, &status);\n");
        c.append("        printf(\"%a %u\", (double)u, status);\n");
        c.append("        for (i = 0; i < N; i++) {\n            printf(\" %a\", x[i]);\n        }\n");
        c.append("        printf(\"\\n\");\n");
        c.append("        input = (double)u - U0 + d;\n");
        c.append("        for (i = 0; i < N; i++) {\n            double acc = 0.0;\n");
        c.append("            for (j = 0; j < N; j++) {\n                acc += AD[i][j] * x[j];\n            }\n");
        c.append("            next[i] = acc + BD[i] * input;\n        }\n");
        c.append("        for (i = 0; i < N; i++) {\n            x[i] = next[i];\n        }\n");
        c.append("    }\n    return 0;\n}\n");
        return c.toString();
    }
}
