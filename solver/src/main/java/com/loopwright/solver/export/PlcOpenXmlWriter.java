package com.loopwright.solver.export;

import com.loopwright.solver.discrete.DiscreteController;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.List;

/**
 * A generic discrete controller as a PLCopen XML project (IEC 61131-10 / TC6 XML 2.01, namespace
 * {@value #NAMESPACE}): one function-block POU with the same interface as the Structured Text export and its ST
 * body, so an IDE that reads the open exchange format imports the block.
 */
public final class PlcOpenXmlWriter {

    /** The TC6 XML 2.01 namespace. */
    public static final String NAMESPACE = "http://www.plcopen.org/xml/tc6_0201";
    /** The namespace of formatted text (ST bodies, documentation). */
    public static final String XHTML = "http://www.w3.org/1999/xhtml";

    /**
     * @param createdAt the fileHeader creationDateTime (to the second, UTC); pass a fixed instant for
     *     reproducible output
     */
    public String write(
            ProvenanceHeader header,
            DiscreteController controller,
            ControllerExportOptions options,
            Instant createdAt) {
        ControllerStructuredTextWriter st = new ControllerStructuredTextWriter();
        ControllerBody body = new ControllerBody(controller, options.settings());
        StringBuilder x = new StringBuilder();
        x.append("<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n");
        x.append("<project xmlns=\"")
                .append(NAMESPACE)
                .append("\" xmlns:xhtml=\"")
                .append(XHTML)
                .append("\">\n");
        x.append("  <fileHeader companyName=\"Loopwright\" productName=\"Loopwright\" productVersion=\"")
                .append(attribute(header.serviceVersion()))
                .append("\" creationDateTime=\"")
                .append(createdAt.truncatedTo(ChronoUnit.SECONDS))
                .append("\"/>\n");
        x.append("  <contentHeader name=\"")
                .append(attribute(options.prefix().blockName()))
                .append("\">\n");
        x.append("    <coordinateInfo>\n");
        for (String language : List.of("fbd", "ld", "sfc")) {
            x.append("      <")
                    .append(language)
                    .append("><scaling x=\"1\" y=\"1\"/></")
                    .append(language)
                    .append(">\n");
        }
        x.append("    </coordinateInfo>\n");
        x.append("  </contentHeader>\n");
        x.append("  <types>\n");
        x.append("    <dataTypes/>\n");
        x.append("    <pous>\n");
        x.append("      <pou name=\"")
                .append(attribute(options.prefix().blockName()))
                .append("\" pouType=\"functionBlock\">\n");
        x.append("        <interface>\n");
        ControllerStructuredTextWriter.Section open = null;
        for (ControllerStructuredTextWriter.Variable v : st.variables(controller, options)) {
            if (v.section() != open) {
                if (open != null) {
                    x.append("          </").append(open.xmlElement).append(">\n");
                }
                x.append("          <").append(v.section().xmlElement);
                if (v.section() == ControllerStructuredTextWriter.Section.CONSTANT) {
                    x.append(" constant=\"true\"");
                }
                x.append(">\n");
                open = v.section();
            }
            x.append("            <variable name=\"").append(v.name()).append("\">\n");
            x.append("              <type><").append(v.type()).append("/></type>\n");
            if (v.initialValue() != null) {
                x.append("              <initialValue><simpleValue value=\"")
                        .append(attribute(v.initialValue()))
                        .append("\"/></initialValue>\n");
            }
            if (v.comment() != null) {
                x.append("              <documentation><xhtml:p>")
                        .append(text(v.comment()))
                        .append("</xhtml:p></documentation>\n");
            }
            x.append("            </variable>\n");
        }
        x.append("          </").append(open.xmlElement).append(">\n");
        x.append("        </interface>\n");
        x.append("        <body>\n");
        x.append("          <ST><xhtml:p><![CDATA[")
                .append(st.body(controller, options))
                .append("]]></xhtml:p></ST>\n");
        x.append("        </body>\n");
        x.append("        <documentation><xhtml:p><![CDATA[");
        for (String line : body.header(header, options.precision())) {
            x.append(line.replace("]]>", "]] >")).append('\n');
        }
        x.append("]]></xhtml:p></documentation>\n");
        x.append("      </pou>\n");
        x.append("    </pous>\n");
        x.append("  </types>\n");
        x.append("  <instances>\n    <configurations/>\n  </instances>\n");
        x.append("</project>\n");
        return x.toString();
    }

    private static String text(String s) {
        return s.replace("&", "&amp;").replace("<", "&lt;").replace(">", "&gt;");
    }

    private static String attribute(String s) {
        return text(s).replace("\"", "&quot;").replaceAll("[^\\x20-\\x7E]", "?");
    }
}
