package com.loopwright.examples;

import java.io.IOException;
import java.io.PrintStream;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * A copyable client on the bare JDK (java.net.http): designs the gains of a packaging-line indexing axis and
 * prints the law. Run: java DesignClient.java [base-url]. Exit status 0 only for a certified design.
 *
 * <p>With LOOPWRIGHT_API_KEY set, the key is sent as "Authorization: Bearer &lt;key&gt;". A 503 is retried after
 * its Retry-After (at most 3 attempts, at most 10 s each). A problem answer (RFC 9457) is printed with its field
 * errors and proposals, and the exit status is non-zero.
 *
 * <p>Production callers should parse the body with their JSON library; patterns suffice for this demo.
 */
public final class DesignClient {

    /** The README's scenario: an indexing axis, 0.15 s settling to 2%, at most 1.5% overshoot. */
    public static final String INDEXING_AXIS = """
            {"plant":{"form":"canonical","a0":0,"a1":0.48,"b":400,"d":400},"spec":{"settlingTime":0.15,"overshootPercent":1.5}}""";
    /** Attempts in all when the service answers 503 (overloaded). */
    public static final int MAX_ATTEMPTS = 3;
    /** The longest wait between two attempts, whatever Retry-After says. */
    public static final int MAX_WAIT_SECONDS = 10;
    /** Field errors or proposals printed from one problem at most. */
    static final int MAX_LISTED = 100;

    private final HttpClient http =
            HttpClient.newBuilder().connectTimeout(Duration.ofSeconds(5)).build();
    private final URI base;
    private final String apiKey;

    /** A client that sends no key. */
    public DesignClient(URI base) {
        this(base, null);
    }

    /** A client that sends {@code apiKey} as a bearer token (none when null or blank). */
    public DesignClient(URI base, String apiKey) {
        this.base = base;
        this.apiKey = apiKey == null || apiKey.isBlank() ? null : apiKey.trim();
    }

    /** Result of one design call: the status and the body as received. */
    public record Reply(int status, String body) {
        public boolean certified() {
            return status == 200 && body.contains("\"certified\":true");
        }

        /** A top-level-or-nested numeric field by name, e.g. "k1"; NaN when absent. */
        public double number(String field) {
            Matcher m = Pattern.compile("\"" + Pattern.quote(field) + "\":(-?[0-9.eE+-]+)")
                    .matcher(body);
            return m.find() ? Double.parseDouble(m.group(1)) : Double.NaN;
        }

        /** The state-feedback gains gain.k (order 2: [k1, k2]); empty when absent. */
        public double[] gains() {
            Matcher m = Pattern.compile("\"k\":\\[([^\\]]*)\\]").matcher(body);
            if (!m.find() || m.group(1).isBlank()) {
                return new double[0];
            }
            String[] parts = m.group(1).split(",");
            double[] k = new double[parts.length];
            for (int i = 0; i < k.length; i++) {
                k[i] = Double.parseDouble(parts[i].trim());
            }
            return k;
        }
    }

    /** POSTs a design request; a 503 is retried after its Retry-After, {@link #MAX_ATTEMPTS} times in all. */
    public Reply design(String requestJson) throws IOException, InterruptedException {
        HttpRequest.Builder request = HttpRequest.newBuilder(base.resolve("/v1/designs"))
                .timeout(Duration.ofSeconds(10))
                .header("Content-Type", "application/json")
                .POST(HttpRequest.BodyPublishers.ofString(requestJson));
        if (apiKey != null) {
            request.header("Authorization", "Bearer " + apiKey);
        }
        for (int attempt = 1; ; attempt++) {
            HttpResponse<String> response = http.send(request.build(), HttpResponse.BodyHandlers.ofString());
            if (response.statusCode() != 503 || attempt >= MAX_ATTEMPTS) {
                return new Reply(response.statusCode(), response.body());
            }
            long seconds = retryAfterSeconds(
                    response.headers().firstValue("Retry-After").orElse(null));
            System.err.printf(
                    "HTTP 503 (overloaded): retrying in %d s (attempt %d of %d)%n", seconds, attempt + 1, MAX_ATTEMPTS);
            Thread.sleep(seconds * 1000);
        }
    }

    /** Retry-After in seconds (RFC 9110), capped; an HTTP date or a missing header waits 1 s. */
    public static long retryAfterSeconds(String value) {
        if (value == null || !value.strip().matches("[0-9]+")) {
            return 1;
        }
        String digits = value.strip();
        return digits.length() > 9 ? MAX_WAIT_SECONDS : Math.min(Long.parseLong(digits), MAX_WAIT_SECONDS);
    }

    /** Prints an RFC 9457 problem: status, title and detail, then each field error and each proposal. */
    public static void printProblem(Reply reply, PrintStream out) {
        String top = FlatJson.withoutArrays(reply.body());
        String title = FlatJson.string(top, "title");
        if (title == null) {
            out.println("HTTP " + reply.status() + ": " + reply.body());
            return;
        }
        String detail = FlatJson.string(top, "detail");
        out.println("HTTP " + reply.status() + " " + title + ": " + (detail == null ? "" : detail));
        for (String error : FlatJson.objects(reply.body(), "errors")) {
            out.println("  field " + FlatJson.string(error, "pointer") + ": " + FlatJson.string(error, "detail"));
        }
        for (String proposal : FlatJson.objects(reply.body(), "proposals")) {
            String note = FlatJson.string(proposal, "note");
            out.println("  proposal " + FlatJson.string(proposal, "pointer") + " = "
                    + FlatJson.number(proposal, "value") + (note == null ? "" : " (" + note + ")"));
        }
    }

    public static void main(String[] args) throws IOException, InterruptedException {
        String url =
                args.length > 0 ? args[0] : System.getenv().getOrDefault("LOOPWRIGHT_URL", "http://localhost:8080");
        Reply reply = new DesignClient(URI.create(url), System.getenv("LOOPWRIGHT_API_KEY")).design(INDEXING_AXIS);
        if (reply.status() != 200) {
            printProblem(reply, System.err);
            System.exit(1);
        }
        if (!reply.certified()) {
            System.err.println("the design is not certified");
            System.exit(1);
        }
        System.out.printf(
                "u = %.6g*r - (%.6g*x1 + %.6g*x2), gamma = %.6g (gamma_min %.6g)%n",
                reply.number("referenceGain"),
                reply.gains()[0],
                reply.gains()[1],
                reply.number("gamma"),
                reply.number("gammaMin"));
        System.out.printf(
                "simulated: settling %.6g s, overshoot %.4g %%, peak control %.6g%n",
                reply.number("settlingTime"), reply.number("overshootPercent"), reply.number("peakControl"));
    }

    /** Just enough JSON reading for a problem's flat members and its arrays of flat objects. */
    static final class FlatJson {

        private FlatJson() {}

        /** The unescaped string member {@code name} of a flat object text, or null. */
        static String string(String json, String name) {
            Matcher m = Pattern.compile("\"" + Pattern.quote(name) + "\"\\s*:\\s*\"((?:[^\"\\\\]|\\\\.)*)\"")
                    .matcher(json);
            return m.find() ? unescape(m.group(1)) : null;
        }

        /** The number member {@code name} as written, or null. */
        static String number(String json, String name) {
            Matcher m = Pattern.compile("\"" + Pattern.quote(name) + "\"\\s*:\\s*(-?[0-9.eE+-]+)")
                    .matcher(json);
            return m.find() ? m.group(1) : null;
        }

        /** The text with the contents of every array removed (outside strings): the top-level members only. */
        static String withoutArrays(String json) {
            StringBuilder out = new StringBuilder();
            int depth = 0;
            boolean inString = false;
            for (int i = 0; i < json.length(); i++) {
                char c = json.charAt(i);
                if (inString) {
                    if (c == '\\') {
                        if (depth == 0) {
                            out.append(c);
                        }
                        c = ++i < json.length() ? json.charAt(i) : c;
                    } else if (c == '"') {
                        inString = false;
                    }
                } else if (c == '"') {
                    inString = true;
                } else if (c == '[') {
                    depth++;
                } else if (c == ']') {
                    depth--;
                    continue;
                }
                if (depth == 0) {
                    out.append(c);
                }
            }
            return out.toString();
        }

        /** Each object of the array member {@code name} as text (its objects hold no nested objects). */
        static List<String> objects(String json, String name) {
            List<String> objects = new ArrayList<>();
            Matcher start = Pattern.compile("\"" + Pattern.quote(name) + "\"\\s*:\\s*\\[")
                    .matcher(json);
            if (!start.find()) {
                return objects;
            }
            boolean inString = false;
            int open = -1;
            int depth = 0;
            for (int i = start.end(); i < json.length() && objects.size() < MAX_LISTED; i++) {
                char c = json.charAt(i);
                if (inString) {
                    if (c == '\\') {
                        i++;
                    } else if (c == '"') {
                        inString = false;
                    }
                } else if (c == '"') {
                    inString = true;
                } else if (c == '{') {
                    if (depth++ == 0) {
                        open = i;
                    }
                } else if (c == '}' && depth > 0) {
                    if (--depth == 0) { // an item's own closing brace, not a nested object's
                        objects.add(json.substring(open, i + 1));
                    }
                } else if (c == ']' && depth == 0) {
                    break;
                }
            }
            return objects;
        }

        private static String unescape(String text) {
            StringBuilder out = new StringBuilder();
            for (int i = 0; i < text.length(); i++) {
                char c = text.charAt(i);
                if (c != '\\' || i + 1 >= text.length()) {
                    out.append(c);
                    continue;
                }
                char e = text.charAt(++i);
                switch (e) {
                    case 'n' -> out.append('\n');
                    case 't' -> out.append('\t');
                    case 'r' -> out.append('\r');
                    case 'b' -> out.append('\b');
                    case 'f' -> out.append('\f');
                    case 'u' -> {
                        if (i + 4 < text.length()) {
                            out.append((char) Integer.parseInt(text.substring(i + 1, i + 5), 16));
                            i += 4;
                        }
                    }
                    default -> out.append(e);
                }
            }
            return out.toString();
        }
    }
}
