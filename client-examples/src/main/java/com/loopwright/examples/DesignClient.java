package com.loopwright.examples;

import java.io.IOException;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.time.Duration;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * A copyable client on the bare JDK (java.net.http): designs the gains of a packaging-line indexing axis and
 * prints the law. Run: java DesignClient.java [base-url]. Exit status 0 only for a certified design.
 *
 * <p>Production callers should parse the body with their JSON library; a pattern suffices for this demo.
 */
public final class DesignClient {

    /** The README's scenario: an indexing axis, 0.15 s settling to 2%, at most 1.5% overshoot. */
    public static final String INDEXING_AXIS = """
            {"plant":{"a0":0,"a1":0.48,"b":400,"d":400},"spec":{"settlingTime":0.15,"overshootPercent":1.5}}""";

    private final HttpClient http = HttpClient.newBuilder().connectTimeout(Duration.ofSeconds(5)).build();
    private final URI base;

    public DesignClient(URI base) {
        this.base = base;
    }

    /** Result of one design call: the status and the body as received. */
    public record Reply(int status, String body) {
        public boolean certified() {
            return status == 200 && body.contains("\"certified\":true");
        }

        /** A top-level-or-nested numeric field by name, e.g. "k1"; NaN when absent. */
        public double number(String field) {
            Matcher m = Pattern.compile("\"" + Pattern.quote(field) + "\":(-?[0-9.eE+-]+)").matcher(body);
            return m.find() ? Double.parseDouble(m.group(1)) : Double.NaN;
        }
    }

    public Reply design(String requestJson) throws IOException, InterruptedException {
        HttpRequest request = HttpRequest.newBuilder(base.resolve("/v1/designs"))
                .timeout(Duration.ofSeconds(10))
                .header("Content-Type", "application/json")
                .POST(HttpRequest.BodyPublishers.ofString(requestJson))
                .build();
        HttpResponse<String> response = http.send(request, HttpResponse.BodyHandlers.ofString());
        return new Reply(response.statusCode(), response.body());
    }

    public static void main(String[] args) throws IOException, InterruptedException {
        String url = args.length > 0 ? args[0] : System.getenv().getOrDefault("LOOPWRIGHT_URL", "http://localhost:8080");
        Reply reply = new DesignClient(URI.create(url)).design(INDEXING_AXIS);
        if (!reply.certified()) {
            System.err.println("HTTP " + reply.status() + ": " + reply.body());
            System.exit(1);
        }
        System.out.printf("u = %.6g*r - (%.6g*x1 + %.6g*x2), gamma = %.6g (gamma_min %.6g)%n",
                reply.number("referenceGain"), reply.number("k1"), reply.number("k2"), reply.number("gamma"),
                reply.number("gammaMin"));
        System.out.printf("simulated: settling %.6g s, overshoot %.4g %%, peak control %.6g%n",
                reply.number("settlingTime"), reply.number("overshootPercent"), reply.number("peakControl"));
    }
}
