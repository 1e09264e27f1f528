package com.loopwright.service;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import javax.xml.XMLConstants;
import javax.xml.parsers.DocumentBuilder;
import javax.xml.parsers.DocumentBuilderFactory;
import org.junit.jupiter.api.Test;
import org.w3c.dom.Document;
import org.w3c.dom.Element;
import org.w3c.dom.NamedNodeMap;
import org.w3c.dom.NodeList;

/** Plots, the controller export's shared wrapper errors and the dashboard on the live server. */
class TakeawayEndpointTest extends LiveServerTest {

    private static final String DESIGN = "{\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":400,\"d\":400},"
            + "\"spec\":{\"settlingTime\":0.15,\"overshootPercent\":1.5}}";
    private static final Pattern NUMBER = Pattern.compile("-?[0-9]+(\\.[0-9]+)?([eE][-+]?[0-9]+)?");

    private final Contract contract = Contract.load();

    @Test
    void stepFigureIsCleanSvgWithTheSpecEnvelope() throws Exception {
        LiveServer.Reply reply = server.post("/v1/designs/plots/step-response", "{\"design\":" + DESIGN + "}");
        assertEquals(200, reply.status());
        assertEquals("image/svg+xml", reply.contentType());
        Document svg = parseSafely(reply.text());
        assertEquals("svg", svg.getDocumentElement().getTagName());
        assertEquals("http://www.w3.org/2000/svg", svg.getDocumentElement().getAttribute("xmlns"));
        assertEquals(1, svg.getElementsByTagName("polyline").getLength());
        assertTrue(countClass(svg, "rect", "band") >= 1, "settling band drawn");
        assertTrue(countClass(svg, "line", "spec") >= 2, "overshoot limit and settling spec lines");
        assertTrue(reply.text().contains("overshoot limit 1.5%"));
        assertTrue(reply.text().contains("settling spec 0.15 s"));
        assertTrue(reply.text().contains("rise (10-90%)"));
        assertTrue(reply.text().contains("time t [s]"));
        assertCleanAndFinite(svg, reply.text());
        // The polyline has the documented 600 samples.
        String points = ((Element) svg.getElementsByTagName("polyline").item(0)).getAttribute("points");
        assertEquals(600, points.trim().split(" ").length);
    }

    @Test
    void uncertaintyBandDrawsTheSpreadOverTheParameterBox() throws Exception {
        String box =
                "\"verify\":{\"uncertainty\":{\"b\":{\"spreadPercent\":20},\"monteCarloSamples\":10," + "\"seed\":5}}";
        String design = DESIGN.substring(0, DESIGN.length() - 1) + "," + box + "}";
        LiveServer.Reply reply = server.post("/v1/designs/plots/uncertainty-band", "{\"design\":" + design + "}");
        assertEquals(200, reply.status(), reply.text());
        Document svg = parseSafely(reply.text());
        assertEquals(1, countClass(svg, "polygon", "spread"), "the band");
        String points = ((Element) svg.getElementsByTagName("polygon").item(0)).getAttribute("points");
        assertEquals(2 * 600, points.trim().split(" ").length, "upper and lower edge of 600 samples each");
        assertTrue(reply.text().contains("12 parameter sets"), "2 corners and 10 samples");
        assertCleanAndFinite(svg, reply.text());

        LiveServer.Reply missing = server.post("/v1/designs/plots/uncertainty-band", "{\"design\":" + DESIGN + "}");
        assertEquals(400, missing.status());
        assertEquals(
                "/design/verify/uncertainty",
                missing.json().at("/errors/0/pointer").asText());

        String unstable = DESIGN.substring(0, DESIGN.length() - 1)
                + ",\"verify\":{\"uncertainty\":{\"a0\":{\"lowest\":-2000,\"highest\":-1000}}}}";
        LiveServer.Reply none = server.post("/v1/designs/plots/uncertainty-band", "{\"design\":" + unstable + "}");
        assertEquals(422, none.status(), none.text());
    }

    // Metrics label a templated route by its template, so label values stay bounded (Prometheus practice).
    @Test
    void metricsLabelTemplatedRoutesByTheirTemplate() {
        server.post("/v1/designs/plots/bode", "{\"design\":" + DESIGN + "}");
        server.get("/no/such/path/" + System.nanoTime());
        String metrics = server.get("/metrics").text();
        assertTrue(metrics.contains("route=\"/v1/designs/plots/{figure}\""), "template label");
        assertFalse(metrics.contains("route=\"/v1/designs/plots/bode\""), "no per-value label");
        assertTrue(metrics.contains("route=\"other\""), "unmatched paths share one label");
    }

    /** A negative step on an unstable plant with a rise-time spec: the band is still drawn with a height. */
    @Test
    void negativeStepKeepsTheBandAndTheRiseSpec() throws Exception {
        LiveServer.Reply reply = server.post(
                "/v1/designs/plots/step-response",
                "{\"design\":{\"plant\":{\"form\":\"canonical\",\"a0\":-4,"
                        + "\"a1\":0,\"b\":2,\"d\":0},\"spec\":{\"riseTime\":0.5,\"overshootPercent\":1,\"stepSize\":-2}}}");
        assertEquals(200, reply.status());
        Document svg = parseSafely(reply.text());
        NodeList rects = svg.getElementsByTagName("rect");
        double bandHeight = 0;
        for (int i = 0; i < rects.getLength(); i++) {
            Element rect = (Element) rects.item(i);
            if ("band".equals(rect.getAttribute("class")) && !"24".equals(rect.getAttribute("width"))) {
                bandHeight = Double.parseDouble(rect.getAttribute("height"));
            }
        }
        // 2% of |r| = 0.04 on an axis of about 2.5 units over 300 px: about 5 px.
        assertTrue(bandHeight > 2, "band height " + bandHeight);
        assertTrue(reply.text().contains("rise spec 0.5 s"));
        assertCleanAndFinite(svg, reply.text());
    }

    @Test
    void controlEffortShowsTheActuatorLimitAndBodeShowsTheMargins() throws Exception {
        LiveServer.Reply effort =
                server.post("/v1/designs/plots/control-effort", "{\"design\":" + DESIGN + ",\"actuatorLimit\":3}");
        assertEquals(200, effort.status());
        Document effortSvg = parseSafely(effort.text());
        assertEquals(3, countClass(effortSvg, "line", "limit")); // +limit, -limit and the legend swatch
        assertTrue(effort.text().contains("actuator limit +3"));
        assertTrue(effort.text().contains("command u [u units]"));
        assertCleanAndFinite(effortSvg, effort.text());

        LiveServer.Reply bode = server.post("/v1/designs/plots/bode", "{\"design\":" + DESIGN + "}");
        assertEquals(200, bode.status());
        Document bodeSvg = parseSafely(bode.text());
        assertEquals(2, bodeSvg.getElementsByTagName("polyline").getLength());
        assertTrue(bode.text().contains("phase margin"));
        assertTrue(bode.text().contains("no finite gain margin"));
        assertTrue(bode.text().contains("magnitude |L(jw)| [dB]"));
        assertCleanAndFinite(bodeSvg, bode.text());
    }

    @Test
    void badRequestsAreProblemsWithPointersIntoTheWrapper() {
        LiveServer.Reply unknown = server.post("/v1/designs/plots/nyquist", "{\"design\":" + DESIGN + "}");
        assertEquals(404, unknown.status());
        LiveServer.Reply missing = server.post("/v1/designs/controllers/c-source", "{\"design\":" + DESIGN + "}");
        assertEquals(400, missing.status());
        assertEquals("/samplePeriod", missing.json().at("/errors/0/pointer").asText());
        assertEquals("/actuatorLimit", missing.json().at("/errors/1/pointer").asText());
        LiveServer.Reply badSpec = server.post(
                "/v1/designs/plots/bode",
                "{\"design\":{\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":400,\"d\":400},"
                        + "\"spec\":{\"settlingTime\":0.15,\"overshootPercent\":120}}}");
        assertEquals(400, badSpec.status());
        assertEquals(
                "/design/spec/overshootPercent",
                badSpec.json().at("/errors/0/pointer").asText());
        LiveServer.Reply tooSlow = server.post(
                "/v1/designs/controllers/structured-text",
                "{\"design\":" + DESIGN + ",\"samplePeriod\":0.05,\"actuatorLimit\":3}");
        assertEquals(422, tooSlow.status());
        assertEquals("/samplePeriod", tooSlow.json().at("/errors/0/pointer").asText());
        assertTrue(tooSlow.json().get("detail").asText().contains("too long"));
        LiveServer.Reply infeasible = server.post(
                "/v1/designs/plots/step-response",
                "{\"design\":{\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":400,\"d\":400},"
                        + "\"spec\":{\"settlingTime\":0.15,\"overshootPercent\":30}}}");
        assertEquals(422, infeasible.status());
        assertTrue(infeasible.json().at("/errors/0/pointer").asText().startsWith("/design/spec/"));
        LiveServer.Reply unknownField =
                server.post("/v1/designs/plots/bode", "{\"design\":" + DESIGN + ",\"colour\":\"red\"}");
        assertEquals(400, unknownField.status());
        LiveServer.Reply negativeLimit =
                server.post("/v1/designs/plots/control-effort", "{\"design\":" + DESIGN + ",\"actuatorLimit\":-1}");
        assertEquals(400, negativeLimit.status());
        LiveServer.Reply text = server.post("/v1/designs/plots/bode", "{\"design\":" + DESIGN + "}", "text/plain");
        assertEquals(415, text.status());
    }

    @Test
    void dashboardIsSelfContained() {
        LiveServer.Reply page = server.get("/");
        assertEquals(200, page.status());
        assertEquals("text/html", page.contentType());
        assertTrue(page.text().contains("<form id=\"design-form\""));
        assertFalse(
                Pattern.compile("(src|href)=\"(https?:)?//")
                        .matcher(page.text())
                        .find(),
                "no external resources");
    }

    private static Document parseSafely(String text) throws Exception {
        DocumentBuilderFactory factory = DocumentBuilderFactory.newInstance();
        factory.setFeature("http://apache.org/xml/features/disallow-doctype-decl", true);
        factory.setFeature(XMLConstants.FEATURE_SECURE_PROCESSING, true);
        factory.setNamespaceAware(false);
        DocumentBuilder builder = factory.newDocumentBuilder();
        return builder.parse(new ByteArrayInputStream(text.getBytes(StandardCharsets.UTF_8)));
    }

    private static int countClass(Document svg, String tag, String cssClass) {
        NodeList nodes = svg.getElementsByTagName(tag);
        int count = 0;
        for (int i = 0; i < nodes.getLength(); i++) {
            if (cssClass.equals(((Element) nodes.item(i)).getAttribute("class"))) {
                count++;
            }
        }
        return count;
    }

    /** No script, no external reference, every coordinate attribute a finite number. */
    private static void assertCleanAndFinite(Document svg, String text) {
        assertEquals(0, svg.getElementsByTagName("script").getLength());
        assertFalse(text.contains("href"), "no links or external references");
        assertFalse(text.contains("@import") || text.contains("url("), "no external style");
        assertFalse(text.contains("NaN") || text.contains("Infinity"));
        NodeList all = svg.getElementsByTagName("*");
        int coordinates = 0;
        for (int i = 0; i < all.getLength(); i++) {
            NamedNodeMap attributes = all.item(i).getAttributes();
            for (int a = 0; a < attributes.getLength(); a++) {
                String name = attributes.item(a).getNodeName();
                String value = attributes.item(a).getNodeValue();
                if (name.matches("x|y|x1|x2|y1|y2|cx|cy|width|height")) {
                    assertTrue(Double.isFinite(Double.parseDouble(value)), name + "=" + value);
                    coordinates++;
                } else if (name.equals("points")) {
                    Matcher m = NUMBER.matcher(value);
                    while (m.find()) {
                        assertTrue(Double.isFinite(Double.parseDouble(m.group())));
                        coordinates++;
                    }
                }
            }
        }
        assertTrue(coordinates > 100, "coordinates checked: " + coordinates);
    }
}
