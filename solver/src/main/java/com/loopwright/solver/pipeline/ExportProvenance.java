package com.loopwright.solver.pipeline;

import java.util.List;

/**
 * Where an exported controller came from, as the caller states it; the pipeline adds gamma and the design period.
 *
 * @param title          one line naming the loop
 * @param serviceVersion the version of the service that designed it
 * @param requestDigest  the digest of the request it answers
 * @param plant          the plant, one line
 * @param specLines      the specs and results, one fact a line
 * @param cautions       safety cautions, one sentence each
 */
public record ExportProvenance(
        String title,
        String serviceVersion,
        String requestDigest,
        String plant,
        List<String> specLines,
        List<String> cautions) {

    public ExportProvenance {
        specLines = List.copyOf(specLines);
        cautions = List.copyOf(cautions);
    }
}
