package com.loopwright.solver.export;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import javax.xml.parsers.DocumentBuilderFactory;
import org.junit.jupiter.api.Test;
import org.w3c.dom.Document;
import org.w3c.dom.Element;
import org.w3c.dom.Node;
import org.w3c.dom.NodeList;

/**
 * The PLCopen XML export against the elements TC6 XML 2.01 requires (tc6_xml_v201.xsd, from memory: project with
 * fileHeader (companyName, productName, productVersion, creationDateTime), contentHeader (name, coordinateInfo with
 * fbd/ld/sfc scaling), types (dataTypes, pous), instances (configurations); pou (name, pouType) with interface var
 * lists of variable (name, type) and body), parsed with the JDK's namespace-aware DOM.
 */
class PlcOpenXmlWriterTest {

    static final Instant CREATED = Instant.parse("2026-12-04T00:00:00Z");

    @Test
    void projectHasTheRequiredStructureAndTheStructuredTextBody() throws Exception {
        for (ControllerExportFixtures.Case c : ControllerExportFixtures.cases()) {
            for (Precision precision : Precision.values()) {
                ControllerExportOptions options = c.options("Axis_2", precision);
                String xml = new PlcOpenXmlWriter()
                        .write(ControllerExportFixtures.header(), c.controller(), options, CREATED);
                Document doc = parse(xml);
                Element project = doc.getDocumentElement();
                assertEquals("project", project.getLocalName());
                assertEquals(PlcOpenXmlWriter.NAMESPACE, project.getNamespaceURI());
                List<String> order = new ArrayList<>();
                for (Element e : children(project)) {
                    order.add(e.getLocalName());
                }
                assertEquals(List.of("fileHeader", "contentHeader", "types", "instances"), order);
                Element fileHeader = only(project, "fileHeader");
                for (String attribute : List.of("companyName", "productName", "productVersion", "creationDateTime")) {
                    assertTrue(!fileHeader.getAttribute(attribute).isEmpty(), attribute);
                }
                assertEquals("2026-12-04T00:00:00Z", fileHeader.getAttribute("creationDateTime"));
                Element contentHeader = only(project, "contentHeader");
                assertEquals("Axis_2_Controller", contentHeader.getAttribute("name"));
                Element coordinateInfo = only(contentHeader, "coordinateInfo");
                for (String language : List.of("fbd", "ld", "sfc")) {
                    assertNotNull(only(only(coordinateInfo, language), "scaling"));
                }
                Element types = only(project, "types");
                assertNotNull(only(types, "dataTypes"));
                Element pous = only(types, "pous");
                Element pou = only(pous, "pou");
                assertEquals("Axis_2_Controller", pou.getAttribute("name"));
                assertEquals("functionBlock", pou.getAttribute("pouType"));
                assertNotNull(only(only(project, "instances"), "configurations"));

                Element iface = only(pou, "interface");
                List<String> inputs = names(only(iface, "inputVars"));
                List<String> expectedInputs = new ArrayList<>(List.of("Enable", "Setpoint"));
                for (int j = 1; j <= c.controller().measuredCount(); j++) {
                    expectedInputs.add("Y" + j);
                }
                expectedInputs.addAll(List.of("GainScale", "MeasuredPeriod"));
                assertEquals(expectedInputs, inputs);
                assertEquals(
                        List.of("Command", "Saturated", "Disabled", "PeriodMismatch"),
                        names(only(iface, "outputVars")));
                int constantLists = 0;
                for (Element list : children(iface)) {
                    for (Element variable : children(list)) {
                        assertEquals("variable", variable.getLocalName());
                        Element type = only(variable, "type");
                        String typeName = children(type).get(0).getLocalName();
                        assertTrue(List.of("BOOL", precision.iecType()).contains(typeName), typeName);
                    }
                    if ("true".equals(list.getAttribute("constant"))) {
                        constantLists++;
                        for (Element variable : children(list)) {
                            assertNotNull(only(only(variable, "initialValue"), "simpleValue")
                                    .getAttribute("value"));
                        }
                    }
                }
                assertEquals(1, constantLists);

                Element body = only(pou, "body");
                Element st = only(body, "ST");
                Element p = only(st, "p");
                assertEquals(PlcOpenXmlWriter.XHTML, p.getNamespaceURI());
                String stExport = new ControllerStructuredTextWriter()
                        .write(ControllerExportFixtures.header(), c.controller(), options);
                assertEquals(bodyOf(stExport), p.getTextContent(), "the XML body is the ST export's body");
            }
        }
    }

    /** The declarations in the XML are the ST export's, name for name and value for value. */
    @Test
    void declarationsMatchTheStructuredText() throws Exception {
        ControllerExportFixtures.Case c = ControllerExportFixtures.cases().get(2);
        ControllerExportOptions options = c.options("Axis1", Precision.DOUBLE);
        Document doc = parse(
                new PlcOpenXmlWriter().write(ControllerExportFixtures.header(), c.controller(), options, CREATED));
        String st =
                new ControllerStructuredTextWriter().write(ControllerExportFixtures.header(), c.controller(), options);
        NodeList variables = doc.getElementsByTagNameNS(PlcOpenXmlWriter.NAMESPACE, "variable");
        int declarations = 0;
        for (String line : st.split("\n")) {
            if (line.startsWith("    ") && line.contains(" : ")) {
                declarations++;
            }
        }
        assertEquals(declarations, variables.getLength());
        for (int i = 0; i < variables.getLength(); i++) {
            Element v = (Element) variables.item(i);
            String type = children(only(v, "type")).get(0).getLocalName();
            String declared = "    " + v.getAttribute("name") + " : " + type;
            NodeList init = v.getElementsByTagNameNS(PlcOpenXmlWriter.NAMESPACE, "simpleValue");
            if (init.getLength() > 0) {
                declared += " := " + ((Element) init.item(0)).getAttribute("value");
            }
            assertTrue(st.contains(declared + ";"), declared);
        }
    }

    /** The text between the last END_VAR line and END_FUNCTION_BLOCK. */
    static String bodyOf(String st) {
        int start = st.lastIndexOf("END_VAR\n") + "END_VAR\n".length();
        int end = st.lastIndexOf("END_FUNCTION_BLOCK");
        return st.substring(start, end);
    }

    static Document parse(String xml) throws Exception {
        DocumentBuilderFactory f = DocumentBuilderFactory.newInstance();
        f.setNamespaceAware(true);
        f.setFeature("http://apache.org/xml/features/disallow-doctype-decl", true);
        return f.newDocumentBuilder().parse(new ByteArrayInputStream(xml.getBytes(StandardCharsets.UTF_8)));
    }

    static List<Element> children(Element parent) {
        List<Element> out = new ArrayList<>();
        for (Node n = parent.getFirstChild(); n != null; n = n.getNextSibling()) {
            if (n instanceof Element) {
                out.add((Element) n);
            }
        }
        return out;
    }

    static Element only(Element parent, String localName) {
        Element found = null;
        for (Element e : children(parent)) {
            if (e.getLocalName().equals(localName)) {
                assertEquals(null, found, "one " + localName + " in " + parent.getLocalName());
                found = e;
            }
        }
        assertNotNull(found, localName + " in " + parent.getLocalName());
        return found;
    }

    static List<String> names(Element list) {
        List<String> out = new ArrayList<>();
        for (Element v : children(list)) {
            out.add(v.getAttribute("name"));
        }
        return out;
    }
}
