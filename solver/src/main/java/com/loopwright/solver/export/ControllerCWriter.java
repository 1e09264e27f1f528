package com.loopwright.solver.export;

import com.loopwright.solver.discrete.DiscreteController;
import com.loopwright.solver.discrete.StepOutput;
import java.util.List;
import java.util.Map;

/**
 * A generic discrete controller as a C99 header and source pair, {@code <prefix>.h} and {@code <prefix>.c}: the
 * design as {@code <PREFIX>_...} macros, a state struct {@code <prefix>_state}, {@code <prefix>_init} and
 * {@code <prefix>_step} (call once per task period). Compiles with {@code -std=c99 -Wall -Werror}; no library.
 */
public final class ControllerCWriter {

    /** The header and source texts. */
    public record Pair(String headerFileName, String header, String sourceFileName, String source) {}

    public Pair write(ProvenanceHeader header, DiscreteController controller, ControllerExportOptions options) {
        ControllerBody body = new ControllerBody(controller, options.settings());
        BlockPrefix prefix = options.prefix();
        Precision precision = options.precision();
        String real = precision.cType();
        String p = prefix.value();
        String m = prefix.macro();
        int nq = controller.stateCount();
        int ny = controller.measuredCount();
        StringBuilder comment = new StringBuilder("/*\n");
        for (String line : body.header(header, precision)) {
            comment.append(" * ").append(line).append('\n');
        }
        comment.append(" */\n");

        StringBuilder h = new StringBuilder(comment);
        h.append("#ifndef ").append(m).append("_H\n#define ").append(m).append("_H\n\n");
        h.append("#define ").append(m).append("_MEASURED_COUNT ").append(ny).append('\n');
        if (nq > 0) {
            h.append("#define ").append(m).append("_STATE_COUNT ").append(nq).append('\n');
        }
        h.append("#define ")
                .append(m)
                .append("_STATUS_SATURATED ")
                .append(StepOutput.STATUS_SATURATED)
                .append("u\n");
        h.append("#define ")
                .append(m)
                .append("_STATUS_DISABLED ")
                .append(StepOutput.STATUS_DISABLED)
                .append("u\n");
        h.append("#define ")
                .append(m)
                .append("_STATUS_PERIOD_MISMATCH ")
                .append(StepOutput.STATUS_PERIOD_MISMATCH)
                .append("u\n");
        for (Map.Entry<String, Double> k : body.constants().entrySet()) {
            h.append("#define ")
                    .append(m)
                    .append('_')
                    .append(k.getKey())
                    .append(" (")
                    .append(precision.cLiteral(k.getValue()))
                    .append(")\n");
        }
        h.append("\n/* One running controller: zero it with ").append(p).append("_init before the first step. */\n");
        h.append("typedef struct {\n");
        if (nq > 0) {
            h.append("    ").append(real).append(" q[").append(m).append("_STATE_COUNT];\n");
        }
        h.append("    int was_enabled;\n");
        h.append("} ").append(p).append("_state;\n\n");
        h.append("void ").append(p).append("_init(").append(p).append("_state *s);\n\n");
        h.append("/* One sample: returns the command u; *status (if not NULL) gets the ")
                .append(m)
                .append("_STATUS_ bits. */\n");
        h.append(signature(p, m, real)).append(";\n\n");
        h.append("#endif\n");

        StringBuilder c = new StringBuilder(comment);
        c.append("#include \"").append(p).append(".h\"\n\n");
        c.append("void ").append(p).append("_init(").append(p).append("_state *s)\n{\n");
        if (nq > 0) {
            c.append("    int i;\n");
            c.append("    for (i = 0; i < ").append(m).append("_STATE_COUNT; i++) {\n");
            c.append("        s->q[i] = ").append(precision.cLiteral(0.0)).append(";\n    }\n");
        }
        c.append("    s->was_enabled = 0;\n}\n\n");
        c.append(signature(p, m, real)).append("\n{\n");
        List<String> reals = body.realLocals();
        for (String local : reals) {
            c.append("    ").append(real).append(' ').append(cName(local)).append(";\n");
        }
        c.append("    ").append(real).append(" command;\n");
        c.append("    int high;\n    int low;\n    int period_mismatch;\n");
        for (String line : body.statements(new Dialect(m, precision))) {
            c.append("    ").append(line).append('\n');
        }
        c.append("    if (status) {\n");
        c.append("        *status = (high || low ? ")
                .append(m)
                .append("_STATUS_SATURATED : 0u) | (enable ? 0u : ")
                .append(m)
                .append("_STATUS_DISABLED) | (period_mismatch ? ")
                .append(m)
                .append("_STATUS_PERIOD_MISMATCH : 0u);\n");
        c.append("    }\n");
        c.append("    return command;\n}\n");
        return new Pair(p + ".h", h.toString(), p + ".c", c.toString());
    }

    private static String signature(String p, String m, String real) {
        return real + " " + p + "_step(" + p + "_state *s, int enable, " + real + " setpoint, const " + real + " y[" + m
                + "_MEASURED_COUNT], " + real + " gain_scale, " + real + " measured_period_s, unsigned int *status)";
    }

    /** Yd1 -> yd[0], QN2 -> qn_2, Push -> push. */
    private static String cName(String local) {
        if (local.startsWith("Yd")) {
            return "yd" + local.substring(2);
        }
        if (local.startsWith("QN")) {
            return "qn" + local.substring(2);
        }
        return local.toLowerCase(java.util.Locale.ROOT);
    }

    /** C spelling: macros, struct members, locals. */
    private static final class Dialect implements ControllerDialect {
        private final String macro;
        private final Precision precision;

        Dialect(String macro, Precision precision) {
            this.macro = macro;
            this.precision = precision;
        }

        @Override
        public String constant(String name) {
            return macro + "_" + name;
        }

        @Override
        public String input(String name) {
            switch (name) {
                case "Enable":
                    return "enable";
                case "Setpoint":
                    return "setpoint";
                case "GainScale":
                    return "gain_scale";
                case "MeasuredPeriod":
                    return "measured_period_s";
                default:
                    return "y[" + (Integer.parseInt(name.substring(1)) - 1) + "]";
            }
        }

        @Override
        public String variable(String name) {
            if (name.equals("WasEnabled")) {
                return "s->was_enabled";
            }
            if (name.equals("PeriodMismatch")) {
                return "period_mismatch";
            }
            if (name.equals("Command")) {
                return "command";
            }
            if (name.equals("Saturated") || name.equals("Disabled")) {
                return "/* status */ " + name;
            }
            if (name.matches("Q[0-9]+")) {
                return "s->q[" + (Integer.parseInt(name.substring(1)) - 1) + "]";
            }
            return cName(name);
        }

        @Override
        public String literal(String text) {
            return precision.cLiteral(Double.parseDouble(text));
        }

        @Override
        public String assign(String target, String expression) {
            if (target.startsWith("/* status */")) {
                return "/* " + target.substring("/* status */ ".length()) + " is reported in *status */";
            }
            return target + " = " + expression + ";";
        }

        @Override
        public String ifOpen(String condition) {
            return "if (" + condition + ") {";
        }

        @Override
        public String elsif(String condition) {
            return "} else if (" + condition + ") {";
        }

        @Override
        public String otherwise() {
            return "} else {";
        }

        @Override
        public String endIf() {
            return "}";
        }

        @Override
        public String and() {
            return "&&";
        }

        @Override
        public String or() {
            return "||";
        }

        @Override
        public String not() {
            return "!";
        }

        @Override
        public String trueValue() {
            return "1";
        }

        @Override
        public String falseValue() {
            return "0";
        }
    }
}
