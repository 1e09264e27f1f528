package com.loopwright.service;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Locale;
import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * Random plants, gains and options (seeded) against the live server: every answer is a 200 or a documented 4xx
 * problem, never a 500, and LiveServer checks each body against the contract.
 */
class RandomVerificationRequestsTest {

    @Test
    void randomRequestsNeverFailTheService() {
        Random random = new Random(4242);
        int ok = 0;
        try (LiveServer server = LiveServer.start()) {
            for (int i = 0; i < 25; i++) {
                double a0 = random.nextBoolean()
                        ? 0
                        : Math.pow(10, -2 + 6 * random.nextDouble()) * (random.nextBoolean() ? 1 : -1);
                double a1 = (random.nextDouble() - 0.3) * Math.pow(10, -2 + 4 * random.nextDouble());
                double b = Math.pow(10, -3 + 8 * random.nextDouble()) * (random.nextBoolean() ? 1 : -1);
                double k1 = Math.pow(10, -6 + 12 * random.nextDouble())
                        * (random.nextDouble() < 0.9 ? 1 : -1)
                        * Math.signum(b);
                double k2 = Math.pow(10, -6 + 12 * random.nextDouble())
                        * (random.nextDouble() < 0.9 ? 1 : -1)
                        * Math.signum(b);
                String body = String.format(
                        Locale.ROOT,
                        "{\"plant\":{\"form\":\"canonical\",\"a0\":%.6g,\"a1\":%.6g,\"b\":%.6g,\"d\":%.6g},"
                                + "\"gain\":{\"k1\":%.6g,\"k2\":%.6g,\"referenceGain\":%.6g},"
                                + "\"spec\":{\"settlingTime\":%.6g,\"overshootPercent\":%.6g},"
                                + "\"verify\":{\"uncertainty\":{\"a1\":{\"spreadPercent\":%.3g},\"monteCarloSamples\":5},"
                                + "\"disturbances\":[{\"shape\":\"sinusoid\",\"amplitude\":1,\"frequency\":%.6g}],"
                                + "\"actuatorLimit\":%.6g,\"sampling\":{\"samplePeriod\":%.6g},\"inputDelay\":%.6g,"
                                + "\"frequencyPoints\":10,\"timeSeriesPoints\":20}}",
                        a0,
                        a1,
                        b,
                        random.nextDouble() * 10,
                        k1,
                        k2,
                        k1,
                        Math.pow(10, -3 + 4 * random.nextDouble()),
                        1 + 20 * random.nextDouble(),
                        50 * random.nextDouble(),
                        Math.pow(10, -2 + 4 * random.nextDouble()),
                        Math.pow(10, -2 + 3 * random.nextDouble()),
                        Math.pow(10, -5 + 3 * random.nextDouble()),
                        Math.pow(10, -5 + 3 * random.nextDouble()));
                LiveServer.Reply reply = server.post("/v1/verifications", body);
                assertTrue(
                        reply.status() == 200 || reply.status() == 400 || reply.status() == 422,
                        reply.status() + " for " + body + ": " + reply.text());
                if (reply.status() == 200) {
                    ok++;
                }
            }
        }
        assertTrue(ok > 0, "some random loops verify");
        System.out.println("random verifications answered 200: " + ok + " of 25");
    }
}
