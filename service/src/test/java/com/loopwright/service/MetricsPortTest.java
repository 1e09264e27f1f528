package com.loopwright.service;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.time.Duration;
import java.util.Map;
import org.eclipse.jetty.server.Connector;
import org.eclipse.jetty.server.ServerConnector;
import org.junit.jupiter.api.Test;

/**
 * LOOPWRIGHT_METRICS_PORT: /metrics moves to a management port of its own (a NetworkPolicy admits by port), the
 * main port answers 404 there, the management port serves nothing else. Unset: /metrics stays on the main port.
 */
class MetricsPortTest {

    private static final HttpClient HTTP =
            HttpClient.newBuilder().connectTimeout(Duration.ofSeconds(5)).build();

    private static HttpResponse<String> get(int port, String path) throws Exception {
        return HTTP.send(
                HttpRequest.newBuilder(URI.create("http://127.0.0.1:" + port + path))
                        .timeout(Duration.ofSeconds(30))
                        .GET()
                        .build(),
                HttpResponse.BodyHandlers.ofString());
    }

    private static int managementPort(LiveServer server) {
        for (Connector connector : server.app().jettyServer().server().getConnectors()) {
            if (LoopwrightApp.METRICS_CONNECTOR.equals(connector.getName())) {
                return ((ServerConnector) connector).getLocalPort();
            }
        }
        return -1;
    }

    @Test
    void metricsMoveToTheManagementPortWhenItIsSet() throws Exception {
        ServiceConfig config =
                ServiceConfig.fromEnvironment(Map.of("LOOPWRIGHT_PORT", "0", "LOOPWRIGHT_METRICS_PORT", "0"));
        try (LiveServer server = LiveServer.start(config)) {
            int main = server.app().port();
            int management = managementPort(server);
            assertTrue(management > 0 && management != main, "a port of its own: " + management);
            HttpResponse<String> scrape = get(management, "/metrics");
            assertEquals(200, scrape.statusCode());
            assertTrue(PrometheusText.parse(scrape.body()).sum("jvm_threads_current", Map.of()) > 0);
            assertEquals(404, get(main, "/metrics").statusCode(), "not on the main port");
            assertEquals(404, get(management, "/health").statusCode(), "nothing else on the management port");
            assertEquals(404, get(management, "/openapi.yaml").statusCode());
            assertEquals(200, get(main, "/health").statusCode());
            // The scrapes are counted like every request (route label /metrics).
            assertTrue(PrometheusText.parse(get(management, "/metrics").body())
                            .sum("loopwright_http_requests_total", Map.of("route", "/metrics", "status", "200"))
                    >= 1);
        }
    }

    @Test
    void unsetKeepsMetricsOnTheMainPort() throws Exception {
        try (LiveServer server = LiveServer.start()) {
            assertEquals(-1, managementPort(server));
            assertEquals(200, get(server.app().port(), "/metrics").statusCode());
        }
    }

    @Test
    void theManagementPortMustDifferFromTheMainPort() {
        IllegalArgumentException same = assertThrows(
                IllegalArgumentException.class,
                () -> ServiceConfig.fromEnvironment(
                        Map.of("LOOPWRIGHT_PORT", "8080", "LOOPWRIGHT_METRICS_PORT", "8080")));
        assertTrue(same.getMessage().contains("differ"), same.getMessage());
        assertThrows(
                IllegalArgumentException.class,
                () -> ServiceConfig.fromEnvironment(Map.of("LOOPWRIGHT_METRICS_PORT", "70000")));
    }
}
