package com.loopwright.solver.export;

import com.loopwright.solver.discrete.DiscreteController;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

/**
 * A generic discrete controller as one IEC 61131-3 Structured Text function block {@code <prefix>_Controller}:
 * inputs Enable, Setpoint, Y1..Yp, GainScale (default 1.0), MeasuredPeriod; outputs Command, Saturated, Disabled,
 * PeriodMismatch; the design as named constants. Call it once per task period.
 */
public final class ControllerStructuredTextWriter {

    /** One variable of the block's interface. */
    record Variable(Section section, String name, String type, String initialValue, String comment) {}

    /** The variable lists of an IEC function block (and their PLCopen XML element names). */
    enum Section {
        INPUT("VAR_INPUT", "inputVars"),
        OUTPUT("VAR_OUTPUT", "outputVars"),
        LOCAL("VAR", "localVars"),
        CONSTANT("VAR CONSTANT", "localVars");

        final String keyword;
        final String xmlElement;

        Section(String keyword, String xmlElement) {
            this.keyword = keyword;
            this.xmlElement = xmlElement;
        }
    }

    public String write(ProvenanceHeader header, DiscreteController controller, ControllerExportOptions options) {
        ControllerBody body = new ControllerBody(controller, options.settings());
        StringBuilder st = new StringBuilder();
        for (String line : body.header(header, options.precision())) {
            st.append("(* ").append(line).append(" *)\n");
        }
        st.append("FUNCTION_BLOCK ").append(options.prefix().blockName()).append('\n');
        Section open = null;
        for (Variable v : variables(controller, options)) {
            if (v.section() != open) {
                if (open != null) {
                    st.append("END_VAR\n");
                }
                st.append(v.section().keyword).append('\n');
                open = v.section();
            }
            st.append("    ").append(v.name()).append(" : ").append(v.type());
            if (v.initialValue() != null) {
                st.append(" := ").append(v.initialValue());
            }
            st.append(';');
            if (v.comment() != null) {
                st.append(" (* ").append(v.comment()).append(" *)");
            }
            st.append('\n');
        }
        st.append("END_VAR\n");
        st.append(body(controller, options));
        st.append("END_FUNCTION_BLOCK\n");
        return st.toString();
    }

    /** The statements between the declarations and END_FUNCTION_BLOCK (the PLCopen XML body holds the same). */
    String body(DiscreteController controller, ControllerExportOptions options) {
        StringBuilder st = new StringBuilder();
        for (String line : new ControllerBody(controller, options.settings()).statements(new Dialect())) {
            st.append(line).append('\n');
        }
        return st.toString();
    }

    /** Every declared variable in declaration order. */
    List<Variable> variables(DiscreteController controller, ControllerExportOptions options) {
        ControllerBody body = new ControllerBody(controller, options.settings());
        String real = options.precision().iecType();
        List<Variable> v = new ArrayList<>();
        v.add(new Variable(
                Section.INPUT, "Enable", "BOOL", null, "FALSE: command 0, integrator held, observer tracks"));
        v.add(new Variable(Section.INPUT, "Setpoint", real, null, "r, in the units of Y1"));
        for (int j = 1; j <= controller.measuredCount(); j++) {
            v.add(new Variable(
                    Section.INPUT, "Y" + j, real, null, j == 1 ? "measured position" : "measured channel " + j));
        }
        v.add(new Variable(Section.INPUT, "GainScale", real, "1.0", "0..1, reduced gain for commissioning"));
        v.add(new Variable(Section.INPUT, "MeasuredPeriod", real, null, "the task's measured period [s]"));
        v.add(new Variable(Section.OUTPUT, "Command", real, null, "u, within [U_MIN, U_MAX]; 0 while disabled"));
        v.add(new Variable(Section.OUTPUT, "Saturated", "BOOL", null, "the clamp is active"));
        v.add(new Variable(Section.OUTPUT, "Disabled", "BOOL", null, "Enable is FALSE"));
        v.add(new Variable(Section.OUTPUT, "PeriodMismatch", "BOOL", null, "MeasuredPeriod outside tolerance"));
        for (int l = 1; l <= controller.stateCount(); l++) {
            v.add(new Variable(
                    Section.LOCAL,
                    "Q" + l,
                    real,
                    null,
                    l - 1 == controller.integratorIndex() ? "integrator state" : "observer state " + l));
        }
        v.add(new Variable(Section.LOCAL, "WasEnabled", "BOOL", null, "Enable of the previous call"));
        for (String local : body.realLocals()) {
            v.add(new Variable(Section.LOCAL, local, real, null, null));
        }
        for (String local : body.booleanLocals()) {
            v.add(new Variable(Section.LOCAL, local, "BOOL", null, null));
        }
        for (Map.Entry<String, Double> k : body.constants().entrySet()) {
            v.add(new Variable(
                    Section.CONSTANT, k.getKey(), real, options.precision().iecLiteral(k.getValue()), null));
        }
        return v;
    }

    /** IEC 61131-3 spelling: every name as declared. */
    private static final class Dialect implements ControllerDialect {
        @Override
        public String constant(String name) {
            return name;
        }

        @Override
        public String input(String name) {
            return name;
        }

        @Override
        public String variable(String name) {
            return name;
        }

        @Override
        public String literal(String text) {
            return text;
        }

        @Override
        public String assign(String target, String expression) {
            return target + " := " + expression + ";";
        }

        @Override
        public String ifOpen(String condition) {
            return "IF " + condition + " THEN";
        }

        @Override
        public String elsif(String condition) {
            return "ELSIF " + condition + " THEN";
        }

        @Override
        public String otherwise() {
            return "ELSE";
        }

        @Override
        public String endIf() {
            return "END_IF;";
        }

        @Override
        public String and() {
            return "AND";
        }

        @Override
        public String or() {
            return "OR";
        }

        @Override
        public String not() {
            return "NOT";
        }

        @Override
        public String trueValue() {
            return "TRUE";
        }

        @Override
        public String falseValue() {
            return "FALSE";
        }
    }
}
