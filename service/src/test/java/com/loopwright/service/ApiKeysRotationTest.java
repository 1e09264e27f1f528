package com.loopwright.service;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.examples.DesignClient;
import java.io.IOException;
import java.net.http.HttpRequest;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.attribute.PosixFilePermissions;
import java.time.Duration;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The API keys file is re-read when it changes, the way a mounted Kubernetes secret changes: the kubelet writes the
 * new content into a fresh directory and swaps the {@code ..data} symbolic link to it (the atomic-writer layout,
 * from the Kubernetes documentation on secret volumes, from memory). Keys of LOOPWRIGHT_API_KEYS stay; a file
 * that turns bad keeps the keys in force.
 */
class ApiKeysRotationTest {

    private static final String OLD_KEY = "conveyor-line-key-old-0001";
    private static final String NEW_KEY = "conveyor-line-key-new-0002";
    private static final String FIXED_KEY = "operator-console-key-0003";
    /** The poll interval of the test (production polls every ApiKeysFile.POLL_INTERVAL_MILLIS). */
    private static final long POLL_MILLIS = 50;
    /** How long a rotation may take to be seen: many poll intervals. */
    private static final long SEEN_WITHIN_MILLIS = 5_000;

    @TempDir
    Path secret;

    private int generation;

    /** Writes a new generation directory and swaps ..data to it (a rename over the old link: atomic). */
    private void publish(String content) throws IOException {
        Path dir = secret.resolve("..generation-" + (++generation));
        Files.createDirectory(dir);
        Files.writeString(dir.resolve("keys"), content, StandardCharsets.UTF_8);
        Path next = secret.resolve("..data_tmp");
        Files.deleteIfExists(next);
        Files.createSymbolicLink(next, dir.getFileName());
        Files.move(next, secret.resolve("..data"), StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
        if (!Files.exists(secret.resolve("keys"), java.nio.file.LinkOption.NOFOLLOW_LINKS)) {
            Files.createSymbolicLink(secret.resolve("keys"), Path.of("..data", "keys"));
        }
    }

    private static int status(LiveServer server, String key) {
        return server.send(
                        HttpRequest.newBuilder(server.base().resolve("/v1/designs"))
                                .timeout(Duration.ofSeconds(30))
                                .header("Content-Type", "application/json")
                                .header("X-Api-Key", key)
                                .POST(HttpRequest.BodyPublishers.ofString(DesignClient.INDEXING_AXIS))
                                .build(),
                        "/v1/designs",
                        "post")
                .status();
    }

    /** Polls the server until {@code key} gets {@code expected} or the time is up; returns the last status. */
    private static int awaitStatus(LiveServer server, String key, int expected) throws InterruptedException {
        long end = System.nanoTime() + SEEN_WITHIN_MILLIS * 1_000_000;
        int seen = status(server, key);
        while (seen != expected && System.nanoTime() < end) {
            Thread.sleep(POLL_MILLIS);
            seen = status(server, key);
        }
        return seen;
    }

    private LiveServer start() {
        ServiceConfig config = ServiceConfig.fromEnvironment(Map.of(
                "LOOPWRIGHT_PORT",
                "0",
                "LOOPWRIGHT_API_KEYS",
                FIXED_KEY,
                "LOOPWRIGHT_API_KEYS_FILE",
                secret.resolve("keys").toString()));
        return LiveServer.started(LoopwrightApp.create(config, null, FatalErrors.haltingTheJvm(), POLL_MILLIS));
    }

    @Test
    void aRotatedSecretReplacesTheFileKeysWithoutARestart() throws Exception {
        publish("# line 3 controllers\n" + OLD_KEY + "\n");
        try (LiveServer server = start()) {
            assertEquals(200, status(server, OLD_KEY));
            assertEquals(403, status(server, NEW_KEY));
            publish(NEW_KEY + "\n");
            assertEquals(403, awaitStatus(server, OLD_KEY, 403), "the old key is refused after the rotation");
            assertEquals(200, status(server, NEW_KEY), "the new key is accepted");
            assertEquals(200, status(server, FIXED_KEY), "LOOPWRIGHT_API_KEYS stays");
            assertTrue(pollerAlive(), "the key file is polled while the server runs");
        }
        for (int i = 0; i < 100 && pollerAlive(); i++) {
            Thread.sleep(10);
        }
        assertTrue(!pollerAlive(), "the poller stops with the server");
    }

    private static boolean pollerAlive() {
        return Thread.getAllStackTraces().keySet().stream()
                .anyMatch(thread -> thread.getName().equals("loopwright-api-keys-file") && thread.isAlive());
    }

    @Test
    void aFileThatTurnsBadKeepsTheKeysInForce() throws Exception {
        publish(OLD_KEY + "\n");
        try (LiveServer server = start()) {
            assertEquals(200, status(server, OLD_KEY));
            // Each bad version is published, then a good one: the good one being seen proves the poller read past
            // the bad one, which must not have changed the keys in between.
            for (String bad :
                    new String[] {"", "# all keys removed\n", "short\n", NEW_KEY + "\nhas a space in it!!\n"}) {
                publish(bad);
                Thread.sleep(10 * POLL_MILLIS);
                assertEquals(200, status(server, OLD_KEY), "a bad file keeps the old key: '" + bad + "'");
                assertEquals(403, status(server, NEW_KEY), "a bad file adds no key: '" + bad + "'");
            }
            // Unreadable: the file's permissions removed (root reads anyway, so also break the link).
            Path current = secret.resolve("..generation-" + generation).resolve("keys");
            Files.setPosixFilePermissions(current, PosixFilePermissions.fromString("---------"));
            Files.delete(secret.resolve("..data"));
            Thread.sleep(10 * POLL_MILLIS);
            assertEquals(200, status(server, OLD_KEY), "an unreadable file keeps the old key");
            assertTrue(status(server, "nobody-has-this-key-000") == 403);
            // The file comes back valid: the poller recovers.
            publish(NEW_KEY + "\n");
            assertEquals(200, awaitStatus(server, NEW_KEY, 200), "a valid file is used again");
            assertEquals(403, status(server, OLD_KEY));
        }
    }
}
