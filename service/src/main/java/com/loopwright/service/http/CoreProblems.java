package com.loopwright.service.http;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.api.endpoint.Trace;
import com.loopwright.api.problem.Problem;
import com.loopwright.api.problem.ProblemType;
import com.loopwright.service.observe.RequestIds;
import java.nio.ByteBuffer;
import java.nio.charset.StandardCharsets;
import java.util.Map;
import org.eclipse.jetty.http.HttpHeader;
import org.eclipse.jetty.server.Request;
import org.eclipse.jetty.server.Response;
import org.eclipse.jetty.util.Callback;

/** Writes RFC 9457 problems on Jetty's own response, for answers given before the application sees a request. */
public final class CoreProblems {

    private final ObjectMapper mapper;
    private final String serviceVersion;

    /** @param serviceVersion stated in {@value Trace#VERSION_HEADER} on every answer, as the application states it */
    public CoreProblems(ObjectMapper mapper, String serviceVersion) {
        this.mapper = mapper;
        this.serviceVersion = java.util.Objects.requireNonNull(serviceVersion, "serviceVersion");
    }

    /** The version every answer states. */
    public String serviceVersion() {
        return serviceVersion;
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

    /**
     * Status, problem+json headers, the request id and the service version (plus {@code headers}) and the body, completing {@code callback}; the problem's
     * {@code instance} names this request by its id (answered in {@code X-Request-Id} too).
     */
    public void write(
            Request request, Response response, Callback callback, Problem problem, Map<String, String> headers) {
        String requestId = response.getHeaders().get(RequestIds.HEADER);
        if (requestId == null) {
            requestId = RequestIds.accept(request.getHeaders().get(RequestIds.HEADER));
        }
        problem = problem.withInstance(RequestIds.instance(requestId));
        response.setStatus(problem.status());
        response.getHeaders().put(RequestIds.HEADER, requestId);
        response.getHeaders().put(Trace.VERSION_HEADER, serviceVersion);
        response.getHeaders().put(HttpHeader.CONTENT_TYPE, Problem.MEDIA_TYPE);
        response.getHeaders().put(HttpHeader.CACHE_CONTROL, "no-store");
        response.getHeaders().put("X-Content-Type-Options", "nosniff");
        headers.forEach(response.getHeaders()::put);
        response.write(true, ByteBuffer.wrap(bytes(problem)), callback);
    }
}
