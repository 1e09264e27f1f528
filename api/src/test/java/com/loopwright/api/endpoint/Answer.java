package com.loopwright.api.endpoint;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.api.design.DesignEndpoint;
import com.loopwright.api.fit.FitEndpoint;
import com.loopwright.api.highorder.HighOrderEndpoint;
import com.loopwright.api.json.StrictJson;
import com.loopwright.api.problem.Problem;
import com.loopwright.api.takeaway.Takeaways;
import com.loopwright.api.verification.VerificationEndpoint;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;

/**
 * Test view of a {@link Reply}: the body as a JSON tree (the problem's tree for a problem) and as text, run through
 * the production runner and endpoints.
 *
 * @param status  HTTP status
 * @param body    the JSON body as a tree (for a problem: the problem), or null for a text body
 * @param problem the problem, or null
 * @param text    the body as UTF-8 text, or null for a problem
 */
public record Answer(int status, JsonNode body, Problem problem, String text) {

    private static final ObjectMapper MAPPER = StrictJson.newMapper();
    private static final EndpointRunner RUNNER = new EndpointRunner(MAPPER);
    private static final DesignEndpoint DESIGN = new DesignEndpoint();
    private static final FitEndpoint FIT = new FitEndpoint();
    private static final HighOrderEndpoint HIGH_ORDER = new HighOrderEndpoint();
    private static final VerificationEndpoint VERIFICATION = new VerificationEndpoint();
    private static final Takeaways TAKEAWAYS = new Takeaways(RUNNER);

    public boolean ok() {
        return problem == null;
    }

    public static Answer of(Reply reply) {
        if (!reply.ok()) {
            return new Answer(reply.status(), MAPPER.valueToTree(reply.problem()), reply.problem(), null);
        }
        JsonNode tree = null;
        if (reply.mediaType().startsWith(Reply.JSON)) {
            try {
                tree = MAPPER.readTree(reply.body());
            } catch (IOException e) {
                throw new UncheckedIOException(e);
            }
        }
        return new Answer(reply.status(), tree, null, reply.text());
    }

    public static Answer design(byte[] body) {
        return of(RUNNER.run(DESIGN, body));
    }

    public static Answer design(String body) {
        return design(body.getBytes(StandardCharsets.UTF_8));
    }

    public static Answer design(JsonNode item) {
        return of(RUNNER.run(DESIGN, item));
    }

    public static Answer fit(byte[] body) {
        return of(RUNNER.run(FIT, body));
    }

    public static Answer highOrder(byte[] body) {
        return of(RUNNER.run(HIGH_ORDER, body));
    }

    public static Answer verification(byte[] body) {
        return of(RUNNER.run(VERIFICATION, body));
    }

    public static Answer plot(String figure, byte[] body) {
        return of(TAKEAWAYS.plot(figure, body));
    }

    public static Answer controller(String format, byte[] body) {
        return of(TAKEAWAYS.controller(format, body));
    }
}
