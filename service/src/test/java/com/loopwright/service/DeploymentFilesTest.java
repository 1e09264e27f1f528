package com.loopwright.service;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.dataformat.yaml.YAMLFactory;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashMap;
import java.util.Map;
import org.junit.jupiter.api.Test;

/**
 * No cluster or container engine runs here, so the deployment files are checked as documents: the manifests
 * parse as YAML with the kinds, probes, limits and ports the service needs, the Dockerfile runs as non-root
 * with a health check, and the load script stays bounded and on loopback.
 */
class DeploymentFilesTest {

    private static final Path ROOT = Path.of("..");

    private static Map<String, JsonNode> manifests() throws Exception {
        Map<String, JsonNode> byKind = new HashMap<>();
        ObjectMapper yaml = new ObjectMapper(new YAMLFactory());
        try (var files = Files.list(ROOT.resolve("deploy"))) {
            for (Path file : files.filter(f -> f.toString().endsWith(".yaml")).toList()) {
                JsonNode document = yaml.readTree(Files.readString(file));
                assertTrue(document.hasNonNull("apiVersion") && document.hasNonNull("kind"), file.toString());
                byKind.put(document.get("kind").asText(), document);
            }
        }
        return byKind;
    }

    @Test
    void kubernetesManifestsDescribeAProbedLimitedScalableService() throws Exception {
        Map<String, JsonNode> kinds = manifests();
        assertTrue(
                kinds.keySet().containsAll(java.util.Set.of("Deployment", "Service", "HorizontalPodAutoscaler")),
                kinds.keySet().toString());
        JsonNode container = kinds.get("Deployment").at("/spec/template/spec/containers/0");
        assertEquals("/health/live", container.at("/livenessProbe/httpGet/path").asText());
        assertEquals(
                "/health/ready", container.at("/readinessProbe/httpGet/path").asText());
        assertTrue(container.at("/resources/limits/cpu").isTextual()
                && container.at("/resources/limits/memory").isTextual());
        assertTrue(container.at("/resources/requests/cpu").isTextual());
        assertEquals(8080, container.at("/ports/0/containerPort").asInt());
        assertTrue(container.at("/securityContext/readOnlyRootFilesystem").asBoolean());
        assertTrue(kinds.get("Deployment")
                .at("/spec/template/spec/securityContext/runAsNonRoot")
                .asBoolean());
        // The pod's grace period covers the pre-stop pause plus the service's own drain.
        long graceMillis = 0;
        for (JsonNode env : container.get("env")) {
            if (env.get("name").asText().equals("LOOPWRIGHT_SHUTDOWN_GRACE_MS")) {
                graceMillis = Long.parseLong(env.get("value").asText());
            }
            assertTrue(env.get("name").asText().startsWith("LOOPWRIGHT_"), env.toString());
        }
        long podGraceSeconds = kinds.get("Deployment")
                .at("/spec/template/spec/terminationGracePeriodSeconds")
                .asLong();
        long preStopSeconds = container.at("/lifecycle/preStop/sleep/seconds").asLong();
        assertTrue(
                graceMillis > 0 && podGraceSeconds * 1000 > graceMillis + preStopSeconds * 1000,
                "pod grace " + podGraceSeconds + " s covers the drain");
        assertEquals(
                "Deployment",
                kinds.get("HorizontalPodAutoscaler")
                        .at("/spec/scaleTargetRef/kind")
                        .asText());
        assertTrue(kinds.get("HorizontalPodAutoscaler").at("/spec/maxReplicas").asInt()
                > kinds.get("HorizontalPodAutoscaler").at("/spec/minReplicas").asInt());
        assertEquals(
                kinds.get("Deployment").at("/spec/selector/matchLabels"),
                kinds.get("Service").at("/spec/selector"));
        // Availability and least privilege (common practice for a stateless service).
        JsonNode pod = kinds.get("Deployment").at("/spec/template/spec");
        assertFalse(pod.at("/automountServiceAccountToken").asBoolean(true), "no service-account token");
        assertEquals(
                "kubernetes.io/hostname",
                pod.at("/topologySpreadConstraints/0/topologyKey").asText());
        assertEquals(
                kinds.get("Deployment").at("/spec/selector/matchLabels"),
                kinds.get("PodDisruptionBudget").at("/spec/selector/matchLabels"));
        assertEquals(
                1, kinds.get("PodDisruptionBudget").at("/spec/minAvailable").asInt());
    }

    /**
     * /metrics on the management port, and that port open to the monitoring namespace only: a NetworkPolicy admits
     * by port (Kubernetes NetworkPolicy API, networking.k8s.io/v1), so the policy names the container ports.
     */
    @Test
    void metricsPortIsOpenToTheMonitoringNamespaceOnly() throws Exception {
        Map<String, JsonNode> kinds = manifests();
        JsonNode container = kinds.get("Deployment").at("/spec/template/spec/containers/0");
        int metricsPort = -1;
        for (JsonNode port : container.get("ports")) {
            if (port.get("name").asText().equals("metrics")) {
                metricsPort = port.get("containerPort").asInt();
            }
        }
        assertTrue(metricsPort > 0 && metricsPort != 8080, "a metrics container port of its own");
        String metricsEnv = null;
        for (JsonNode env : container.get("env")) {
            if (env.get("name").asText().equals("LOOPWRIGHT_METRICS_PORT")) {
                metricsEnv = env.get("value").asText();
            }
        }
        assertEquals(String.valueOf(metricsPort), metricsEnv, "the service listens where the port is declared");
        assertEquals(
                String.valueOf(metricsPort),
                kinds.get("Deployment")
                        .at("/spec/template/metadata/annotations/prometheus.io~1port")
                        .asText());
        boolean servicePort = false;
        for (JsonNode port : kinds.get("Service").at("/spec/ports")) {
            servicePort |= port.get("targetPort").asText().equals("metrics");
        }
        assertTrue(servicePort, "the Service exposes the metrics port");
        ObjectMapper yaml = new ObjectMapper(new YAMLFactory());
        JsonNode monitor = yaml.readTree(Files.readString(ROOT.resolve("deploy/monitoring/servicemonitor.yaml")));
        assertEquals("metrics", monitor.at("/spec/endpoints/0/port").asText());

        JsonNode policy = kinds.get("NetworkPolicy");
        assertEquals(
                kinds.get("Deployment").at("/spec/selector/matchLabels"), policy.at("/spec/podSelector/matchLabels"));
        assertEquals("Ingress", policy.at("/spec/policyTypes/0").asText());
        JsonNode rules = policy.at("/spec/ingress");
        assertEquals(2, rules.size());
        for (JsonNode rule : rules) {
            assertEquals(1, rule.get("ports").size(), rule.toString());
            String port = rule.at("/ports/0/port").asText();
            JsonNode from = rule.at("/from/0");
            if (port.equals("metrics")) {
                assertEquals(
                        "monitoring",
                        from.at("/namespaceSelector/matchLabels/kubernetes.io~1metadata.name")
                                .asText(),
                        "metrics only from the monitoring namespace");
                assertFalse(from.has("podSelector"), rule.toString());
            } else {
                assertEquals("http", port, rule.toString());
                assertTrue(from.has("podSelector") && !from.has("namespaceSelector"), "http from this namespace");
            }
        }
    }

    /** CI checks the manifests against the Kubernetes schemas, and that the checker refuses broken ones. */
    @Test
    void ciChecksTheManifestsAgainstTheKubernetesSchemas() throws Exception {
        String ci = Files.readString(ROOT.resolve(".ci/run"));
        assertTrue(ci.contains("check-manifests.mjs .. ../monitoring"), "the real manifests are checked");
        assertTrue(ci.contains("deploy/validate/test/"), "the broken examples must fail the check");
        try (var broken = Files.list(ROOT.resolve("deploy/validate/test"))) {
            assertTrue(broken.count() >= 2, "a misspelled member and a wrong type");
        }
    }

    @Test
    void dockerfileRunsTheJarAsNonRootWithAHealthCheck() throws Exception {
        String dockerfile = Files.readString(ROOT.resolve("Dockerfile"));
        assertTrue(dockerfile.contains("USER 10001"), "non-root user");
        assertTrue(dockerfile.contains("loopwright.jar"));
        // The health check speaks HTTP from the shell: no second JVM every interval.
        String check = dockerfile.substring(dockerfile.indexOf("HEALTHCHECK"));
        check = check.substring(0, check.indexOf("]") + 1);
        assertTrue(check.contains("/health/live") && !check.contains("java"), check);
        assertTrue(dockerfile.contains("org.opencontainers.image.version"), "OCI labels");
        // Only the service module is built, and the dependency layer lists every module pom the reactor reads.
        assertTrue(dockerfile.contains("-pl service -am package"), "only the service module is built");
        java.util.regex.Matcher module = java.util.regex.Pattern.compile("<module>([^<]+)</module>")
                .matcher(Files.readString(ROOT.resolve("pom.xml")));
        while (module.find()) {
            String pom = "COPY " + module.group(1) + "/pom.xml " + module.group(1) + "/";
            assertTrue(dockerfile.contains(pom), "the dependency layer copies " + module.group(1) + "/pom.xml");
        }
        assertTrue(
                dockerfile.indexOf("COPY solver/src") > dockerfile.indexOf("COPY service/pom.xml"),
                "sources come after the dependency layer");
        String ignored = Files.readString(ROOT.resolve(".dockerignore"));
        assertTrue(
                ignored.contains("**/target/") && ignored.contains(".git/"), ".dockerignore keeps the context small");
        // Out of memory must end the process so that the orchestrator restarts it (not serve on, sick).
        assertTrue(
                dockerfile
                        .lines()
                        .anyMatch(line ->
                                line.startsWith("ENTRYPOINT") && line.contains("\"-XX:+ExitOnOutOfMemoryError\"")),
                "the java command exits on OutOfMemoryError");
        String readme = Files.readString(ROOT.resolve("README.md"));
        assertTrue(
                readme.contains("java -XX:+ExitOnOutOfMemoryError -jar service/target/loopwright.jar"),
                "the README's start command has the flag too");
    }

    @Test
    void loadScriptIsBoundedAndLoopbackOnly() throws Exception {
        Path script = ROOT.resolve("bench").resolve("load.sh");
        assertTrue(Files.isExecutable(script), "bench/load.sh is executable");
        String text = Files.readString(script);
        assertTrue(
                text.contains("127.0.0.1") && !text.matches("(?s).*https?://(?!127\\.0\\.0\\.1)[a-z0-9].*"),
                "targets loopback only");
        assertTrue(text.contains("--duration") || text.contains(" -d "), "wrk runs for a bounded time");
        assertTrue(text.contains("--latency"), "prints latency percentiles");
    }

    /** The soak test CI runs: loopback only, bounded by a timeout, under the documented heap, started by .ci/run. */
    @Test
    void soakScriptIsBoundedAndLoopbackOnlyAndRunInCi() throws Exception {
        Path script = ROOT.resolve("bench").resolve("soak.sh");
        assertTrue(Files.isExecutable(script), "bench/soak.sh is executable");
        String text = Files.readString(script);
        assertTrue(
                text.contains("127.0.0.1") && !text.matches("(?s).*https?://(?!127\\.0\\.0\\.1)[a-z0-9].*"),
                "targets loopback only");
        assertTrue(text.contains("timeout 160 mvn"), "the soak run is bounded in time");
        // The jar is started by the shared bench/service-jar.sh, which passes the heap as -Xmx.
        String starter = Files.readString(ROOT.resolve("bench").resolve("service-jar.sh"));
        assertTrue(
                text.contains("heap=${SOAK_HEAP:-256m}")
                        && text.contains("service_start \"$heap\"")
                        && starter.contains("local heap=$1")
                        && starter.contains("java -Xmx\"$heap\""),
                "under -Xmx256m");
        assertTrue(Files.readString(ROOT.resolve(".ci/run")).contains("bench/soak.sh"), ".ci/run starts it");
        assertTrue(SoakTest.ROUNDS >= SoakTest.COMPARED_ROUND && SoakTest.RSS_GROWTH_LIMIT <= 0.10);
        assertTrue(SoakTest.ROUND_BUDGET_MILLIS * SoakTest.ROUNDS <= 150_000, "rounds fit the time promise");
    }
}
