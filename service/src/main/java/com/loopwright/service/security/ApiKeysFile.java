package com.loopwright.service.security;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.concurrent.Executors;
import java.util.concurrent.ScheduledExecutorService;
import java.util.concurrent.TimeUnit;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;

/**
 * The API keys file (LOOPWRIGHT_API_KEYS_FILE): one key per line, blank lines and {@code #} comments ignored. Its
 * content is polled every {@link #POLL_INTERVAL_MILLIS} ms on one daemon thread, so that a mounted Kubernetes
 * secret, which the kubelet updates by swapping a symbolic link, rotates the keys without a restart. A changed
 * file with valid keys puts them in force at once, together with the fixed keys of LOOPWRIGHT_API_KEYS; a file
 * that cannot be read, or holds no key or an invalid one, keeps the keys in force and logs a warning (once per
 * content): a rotation never turns authentication off.
 */
public final class ApiKeysFile implements AutoCloseable {

    /** How often the file's content is compared with the last one read [ms]. */
    public static final long POLL_INTERVAL_MILLIS = 5_000;
    /** A key file larger than this is not read (bytes): 64 keys of 512 characters fit many times over. */
    public static final int MAX_FILE_BYTES = 256 * 1024;

    private static final Logger LOG = LoggerFactory.getLogger(ApiKeysFile.class);

    private final Path file;
    private final List<String> fixedKeys;
    private final ApiKeys keys;
    private final ScheduledExecutorService poller;
    /** The content last seen (valid or not), or null when the file was unreadable last time. Poller thread only. */
    private byte[] lastContent;

    private boolean lastUnreadable;

    /**
     * Starts polling.
     *
     * @param file      the key file (followed through symbolic links on every read)
     * @param fixedKeys keys from LOOPWRIGHT_API_KEYS, always in force
     * @param keys      the key set to update
     * @param pollMillis the poll interval (production: {@link #POLL_INTERVAL_MILLIS})
     */
    public ApiKeysFile(Path file, List<String> fixedKeys, ApiKeys keys, long pollMillis) {
        this.file = file;
        this.fixedKeys = List.copyOf(fixedKeys);
        this.keys = keys;
        this.lastContent = readQuietly(file);
        this.poller = Executors.newSingleThreadScheduledExecutor(task -> {
            Thread thread = new Thread(task, "loopwright-api-keys-file");
            thread.setDaemon(true);
            return thread;
        });
        poller.scheduleWithFixedDelay(this::poll, pollMillis, pollMillis, TimeUnit.MILLISECONDS);
    }

    /** The keys of a key file's lines: trimmed, blank lines and comments left out (not yet validated). */
    public static List<String> keysOf(List<String> lines) {
        List<String> found = new ArrayList<>();
        for (String line : lines) {
            String key = line.trim();
            if (!key.isEmpty() && !key.startsWith("#")) {
                found.add(key);
            }
            if (found.size() > ApiKeys.MAX_KEYS) {
                throw new IllegalArgumentException("at most " + ApiKeys.MAX_KEYS + " API keys");
            }
        }
        return found;
    }

    /** Reads the keys of a file (start-up); throws IOException when it cannot be read. */
    public static List<String> read(Path file) throws IOException {
        byte[] content = readBounded(file);
        return keysOf(new String(content, StandardCharsets.UTF_8).lines().toList());
    }

    /** One poll: re-reads the file and, when its content changed, puts valid keys in force. Never throws. */
    void poll() {
        try {
            byte[] content;
            try {
                content = readBounded(file);
            } catch (IOException | RuntimeException e) {
                if (!lastUnreadable) {
                    LOG.warn(
                            "the API keys file cannot be read ({}); the {} keys in force stay", reason(e), keys.size());
                    lastUnreadable = true;
                }
                return;
            }
            lastUnreadable = false;
            if (lastContent != null && Arrays.equals(content, lastContent)) {
                return;
            }
            lastContent = content;
            List<String> fromFile;
            try {
                fromFile = keysOf(
                        new String(content, StandardCharsets.UTF_8).lines().toList());
                if (fromFile.isEmpty()) {
                    throw new IllegalArgumentException("the file holds no key");
                }
                List<String> all = new ArrayList<>(fixedKeys);
                all.addAll(fromFile);
                keys.replace(all);
            } catch (IllegalArgumentException e) {
                LOG.warn(
                        "the API keys file changed but is not used ({}); the {} keys in force stay",
                        e.getMessage(),
                        keys.size());
                return;
            }
            LOG.info("the API keys file changed: {} keys in force ({} from the file)", keys.size(), fromFile.size());
        } catch (RuntimeException e) {
            LOG.warn("re-reading the API keys file failed; the keys in force stay", e);
        }
    }

    private static String reason(Exception e) {
        return e.getClass().getSimpleName() + (e.getMessage() == null ? "" : ": " + e.getMessage());
    }

    private static byte[] readBounded(Path file) throws IOException {
        if (Files.size(file) > MAX_FILE_BYTES) {
            throw new IOException("larger than " + MAX_FILE_BYTES + " bytes");
        }
        return Files.readAllBytes(file);
    }

    private static byte[] readQuietly(Path file) {
        try {
            return readBounded(file);
        } catch (IOException e) {
            return null;
        }
    }

    /** Stops polling (with the server). */
    @Override
    public void close() {
        poller.shutdownNow();
    }
}
