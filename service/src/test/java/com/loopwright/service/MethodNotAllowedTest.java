package com.loopwright.service;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import org.junit.jupiter.api.Test;

/**
 * A 405 names the methods the path takes: RFC 9110, section 15.5.6 ("The origin server MUST generate an Allow
 * header field in a 405 response containing a list of the target resource's currently supported methods"), and the
 * problem's detail says which one to send.
 */
class MethodNotAllowedTest {

    private static RawExchange.Reply send(LiveServer server, String method, String path) throws IOException {
        try (RawExchange socket = new RawExchange(server.app().port(), 5_000)) {
            return socket.send(method + " " + path + " HTTP/1.1\r\nHost: 127.0.0.1\r\nConnection: close\r\n"
                            + "Content-Length: 0\r\n\r\n")
                    .read();
        }
    }

    @Test
    void aWrongMethodIsToldTheRightOne() throws IOException {
        try (LiveServer server = LiveServer.start()) {
            String[][] cases = {
                {"GET", "/v1/designs", "POST"},
                {"DELETE", "/v1/designs/batch", "POST"},
                {"PUT", "/v1/designs/plots/bode", "POST"},
                {"GET", "/v1/designs/controllers/c-source", "POST"},
                {"POST", "/health", "GET"},
                {"PUT", "/openapi.yaml", "GET"},
            };
            for (String[] c : cases) {
                RawExchange.Reply reply = send(server, c[0], c[1]);
                assertEquals(405, reply.status(), c[0] + " " + c[1]);
                assertEquals(c[2], reply.header("Allow"), c[0] + " " + c[1]);
                assertTrue(reply.body().contains(c[0] + " is not supported on this path; send " + c[2]), reply.body());
                assertTrue(reply.body().contains("method-not-allowed"), reply.body());
            }
        }
    }

    @Test
    void aPathNobodyServesIsNotFoundWithoutAnAllowHeader() throws IOException {
        try (LiveServer server = LiveServer.start()) {
            RawExchange.Reply reply = send(server, "GET", "/v1/nothing-here");
            assertEquals(404, reply.status());
            assertNull(reply.header("Allow"));
        }
    }
}
