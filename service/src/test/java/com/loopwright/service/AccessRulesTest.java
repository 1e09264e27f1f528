package com.loopwright.service;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/**
 * Who may call what, on a server with API keys, with CORS on and off: the status of each method and path, written
 * down from the service before the route table drove registration, CORS and the key check (the table must not
 * change one of them). Raw sockets, so that any method and path can be sent; a POST carries a small body, so it
 * passes through the HTTP layer's body gate.
 */
class AccessRulesTest {

    private static final String KEY = "indexing-axis-key-0001";
    private static final String ORIGIN = "https://scada.example";

    /** method, path, status without a key; then the status with the key (- when not sent). */
    private static final String RULES = """
            POST    /v1/designs              401 400
            GET     /v1/designs              401 405
            DELETE  /v1/designs              401 405
            HEAD    /v1/designs              401 -
            POST    /v1/designs/             401 400
            POST    /v1/nothing              401 404
            GET     /v1/                     401 404
            GET     /v1                      404 404
            GET     /v1x                     404 -
            POST    /v1/designs/plots/bode   401 400
            POST    /v1/designs/plots/       401 -
            GET     /v1/designs/batch/x      401 404
            POST    /V1/designs              404 -
            POST    //v1/designs             404 -
            GET     /health                  200 200
            HEAD    /health                  200 -
            GET     /health/ready            200 -
            GET     /openapi.yaml            200 -
            GET     /                        200 -
            GET     /nothing                 404 -
            PUT     /metrics                 405 -
            OPTIONS /health                  405 -
            OPTIONS /                        405 -
            OPTIONS /v1/nothing              404 -
            """;

    /** OPTIONS on a keyed route: a preflight (no key needed) when CORS is on, else not a method of the path. */
    private static final String PREFLIGHTS = """
            /v1/designs
            /v1/designs/batch
            /v1/models/fit
            /v1/designs/high-order
            /v1/verifications
            /v1/designs/plots/bode
            /v1/designs/controllers/c-source
            """;

    private static LiveServer keyed(boolean cors) {
        Map<String, String> environment = new HashMap<>();
        environment.put("LOOPWRIGHT_PORT", "0");
        environment.put("LOOPWRIGHT_API_KEYS", KEY);
        if (cors) {
            environment.put("LOOPWRIGHT_CORS_ORIGINS", ORIGIN);
        }
        return LiveServer.start(ServiceConfig.fromEnvironment(environment));
    }

    private static RawExchange.Reply send(LiveServer server, String method, String path, String origin, String key)
            throws IOException {
        String body = method.equals("POST") ? "{}" : "";
        try (RawExchange socket = new RawExchange(server.app().port(), 5_000)) {
            return socket.send(method + " " + path + " HTTP/1.1\r\nHost: 127.0.0.1\r\nOrigin: " + origin
                            + "\r\nConnection: close\r\nContent-Type: application/json\r\nContent-Length: "
                            + body.length()
                            + (key == null ? "" : "\r\nX-Api-Key: " + key) + "\r\n\r\n" + body)
                    .read();
        }
    }

    @Test
    void everyPathAnswersAsBeforeWithAndWithoutTheKey() throws IOException {
        for (boolean cors : new boolean[] {true, false}) {
            List<String> wrong = new ArrayList<>();
            try (LiveServer server = keyed(cors)) {
                for (String line : RULES.strip().split("\n")) {
                    String[] rule = line.trim().split("\\s+");
                    RawExchange.Reply without = send(server, rule[0], rule[1], ORIGIN, null);
                    if (without.status() != Integer.parseInt(rule[2])) {
                        wrong.add(rule[0] + " " + rule[1] + " without key: " + without.status());
                    }
                    if (cors != (without.header("Access-Control-Allow-Origin") != null)) {
                        wrong.add(rule[0] + " " + rule[1] + " CORS header: "
                                + without.header("Access-Control-Allow-Origin"));
                    }
                    if (!rule[3].equals("-")) {
                        RawExchange.Reply with = send(server, rule[0], rule[1], ORIGIN, KEY);
                        if (with.status() != Integer.parseInt(rule[3])) {
                            wrong.add(rule[0] + " " + rule[1] + " with key: " + with.status());
                        }
                    }
                }
            }
            assertEquals(List.of(), wrong, "CORS " + (cors ? "on" : "off"));
        }
    }

    @Test
    void keyedRoutesArePreflightedWithoutAKeyOnlyWhenCorsIsOn() throws IOException {
        try (LiveServer on = keyed(true);
                LiveServer off = keyed(false)) {
            for (String path : PREFLIGHTS.strip().split("\n")) {
                RawExchange.Reply allowed = send(on, "OPTIONS", path, ORIGIN, null);
                assertEquals(204, allowed.status(), path);
                assertEquals(ORIGIN, allowed.header("Access-Control-Allow-Origin"), path);
                assertTrue(allowed.header("Access-Control-Allow-Methods").contains("POST"), path);
                assertEquals(
                        403,
                        send(on, "OPTIONS", path, "https://evil.example", null).status(),
                        path);
                assertEquals(405, send(off, "OPTIONS", path, ORIGIN, null).status(), path);
            }
        }
    }
}
