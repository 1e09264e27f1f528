package com.loopwright.solver.export;

import java.util.List;

/**
 * Where an exported controller came from, written at the top of every text; the api fills it from the request.
 *
 * @param title          one line naming the loop
 * @param serviceVersion the version of the service that designed it
 * @param requestDigest  the digest of the design request (e.g. sha-256 hex)
 * @param plant          the plant, one line (e.g. its transfer function and units)
 * @param specLines      the specs and results, one fact a line
 * @param gamma          the H-infinity level the design is certified for
 * @param cautions       safety cautions, one sentence each
 */
public record ProvenanceHeader(
        String title,
        String serviceVersion,
        String requestDigest,
        String plant,
        List<String> specLines,
        double gamma,
        List<String> cautions) {

    public ProvenanceHeader {
        specLines = List.copyOf(specLines);
        cautions = List.copyOf(cautions);
        if (title == null || serviceVersion == null || requestDigest == null || plant == null) {
            throw new IllegalArgumentException("title, service version, request digest and plant are required");
        }
        Literals.real(gamma);
    }
}
