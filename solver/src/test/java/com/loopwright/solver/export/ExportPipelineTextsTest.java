package com.loopwright.solver.export;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.solver.design.SampledLaw;
import com.loopwright.solver.pipeline.ControllerExport;
import com.loopwright.solver.pipeline.ControllerOptions;
import com.loopwright.solver.pipeline.ControllerTexts;
import com.loopwright.solver.pipeline.DesignReport;
import com.loopwright.solver.pipeline.ExportPipeline;
import com.loopwright.solver.pipeline.ExportProvenance;
import com.loopwright.solver.pipeline.SolverFailure;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * The export front door: the request's command range, operating point, period tolerance and prefix reach the
 * exported block, and the block computes the law the parameter set states.
 */
class ExportPipelineTextsTest {

    private static final int SAMPLES = 2_000;

    private final ExportPipeline pipeline = new ExportPipeline();

    private static ExportProvenance provenance() {
        return new ExportProvenance(
                "Packaging-line indexing axis 2",
                "0.1.0-test",
                "sha256:feed",
                "x1' = x2, x2' = -0.48 x2 + 400 u + 400 w",
                List.of("Specs: settling time 0.15 s (2% band), overshoot 1.5%"),
                List.of("Commission at reduced gain first."));
    }

    /**
     * The interpreted Structured Text of an asymmetric, biased export against the law written out by hand,
     * u = clamp(u0 + kr (r - y0) - (k1 (x1 - y0) + k2 x2), lowest, highest) (the law the parameter set states;
     * from memory of the operating-point form of a state-feedback law), and the period check at +-5 %.
     */
    @Test
    void theExportedBlockComputesTheStatedLaw() {
        DesignReport report = IndexingAxis.report();
        ControllerOptions options = new ControllerOptions(1e-3, -1.0, 2.5, 0.1, 0.2, 0.05, "Axis_2", false);
        ControllerExport export = pipeline.export(report, options);
        ControllerTexts texts = pipeline.texts(export, provenance());
        assertEquals("Axis_2_Controller.st", texts.structuredTextFileName());
        assertEquals("Axis_2_Controller.xml", texts.plcOpenXmlFileName());
        assertEquals("Axis_2.h", texts.cHeaderFileName());
        assertEquals("Axis_2.c", texts.cSourceFileName());
        for (String text : List.of(texts.structuredText(), texts.cHeader(), texts.cSource(), texts.plcOpenXml())) {
            assertTrue(text.contains("sha256:feed") && text.contains("0.1.0-test"), "provenance");
            assertTrue(text.contains("gamma (H-infinity level"), "gamma");
            assertTrue(text.contains("Design task period T = 0.001 s"), "design period");
            assertTrue(text.contains("Commission at reduced gain first."), "cautions");
        }
        SampledLaw law = export.law();
        StructuredTextSubsetInterpreter block = new StructuredTextSubsetInterpreter(texts.structuredText());
        SplittableRandom random = new SplittableRandom(2);
        int clamped = 0;
        for (int k = 0; k < SAMPLES; k++) {
            // ranges of 3 limits per gain: both the linear and the clamped regime occur
            double r = random.nextDouble(-3, 3) / law.referenceGain();
            double x1 = random.nextDouble(-3, 3) / law.positionGain();
            double x2 = random.nextDouble(-3, 3) / law.velocityGain();
            block.setInput("Enable", true);
            block.setInput("Setpoint", r);
            block.setInput("Y1", x1);
            block.setInput("Y2", x2);
            block.setInput("GainScale", 1.0);
            block.setInput("MeasuredPeriod", 1e-3);
            block.call();
            double byHand = Math.max(
                    -1.0,
                    Math.min(
                            2.5,
                            0.2
                                    + law.referenceGain() * (r - 0.1)
                                    - (law.positionGain() * (x1 - 0.1) + law.velocityGain() * x2)));
            assertEquals(byHand, block.real("Command"), 1e-12 * Math.max(1, Math.abs(byHand)), "sample " + k);
            if (block.bool("Saturated")) {
                clamped++;
            }
        }
        assertTrue(clamped > SAMPLES / 20 && clamped < SAMPLES - SAMPLES / 20, "both regimes: " + clamped);
        for (double[] periodAndFlag : new double[][] {{1.04e-3, 0}, {0.96e-3, 0}, {1.06e-3, 1}, {0.94e-3, 1}}) {
            block.setInput("MeasuredPeriod", periodAndFlag[0]);
            block.call();
            assertEquals(periodAndFlag[1] == 1, block.bool("PeriodMismatch"), "period " + periodAndFlag[0]);
        }
    }

    /** The PLCopen project's ST body is the Structured Text export's body, byte for byte. */
    @Test
    void thePlcOpenBodyIsTheStructuredTextBody() {
        ControllerTexts texts = pipeline.texts(
                pipeline.export(IndexingAxis.report(), new ControllerOptions(1e-3, -3, 3, 0, 0, 0.1, "LW", true)),
                provenance());
        String xml = texts.plcOpenXml();
        String body = xml.substring(xml.indexOf("<![CDATA[") + 9, xml.indexOf("]]>"));
        String st = texts.structuredText();
        assertEquals(st.substring(st.lastIndexOf("END_VAR\n") + 8, st.indexOf("END_FUNCTION_BLOCK")), body);
        assertTrue(st.contains(" : REAL") && !st.contains("LREAL"), "single precision");
    }

    /** wn T above 0.5 is refused as about the sample period (the 422 at /samplePeriod). */
    @Test
    void aTooLongPeriodIsASamplePeriodFailure() {
        SolverFailure failure = assertThrows(
                SolverFailure.class,
                () -> pipeline.export(
                        IndexingAxis.report(), new ControllerOptions(0.05, -3, 3, 0, 0, 0.1, "LW", false)));
        assertEquals(SolverFailure.Kind.SAMPLED_LAW_INFEASIBLE, failure.kind());
        assertEquals(SolverFailure.SAMPLE_PERIOD, failure.subject());
    }
}
