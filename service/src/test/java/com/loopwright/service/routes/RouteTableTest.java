package com.loopwright.service.routes;

import static io.javalin.http.HandlerType.GET;
import static io.javalin.http.HandlerType.POST;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.service.routes.RouteTable.Route;
import io.javalin.config.RouterConfig;
import io.javalin.http.Handler;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import org.junit.jupiter.api.Test;

class RouteTableTest {

    private static final Handler NOTHING = ctx -> {};

    private static RouteTable table() {
        return new RouteTable(List.of(
                Route.keyed(POST, "/v1/designs", NOTHING),
                Route.keyed(POST, "/v1/designs/plots/{figure}", NOTHING),
                Route.open(GET, "/health", NOTHING),
                Route.open(GET, "/", NOTHING)));
    }

    @Test
    void aKeyedRouteKeysItsFirstSegmentAndTheLabelsAreTheTemplates() {
        RouteTable table = table();
        assertEquals(Set.of("/v1/*"), table.keyedScopes());
        assertEquals(List.of("/v1/designs", "/v1/designs/plots/{figure}", "/health", "/"), List.copyOf(table.paths()));
    }

    @Test
    void theMatcherAnswersLikeJavalinsDefaultRouter() {
        RouteTable.Matcher paths = table().matcher(new RouterConfig());
        assertTrue(paths.keyed("POST", "/v1/designs"));
        assertTrue(paths.keyed("GET", "/v1/no-such-path"), "unknown paths in a keyed segment are keyed too");
        assertTrue(paths.keyed("GET", "/v1/"));
        assertFalse(paths.keyed("OPTIONS", "/v1/designs"), "preflights carry no key");
        assertFalse(paths.keyed("GET", "/v1"), "the segment itself is not under /v1/*");
        assertFalse(paths.keyed("GET", "/health"));
        assertFalse(paths.keyed("POST", "/V1/designs"), "paths are case-sensitive");
        assertEquals("/v1/designs/plots/{figure}", paths.label("/v1/designs/plots/bode"));
        assertEquals("/v1/designs", paths.label("/v1/designs/"), "a trailing slash is ignored");
        assertEquals("/", paths.label("/"));
        assertEquals("other", paths.label("/v1/designs/plots/bode/extra"));
        assertEquals("other", paths.label(null));
    }

    @Test
    void aTableThatWouldMisrouteIsRefused() {
        assertThrows(
                IllegalArgumentException.class,
                () -> new RouteTable(
                        List.of(Route.keyed(POST, "/v1/designs", NOTHING), Route.keyed(POST, "/v1/designs", NOTHING))),
                "two rows for one method and path");
        assertThrows(
                IllegalArgumentException.class,
                () -> new RouteTable(
                        List.of(Route.keyed(POST, "/v1/designs", NOTHING), Route.open(GET, "/v1/status", NOTHING))),
                "a public route inside a keyed segment would be keyed after all");
        assertThrows(
                IllegalArgumentException.class,
                () -> new RouteTable(List.of(Route.keyed(POST, "/designs", NOTHING))),
                "a keyed route needs a segment of its own");
        assertThrows(
                IllegalArgumentException.class,
                () -> new Route(POST, "designs", NOTHING, false, RouteTable.Access.PUBLIC),
                "relative path");
        List<Route> many = new ArrayList<>();
        for (int i = 0; i <= RouteTable.MAX_ROUTES; i++) {
            many.add(Route.open(GET, "/r" + i, NOTHING));
        }
        assertThrows(IllegalArgumentException.class, () -> new RouteTable(many));
        assertThrows(IllegalArgumentException.class, () -> new RouteTable(List.of()));
    }
}
