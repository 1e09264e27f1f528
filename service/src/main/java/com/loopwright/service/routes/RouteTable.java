package com.loopwright.service.routes;

import io.javalin.config.RouterConfig;
import io.javalin.http.Handler;
import io.javalin.http.HandlerType;
import io.javalin.router.JavalinDefaultRoutingApi;
import io.javalin.router.matcher.PathParser;
import java.util.ArrayList;
import java.util.Collections;
import java.util.HashSet;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Objects;
import java.util.Set;

/**
 * Every endpoint of the service, one row each: method, path template, handler, whether browsers may call it across
 * origins, and who may call it. The rows drive the registration, the CORS preflights, the API-key check and the
 * route labels of the metrics, so an endpoint is added in one place.
 *
 * <p>A keyed route puts its whole first path segment under the key ("/v1/designs" keys "/v1/*"): a path there that
 * matches no route still needs a key, so a client without one learns nothing about which paths exist. A public
 * route may not lie in a keyed segment.
 */
public final class RouteTable {

    /** Rows a table may hold (it is written by hand; the cap only bounds the loops over it). */
    public static final int MAX_ROUTES = 64;

    /** Who may call a route. */
    public enum Access {
        /** Anyone: probes, the metrics scraper, the contract, the dashboard. */
        PUBLIC,
        /** Only a caller presenting a configured API key (when keys are configured). */
        KEYED
    }

    /**
     * One endpoint.
     *
     * @param method  HTTP method
     * @param path    Javalin path template, e.g. {@code /v1/designs/plots/{figure}}
     * @param handler serves the request
     * @param cors    an OPTIONS preflight is answered on this path when CORS origins are configured
     * @param access  who may call it
     */
    public record Route(HandlerType method, String path, Handler handler, boolean cors, Access access) {

        public Route {
            Objects.requireNonNull(method, "method");
            Objects.requireNonNull(handler, "handler");
            Objects.requireNonNull(access, "access");
            if (path == null || !path.startsWith("/") || !method.isHttpMethod()) {
                throw new IllegalArgumentException(
                        "a route needs an HTTP method and an absolute path: " + method + " " + path);
            }
        }

        /** A /v1 endpoint: needs the API key, preflight answered for browsers. */
        public static Route keyed(HandlerType method, String path, Handler handler) {
            return new Route(method, path, handler, true, Access.KEYED);
        }

        /** An open resource: no key, no preflight. */
        public static Route open(HandlerType method, String path, Handler handler) {
            return new Route(method, path, handler, false, Access.PUBLIC);
        }
    }

    private final List<Route> routes;
    private final Set<String> paths;
    private final Set<String> keyedScopes;

    public RouteTable(List<Route> routes) {
        if (routes.isEmpty() || routes.size() > MAX_ROUTES) {
            throw new IllegalArgumentException("a route table holds 1 to " + MAX_ROUTES + " routes: " + routes.size());
        }
        this.routes = List.copyOf(routes);
        Set<String> seen = new HashSet<>();
        Set<String> templates = new LinkedHashSet<>();
        Set<String> scopes = new LinkedHashSet<>();
        for (Route route : this.routes) {
            if (!seen.add(route.method().name() + " " + route.path())) {
                throw new IllegalArgumentException("two routes for " + route.method() + " " + route.path());
            }
            templates.add(route.path());
            if (route.access() == Access.KEYED) {
                scopes.add(scopeOf(route.path()));
            }
        }
        for (Route route : this.routes) {
            if (route.access() == Access.PUBLIC
                    && scopes.stream()
                            .anyMatch(scope -> route.path().startsWith(scope.substring(0, scope.length() - 1)))) {
                throw new IllegalArgumentException("the public route " + route.path() + " lies in a keyed segment");
            }
        }
        this.paths = Collections.unmodifiableSet(templates);
        this.keyedScopes = Collections.unmodifiableSet(scopes);
    }

    /** "/v1/designs" -> "/v1/*": the first segment of a keyed path, every path under it keyed. */
    private static String scopeOf(String path) {
        int end = path.indexOf('/', 1);
        if (end < 0) {
            throw new IllegalArgumentException(
                    "a keyed route needs a first segment of its own (e.g. /v1/...): " + path);
        }
        return path.substring(0, end + 1) + "*";
    }

    public List<Route> routes() {
        return routes;
    }

    /** The path templates in table order: the route label values of the metrics (any other path is "other"). */
    public Set<String> paths() {
        return paths;
    }

    /**
     * The methods the table serves on a path template, in table order: the Allow header of a 405 (RFC 9110,
     * section 15.5.6: a 405 must list the methods the target supports). Empty for a path the table does not serve.
     */
    public List<String> methodsOn(String template) {
        return routes.stream()
                .filter(route -> route.path().equals(template))
                .map(route -> route.method().name())
                .distinct()
                .toList();
    }

    /** Path patterns whose every request needs a key when keys are configured (e.g. "/v1/*"). */
    public Set<String> keyedScopes() {
        return keyedScopes;
    }

    /**
     * Registers every route; then, for each keyed scope, {@code keyCheck} as a before-handler, and, when
     * {@code preflight} is not null, an OPTIONS handler on each path whose route asks for CORS.
     */
    public void register(JavalinDefaultRoutingApi javalin, Handler keyCheck, Handler preflight) {
        for (String scope : keyedScopes) {
            javalin.before(scope, keyCheck);
        }
        Set<String> preflighted = new HashSet<>();
        for (Route route : routes) {
            javalin.addHttpHandler(route.method(), route.path(), route.handler());
            if (preflight != null && route.cors() && preflighted.add(route.path())) {
                javalin.options(route.path(), preflight);
            }
        }
    }

    /** Matches raw request paths the way the router configured by {@code router} does, without Javalin's context. */
    public Matcher matcher(RouterConfig router) {
        List<PathParser> scopes = new ArrayList<>();
        for (String scope : keyedScopes) {
            scopes.add(new PathParser(scope, router));
        }
        List<String> templates = new ArrayList<>();
        List<PathParser> parsers = new ArrayList<>();
        for (String path : paths) {
            templates.add(path);
            parsers.add(new PathParser(path, router));
        }
        return new Matcher(List.copyOf(scopes), List.copyOf(templates), List.copyOf(parsers));
    }

    /** Path questions asked before Javalin has seen a request (the HTTP layer's body gate asks them). */
    public static final class Matcher {
        private final List<PathParser> scopes;
        private final List<String> templates;
        private final List<PathParser> parsers;

        private Matcher(List<PathParser> scopes, List<String> templates, List<PathParser> parsers) {
            this.scopes = scopes;
            this.templates = templates;
            this.parsers = parsers;
        }

        /** Whether a request on this path needs the API key (OPTIONS preflights never do). */
        public boolean keyed(String method, String path) {
            if (HandlerType.OPTIONS.name().equals(method) || path == null) {
                return false;
            }
            for (PathParser scope : scopes) {
                if (scope.matches(path)) {
                    return true;
                }
            }
            return false;
        }

        /** The route template a path matches (any method), or "other": a bounded metric label. */
        public String label(String path) {
            if (path != null) {
                for (int i = 0; i < templates.size(); i++) {
                    if (parsers.get(i).matches(path)) {
                        return templates.get(i);
                    }
                }
            }
            return "other";
        }
    }
}
