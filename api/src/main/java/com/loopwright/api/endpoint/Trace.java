package com.loopwright.api.endpoint;

import java.util.Objects;

/**
 * Which build answered which request: the field {@code trace} of every computing 200 JSON body, and the headers
 * {@value #VERSION_HEADER} and {@value #DIGEST_HEADER} of the response.
 *
 * @param serviceVersion the project version of the build that answered
 * @param requestDigest  {@link RequestDigest} of the decoded request, {@code sha256:} and 64 hex digits
 */
public record Trace(String serviceVersion, String requestDigest) {

    /** Response header: the service version. */
    public static final String VERSION_HEADER = "Loopwright-Version";
    /** Response header: the digest of the canonical request (absent when the request did not decode). */
    public static final String DIGEST_HEADER = "Loopwright-Request-Digest";

    public Trace {
        Objects.requireNonNull(serviceVersion, "serviceVersion");
        Objects.requireNonNull(requestDigest, "requestDigest");
    }
}
