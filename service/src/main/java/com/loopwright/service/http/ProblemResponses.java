package com.loopwright.service.http;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.api.problem.Problem;
import com.loopwright.service.observe.RequestIds;
import io.javalin.http.Context;
import java.nio.charset.StandardCharsets;

/** Writes RFC 9457 problems as application/problem+json. */
public final class ProblemResponses {

    /** The context attribute set once a problem has been written. */
    private static final String WRITTEN = "loopwright.problemWritten";

    private final ObjectMapper mapper;

    public ProblemResponses(ObjectMapper mapper) {
        this.mapper = mapper;
    }

    /**
     * The id of this request: the one the before-handler already answered in {@code X-Request-Id}, or (for a problem
     * written before it ran) the accepted caller's id or a new one, then answered in the header too.
     */
    public static String requestId(Context ctx) {
        String answered = ctx.res().getHeader(RequestIds.HEADER);
        if (answered != null) {
            return answered;
        }
        String requestId = RequestIds.accept(ctx.header(RequestIds.HEADER));
        ctx.header(RequestIds.HEADER, requestId);
        return requestId;
    }

    public void write(Context ctx, Problem problem) {
        Problem located = problem.withInstance(RequestIds.instance(requestId(ctx)));
        byte[] body;
        try {
            body = mapper.writeValueAsBytes(located);
        } catch (JsonProcessingException e) {
            // A Problem is plain strings and numbers; this cannot fail, but never leak a stack trace if it does.
            body = ("{\"type\":\"" + located.type() + "\",\"title\":\"" + located.title() + "\",\"status\":"
                            + located.status() + ",\"detail\":\"unavailable\"}")
                    .getBytes(StandardCharsets.UTF_8);
        }
        ctx.attribute(WRITTEN, Boolean.TRUE);
        ctx.status(located.status()).contentType(Problem.MEDIA_TYPE).result(body);
    }

    /**
     * Whether a handler already answered this request with a problem: a status error handler (404) then keeps that
     * answer (e.g. the names an unknown figure could have been) instead of writing its generic one.
     */
    public static boolean written(Context ctx) {
        return Boolean.TRUE.equals(ctx.attribute(WRITTEN));
    }
}
