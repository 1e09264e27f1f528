package com.loopwright.service.http;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.api.problem.Problem;
import com.loopwright.api.problem.ProblemType;
import java.nio.ByteBuffer;
import java.nio.charset.StandardCharsets;
import java.util.List;
import org.eclipse.jetty.http.HttpField;
import org.eclipse.jetty.http.HttpFields;
import org.eclipse.jetty.http.HttpHeader;
import org.eclipse.jetty.server.Request;
import org.eclipse.jetty.server.Response;
import org.eclipse.jetty.server.handler.ErrorHandler;
import org.eclipse.jetty.util.Callback;

/**
 * Errors that Jetty answers before the application sees the request (unparseable request lines, bad URIs,
 * oversized headers, requests refused during a graceful stop) as problem+json too, never an HTML page and
 * never a stack trace.
 */
public final class ProblemErrorHandler extends ErrorHandler {

    private final ObjectMapper mapper;

    public ProblemErrorHandler(ObjectMapper mapper) {
        this.mapper = mapper;
        setShowStacks(false);
    }

    /** The problem for a status Jetty produced on its own. */
    static Problem problemFor(int status) {
        ProblemType type = switch (status) {
            case 404 -> ProblemType.NOT_FOUND;
            case 405 -> ProblemType.METHOD_NOT_ALLOWED;
            case 413 -> ProblemType.PAYLOAD_TOO_LARGE;
            case 415 -> ProblemType.UNSUPPORTED_MEDIA_TYPE;
            case 503 -> ProblemType.NOT_READY;
            default -> status >= 500 ? ProblemType.INTERNAL_ERROR : ProblemType.MALFORMED_REQUEST;
        };
        Problem base = type.problem(status == type.status() ? null : "the HTTP request could not be read");
        // Keep the type, but report the status that is actually sent (e.g. 431 for oversized headers).
        return new Problem(base.type(), base.title(), status >= 400 && status <= 599 ? status : type.status(),
                base.detail(), null, List.of(), List.of());
    }

    private byte[] body(int status) {
        try {
            return mapper.writeValueAsBytes(problemFor(status));
        } catch (JsonProcessingException e) {
            return ("{\"type\":\"" + ProblemType.INTERNAL_ERROR.uri() + "\",\"title\":\"Error\",\"status\":" + status
                    + ",\"detail\":\"unavailable\"}").getBytes(StandardCharsets.UTF_8);
        }
    }

    @Override
    protected void generateResponse(Request request, Response response, int code, String message, Throwable cause,
                                    Callback callback) {
        response.getHeaders().put(HttpHeader.CONTENT_TYPE, Problem.MEDIA_TYPE);
        response.getHeaders().put(HttpHeader.CACHE_CONTROL, "no-store");
        response.getHeaders().put("X-Content-Type-Options", "nosniff");
        response.write(true, ByteBuffer.wrap(body(code)), callback);
    }

    @Override
    public ByteBuffer badMessageError(int status, String reason, HttpFields.Mutable fields) {
        fields.put(new HttpField(HttpHeader.CONTENT_TYPE, Problem.MEDIA_TYPE));
        return ByteBuffer.wrap(body(status));
    }
}
