package com.loopwright.service;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.api.endpoint.RequestDigest;
import com.loopwright.api.endpoint.ServiceVersion;
import com.loopwright.api.endpoint.Trace;
import io.javalin.Javalin;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.time.Duration;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/** Every answer says which build answered which request: headers, the trace field, the exported code's header. */
class TraceHeadersTest {

    private static final String DESIGN =
            "{\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":400,\"d\":400},\"spec\":{\"settlingTime\":0.15,\"overshootPercent\":1.5}}";
    /** The same request, members in another order, other spacing and number spelling. */
    private static final String DESIGN_RESPELLED =
            "{\"spec\": {\"overshootPercent\": 1.50, \"settlingTime\": 0.15},\n \"plant\": {\"form\": \"canonical\", \"d\": 4e2, \"b\": 400.0,"
                    + " \"a1\": 0.48, \"a0\": 0}}";

    private static final ObjectMapper JSON = new ObjectMapper();
    private static final HttpClient HTTP =
            HttpClient.newBuilder().connectTimeout(Duration.ofSeconds(5)).build();
    private static Javalin app;

    @BeforeAll
    static void start() {
        app = LoopwrightApp.create(ServiceConfig.defaults(0)).start("127.0.0.1", 0);
    }

    @AfterAll
    static void stop() {
        app.stop();
    }

    private static HttpResponse<String> post(String path, String body) throws Exception {
        return HTTP.send(
                HttpRequest.newBuilder(URI.create("http://127.0.0.1:" + app.port() + path))
                        .header("Content-Type", "application/json")
                        .timeout(Duration.ofSeconds(60))
                        .POST(HttpRequest.BodyPublishers.ofString(body))
                        .build(),
                HttpResponse.BodyHandlers.ofString());
    }

    @Test
    void theVersionIsTheBuildsAndTheDigestIsTheCanonicalRequests() throws Exception {
        assertEquals(ServiceVersion.fromBuild(), ServiceConfig.defaults(0).serviceVersion());
        HttpResponse<String> first = post("/v1/designs", DESIGN);
        HttpResponse<String> second = post("/v1/designs", DESIGN_RESPELLED);
        assertEquals(200, first.statusCode(), first.body());
        String digest = first.headers().firstValue(Trace.DIGEST_HEADER).orElseThrow();
        assertEquals(new RequestDigest(JSON).of(JSON.readTree(DESIGN)).length(), digest.length());
        assertTrue(digest.matches("sha256:[0-9a-f]{64}"), digest);
        assertEquals(digest, second.headers().firstValue(Trace.DIGEST_HEADER).orElseThrow());
        assertEquals(
                ServiceVersion.fromBuild(),
                first.headers().firstValue(Trace.VERSION_HEADER).orElseThrow());
        JsonNode trace = JSON.readTree(first.body()).get("trace");
        assertEquals(ServiceVersion.fromBuild(), trace.get("serviceVersion").asText());
        assertEquals(digest, trace.get("requestDigest").asText());
        // A changed value is another request.
        HttpResponse<String> other = post("/v1/designs", DESIGN.replace("1.5}", "2.5}"));
        assertFalse(
                digest.equals(other.headers().firstValue(Trace.DIGEST_HEADER).orElseThrow()));
    }

    @Test
    void aProblemStatesTheDigestOnlyWhenTheRequestDecoded() throws Exception {
        HttpResponse<String> infeasible = post("/v1/designs", DESIGN.replace("1.5}", "-1}"));
        assertEquals(400, infeasible.statusCode(), infeasible.body());
        assertTrue(infeasible.headers().firstValue(Trace.DIGEST_HEADER).isPresent());
        assertTrue(infeasible.headers().firstValue(Trace.VERSION_HEADER).isPresent());
        // Regression: a plant with a field of another form decodes only to be refused; it was a 500 (its decoded
        // value has no JSON form to digest) and is the 400 naming the field, without a digest.
        HttpResponse<String> otherForm = post(
                "/v1/designs",
                "{\"plant\":{\"form\":\"stateSpace\",\"a\":[[0,1],[-4,-0.4]],\"b2\":[0,2],\"mass\":3},"
                        + "\"spec\":{\"settlingTime\":0.25,\"overshootPercent\":1}}");
        assertEquals(400, otherForm.statusCode(), otherForm.body());
        assertTrue(otherForm.body().contains("/plant/mass"), otherForm.body());
        assertTrue(otherForm.headers().firstValue(Trace.DIGEST_HEADER).isEmpty());
        HttpResponse<String> malformed = post("/v1/designs", "{\"plant\":");
        assertEquals(400, malformed.statusCode());
        assertTrue(malformed.headers().firstValue(Trace.DIGEST_HEADER).isEmpty());
        assertTrue(malformed.headers().firstValue(Trace.VERSION_HEADER).isPresent());
    }

    @Test
    void aBatchStatesTheEnvelopeDigestAndEachDesignItsOwn() throws Exception {
        String batch = "{\"items\":[" + DESIGN + "," + DESIGN_RESPELLED + "]}";
        HttpResponse<String> response = post("/v1/designs/batch", batch);
        assertEquals(200, response.statusCode());
        String envelope = response.headers().firstValue(Trace.DIGEST_HEADER).orElseThrow();
        String single = post("/v1/designs", DESIGN)
                .headers()
                .firstValue(Trace.DIGEST_HEADER)
                .orElseThrow();
        String[] lines = response.body().split("\n");
        assertEquals(2, lines.length);
        for (String line : lines) {
            assertEquals(
                    single,
                    JSON.readTree(line).at("/design/trace/requestDigest").asText());
        }
        assertFalse(envelope.equals(single));
        assertEquals(new RequestDigest(JSON).of(JSON.readTree(batch)), envelope);
    }

    @Test
    void exportedControllersStateTheVersionAndTheDigest() throws Exception {
        String body = "{\"design\":" + DESIGN + ",\"samplePeriod\":0.001,\"actuatorLimit\":10}";
        for (String format : new String[] {"c-header", "c-source", "structured-text", "plcopen-xml"}) {
            HttpResponse<String> code = post("/v1/designs/controllers/" + format, body);
            assertEquals(200, code.statusCode(), code.body());
            String digest = code.headers().firstValue(Trace.DIGEST_HEADER).orElseThrow();
            assertTrue(code.body().contains("Service version: " + ServiceVersion.fromBuild()), code.body());
            assertTrue(code.body().contains("Request digest: " + digest), code.body());
        }
        HttpResponse<String> parameters = post("/v1/designs/controllers/parameters", body);
        assertEquals(
                parameters.headers().firstValue(Trace.DIGEST_HEADER).orElseThrow(),
                JSON.readTree(parameters.body()).at("/trace/requestDigest").asText());
    }
}
