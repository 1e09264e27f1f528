package com.loopwright.service;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.loopwright.api.takeaway.Takeaways;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * An unknown name under /v1/designs/plots/ or /v1/designs/controllers/ is a 404 that lists the names the path takes,
 * in its detail and in validNames. Regression: the application's generic 404 ("no resource at this path") replaced
 * the handler's problem, so the names never reached a client.
 */
class UnknownPathNameTest extends LiveServerTest {

    private static final String DESIGN =
            "{\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":400,\"d\":400},\"spec\":{\"settlingTime\":0.15,\"overshootPercent\":1.5}}";

    @Test
    void anUnknownFigureListsTheFigures() {
        JsonNode problem = notFound("/v1/designs/plots/nyquist", "{\"design\":" + DESIGN + "}");
        assertEquals(
                "no figure 'nyquist'; valid names: step-response, control-effort, bode, uncertainty-band",
                problem.path("detail").asText());
        assertEquals(Takeaways.FIGURES, names(problem));
    }

    @Test
    void anUnknownControllerFormatListsTheFormats() {
        JsonNode problem = notFound(
                "/v1/designs/controllers/ladder",
                "{\"design\":" + DESIGN + ",\"samplePeriod\":0.001,\"actuatorLimit\":3}");
        assertEquals(
                "no controller format 'ladder'; valid names: structured-text, c-header, c-source, plcopen-xml,"
                        + " parameters",
                problem.path("detail").asText());
        assertEquals(List.of("structured-text", "c-header", "c-source", "plcopen-xml", "parameters"), names(problem));
    }

    /** The format `c` of the first release is gone (docs/migration-v1.md): its 404 names the header and source. */
    @Test
    void theRetiredCFormatNamesItsSuccessors() {
        JsonNode problem = notFound(
                "/v1/designs/controllers/c", "{\"design\":" + DESIGN + ",\"samplePeriod\":0.001,\"actuatorLimit\":3}");
        assertTrue(names(problem).containsAll(List.of("c-header", "c-source")), problem.toString());
    }

    @Test
    void aPathNobodyServesKeepsTheGenericAnswerWithoutNames() {
        JsonNode problem = notFound("/v1/designs/nothing/here", "{}");
        assertEquals(
                "no resource at this path; see GET /openapi.yaml",
                problem.path("detail").asText());
        assertTrue(problem.path("validNames").isMissingNode(), problem.toString());
    }

    private static JsonNode notFound(String path, String body) {
        LiveServer.Reply reply = server.post(path, body);
        assertEquals(404, reply.status(), reply.text());
        assertEquals("application/problem+json", reply.contentType());
        return reply.json();
    }

    private static List<String> names(JsonNode problem) {
        List<String> names = new ArrayList<>();
        problem.path("validNames").forEach(name -> names.add(name.asText()));
        return names;
    }
}
