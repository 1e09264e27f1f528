package com.loopwright.service;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.loopwright.api.endpoint.ServiceVersion;
import com.loopwright.api.endpoint.Trace;
import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.TreeSet;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import javax.xml.XMLConstants;
import javax.xml.parsers.DocumentBuilderFactory;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.w3c.dom.Document;
import org.w3c.dom.Element;
import org.w3c.dom.Node;

/**
 * POST /v1/designs/controllers/{structured-text, c-header, c-source, plcopen-xml, parameters} on the live server:
 * one media type per format, an attachment named after the prefix, the provenance header, the request's options
 * in the code, and the problems of bad options.
 */
class ControllerExportEndpointTest extends LiveServerTest {

    private static final String DESIGN = "{\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":400,"
            + "\"d\":400},\"spec\":{\"settlingTime\":0.15,\"overshootPercent\":1.5}}";
    private static final String PATH = "/v1/designs/controllers/";
    /** Longest gcc run [s]. */
    private static final long GCC_TIMEOUT_SECONDS = 60;

    @TempDir
    Path dir;

    private static String body(String options) {
        return "{\"design\":" + DESIGN + ",\"samplePeriod\":0.001" + (options.isEmpty() ? "" : "," + options) + "}";
    }

    /** Each format: its media type, its file name, the version and digest headers and (code) the header lines. */
    @Test
    void everyFormatIsAnAttachmentOfItsOwnType() {
        String[][] formats = {
            {"structured-text", "text/plain", "Axis1_Controller.st"},
            {"c-header", "text/x-c", "Axis1.h"},
            {"c-source", "text/x-c", "Axis1.c"},
            {"plcopen-xml", "application/xml", "Axis1_Controller.xml"},
            {"parameters", "application/json", "Axis1_parameters.json"},
        };
        for (String[] f : formats) {
            LiveServer.Reply reply = server.post(PATH + f[0], body("\"actuatorLimit\":3,\"prefix\":\"Axis1\""));
            assertEquals(200, reply.status(), f[0] + ": " + reply.text());
            assertEquals(f[1], reply.contentType(), f[0]);
            assertEquals("attachment; filename=\"" + f[2] + "\"", reply.header("Content-Disposition"), f[0]);
            String digest = reply.header(Trace.DIGEST_HEADER);
            assertTrue(digest.startsWith("sha256:"), f[0]);
            assertEquals(ServiceVersion.fromBuild(), reply.header(Trace.VERSION_HEADER), f[0]);
            if (f[0].equals("parameters")) {
                assertEquals(digest, reply.json().at("/trace/requestDigest").asText());
                continue;
            }
            for (String provenance : List.of(
                    "Service version: " + ServiceVersion.fromBuild(),
                    "Request digest: " + digest,
                    "Plant: x1' = x2",
                    "Specs: settling time",
                    "gamma (H-infinity level",
                    "Design task period T = 0.001 s",
                    "Sampled loop (emulation, gains unchanged): spectral radius",
                    "CAUTIONS:")) {
                assertTrue(reply.text().contains(provenance), f[0] + " states " + provenance);
            }
        }
    }

    /** The parameter set: the design's gains, the range from actuatorLimit, the default operating point. */
    @Test
    void parametersMatchTheDesign() {
        JsonNode design = server.post("/v1/designs", DESIGN).json();
        JsonNode p =
                server.post(PATH + "parameters", body("\"actuatorLimit\":3")).json();
        assertEquals(design.at("/gain/k/0").asDouble(), p.get("positionGain").asDouble(), 0);
        assertEquals(design.at("/gain/k/1").asDouble(), p.get("velocityGain").asDouble(), 0);
        assertEquals(
                design.at("/gain/referenceGain").asDouble(),
                p.get("referenceGain").asDouble(),
                0);
        assertEquals(design.get("gamma").asDouble(), p.get("gamma").asDouble(), 0);
        assertEquals(-3, p.at("/actuatorRange/lowest").asDouble(), 0);
        assertEquals(3, p.at("/actuatorRange/highest").asDouble(), 0);
        assertEquals(0, p.at("/operatingPoint/output").asDouble(), 0);
        assertEquals(0, p.at("/operatingPoint/command").asDouble(), 0);
        assertEquals(10, p.get("periodTolerancePercent").asDouble(), 0);
        assertTrue(p.get("sampledSpectralRadius").asDouble() < 1);
        assertEquals(4, p.get("cautions").size());
    }

    /** The asymmetric range, the operating point, the tolerance and the precision reach the code's constants. */
    @Test
    void theOptionsReachTheCode() {
        String options = "\"actuatorRange\":{\"lowest\":4,\"highest\":20},\"operatingPoint\":{\"output\":0.25,"
                + "\"command\":12},\"periodTolerancePercent\":5,\"prefix\":\"Valve7\"";
        String header = server.post(PATH + "c-header", body(options)).text();
        for (String constant : List.of(
                "#define VALVE7_U_MIN (4.0)",
                "#define VALVE7_U_MAX (20.0)",
                "#define VALVE7_U0 (12.0)",
                "#define VALVE7_Y0_1 (0.25)",
                "#define VALVE7_Y0_2 (0.0)",
                "#define VALVE7_PERIOD_TOLERANCE_S (5.0E-5)")) {
            assertTrue(header.contains(constant), constant + " in " + header);
        }
        JsonNode p = server.post(PATH + "parameters", body(options)).json();
        assertEquals(4, p.at("/actuatorRange/lowest").asDouble(), 0);
        assertEquals(12, p.at("/operatingPoint/command").asDouble(), 0);
        assertEquals(5, p.get("periodTolerancePercent").asDouble(), 0);
        String single = server.post(PATH + "structured-text", body("\"actuatorLimit\":3,\"precision\":\"single\""))
                .text();
        assertTrue(single.contains("Command : REAL;") && !single.contains("LREAL"), single);
        String singleC = server.post(PATH + "c-header", body("\"actuatorLimit\":3,\"precision\":\"single\""))
                .text();
        assertTrue(singleC.contains("float LW_step(") && !singleC.contains("double"), singleC);
    }

    /**
     * The PLCopen XML project has the elements TC6 XML 2.01 requires (project, fileHeader, contentHeader,
     * types/pous/pou with pouType functionBlock, interface variable lists, body with ST; from the PLCopen TC6 XML
     * schema) and its ST body is the Structured Text export's body (same request).
     */
    @Test
    void thePlcOpenProjectHoldsTheStructuredTextBody() throws Exception {
        String body = body("\"actuatorLimit\":3,\"prefix\":\"Axis1\"");
        String xml = server.post(PATH + "plcopen-xml", body).text();
        String st = server.post(PATH + "structured-text", body).text();
        Document doc = parse(xml);
        Element project = doc.getDocumentElement();
        assertEquals("project", project.getLocalName());
        assertEquals("http://www.plcopen.org/xml/tc6_0201", project.getNamespaceURI());
        assertEquals(1, children(project, "fileHeader").size());
        assertEquals(1, children(project, "contentHeader").size());
        Element pou = only(only(only(project, "types"), "pous"), "pou");
        assertEquals("Axis1_Controller", pou.getAttribute("name"));
        assertEquals("functionBlock", pou.getAttribute("pouType"));
        Element iface = only(pou, "interface");
        assertEquals(1, children(iface, "inputVars").size());
        assertEquals(1, children(iface, "outputVars").size());
        String xmlBody = only(only(pou, "body"), "ST").getTextContent();
        String stBody =
                st.substring(st.lastIndexOf("END_VAR\n") + "END_VAR\n".length(), st.indexOf("END_FUNCTION_BLOCK"));
        assertEquals(stBody, xmlBody);
        assertTrue(st.contains("FUNCTION_BLOCK Axis1_Controller\n"));
    }

    /**
     * Two axes in one program: the names one export defines (block, functions, state type, macros) are disjoint
     * from the other's, and both C pairs compile and link into one program with gcc (-std=c99 -Wall -Werror).
     */
    @Test
    void twoAxesLiveInOneProject() throws Exception {
        List<String> files = new ArrayList<>();
        List<Set<String>> names = new ArrayList<>();
        for (String prefix : List.of("Axis1", "Axis2")) {
            String options = "\"actuatorLimit\":3,\"prefix\":\"" + prefix + "\"";
            LiveServer.Reply h = server.post(PATH + "c-header", body(options));
            LiveServer.Reply c = server.post(PATH + "c-source", body(options));
            String st = server.post(PATH + "structured-text", body(options)).text();
            Files.writeString(dir.resolve(prefix + ".h"), h.text());
            Files.writeString(dir.resolve(prefix + ".c"), c.text());
            files.add(dir.resolve(prefix + ".c").toString());
            // the declarations, without the header comment (its prose names no C identifier)
            String code = h.text().replaceAll("(?s)/\\*.*?\\*/", "");
            Set<String> defined = new TreeSet<>();
            collect(Pattern.compile("#define (\\w+)"), code, defined);
            collect(Pattern.compile("} (\\w+);"), code, defined);
            collect(Pattern.compile("\\b(\\w+)\\("), code, defined);
            collect(Pattern.compile("FUNCTION_BLOCK (\\w+)"), st, defined);
            defined.removeAll(Set.of("float", "double", "void", "int"));
            assertTrue(defined.size() > 10, prefix + " defines " + defined);
            for (String name : defined) {
                assertTrue(name.toUpperCase().startsWith(prefix.toUpperCase()), name + " carries " + prefix);
            }
            names.add(defined);
        }
        Set<String> shared = new TreeSet<>(names.get(0));
        shared.retainAll(names.get(1));
        assertTrue(shared.isEmpty(), "shared names " + shared);

        boolean required = "1".equals(System.getenv("LOOPWRIGHT_REQUIRE_GCC"));
        boolean gcc = gccRuns();
        assertTrue(gcc || !required, "gcc is required (LOOPWRIGHT_REQUIRE_GCC=1) but missing");
        assumeTrue(gcc, "gcc is not installed");
        Files.writeString(dir.resolve("main.c"), """
                #include "Axis1.h"
                #include "Axis2.h"
                int main(void)
                {
                    Axis1_state a;
                    Axis2_state b;
                    unsigned int sa = 0u;
                    unsigned int sb = 0u;
                    const double y[2] = {0.0, 0.0};
                    double u1;
                    double u2;
                    Axis1_init(&a);
                    Axis2_init(&b);
                    u1 = Axis1_step(&a, 1, 0.01, y, 1.0, 0.001, &sa);
                    u2 = Axis2_step(&b, 1, 0.01, y, 1.0, 0.001, &sb);
                    return (u1 == u2 && sa == sb) ? 0 : 1;
                }
                """);
        List<String> command = new ArrayList<>(List.of("gcc", "-std=c99", "-Wall", "-Werror", "-o", "axes"));
        command.add("main.c");
        command.addAll(files);
        Process p = new ProcessBuilder(command)
                .directory(dir.toFile())
                .redirectErrorStream(true)
                .start();
        String log = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        assertTrue(p.waitFor(GCC_TIMEOUT_SECONDS, TimeUnit.SECONDS), "gcc finished");
        assertEquals(0, p.exitValue(), log);
        Process run = new ProcessBuilder(dir.resolve("axes").toString())
                .redirectErrorStream(true)
                .start();
        run.getInputStream().readAllBytes();
        assertTrue(run.waitFor(GCC_TIMEOUT_SECONDS, TimeUnit.SECONDS));
        assertEquals(0, run.exitValue(), "the same design on two axes gives the same command");
    }

    /** Bad options are 400 problems with the field's pointer; a too long period is the 422 at /samplePeriod. */
    @Test
    void badOptionsArePointedAt() {
        String[][] cases = {
            {"", "/actuatorLimit"},
            {"\"actuatorLimit\":3,\"actuatorRange\":{\"lowest\":0,\"highest\":1}", "/actuatorRange"},
            {"\"actuatorRange\":{\"lowest\":1,\"highest\":1}", "/actuatorRange/highest"},
            {"\"actuatorRange\":{\"lowest\":1}", "/actuatorRange/highest"},
            {"\"actuatorLimit\":3,\"operatingPoint\":{\"command\":4}", "/operatingPoint/command"},
            {"\"actuatorLimit\":3,\"operatingPoint\":{\"output\":1e12}", "/operatingPoint/output"},
            {"\"actuatorLimit\":3,\"prefix\":\"1Axis\"", "/prefix"},
            {"\"actuatorLimit\":3,\"prefix\":\"Axis__1\"", "/prefix"},
            {"\"actuatorLimit\":3,\"prefix\":\"Axis1234567890123\"", "/prefix"},
            {"\"actuatorLimit\":3,\"precision\":\"quad\"", "/precision"},
            {"\"actuatorLimit\":3,\"periodTolerancePercent\":0", "/periodTolerancePercent"},
            {"\"actuatorLimit\":3,\"periodTolerancePercent\":60", "/periodTolerancePercent"},
        };
        for (String format : List.of("structured-text", "c-header", "c-source", "plcopen-xml", "parameters")) {
            for (String[] c : cases) {
                LiveServer.Reply reply = server.post(PATH + format, body(c[0]));
                assertEquals(400, reply.status(), format + " " + c[0] + ": " + reply.text());
                assertEquals("application/problem+json", reply.contentType());
                assertEquals(c[1], reply.json().at("/errors/0/pointer").asText(), format + " " + c[0]);
                assertFalse(reply.headers().firstValue("Content-Disposition").isPresent());
            }
            LiveServer.Reply tooSlow =
                    server.post(PATH + format, body("\"actuatorLimit\":3").replace("0.001", "0.05"));
            assertEquals(422, tooSlow.status(), format);
            assertEquals("/samplePeriod", tooSlow.json().at("/errors/0/pointer").asText());
            assertTrue(tooSlow.json().get("detail").asText().contains("too long"));
        }
    }

    /**
     * The vertical axis of the loop tests: an 18 kg carriage, encoder only, integral action against its weight; the
     * observer poles at 5 x the controller's.
     */
    private static final String VERTICAL_AXIS = "{\"plant\":{\"form\":\"massSpringDamper\",\"mass\":18,\"damping\":60,"
            + "\"stiffness\":0},\"spec\":{\"settlingTime\":0.3,\"overshootPercent\":2},\"integralAction\":true,"
            + "\"measurement\":\"position\",\"observer\":{\"method\":\"poleMultiple\",\"multiple\":5}}";
    /** The same axis with a steady-state Kalman observer for a 1 um encoder: observer poles near 3900 (1 +- j) 1/s. */
    private static final String VERTICAL_AXIS_KALMAN = VERTICAL_AXIS.replace(
            "{\"method\":\"poleMultiple\",\"multiple\":5}",
            "{\"method\":\"kalman\",\"processNoise\":25,\"sensorResolution\":1e-6,\"samplePeriod\":1e-3}");

    /**
     * Integral action with position-only sensing: every format exports the loop's controller (integrator and
     * observer discretized exactly), the parameter set names its gains and the sampled loop's radius (below
     * 0.999), the PLCopen body is the ST body, and a period at which the slowest mode barely decays is the 422.
     */
    @Test
    void aLoopWithIntegralActionAndAnObserverIsExported() throws Exception {
        String body = "{\"design\":" + VERTICAL_AXIS + ",\"samplePeriod\":0.001,\"actuatorLimit\":400,"
                + "\"prefix\":\"Lift\"}";
        JsonNode design = server.post("/v1/designs", VERTICAL_AXIS).json();
        LiveServer.Reply parameters = server.post(PATH + "parameters", body);
        assertEquals(200, parameters.status(), parameters.text());
        JsonNode p = parameters.json();
        assertEquals("zeroOrderHold", p.get("discretization").asText());
        assertEquals(
                design.at("/law/integralGain").asDouble(), p.get("integralGain").asDouble(), 0, p.toString());
        assertEquals(2, p.get("observerGain").size());
        assertTrue(p.get("sampledSpectralRadius").asDouble() < 0.999);
        assertFalse(p.has("sampledStep"));
        String st = server.post(PATH + "structured-text", body).text();
        assertTrue(st.contains("Integrator Q3 of r - y1; anti-windup by conditional integration"), st);
        assertTrue(st.contains("Bumpless enable"), st);
        assertTrue(st.contains("Loop: integral action (ki = "), st);
        assertFalse(st.contains("Y2 :"), "position only");
        String xml = server.post(PATH + "plcopen-xml", body).text();
        String xmlBody = parse(xml).getElementsByTagNameNS("*", "ST").item(0).getTextContent();
        assertEquals(
                st.substring(st.lastIndexOf("END_VAR\n") + "END_VAR\n".length(), st.indexOf("END_FUNCTION_BLOCK")),
                xmlBody);
        assertTrue(server.post(PATH + "c-header", body).text().contains("#define LIFT_STATE_COUNT 3"));
        LiveServer.Reply tooShort = server.post(
                PATH + "c-source",
                body.replace("\"samplePeriod\":0.001,\"actuatorLimit", "\"samplePeriod\":1e-5,\"actuatorLimit"));
        assertEquals(422, tooShort.status(), tooShort.text());
        assertEquals("/samplePeriod", tooShort.json().at("/errors/0/pointer").asText());
        assertTrue(tooShort.json().get("detail").asText().contains("lengthen the period"), tooShort.text());
        // observer poles with |s| T near 5.5: the sampled loop is unstable at 1 ms (a 422 the period explains)
        LiveServer.Reply tooFast = server.post(PATH + "c-source", body.replace(VERTICAL_AXIS, VERTICAL_AXIS_KALMAN));
        assertEquals(422, tooFast.status(), tooFast.text());
        assertEquals("/samplePeriod", tooFast.json().at("/errors/0/pointer").asText());
        assertTrue(tooFast.json().get("detail").asText().contains("unstable; shorten"), tooFast.text());
    }

    private static void collect(Pattern pattern, String text, Set<String> into) {
        Matcher m = pattern.matcher(text);
        while (m.find()) {
            into.add(m.group(1));
        }
    }

    private static boolean gccRuns() {
        try {
            Process p = new ProcessBuilder("gcc", "--version")
                    .redirectErrorStream(true)
                    .start();
            p.getInputStream().readAllBytes();
            return p.waitFor(GCC_TIMEOUT_SECONDS, TimeUnit.SECONDS) && p.exitValue() == 0;
        } catch (IOException e) {
            return false;
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            return false;
        }
    }

    private static Document parse(String xml) throws Exception {
        DocumentBuilderFactory factory = DocumentBuilderFactory.newInstance();
        factory.setFeature("http://apache.org/xml/features/disallow-doctype-decl", true);
        factory.setFeature(XMLConstants.FEATURE_SECURE_PROCESSING, true);
        factory.setNamespaceAware(true);
        return factory.newDocumentBuilder().parse(new ByteArrayInputStream(xml.getBytes(StandardCharsets.UTF_8)));
    }

    private static List<Element> children(Element parent, String name) {
        List<Element> found = new ArrayList<>();
        for (Node n = parent.getFirstChild(); n != null; n = n.getNextSibling()) {
            if (n instanceof Element e && name.equals(e.getLocalName())) {
                found.add(e);
            }
        }
        return found;
    }

    private static Element only(Element parent, String name) {
        List<Element> found = children(parent, name);
        assertEquals(1, found.size(), "one " + name + " in " + parent.getLocalName());
        return found.get(0);
    }
}
