package com.loopwright.solver.export;

import com.loopwright.solver.discrete.ControllerSettings;
import com.loopwright.solver.discrete.ControllerStep;
import com.loopwright.solver.discrete.DiscreteController;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * The statements of one controller sample, the order of {@link ControllerStep} exactly (so exported double code
 * agrees with the service's simulation to rounding), in any {@link ControllerDialect}; and the named constants
 * they use.
 */
final class ControllerBody {

    private static final String INDENT = "    ";

    private final DiscreteController c;
    private final ControllerSettings s;

    ControllerBody(DiscreteController controller, ControllerSettings settings) {
        if (settings.measurementBias().length != controller.measuredCount()) {
            throw new IllegalArgumentException("one measurement bias per measured channel");
        }
        this.c = controller;
        this.s = settings;
    }

    /** Whether the bumpless-enable initialisation of the integrator is emitted (integrator that acts on u). */
    boolean bumpless() {
        return c.hasIntegrator() && c.stateGain()[c.integratorIndex()] != 0.0;
    }

    /** The design constants by neutral name, in declaration order. */
    Map<String, Double> constants() {
        Map<String, Double> k = new LinkedHashMap<>();
        int nq = c.stateCount();
        int ny = c.measuredCount();
        k.put("SAMPLE_PERIOD_S", c.samplePeriodSeconds());
        k.put("PERIOD_TOLERANCE_S", s.periodToleranceFraction() * c.samplePeriodSeconds());
        k.put("U_MIN", s.commandMin());
        k.put("U_MAX", s.commandMax());
        k.put("U0", s.commandBias());
        for (int j = 0; j < ny; j++) {
            k.put("Y0_" + (j + 1), s.measurementBias()[j]);
        }
        k.put("KR", c.setpointGain());
        for (int l = 0; l < nq; l++) {
            k.put("KQ_" + (l + 1), c.stateGain()[l]);
        }
        for (int j = 0; j < ny; j++) {
            k.put("KY_" + (j + 1), c.measurementGain()[j]);
        }
        for (int l = 0; l < nq; l++) {
            for (int m = 0; m < nq; m++) {
                k.put("F_" + (l + 1) + "_" + (m + 1), c.stateMatrix()[l][m]);
            }
            for (int j = 0; j < ny; j++) {
                k.put("GY_" + (l + 1) + "_" + (j + 1), c.measurementInput()[l][j]);
            }
            k.put("GR_" + (l + 1), c.setpointInput()[l]);
            k.put("GU_" + (l + 1), c.commandInput()[l]);
        }
        return k;
    }

    /** The per-call locals the body assigns (real unless listed in {@link #booleanLocals()}). */
    List<String> realLocals() {
        List<String> v = new ArrayList<>(List.of("G", "Rd"));
        for (int j = 0; j < c.measuredCount(); j++) {
            v.add("Yd" + (j + 1));
        }
        if (bumpless()) {
            v.add("Rest");
        }
        v.add("V");
        v.add("Uc");
        if (c.stateCount() > 0) {
            v.add("Ua");
            for (int l = 0; l < c.stateCount(); l++) {
                v.add("QN" + (l + 1));
            }
        }
        if (c.hasIntegrator()) {
            v.add("Push");
        }
        return v;
    }

    List<String> booleanLocals() {
        return List.of("High", "Low");
    }

    /** The statements, one line each, indented by nesting. */
    List<String> statements(ControllerDialect d) {
        List<String> out = new ArrayList<>();
        int nq = c.stateCount();
        int ny = c.measuredCount();
        int ii = c.integratorIndex();
        String g = d.variable("G");
        // g = min(max(s, 0), 1)
        out.add(d.ifOpen(d.input("GainScale") + " > " + d.literal("1.0")));
        out.add(INDENT + d.assign(g, d.literal("1.0")));
        out.add(d.elsif(d.input("GainScale") + " < " + d.literal("0.0")));
        out.add(INDENT + d.assign(g, d.literal("0.0")));
        out.add(d.otherwise());
        out.add(INDENT + d.assign(g, d.input("GainScale")));
        out.add(d.endIf());
        out.add(d.assign(d.variable("Rd"), d.input("Setpoint") + " - " + d.constant("Y0_1")));
        for (int j = 1; j <= ny; j++) {
            out.add(d.assign(d.variable("Yd" + j), d.input("Y" + j) + " - " + d.constant("Y0_" + j)));
        }
        if (bumpless()) {
            // on the rising edge of enable: u0 + g v = 0
            out.add(d.ifOpen(d.input("Enable") + " " + d.and() + " " + d.not() + " " + d.variable("WasEnabled") + " "
                    + d.and() + " " + g + " > " + d.literal("0.0")));
            StringBuilder rest = new StringBuilder(d.constant("KR") + " * " + d.variable("Rd"));
            for (int l = 1; l <= nq; l++) {
                if (l - 1 != ii) {
                    rest.append(" - ")
                            .append(d.constant("KQ_" + l))
                            .append(" * ")
                            .append(d.variable("Q" + l));
                }
            }
            for (int j = 1; j <= ny; j++) {
                rest.append(" - ").append(d.constant("KY_" + j)).append(" * ").append(d.variable("Yd" + j));
            }
            out.add(INDENT + d.assign(d.variable("Rest"), rest.toString()));
            out.add(INDENT
                    + d.assign(
                            d.variable("Q" + (ii + 1)),
                            "(" + d.variable("Rest") + " + " + d.constant("U0") + " / " + g + ") / "
                                    + d.constant("KQ_" + (ii + 1))));
            out.add(d.endIf());
        }
        List<String> feedback = new ArrayList<>();
        for (int l = 1; l <= nq; l++) {
            feedback.add(d.constant("KQ_" + l) + " * " + d.variable("Q" + l));
        }
        for (int j = 1; j <= ny; j++) {
            feedback.add(d.constant("KY_" + j) + " * " + d.variable("Yd" + j));
        }
        out.add(d.assign(
                d.variable("V"),
                d.constant("KR") + " * " + d.variable("Rd") + " - (" + String.join(" + ", feedback) + ")"));
        String high = d.variable("High");
        String low = d.variable("Low");
        String command = d.variable("Command");
        out.add(d.assign(high, d.falseValue()));
        out.add(d.assign(low, d.falseValue()));
        out.add(d.ifOpen(d.input("Enable")));
        out.add(INDENT + d.assign(d.variable("Uc"), d.constant("U0") + " + " + g + " * " + d.variable("V")));
        out.add(INDENT + d.ifOpen(d.variable("Uc") + " > " + d.constant("U_MAX")));
        out.add(INDENT + INDENT + d.assign(command, d.constant("U_MAX")));
        out.add(INDENT + INDENT + d.assign(high, d.trueValue()));
        out.add(INDENT + d.elsif(d.variable("Uc") + " < " + d.constant("U_MIN")));
        out.add(INDENT + INDENT + d.assign(command, d.constant("U_MIN")));
        out.add(INDENT + INDENT + d.assign(low, d.trueValue()));
        out.add(INDENT + d.otherwise());
        out.add(INDENT + INDENT + d.assign(command, d.variable("Uc")));
        out.add(INDENT + d.endIf());
        out.add(d.otherwise());
        out.add(INDENT + d.assign(command, d.literal("0.0")));
        out.add(d.endIf());
        if (nq > 0) {
            out.add(d.assign(d.variable("Ua"), command + " - " + d.constant("U0")));
            for (int l = 1; l <= nq; l++) {
                List<String> terms = new ArrayList<>();
                for (int m = 1; m <= nq; m++) {
                    terms.add(d.constant("F_" + l + "_" + m) + " * " + d.variable("Q" + m));
                }
                for (int j = 1; j <= ny; j++) {
                    terms.add(d.constant("GY_" + l + "_" + j) + " * " + d.variable("Yd" + j));
                }
                terms.add(d.constant("GR_" + l) + " * " + d.variable("Rd"));
                terms.add(d.constant("GU_" + l) + " * " + d.variable("Ua"));
                out.add(d.assign(d.variable("QN" + l), String.join(" + ", terms)));
            }
        }
        if (ii >= 0) {
            String qi = d.variable("Q" + (ii + 1));
            String qni = d.variable("QN" + (ii + 1));
            String push = d.variable("Push");
            // conditional integration: hold while disabled or when the step pushes further into the limit
            out.add(d.assign(push, "-" + d.constant("KQ_" + (ii + 1)) + " * (" + qni + " - " + qi + ")"));
            out.add(d.ifOpen(d.not() + " " + d.input("Enable") + " " + d.or() + " (" + high + " " + d.and() + " "
                    + push + " > " + d.literal("0.0") + ") " + d.or() + " (" + low + " " + d.and() + " " + push
                    + " < " + d.literal("0.0") + ")"));
            out.add(INDENT + d.assign(qni, qi));
            out.add(d.endIf());
        }
        String tm = d.input("MeasuredPeriod");
        String t = d.constant("SAMPLE_PERIOD_S");
        String tol = d.constant("PERIOD_TOLERANCE_S");
        out.add(d.assign(
                d.variable("PeriodMismatch"),
                "(" + tm + " - " + t + " > " + tol + ") " + d.or() + " (" + t + " - " + tm + " > " + tol + ")"));
        for (int l = 1; l <= nq; l++) {
            out.add(d.assign(d.variable("Q" + l), d.variable("QN" + l)));
        }
        out.add(d.assign(d.variable("WasEnabled"), d.input("Enable")));
        out.add(d.assign(d.variable("Saturated"), high + " " + d.or() + " " + low));
        out.add(d.assign(d.variable("Disabled"), d.not() + " " + d.input("Enable")));
        return out;
    }

    /** The header lines (no comment markers): provenance, the law as math, the settings. */
    List<String> header(ProvenanceHeader h, Precision precision) {
        List<String> lines = new ArrayList<>();
        lines.addAll(Literals.commentLines(h.title()));
        lines.add("");
        lines.add(
                "Service version: " + Literals.commentLines(h.serviceVersion()).get(0));
        lines.add("Request digest: " + Literals.commentLines(h.requestDigest()).get(0));
        lines.addAll(Literals.commentLines("Plant: " + h.plant()));
        for (String spec : h.specLines()) {
            lines.addAll(Literals.commentLines(spec));
        }
        lines.add("gamma (H-infinity level, disturbance to performance output) = " + Literals.real(h.gamma()));
        lines.add("Design task period T = " + Literals.real(c.samplePeriodSeconds())
                + " s; MeasuredPeriod is flagged beyond +-" + Literals.real(s.periodToleranceFraction()) + " T");
        lines.add("Arithmetic: " + precision.iecType() + " / " + precision.cType());
        lines.add("");
        lines.addAll(
                Literals.commentLines(
                        "Law (deviations rd = r - Y0_1, yd = y - Y0): v = KR rd - (KQ q + KY yd);"
                                + " enabled: u = clamp(U0 + g v, U_MIN, U_MAX) with g = GainScale limited to [0, 1]; disabled: u = 0."));
        if (c.stateCount() > 0) {
            lines.addAll(Literals.commentLines("Controller state (" + c.stateCount()
                    + "): q+ = F q + GY yd + GR rd + GU (u - U0), the continuous design discretized exactly for T"
                    + " (zero-order hold); the observer part is driven by the applied command."));
        }
        if (c.hasIntegrator()) {
            lines.addAll(Literals.commentLines("Integrator Q" + (c.integratorIndex() + 1)
                    + " of r - y1; anti-windup by conditional integration: it holds while disabled and while the"
                    + " clamp is active and its step would push the command further into the limit."));
        }
        if (bumpless()) {
            lines.addAll(Literals.commentLines("Bumpless enable: on the rising edge of Enable the integrator is set"
                    + " so that U0 + g v = 0, the command held while disabled."));
        }
        lines.add("");
        lines.add("CAUTIONS:");
        for (String caution : h.cautions()) {
            lines.addAll(Literals.commentLines("- " + caution));
        }
        return lines;
    }
}
