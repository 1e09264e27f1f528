package com.loopwright.service;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.net.Socket;
import java.nio.charset.StandardCharsets;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;

/** A loopback socket that writes raw HTTP/1.1 and reads one response (status, headers, a Content-Length body). */
final class RawExchange implements AutoCloseable {

    /** Longest status line plus headers read back. */
    private static final int MAX_HEAD_BYTES = 64 * 1024;

    private static final ObjectMapper JSON = new ObjectMapper();

    private final Socket socket;
    private final InputStream in;
    private final OutputStream out;

    RawExchange(int port, int readTimeoutMillis) throws IOException {
        socket = new Socket("127.0.0.1", port);
        socket.setSoTimeout(readTimeoutMillis);
        in = socket.getInputStream();
        out = socket.getOutputStream();
    }

    RawExchange send(String text) throws IOException {
        return send(text.getBytes(StandardCharsets.ISO_8859_1));
    }

    RawExchange send(byte[] bytes) throws IOException {
        out.write(bytes);
        out.flush();
        return this;
    }

    /** The raw input, e.g. to see the server close the connection (read() == -1). */
    InputStream in() {
        return in;
    }

    boolean hasReply() throws IOException {
        return in.available() > 0;
    }

    /** One response: status line, headers (names lower-cased), and the body of its Content-Length (or to EOF). */
    Reply read() throws IOException {
        ByteArrayOutputStream head = new ByteArrayOutputStream();
        int matched = 0;
        while (matched < 4) {
            int b = in.read();
            if (b < 0) {
                throw new IOException("connection closed after " + head.size() + " bytes: " + head);
            }
            head.write(b);
            matched = (b == (matched % 2 == 0 ? '\r' : '\n')) ? matched + 1 : (b == '\r' ? 1 : 0);
            if (head.size() > MAX_HEAD_BYTES) {
                throw new IOException("response head over " + MAX_HEAD_BYTES + " bytes");
            }
        }
        String[] lines = head.toString(StandardCharsets.ISO_8859_1).split("\r\n");
        int status = Integer.parseInt(lines[0].split(" ")[1]);
        Map<String, String> headers = new TreeMap<>();
        for (int i = 1; i < lines.length; i++) {
            int colon = lines[i].indexOf(':');
            if (colon > 0) {
                headers.put(
                        lines[i].substring(0, colon).trim().toLowerCase(Locale.ROOT),
                        lines[i].substring(colon + 1).trim());
            }
        }
        byte[] body;
        if (status / 100 == 1) {
            body = new byte[0];
        } else if (headers.containsKey("content-length")) {
            body = in.readNBytes(Integer.parseInt(headers.get("content-length")));
        } else {
            body = in.readAllBytes();
        }
        return new Reply(status, headers, new String(body, StandardCharsets.UTF_8));
    }

    @Override
    public void close() throws IOException {
        socket.close();
    }

    record Reply(int status, Map<String, String> headers, String body) {
        String header(String name) {
            return headers.get(name.toLowerCase(Locale.ROOT));
        }

        JsonNode json() throws IOException {
            return JSON.readTree(body);
        }
    }
}
