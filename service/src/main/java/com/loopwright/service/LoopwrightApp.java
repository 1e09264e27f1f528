package com.loopwright.service;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.api.json.StrictJson;
import com.loopwright.api.problem.ProblemType;
import com.loopwright.service.http.ProblemResponses;
import com.loopwright.service.routes.ContractRoute;
import com.loopwright.service.routes.DesignRoute;
import com.loopwright.service.routes.FitRoute;
import com.loopwright.service.routes.HighOrderDesignRoute;
import com.loopwright.service.routes.HealthRoute;
import io.javalin.Javalin;
import io.javalin.http.HttpResponseException;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;

/** Builds the Javalin application: routes, limits and the problem+json error model. */
public final class LoopwrightApp {

    private static final Logger LOG = LoggerFactory.getLogger(LoopwrightApp.class);

    private LoopwrightApp() {
    }

    public static Javalin create(ServiceConfig config) {
        ObjectMapper mapper = StrictJson.newMapper();
        ProblemResponses problems = new ProblemResponses(mapper);
        DesignRoute designs = new DesignRoute(mapper, problems);
        FitRoute fits = new FitRoute(mapper, problems);
        HighOrderDesignRoute highOrderDesigns = new HighOrderDesignRoute(mapper, problems);
        ContractRoute contract = new ContractRoute();
        HealthRoute health = new HealthRoute();
        return Javalin.create(javalin -> {
            javalin.http.maxRequestSize = config.maxRequestBytes();
            javalin.http.prefer405over404 = true;
            javalin.startup.showJavalinBanner = false;
            javalin.routes.post(DesignRoute.PATH, designs);
            javalin.routes.post(HighOrderDesignRoute.PATH, highOrderDesigns);
            javalin.routes.get(ContractRoute.PATH, contract);
            javalin.routes.get(HealthRoute.PATH, health);
            javalin.routes.post(FitRoute.PATH, fits);
            javalin.routes.exception(HttpResponseException.class, (e, ctx) -> problems.write(ctx,
                    statusProblem(e.getStatus())));
            javalin.routes.exception(Exception.class, (e, ctx) -> {
                LOG.error("unhandled failure on {} {}", ctx.method(), ctx.path(), e);
                problems.write(ctx, ProblemType.INTERNAL_ERROR.problem(null));
            });
            javalin.routes.error(404, ctx -> problems.write(ctx, ProblemType.NOT_FOUND.problem(
                    "no resource at " + ctx.path() + "; see GET /openapi.yaml")));
            javalin.routes.error(405, ctx -> problems.write(ctx, ProblemType.METHOD_NOT_ALLOWED.problem(
                    ctx.method() + " is not supported on " + ctx.path())));
        });
    }

    private static com.loopwright.api.problem.Problem statusProblem(int status) {
        return switch (status) {
            case 404 -> ProblemType.NOT_FOUND.problem(null);
            case 405 -> ProblemType.METHOD_NOT_ALLOWED.problem(null);
            case 413 -> ProblemType.PAYLOAD_TOO_LARGE.problem("the body exceeds the request size cap");
            case 415 -> ProblemType.UNSUPPORTED_MEDIA_TYPE.problem(null);
            default -> status >= 500 ? ProblemType.INTERNAL_ERROR.problem(null)
                    : ProblemType.MALFORMED_REQUEST.problem("the request could not be read (HTTP " + status + ")");
        };
    }
}
