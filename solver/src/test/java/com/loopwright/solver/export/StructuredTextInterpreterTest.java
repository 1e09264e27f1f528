package com.loopwright.solver.export;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import com.loopwright.solver.discrete.ControllerFixtures;
import com.loopwright.solver.discrete.Scenario;
import com.loopwright.solver.discrete.StepOutput;
import com.loopwright.solver.simulation.DiscreteStateSpace;
import com.loopwright.solver.simulation.ZeroOrderHold;
import java.nio.file.Files;
import java.nio.file.Path;
import org.ejml.data.DMatrixRMaj;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The exported Structured Text, run by a subset interpreter in closed loop, agrees with the exported C run. */
class StructuredTextInterpreterTest {

    /** ST against C, relative to the run's peak (the issue asks 1e-12). */
    static final double ST_RELATIVE = 1e-12;

    @TempDir
    Path dir;

    @Test
    void structuredTextAgreesWithTheCRunInEveryScenario() throws Exception {
        assumeTrue(CClosedLoop.gccPresent(), "gcc is not installed");
        for (ControllerExportFixtures.Case c : ControllerExportFixtures.cases()) {
            ControllerExportOptions options = c.options("Axis1", Precision.DOUBLE);
            String st = new ControllerStructuredTextWriter()
                    .write(ControllerExportFixtures.header(), c.controller(), options);
            ControllerCWriter.Pair pair =
                    new ControllerCWriter().write(ControllerExportFixtures.header(), c.controller(), options);
            Path sub = Files.createDirectory(dir.resolve("st" + c.controller().stateCount()));
            Path exe = CClosedLoop.compile(
                    sub,
                    pair,
                    Precision.DOUBLE,
                    c.controller(),
                    c.settings(),
                    ControllerFixtures.a(),
                    ControllerFixtures.b2(),
                    c.measured());
            for (Scenario s : ControllerFixtures.scenarios()) {
                double[][] gcc = CClosedLoop.run(exe, s, 2);
                double[][] interpreted = runStructuredText(st, c, s);
                double worst = ControllerCClosedLoopTest.compare(
                        gcc, interpreted, ST_RELATIVE, true, c.name() + ", " + s.name());
                System.out.printf("ST vs C, %s, %s: worst relative %.3g%n", c.name(), s.name(), worst);
            }
        }
    }

    @Test
    void constructsOutsideTheSubsetFail() {
        ControllerExportFixtures.Case c = ControllerExportFixtures.cases().get(2);
        String st = new ControllerStructuredTextWriter()
                .write(ControllerExportFixtures.header(), c.controller(), c.options("Axis1", Precision.DOUBLE));
        new StructuredTextSubsetInterpreter(st); // the export itself parses
        assertThrows(
                IllegalArgumentException.class,
                () -> new StructuredTextSubsetInterpreter(st.replace("Command := Uc;", "Command := ABS(Uc);")));
        assertThrows(
                IllegalArgumentException.class,
                () -> new StructuredTextSubsetInterpreter(st.replace("Rd := ", "FOR Rd := ")));
        assertThrows(
                IllegalArgumentException.class,
                () -> new StructuredTextSubsetInterpreter(st.replace("WasEnabled : BOOL;", "WasEnabled : INT;")));
        assertThrows(
                IllegalArgumentException.class,
                () -> new StructuredTextSubsetInterpreter(st.replace("Command := Uc;", "KR := Uc;")));
        assertThrows(
                IllegalArgumentException.class,
                () -> new StructuredTextSubsetInterpreter(st.replace("Command := Uc;", "Command := Unknown;")));
        String real = new ControllerStructuredTextWriter()
                .write(ControllerExportFixtures.header(), c.controller(), c.options("Axis1", Precision.SINGLE));
        assertThrows(IllegalArgumentException.class, () -> new StructuredTextSubsetInterpreter(real));
    }

    /** The same plant recursion as the simulator and the C harness, with the interpreted block as controller. */
    static double[][] runStructuredText(String st, ControllerExportFixtures.Case c, Scenario s) {
        StructuredTextSubsetInterpreter block = new StructuredTextSubsetInterpreter(st);
        double[][] a = ControllerFixtures.a();
        double[] b2 = ControllerFixtures.b2();
        int n = b2.length;
        double[][] cm = c.measured();
        DiscreteStateSpace plant = ZeroOrderHold.discretize(
                new DMatrixRMaj(a),
                new DMatrixRMaj(n, 1, true, b2),
                c.controller().samplePeriodSeconds());
        double[] y0 = c.settings().measurementBias();
        double[][] rows = new double[s.steps()][];
        double[] x = new double[n];
        for (int k = 0; k < s.steps(); k++) {
            block.setInput("Enable", s.enable()[k]);
            block.setInput("Setpoint", s.setpoint()[k]);
            for (int m = 0; m < cm.length; m++) {
                double acc = 0;
                for (int j = 0; j < n; j++) {
                    acc += cm[m][j] * x[j];
                }
                block.setInput("Y" + (m + 1), acc + y0[m]);
            }
            block.setInput("GainScale", s.gainScale()[k]);
            block.setInput("MeasuredPeriod", s.measuredPeriodSeconds()[k]);
            block.call();
            double u = block.real("Command");
            int status = new StepOutput(
                            u, block.bool("Saturated"), block.bool("Disabled"), block.bool("PeriodMismatch"))
                    .status();
            double[] row = new double[n + 2];
            System.arraycopy(x, 0, row, 0, n);
            row[n] = u;
            row[n + 1] = status;
            rows[k] = row;
            double input = u - c.settings().commandBias() + s.load()[k];
            double[] next = new double[n];
            for (int i = 0; i < n; i++) {
                double acc = 0;
                for (int j = 0; j < n; j++) {
                    acc += plant.ad().get(i, j) * x[j];
                }
                next[i] = acc + plant.bd().get(i, 0) * input;
            }
            x = next;
        }
        assertEquals(s.steps(), rows.length);
        return rows;
    }
}
