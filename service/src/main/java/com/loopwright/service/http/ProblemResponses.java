package com.loopwright.service.http;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.api.problem.Problem;
import io.javalin.http.Context;
import java.nio.charset.StandardCharsets;

/** Writes RFC 9457 problems as application/problem+json. */
public final class ProblemResponses {

    private final ObjectMapper mapper;

    public ProblemResponses(ObjectMapper mapper) {
        this.mapper = mapper;
    }

    public void write(Context ctx, Problem problem) {
        Problem located = problem.withInstance(ctx.path());
        byte[] body;
        try {
            body = mapper.writeValueAsBytes(located);
        } catch (JsonProcessingException e) {
            // A Problem is plain strings and numbers; this cannot fail, but never leak a stack trace if it does.
            body = ("{\"type\":\"" + located.type() + "\",\"title\":\"" + located.title() + "\",\"status\":"
                            + located.status() + ",\"detail\":\"unavailable\"}")
                    .getBytes(StandardCharsets.UTF_8);
        }
        ctx.status(located.status()).contentType(Problem.MEDIA_TYPE).result(body);
    }
}
