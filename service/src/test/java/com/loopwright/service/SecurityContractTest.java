package com.loopwright.service;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import com.loopwright.service.security.ApiKeys;
import io.javalin.http.HandlerType;
import io.javalin.router.ParsedEndpoint;
import java.io.IOException;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.time.Duration;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import org.junit.jupiter.api.Test;

/**
 * The contract's security (OpenAPI 3.1 securitySchemes and per-operation security requirements) against the service:
 * every route the route table registers must be in the contract, and the contract must say a key is needed exactly on
 * the routes that answer 401 without one when keys are configured.
 */
class SecurityContractTest {

    private static final String KEY = "security-contract-key-0001";
    private static final String BEARER = "bearerKey";
    private static final String API_KEY_HEADER = "apiKeyHeader";
    /** Operations the contract may hold (a bound for the loops below; the route table allows 64 rows). */
    private static final int MAX_OPERATIONS = 64;

    private final Contract contract = Contract.load();

    @Test
    void schemesAreBearerAndTheXApiKeyHeader() {
        JsonNode schemes = contract.document().at("/components/securitySchemes");
        assertEquals(Set.of(BEARER, API_KEY_HEADER), fieldNames(schemes));
        assertEquals("http", schemes.at("/" + BEARER + "/type").asText());
        assertEquals("bearer", schemes.at("/" + BEARER + "/scheme").asText());
        assertEquals("apiKey", schemes.at("/" + API_KEY_HEADER + "/type").asText());
        assertEquals("header", schemes.at("/" + API_KEY_HEADER + "/in").asText());
        assertEquals(ApiKeys.HEADER, schemes.at("/" + API_KEY_HEADER + "/name").asText());
    }

    @Test
    void everyOperationStatesItsSecurityAndKeyedOnesDocument401And403() {
        Map<String, JsonNode> operations = operations(contract.document());
        assertTrue(operations.size() > 5 && operations.size() <= MAX_OPERATIONS, "operations: " + operations.keySet());
        for (Map.Entry<String, JsonNode> operation : operations.entrySet()) {
            JsonNode security = operation.getValue().get("security");
            assertTrue(security != null && security.isArray(), operation.getKey() + " states its security");
            boolean keyed = documentedKeyed(operation.getValue());
            if (keyed) {
                // Alternatives: either scheme alone suffices (one requirement object per scheme, no scopes).
                assertEquals(2, security.size(), operation.getKey());
                assertEquals(Set.of(BEARER), fieldNames(security.get(0)), operation.getKey());
                assertEquals(Set.of(API_KEY_HEADER), fieldNames(security.get(1)), operation.getKey());
                assertEquals(0, security.at("/0/" + BEARER).size(), operation.getKey());
                assertEquals(0, security.at("/1/" + API_KEY_HEADER).size(), operation.getKey());
            }
            JsonNode responses = operation.getValue().get("responses");
            assertEquals(keyed, responses.has("401"), operation.getKey() + " documents 401 iff keyed");
            assertEquals(keyed, responses.has("403"), operation.getKey() + " documents 403 iff keyed");
            assertEquals(operation.getKey().contains(" /v1/"), keyed, operation.getKey() + ": /v1 and only /v1 keyed");
        }
    }

    @Test
    void theRouteTableAndTheContractAgreeOnWhichRoutesNeedAKey() throws Exception {
        Map<String, Boolean> documented = documentedAccess(contract.document());
        Map<String, Boolean> served;
        try (LiveServer server = LiveServer.start(
                ServiceConfig.fromEnvironment(Map.of("LOOPWRIGHT_PORT", "0", "LOOPWRIGHT_API_KEYS", KEY)))) {
            served = servedAccess(server);
        }
        assertTrue(served.size() > 5, "registered routes: " + served.keySet());
        assertEquals(List.of(), disagreements(served, documented));
    }

    /** The comparison above must fail on a contract that marks one keyed operation public, or one public one keyed. */
    @Test
    void aContractThatDisagreesWithTheServiceIsCaught() {
        Map<String, Boolean> served = documentedAccess(contract.document());
        ObjectNode opened = contract.document().deepCopy();
        ((ObjectNode) opened.at("/paths/~1v1~1designs/post")).set("security", opened.arrayNode());
        assertEquals(
                List.of("POST /v1/designs: the service needs a key, the contract says none"),
                disagreements(served, documentedAccess(opened)));
        ObjectNode closed = contract.document().deepCopy();
        ArrayNode keyed = closed.arrayNode();
        keyed.addObject().putArray(BEARER);
        ((ObjectNode) closed.at("/paths/~1health/get")).set("security", keyed);
        assertEquals(
                List.of("GET /health: the service needs none, the contract says a key"),
                disagreements(served, documentedAccess(closed)));
        ObjectNode missing = contract.document().deepCopy();
        ((ObjectNode) missing.get("paths")).remove("/metrics");
        assertEquals(
                List.of("GET /metrics: served but not in the contract"),
                disagreements(served, documentedAccess(missing)));
    }

    /** "METHOD /template" -> whether the contract requires a key: the operation's security, else the document's. */
    private static Map<String, Boolean> documentedAccess(JsonNode document) {
        Map<String, Boolean> access = new TreeMap<>();
        operations(document).forEach((operation, node) -> access.put(operation, documentedKeyed(node)));
        return access;
    }

    private static boolean documentedKeyed(JsonNode operation) {
        // OpenAPI 3.1: an empty requirement object ({}) makes the security optional, like no requirement at all.
        for (JsonNode requirement : operation.path("security")) {
            if (requirement.isEmpty()) {
                return false;
            }
        }
        return !operation.path("security").isEmpty();
    }

    /** Every operation of the contract, "METHOD /template". */
    private static Map<String, JsonNode> operations(JsonNode document) {
        Map<String, JsonNode> operations = new TreeMap<>();
        Iterator<Map.Entry<String, JsonNode>> paths = document.get("paths").fields();
        while (paths.hasNext() && operations.size() <= MAX_OPERATIONS) {
            Map.Entry<String, JsonNode> path = paths.next();
            path.getValue().fields().forEachRemaining(method -> {
                if (!method.getKey().equals("parameters")) {
                    operations.put(method.getKey().toUpperCase() + " " + path.getKey(), method.getValue());
                }
            });
        }
        return operations;
    }

    /**
     * Every route the running service registered (Javalin's router, so the route table's rows as registered; HEAD and
     * the CORS preflights left out), and whether it answers 401 without a key while keys are configured.
     */
    private Map<String, Boolean> servedAccess(LiveServer server) throws IOException, InterruptedException {
        HttpClient http =
                HttpClient.newBuilder().connectTimeout(Duration.ofSeconds(5)).build();
        Map<String, Boolean> access = new TreeMap<>();
        List<ParsedEndpoint> endpoints = server.app().unsafe.internalRouter.allHttpHandlers();
        assertTrue(endpoints.size() <= MAX_OPERATIONS, "registered: " + endpoints.size());
        for (ParsedEndpoint parsed : endpoints) {
            HandlerType method = parsed.endpoint.method;
            if (!method.isHttpMethod() || method == HandlerType.HEAD || method == HandlerType.OPTIONS) {
                continue;
            }
            String template = parsed.endpoint.path;
            String operation = method.name() + " " + template;
            URI uri = server.base()
                    .resolve(concretePath(
                            template,
                            contract.document()
                                    .at("/paths/" + template.replace("~", "~0").replace("/", "~1") + "/"
                                            + method.name().toLowerCase())));
            int without = http.send(probe(uri, method, null), HttpResponse.BodyHandlers.discarding())
                    .statusCode();
            int with = http.send(probe(uri, method, KEY), HttpResponse.BodyHandlers.discarding())
                    .statusCode();
            assertFalse(with == 401 || with == 403, operation + " refuses the configured key: " + with);
            access.put(operation, without == 401);
        }
        return access;
    }

    private static HttpRequest probe(URI uri, HandlerType method, String key) {
        HttpRequest.Builder request = HttpRequest.newBuilder(uri)
                .timeout(Duration.ofSeconds(30))
                .header("Content-Type", "application/json")
                .method(
                        method.name(),
                        method == HandlerType.GET
                                ? HttpRequest.BodyPublishers.noBody()
                                : HttpRequest.BodyPublishers.ofString("{}"));
        if (key != null) {
            request.header("Authorization", "Bearer " + key);
        }
        return request.build();
    }

    /** A template with each {parameter} replaced by the first value of its documented enum (else "x"). */
    private static String concretePath(String template, JsonNode operation) {
        String concrete = template;
        for (JsonNode parameter : operation.path("parameters")) {
            if ("path".equals(parameter.path("in").asText())) {
                concrete = concrete.replace(
                        "{" + parameter.get("name").asText() + "}",
                        parameter.at("/schema/enum/0").asText());
            }
        }
        return concrete.replaceAll("\\{[^}/]+}", "x");
    }

    /** Each operation on which the two maps disagree, in words. */
    static List<String> disagreements(Map<String, Boolean> served, Map<String, Boolean> documented) {
        List<String> wrong = new ArrayList<>();
        for (Map.Entry<String, Boolean> route : new TreeMap<>(served).entrySet()) {
            Boolean contractKeyed = documented.get(route.getKey());
            if (contractKeyed == null) {
                // A template route that serves concrete paths the contract names one by one (POST
                // /v1/designs/controllers/{format}: one operation and media type per format) takes their key rule.
                contractKeyed = documentedConcreteKeyed(documented, route.getKey());
            }
            if (contractKeyed == null) {
                wrong.add(route.getKey() + ": served but not in the contract");
            } else if (!contractKeyed.equals(route.getValue())) {
                wrong.add(route.getKey()
                        + (route.getValue()
                                ? ": the service needs a key, the contract says none"
                                : ": the service needs none, the contract says a key"));
            }
        }
        for (Map.Entry<String, Boolean> operation : documented.entrySet()) {
            if (served.containsKey(operation.getKey())) {
                continue;
            }
            // A concrete path the contract names on its own (POST /v1/designs/controllers/parameters, one media
            // type for generated clients) is served by the route whose template matches it, with that key rule.
            Boolean templateKeyed = servingTemplateKeyed(served, operation.getKey());
            if (templateKeyed == null) {
                wrong.add(operation.getKey() + ": in the contract but not served");
            } else if (!templateKeyed.equals(operation.getValue())) {
                wrong.add(operation.getKey() + ": the contract's key rule differs from its route's");
            }
        }
        return wrong;
    }

    /**
     * The key rule of the documented concrete "METHOD /path"s that a served "METHOD /template" matches: null when
     * it matches none or they disagree.
     */
    private static Boolean documentedConcreteKeyed(Map<String, Boolean> documented, String served) {
        if (!served.contains("{")) {
            return null;
        }
        String template = java.util.regex.Pattern.quote(served).replaceAll("\\{[^}/]+}", "\\\\E[^/]+\\\\Q");
        Set<Boolean> rules = new java.util.HashSet<>();
        documented.forEach((operation, keyed) -> {
            if (!operation.contains("{") && operation.matches(template)) {
                rules.add(keyed);
            }
        });
        return rules.size() == 1 ? rules.iterator().next() : null;
    }

    /** Whether the served "METHOD /template" that matches a concrete "METHOD /path" needs a key; null if none. */
    private static Boolean servingTemplateKeyed(Map<String, Boolean> served, String operation) {
        for (Map.Entry<String, Boolean> route : served.entrySet()) {
            String template = java.util.regex.Pattern.quote(route.getKey()).replaceAll("\\{[^}/]+}", "\\\\E[^/]+\\\\Q");
            if (route.getKey().contains("{") && operation.matches(template)) {
                return route.getValue();
            }
        }
        return null;
    }

    private static Set<String> fieldNames(JsonNode node) {
        Set<String> names = new java.util.TreeSet<>();
        node.fieldNames().forEachRemaining(names::add);
        return names;
    }
}
