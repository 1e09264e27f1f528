package com.loopwright.solver.export;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.solver.design.SampledLaw;
import com.loopwright.solver.pipeline.DesignReport;
import java.util.List;
import org.junit.jupiter.api.Test;

class StructuredTextWriterTest {

    private final StructuredTextChecker checker = new StructuredTextChecker();

    @Test
    void generatedBlockPassesTheGrammarCheckAndCarriesTheDesign() {
        DesignReport report = IndexingAxis.report();
        SampledLaw law = new SampledLawDesigner().emulate(report.design(), 1e-3, 3);
        String st = new StructuredTextWriter().write(IndexingAxis.header(report), law);
        assertEquals(List.of(), checker.check(st));
        assertTrue(st.contains("K_POSITION : LREAL := " + report.design().positionGain() + ";"));
        assertTrue(st.contains("K_VELOCITY : LREAL := " + report.design().velocityGain() + ";"));
        assertTrue(st.contains("K_REFERENCE : LREAL := " + report.design().referenceGain() + ";"));
        assertTrue(st.contains("ACTUATOR_LIMIT : LREAL := 3.0;"));
        assertTrue(st.contains("gamma (H-infinity level"));
        assertTrue(st.contains("CAUTIONS:"));
        assertTrue(st.contains("settling time 0.15 s"));
        // The caution text contains "*)"; it must not end the comment early.
        assertFalse(st.contains("(*/ *)"));
    }

    /** The checker itself must fail on broken text, else the test above proves nothing. */
    @Test
    void checkerRejectsBrokenBlocks() {
        DesignReport report = IndexingAxis.report();
        String good = new StructuredTextWriter()
                .write(IndexingAxis.header(report), new SampledLawDesigner().emulate(report.design(), 1e-3, 3));
        List<String> broken = List.of(
                good.replace("END_FUNCTION_BLOCK\n", ""),
                good.replaceFirst("END_VAR\n", ""),
                good.replace("Command := Unclamped;", "Command := Unclamped"),
                good.replace("Saturated := FALSE;", "Saturated := Flase;"),
                good.replace("    Unclamped : LREAL;", "    2Unclamped : LREAL;"),
                good.replace("END_IF;\nIF", "IF"),
                good.replaceFirst("\\(\\* ", "(* (* "),
                good.replace("- (K_POSITION", "- K_POSITION"),
                good.replace("K_VELOCITY : LREAL := ", "K__VELOCITY : LREAL := "));
        for (String text : broken) {
            assertFalse(checker.check(text).isEmpty(), "not caught:\n" + text);
        }
    }
}
