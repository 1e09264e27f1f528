package com.loopwright.solver.export;

import java.util.List;

/**
 * What the generated code's header comment states.
 *
 * @param title     one line naming the loop
 * @param specLines the design's specs and results, one fact a line
 * @param gamma     the H-infinity level the design is certified for
 * @param cautions  safety cautions, one sentence each
 */
public record ExportHeader(String title, List<String> specLines, double gamma, List<String> cautions) {

    public ExportHeader {
        specLines = List.copyOf(specLines);
        cautions = List.copyOf(cautions);
    }
}
