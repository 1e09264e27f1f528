package com.loopwright.service;

import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.time.Duration;

/**
 * Container health check without curl: GET http://127.0.0.1:$LOOPWRIGHT_PORT/health, exit 0 on 200, else 1.
 */
public final class HealthProbe {

    private HealthProbe() {}

    public static void main(String[] args) {
        String port = System.getenv().getOrDefault("LOOPWRIGHT_PORT", String.valueOf(ServiceConfig.DEFAULT_PORT));
        try {
            HttpResponse<Void> response = HttpClient.newHttpClient()
                    .send(
                            HttpRequest.newBuilder(URI.create("http://127.0.0.1:" + port + "/health"))
                                    .timeout(Duration.ofSeconds(2))
                                    .build(),
                            HttpResponse.BodyHandlers.discarding());
            System.exit(response.statusCode() == 200 ? 0 : 1);
        } catch (Exception e) {
            System.exit(1);
        }
    }
}
