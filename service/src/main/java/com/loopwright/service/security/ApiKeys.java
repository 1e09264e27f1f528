package com.loopwright.service.security;

import com.loopwright.api.problem.ProblemType;
import com.loopwright.service.http.ProblemException;
import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

/**
 * Optional API-key authentication. Keys are held only as SHA-256 digests and compared in constant time
 * (MessageDigest.isEqual over equal-length digests, every configured key checked), so neither timing nor a heap
 * dump of this object gives a key away. No key is ever logged or echoed.
 */
public final class ApiKeys {

    public static final String HEADER = "X-Api-Key";
    private static final String BEARER = "Bearer ";
    /** A presented credential longer than this is refused without hashing. */
    static final int MAX_PRESENTED_LENGTH = 512;
    /** Hex digits of a key's SHA-256 digest shown as its id in access logs. */
    public static final int KEY_ID_HEX_DIGITS = 8;

    /** At most this many accepted keys (all sources together). */
    public static final int MAX_KEYS = 64;
    /** A configured key is at least this long (printable ASCII without spaces). */
    public static final int MIN_KEY_LENGTH = 16;

    /** The digests in force, swapped whole when a key file is re-read (readers see the old or the new set). */
    private volatile List<byte[]> digests;

    public ApiKeys(List<String> keys) {
        validate(keys);
        this.digests = digestsOf(keys);
    }

    /**
     * Throws IllegalArgumentException unless every key is at least {@link #MIN_KEY_LENGTH} printable ASCII
     * characters without spaces and there are at most {@link #MAX_KEYS}. The message names the key's position,
     * never the key.
     */
    public static void validate(List<String> keys) {
        if (keys.size() > MAX_KEYS) {
            throw new IllegalArgumentException("at most " + MAX_KEYS + " API keys");
        }
        for (int i = 0; i < keys.size(); i++) {
            String key = keys.get(i);
            if (key == null || key.length() < MIN_KEY_LENGTH || !key.chars().allMatch(c -> c > 0x20 && c < 0x7f)) {
                throw new IllegalArgumentException("API key #" + (i + 1) + " must be at least " + MIN_KEY_LENGTH
                        + " printable ASCII characters without spaces");
            }
        }
    }

    /**
     * Puts a new key set in force at once (a rotated key file). An empty or invalid set is refused with
     * IllegalArgumentException and the keys in force stay: a rotation never turns authentication off.
     */
    public void replace(List<String> keys) {
        if (keys.isEmpty()) {
            throw new IllegalArgumentException("an empty key set would turn authentication off");
        }
        validate(keys);
        this.digests = digestsOf(keys);
    }

    /** How many keys are in force. */
    public int size() {
        return digests.size();
    }

    private static List<byte[]> digestsOf(List<String> keys) {
        List<byte[]> hashed = new ArrayList<>();
        for (String key : keys) {
            hashed.add(sha256(key));
        }
        return List.copyOf(hashed);
    }

    public boolean enabled() {
        return !digests.isEmpty();
    }

    /**
     * Whether {@link #check} would pass, without building a problem: the header-only test the HTTP layer makes
     * before it admits a body.
     */
    public boolean accepts(String authorization, String apiKeyHeader) {
        if (!enabled()) {
            return true;
        }
        String presented = presented(authorization, apiKeyHeader);
        return presented != null
                && !presented.isEmpty()
                && presented.length() <= MAX_PRESENTED_LENGTH
                && matches(presented);
    }

    /** Throws a 401 problem without a credential, 403 with a wrong one; returns quietly when authorised. */
    public void check(String authorization, String apiKeyHeader) {
        if (!enabled()) {
            return;
        }
        String presented = presented(authorization, apiKeyHeader);
        if (presented == null || presented.isEmpty()) {
            throw new ProblemException(
                    ProblemType.UNAUTHORIZED.problem(
                            "this service requires an API key: send Authorization: Bearer <key> or " + HEADER
                                    + ": <key>"),
                    Map.of("WWW-Authenticate", "Bearer realm=\"loopwright\""));
        }
        if (presented.length() > MAX_PRESENTED_LENGTH || !matches(presented)) {
            throw new ProblemException(ProblemType.FORBIDDEN.problem("the API key is not accepted"));
        }
    }

    /**
     * A short id of the presented credential for access logs: the first {@link #KEY_ID_HEX_DIGITS} hex digits of
     * its SHA-256 digest (never the key; 32 bits of a digest tell nothing usable about a key), or null when
     * authentication is off or no credential (or an over-long one) is presented. The same key always has the
     * same id, so an operator can tell callers apart and match a rotated key to its digest.
     */
    public String keyId(String authorization, String apiKeyHeader) {
        if (!enabled()) {
            return null;
        }
        String presented = presented(authorization, apiKeyHeader);
        if (presented == null || presented.isEmpty() || presented.length() > MAX_PRESENTED_LENGTH) {
            return null;
        }
        return java.util.HexFormat.of().formatHex(sha256(presented)).substring(0, KEY_ID_HEX_DIGITS);
    }

    /** The X-Api-Key header, else the token of an "Authorization: Bearer" header, else null. */
    private static String presented(String authorization, String apiKeyHeader) {
        if (apiKeyHeader == null
                && authorization != null
                && authorization.regionMatches(true, 0, BEARER, 0, BEARER.length())) {
            return authorization.substring(BEARER.length()).trim();
        }
        return apiKeyHeader;
    }

    private boolean matches(String presented) {
        byte[] digest = sha256(presented);
        boolean match = false;
        for (byte[] known : digests) { // one read of the volatile set: all of one version
            match |= MessageDigest.isEqual(known, digest);
        }
        return match;
    }

    private static byte[] sha256(String value) {
        try {
            return MessageDigest.getInstance("SHA-256").digest(value.getBytes(StandardCharsets.UTF_8));
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("every Java platform provides SHA-256", e);
        }
    }
}
