package com.loopwright.service.http;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.api.endpoint.Trace;
import com.loopwright.api.problem.Problem;
import com.loopwright.api.problem.ProblemType;
import com.loopwright.service.FatalErrors;
import com.loopwright.service.observe.RequestIds;
import java.nio.ByteBuffer;
import java.util.List;
import java.util.Map;
import org.eclipse.jetty.http.HttpField;
import org.eclipse.jetty.http.HttpFields;
import org.eclipse.jetty.http.HttpHeader;
import org.eclipse.jetty.server.Request;
import org.eclipse.jetty.server.Response;
import org.eclipse.jetty.server.handler.ErrorHandler;
import org.eclipse.jetty.util.Callback;

/**
 * Errors that Jetty answers before the application sees the request (unparseable request lines, bad URIs,
 * oversized headers, an HTTP/2 preface, requests refused during a graceful stop) as problem+json too, with words
 * that name the HTTP-level fault, for every method, never an HTML page, an empty body or a stack trace.
 */
public final class ProblemErrorHandler extends ErrorHandler {

    private final CoreProblems problems;
    private final FatalErrors fatal;

    /** @param serviceVersion stated in the version header of every answer, as the application states it */
    public ProblemErrorHandler(ObjectMapper mapper, FatalErrors fatal, String serviceVersion) {
        this.problems = new CoreProblems(mapper, serviceVersion);
        this.fatal = fatal;
        setShowStacks(false);
    }

    /** The problem for a status Jetty produced on its own. */
    static Problem problemFor(int status) {
        Problem problem = switch (status) {
            case 400 -> ProblemType.MALFORMED_HTTP.problem(null);
            case 404 -> ProblemType.NOT_FOUND.problem(null);
            case 405 -> ProblemType.METHOD_NOT_ALLOWED.problem(null);
            case 408 -> ProblemType.REQUEST_TIMEOUT.problem(null);
            case 413 -> ProblemType.PAYLOAD_TOO_LARGE.problem(null);
            case 414 -> ProblemType.MALFORMED_HTTP.problem("the request target is longer than the request line cap");
            case 415 -> ProblemType.UNSUPPORTED_MEDIA_TYPE.problem(null);
            case 426 -> ProblemType.UNSUPPORTED_PROTOCOL.problem("HTTP/2 is not offered; send the request as HTTP/1.1");
            case 431 ->
                ProblemType.MALFORMED_HTTP.problem(
                        "the request line and headers exceed " + HttpLimits.MAX_HEADER_BYTES + " bytes");
            case 503 -> ProblemType.NOT_READY.problem(null);
            case 505 -> ProblemType.UNSUPPORTED_PROTOCOL.problem(null);
            default ->
                status >= 500 ? ProblemType.INTERNAL_ERROR.problem(null) : ProblemType.MALFORMED_HTTP.problem(null);
        };
        // Keep the type, but report the status that is actually sent (e.g. 431 for oversized headers).
        return new Problem(
                problem.type(),
                problem.title(),
                status >= 400 && status <= 599 ? status : problem.status(),
                problem.detail(),
                null,
                List.of(),
                List.of());
    }

    /** A body for every method (Jetty's default gives none for methods other than GET, POST and HEAD). */
    @Override
    public boolean errorPageForMethod(String method) {
        return true;
    }

    @Override
    protected void generateResponse(
            Request request, Response response, int code, String message, Throwable cause, Callback callback) {
        fatal.check(cause);
        problems.write(request, response, callback, problemFor(code), Map.of());
    }

    @Override
    public ByteBuffer badMessageError(int status, String reason, HttpFields.Mutable fields) {
        // A message too broken to read its headers: a new request id names the occurrence.
        String requestId = RequestIds.accept(null);
        fields.put(new HttpField(HttpHeader.CONTENT_TYPE, Problem.MEDIA_TYPE));
        fields.put(new HttpField(RequestIds.HEADER, requestId));
        fields.put(new HttpField(Trace.VERSION_HEADER, problems.serviceVersion()));
        return ByteBuffer.wrap(problems.bytes(problemFor(status).withInstance(RequestIds.instance(requestId))));
    }
}
