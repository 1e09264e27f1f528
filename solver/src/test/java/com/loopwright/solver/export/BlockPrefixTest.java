package com.loopwright.solver.export;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.solver.pipeline.ControllerTexts;
import java.time.Instant;
import org.junit.jupiter.api.Test;

/** Prefixes valid in both IEC 61131-3 and C are accepted, all others refused; every name carries the prefix. */
class BlockPrefixTest {

    @Test
    void validIdentifiersAreAccepted() {
        for (String ok : new String[] {"A", "Axis1", "axis_1", "Line2_Feed_X", "x0123456789abcde"}) {
            assertEquals(ok, new BlockPrefix(ok).value());
        }
        assertEquals("AXIS_1", new BlockPrefix("Axis_1").macro());
        assertEquals("Axis_1_Controller", new BlockPrefix("Axis_1").blockName());
    }

    @Test
    void invalidIdentifiersAreRefused() {
        for (String bad : new String[] {
            "", "1Axis", "_Axis", "Axis_", "Axis__1", "Axis-1", "Axis 1", "Ax\u00e9s", "Axis;", "x0123456789abcdef"
        }) {
            assertThrows(IllegalArgumentException.class, () -> new BlockPrefix(bad), bad);
        }
        assertThrows(IllegalArgumentException.class, () -> new BlockPrefix(null));
    }

    /** Every exported text names the block, functions and macros after the prefix, and not after another. */
    @Test
    void everyTextCarriesThePrefix() {
        ControllerExportFixtures.Case c = ControllerExportFixtures.cases().get(2);
        ControllerTexts texts = new com.loopwright.solver.pipeline.ExportPipeline()
                .controllerTexts(
                        c.controller(),
                        ControllerExportFixtures.header(),
                        c.options("Feed_X", Precision.DOUBLE),
                        Instant.parse("2026-12-04T00:00:00Z"));
        assertTrue(texts.structuredText().contains("FUNCTION_BLOCK Feed_X_Controller\n"));
        assertEquals("Feed_X.h", texts.cHeaderFileName());
        assertEquals("Feed_X.c", texts.cSourceFileName());
        assertTrue(texts.cHeader().contains("#ifndef FEED_X_H"));
        assertTrue(texts.cHeader().contains("double Feed_X_step(Feed_X_state *s,"));
        assertTrue(texts.cHeader().contains("#define FEED_X_KR ("));
        assertTrue(texts.cSource().contains("#include \"Feed_X.h\""));
        assertTrue(texts.plcOpenXml().contains("<pou name=\"Feed_X_Controller\" pouType=\"functionBlock\">"));
        for (String text :
                new String[] {texts.structuredText(), texts.cHeader(), texts.cSource(), texts.plcOpenXml()}) {
            assertTrue(!text.contains("LW_") && !text.contains("Axis1"), "no foreign prefix");
            for (String provenance : new String[] {
                "0.1.0-test",
                "sha256:0123abcd",
                "G(s) = 400",
                "settling time",
                "gamma",
                "Design task period T = 0.001 s",
                "CAUTIONS"
            }) {
                assertTrue(text.contains(provenance), provenance);
            }
        }
    }
}
