package com.loopwright.service.http;

import com.loopwright.api.problem.Problem;
import java.util.Map;

/** Ends a request early with a problem (thrown from before-handlers such as authentication). */
public final class ProblemException extends RuntimeException {

    private final transient Problem problem;
    private final Map<String, String> headers;

    public ProblemException(Problem problem, Map<String, String> headers) {
        super(problem.title(), null, false, false);
        this.problem = problem;
        this.headers = Map.copyOf(headers);
    }

    public ProblemException(Problem problem) {
        this(problem, Map.of());
    }

    public Problem problem() {
        return problem;
    }

    public Map<String, String> headers() {
        return headers;
    }
}
