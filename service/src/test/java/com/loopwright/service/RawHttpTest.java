package com.loopwright.service;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.ByteArrayOutputStream;
import java.io.InputStream;
import java.io.OutputStream;
import java.net.Socket;
import java.nio.charset.StandardCharsets;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * Requests a well-behaved client cannot send (bad request lines, bad percent-encoding, oversized headers,
 * garbage) written straight to the socket: Jetty's own answers are problem+json too, with no HTML or stack.
 */
class RawHttpTest extends LiveServerTest {

    private final Contract contract = Contract.load();

    private static String exchange(String request) throws Exception {
        try (Socket socket = new Socket("127.0.0.1", server.base().getPort())) {
            socket.setSoTimeout(10_000);
            OutputStream out = socket.getOutputStream();
            out.write(request.getBytes(StandardCharsets.ISO_8859_1));
            out.flush();
            socket.shutdownOutput();
            InputStream in = socket.getInputStream();
            ByteArrayOutputStream reply = new ByteArrayOutputStream();
            in.transferTo(reply);
            return reply.toString(StandardCharsets.ISO_8859_1);
        }
    }

    @ParameterizedTest
    @ValueSource(
            strings = {
                "GET /%ZZ HTTP/1.1\r\nHost: x\r\nConnection: close\r\n\r\n",
                "GET /health HTTP/1.1\r\nHost: x\r\nX-Big: %BIG%\r\nConnection: close\r\n\r\n",
                "BLAH\r\n\r\n",
                "GET /health HTTP/9.9\r\nHost: x\r\n\r\n",
                "POST /v1/designs HTTP/1.1\r\nHost: x\r\nContent-Length: -5\r\nConnection: close\r\n\r\n",
                "GET /health HTTP/1.1\r\nHost: x\r\nBad Header\r\nConnection: close\r\n\r\n",
            })
    void jettyLevelErrorsAreProblems(String raw) throws Exception {
        String reply = exchange(raw.replace("%BIG%", "y".repeat(64 * 1024)));
        String[] parts = reply.split("\r\n\r\n", 2);
        int status = Integer.parseInt(parts[0].split(" ")[1]);
        // 505 (an HTTP version Jetty does not speak) is the protocol's own answer, not a service failure.
        assertTrue(status >= 400 && status < 500 || status == 505, parts[0]);
        assertTrue(parts[0].toLowerCase().contains("content-type: application/problem+json"), parts[0]);
        assertTrue(
                parts[0].toLowerCase()
                        .contains("loopwright-version: "
                                + com.loopwright.api.endpoint.ServiceVersion.fromBuild()
                                        .toLowerCase()),
                parts[0]);
        JsonNode problem = new ObjectMapper().readTree(parts[1].trim());
        assertEquals(status, problem.get("status").asInt());
        String violations = contract.violations("/v1/designs", "post", 400, "application/problem+json", problem);
        assertTrue(violations.isEmpty(), violations + " in " + problem);
        assertTrue(!reply.contains("<html") && !reply.contains("Exception") && !reply.contains("org.eclipse"), reply);
    }
}
