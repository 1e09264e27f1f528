package com.loopwright.service.security;

import com.loopwright.api.problem.ProblemType;
import com.loopwright.service.http.ProblemException;
import com.loopwright.service.http.RequestBodyGate;
import com.loopwright.service.routes.RouteTable;
import io.javalin.http.Context;
import io.javalin.http.HandlerType;
import java.util.Map;
import org.eclipse.jetty.http.HttpHeader;
import org.eclipse.jetty.server.Request;

/**
 * The API-key check of the keyed routes, made twice with one rule: by the HTTP layer from the headers alone, before
 * a body is admitted (a request without an accepted key reserves no body budget), and by the application, which
 * answers 401 or 403. OPTIONS preflights never need a key.
 */
public final class KeyedAccess {

    /** Retry-After of a request caught by a key rotation between the body gate and the application. */
    static final int RETRY_AFTER_SECONDS = 1;

    private final ApiKeys keys;
    private final RouteTable.Matcher paths;

    public KeyedAccess(ApiKeys keys, RouteTable.Matcher paths) {
        this.keys = keys;
        this.paths = paths;
    }

    /** The body gate's admission test: false when the path is keyed and no accepted key is presented. */
    public boolean admitsBody(Request request) {
        return !keys.enabled()
                || !paths.keyed(request.getMethod(), request.getHttpURI().getPath())
                || keys.accepts(
                        request.getHeaders().get(HttpHeader.AUTHORIZATION),
                        request.getHeaders().get(ApiKeys.HEADER));
    }

    /** Before-handler of a keyed scope: 401 without a key, 403 with a wrong one. */
    public void check(Context ctx) {
        if (ctx.method() != HandlerType.OPTIONS) {
            keys.check(ctx.header(HttpHeader.AUTHORIZATION.asString()), ctx.header(ApiKeys.HEADER));
        }
    }

    /**
     * Before-handler of every request: one whose body the gate withheld is answered 401/403 here, whatever the path,
     * so that no handler ever sees a request without its body.
     */
    public void refuseWithheld(Context ctx) {
        refuseWithheld(
                Boolean.TRUE.equals(ctx.attribute(RequestBodyGate.WITHHELD)),
                ctx.header(HttpHeader.AUTHORIZATION.asString()),
                ctx.header(ApiKeys.HEADER));
    }

    /**
     * A withheld body is refused with 401/403 by the keys in force now. When they accept the key (the keys were
     * rotated between the gate's test and this one), the request still has no body: 503 with Retry-After, to be
     * sent again, never a handler without its body.
     */
    void refuseWithheld(boolean withheld, String authorization, String apiKeyHeader) {
        if (withheld) {
            keys.check(authorization, apiKeyHeader);
            throw new ProblemException(
                    ProblemType.SERVICE_OVERLOADED.problem("the API keys in force changed while this request arrived:"
                            + " its key was not accepted when its body came and is now; send it again after "
                            + RETRY_AFTER_SECONDS + " s"),
                    Map.of("Retry-After", String.valueOf(RETRY_AFTER_SECONDS)));
        }
    }
}
