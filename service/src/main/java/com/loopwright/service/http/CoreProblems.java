package com.loopwright.service.http;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.api.problem.Problem;
import com.loopwright.api.problem.ProblemType;
import java.nio.ByteBuffer;
import java.nio.charset.StandardCharsets;
import java.util.Map;
import org.eclipse.jetty.http.HttpHeader;
import org.eclipse.jetty.server.Response;
import org.eclipse.jetty.util.Callback;

/** Writes RFC 9457 problems on Jetty's own response, for answers given before the application sees a request. */
public final class CoreProblems {

    private final ObjectMapper mapper;

    public CoreProblems(ObjectMapper mapper) {
        this.mapper = mapper;
    }

    /** The problem as bytes; a Problem is plain strings and numbers, the fallback only guards against the impossible. */
    public byte[] bytes(Problem problem) {
        try {
            return mapper.writeValueAsBytes(problem);
        } catch (JsonProcessingException e) {
            return ("{\"type\":\"" + ProblemType.INTERNAL_ERROR.uri() + "\",\"title\":\"Error\",\"status\":"
                            + problem.status() + ",\"detail\":\"unavailable\"}")
                    .getBytes(StandardCharsets.UTF_8);
        }
    }

    /** Status, problem+json headers (plus {@code headers}) and the body, completing {@code callback}. */
    public void write(Response response, Callback callback, Problem problem, Map<String, String> headers) {
        response.setStatus(problem.status());
        response.getHeaders().put(HttpHeader.CONTENT_TYPE, Problem.MEDIA_TYPE);
        response.getHeaders().put(HttpHeader.CACHE_CONTROL, "no-store");
        response.getHeaders().put("X-Content-Type-Options", "nosniff");
        headers.forEach(response.getHeaders()::put);
        response.write(true, ByteBuffer.wrap(bytes(problem)), callback);
    }
}
