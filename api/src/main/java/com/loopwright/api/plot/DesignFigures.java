package com.loopwright.api.plot;

import com.loopwright.solver.design.LoopMargins;
import com.loopwright.solver.design.StepMetrics;
import com.loopwright.solver.pipeline.BodeData;
import com.loopwright.solver.pipeline.DesignReport;
import com.loopwright.solver.pipeline.StepSeries;
import com.loopwright.solver.robustness.StepEnvelope;
import com.loopwright.solver.spec.TimeSpec;
import java.util.Locale;
import java.util.OptionalDouble;

/**
 * Draws a verified design and the figure data the solver computed for it (solver.pipeline.FigurePipeline) as a
 * self-contained SVG figure (inline style, generic font family, no scripts, no
 * external references). Stateless and thread-safe.
 */
public final class DesignFigures {

    static final double WIDTH = 720;
    static final double PANEL_HEIGHT = 300;
    static final double LEFT = 80;
    static final double RIGHT = 24;
    static final double TOP = 48;
    static final double BOTTOM = 56;

    private static final String STYLE = "<style>"
            + "svg{background:#fbfaf7}text{font-family:sans-serif;font-size:12px;fill:#2b2d42}"
            + ".title{font-size:15px;font-weight:bold}.axis-title{font-size:12px;fill:#44475a}"
            + ".frame{fill:#ffffff;stroke:#2b2d42;stroke-width:1}.grid line{stroke:#e4e2dc;stroke-width:1}"
            + ".series{fill:none;stroke:#0f7c80;stroke-width:2}.series2{fill:none;stroke:#7a4fb0;stroke-width:2}"
            + ".band{fill:#f2b134;fill-opacity:0.18;stroke:none}"
            + ".limit{stroke:#d1495b;stroke-width:1.5;stroke-dasharray:6 4}"
            + ".spec{stroke:#c67c00;stroke-width:1.5;stroke-dasharray:2 3}"
            + ".measured{stroke:#0f7c80;stroke-width:1;stroke-dasharray:4 3}"
            + ".point{fill:#2b2d42}.spread{fill:#0f7c80;fill-opacity:0.2;stroke:#0f7c80;stroke-width:0.5}"
            + "</style>\n";

    /**
     * The step-response band over a parameter box (corners plus seeded interior samples) with the nominal
     * response and the spec envelope on top.
     */
    public String uncertaintyBand(DesignReport report, StepEnvelope.Band band, String rangesText) {
        StringBuilder svg = open(
                1,
                "Step response under parameter uncertainty (" + band.drawnCases()
                        + " parameter sets"
                        + (band.unstableCases() > 0 ? ", " + band.unstableCases() + " unstable, not drawn" : "") + ")");
        SvgPanel panel = specPanel(svg, report, min(band.lowerX1()), max(band.upperX1()));
        panel.envelope("spread", band.timeSeconds(), band.lowerX1(), band.upperX1());
        panel.polyline("series", band.timeSeconds(), band.nominalX1());
        panel.text(LEFT + 8, TOP + PANEL_HEIGHT - 10, "start", rangesText);
        legend(svg, "nominal x1(t)", "spread", "range over the parameter box");
        return close(svg);
    }

    /**
     * A position-versus-time panel with the spec envelope: the settling band, the overshoot limit and the time
     * spec, its y range covering [lowest, highest] of the drawn series, zero and the envelope.
     */
    private static SvgPanel specPanel(StringBuilder svg, DesignReport report, double lowest, double highest) {
        double r = report.stepSize();
        double band = report.bandFraction();
        double overshootLimit = r * (1 + report.spec().overshootFraction());
        double low = Math.min(0, lowest);
        double high = Math.max(Math.max(highest, overshootLimit), r * (1 + band));
        if (r < 0) {
            high = Math.max(0, highest);
            low = Math.min(Math.min(lowest, overshootLimit), r * (1 + band));
        }
        SvgPanel panel = timePanel(svg, report, low, high);
        panel.frame("time t [s]", "position x1 [x1 units]");
        panel.band("band", r * (1 - band), r * (1 + band));
        panel.horizontal(
                "spec",
                overshootLimit,
                "overshoot limit " + format(100 * report.spec().overshootFraction()) + "%");
        if (report.spec().timeSpec() instanceof TimeSpec.SettlingTime settling) {
            panel.vertical("spec", settling.seconds(), "settling spec " + format(settling.seconds()) + " s");
        } else if (report.spec().timeSpec() instanceof TimeSpec.RiseTime rise) {
            panel.vertical("spec", rise.seconds(), "rise spec " + format(rise.seconds()) + " s");
        }
        return panel;
    }

    /** One panel over the design's horizon: time from 0 on the x axis, [low, high] on the y axis. */
    private static SvgPanel timePanel(StringBuilder svg, DesignReport report, double low, double high) {
        return new SvgPanel(
                svg,
                LEFT,
                TOP,
                WIDTH - LEFT - RIGHT,
                PANEL_HEIGHT,
                NiceTicks.covering(0, report.horizonSeconds(), 8),
                NiceTicks.covering(low, high, 7),
                false);
    }

    /** The step the solver simulated (FigurePipeline#step), with the spec envelope and the measured metrics. */
    public String stepResponse(DesignReport report, StepSeries step) {
        StepMetrics metrics = report.stepMetrics();
        double r = report.stepSize();
        double[] y = step.output();
        StringBuilder svg = open(1, "Step response: position x1 after a setpoint step of " + format(r));
        SvgPanel panel = specPanel(svg, report, min(y), max(y));
        panel.polyline("series", step.timeSeconds(), y);
        panel.vertical("measured", metrics.settlingTimeSeconds(), null);
        panel.marker(
                "point",
                metrics.settlingTimeSeconds(),
                valueAt(step, metrics.settlingTimeSeconds()),
                "settles " + format(metrics.settlingTimeSeconds()) + " s");
        double riseEnd = firstCrossing(step, 0.9 * r);
        panel.marker("point", riseEnd, 0.9 * r, "rise (10-90%) " + format(metrics.riseTimeSeconds()) + " s");
        panel.marker(
                "point",
                metrics.peakTimeSeconds(),
                r * (1 + metrics.overshootPercent() / 100),
                "peak overshoot " + format(metrics.overshootPercent()) + "%");
        legend(svg, "x1(t)", "band", "settling band +-" + format(100 * report.bandFraction()) + "%");
        return close(svg);
    }

    /**
     * The command of the same step.
     *
     * @param actuatorLimit actuator limit drawn on the figure, if given
     */
    public String controlEffort(DesignReport report, StepSeries step, OptionalDouble actuatorLimit) {
        double[] u = step.control();
        double low = Math.min(0, min(u));
        double high = Math.max(0, max(u));
        if (actuatorLimit.isPresent()) {
            low = Math.min(low, -actuatorLimit.getAsDouble());
            high = Math.max(high, actuatorLimit.getAsDouble());
        }
        StringBuilder svg = open(1, "Control effort u(t) for the same step");
        SvgPanel panel = timePanel(svg, report, low, high);
        panel.frame("time t [s]", "command u [u units]");
        if (actuatorLimit.isPresent()) {
            double limit = actuatorLimit.getAsDouble();
            panel.horizontal("limit", limit, "actuator limit +" + format(limit));
            panel.horizontal("limit", -limit, "actuator limit -" + format(limit));
        }
        panel.polyline("series", step.timeSeconds(), u);
        double peak = report.stepMetrics().peakControl();
        panel.marker("point", 0, u[0], "peak |u| " + format(peak));
        legend(svg, "u(t) = kr r - (k1 x1 + k2 x2)", actuatorLimit.isPresent() ? "limit" : null, "actuator limit");
        return close(svg);
    }

    /** The Bode diagram of the frequency response and margins the solver computed (FigurePipeline#bode). */
    public String bode(DesignReport report, BodeData bode) {
        LoopMargins margins = bode.margins();
        double low = bode.lowRadPerSec();
        double high = bode.highRadPerSec();
        double[] logW = new double[bode.series().size()];
        double[] w = bode.series().angularFrequencyRadPerSec();
        for (int i = 0; i < logW.length; i++) {
            logW[i] = Math.log10(w[i]);
        }
        double firstDecade = Math.floor(Math.log10(low));
        NiceTicks decades = new NiceTicks(firstDecade, 1, (int) (Math.ceil(Math.log10(high)) - firstDecade) + 1);
        double[] magnitude = bode.series().magnitudeDecibels();
        double[] phase = bode.series().phaseDegrees();
        StringBuilder svg = open(2, "Bode diagram of the loop broken at the plant input, L(s) = K (sI - A)^-1 B");
        double panelWidth = WIDTH - LEFT - RIGHT;
        SvgPanel top = new SvgPanel(
                svg,
                LEFT,
                TOP,
                panelWidth,
                PANEL_HEIGHT,
                decades,
                NiceTicks.covering(Math.min(min(magnitude), -20), Math.max(max(magnitude), 20), 7),
                true);
        top.frame("angular frequency w [rad/s]", "magnitude |L(jw)| [dB]");
        top.horizontal("spec", 0, "0 dB");
        top.polyline("series", logW, magnitude);
        double phaseTop = PANEL_HEIGHT + TOP + BOTTOM + 16;
        SvgPanel bottom = new SvgPanel(
                svg,
                LEFT,
                phaseTop,
                panelWidth,
                PANEL_HEIGHT,
                decades,
                NiceTicks.covering(Math.min(min(phase), -180), Math.max(max(phase), 0), 7),
                true);
        bottom.frame("angular frequency w [rad/s]", "phase arg L(jw) [deg]");
        bottom.horizontal("limit", -180, "-180 deg");
        bottom.polyline("series2", logW, phase);
        if (margins.crossoverRadPerSec() != null) {
            double wc = Math.log10(margins.crossoverRadPerSec());
            double pm = margins.phaseMarginDegrees();
            top.vertical("measured", wc, null);
            top.marker("point", wc, 0, "gain crossover " + format(Math.pow(10, wc)) + " rad/s");
            bottom.vertical("measured", wc, null);
            // arg L = pm - 180 on the branch the phase is drawn on near the crossover
            bottom.marker(
                    "point",
                    wc,
                    phaseNear(logW, phase, wc, pm - 180),
                    String.format(
                            Locale.ROOT,
                            "phase margin %.1f deg, delay margin %s s",
                            pm,
                            format(margins.delayMarginSeconds())));
        }
        if (margins.gainMarginRadPerSec() != null && margins.gainMarginRadPerSec() > 0) {
            double wp = Math.log10(margins.gainMarginRadPerSec());
            double gm = 20 * Math.log10(margins.gainMargin());
            bottom.marker(
                    "point",
                    wp,
                    phaseNear(logW, phase, wp, -180),
                    "phase crossover " + format(Math.pow(10, wp)) + " rad/s");
            top.marker("point", wp, -gm, String.format(Locale.ROOT, "gain margin %.1f dB", gm));
        } else {
            bottom.text(
                    LEFT + 8,
                    phaseTop + PANEL_HEIGHT - 10,
                    "start",
                    "phase never reaches -180 deg with |L| < 1: no finite gain margin");
        }
        return close(svg);
    }

    /** The angle congruent to {@code degrees} (mod 360) nearest the drawn phase at log10 w. */
    private static double phaseNear(double[] logW, double[] phase, double logWAt, double degrees) {
        int nearest = 0;
        for (int i = 1; i < logW.length; i++) {
            if (Math.abs(logW[i] - logWAt) < Math.abs(logW[nearest] - logWAt)) {
                nearest = i;
            }
        }
        return degrees + 360 * Math.rint((phase[nearest] - degrees) / 360);
    }

    private static double valueAt(StepSeries step, double time) {
        double[] t = step.timeSeconds();
        double[] y = step.output();
        for (int k = 1; k < t.length; k++) {
            if (t[k] >= time) {
                double f = (time - t[k - 1]) / (t[k] - t[k - 1]);
                return y[k - 1] + f * (y[k] - y[k - 1]);
            }
        }
        return y[y.length - 1];
    }

    private static double firstCrossing(StepSeries step, double level) {
        double[] t = step.timeSeconds();
        double[] y = step.output();
        for (int k = 1; k < y.length; k++) {
            if ((y[k] - level) * Math.signum(level) >= 0) {
                double f = (level - y[k - 1]) / (y[k] - y[k - 1]);
                return t[k - 1] + f * (t[k] - t[k - 1]);
            }
        }
        return t[t.length - 1];
    }

    private static StringBuilder open(int panels, String title) {
        double height = TOP + panels * (PANEL_HEIGHT + BOTTOM) + (panels - 1) * 16 + 24;
        StringBuilder svg = new StringBuilder(64 * 1024);
        svg.append(String.format(
                Locale.ROOT,
                "<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"%.0f\" height=\"%.0f\""
                        + " viewBox=\"0 0 %.0f %.0f\" role=\"img\">\n",
                WIDTH,
                height,
                WIDTH,
                height));
        svg.append("<title>").append(SvgPanel.escape(title)).append("</title>\n");
        svg.append(STYLE);
        svg.append(String.format(
                Locale.ROOT, "<text class=\"title\" x=\"%.0f\" y=\"26\">%s</text>\n", LEFT, SvgPanel.escape(title)));
        return svg;
    }

    /** One series entry, and a second entry drawn as a band swatch ("band") or a dashed line (other class). */
    private static void legend(StringBuilder svg, String first, String secondClass, String second) {
        double y = TOP + PANEL_HEIGHT + BOTTOM + 8;
        svg.append(String.format(
                Locale.ROOT,
                "<g class=\"legend\"><line class=\"series\" x1=\"%.0f\" y1=\"%.0f\"" + " x2=\"%.0f\" y2=\"%.0f\"/>",
                LEFT,
                y,
                LEFT + 24,
                y));
        svg.append(String.format(
                Locale.ROOT, "<text x=\"%.0f\" y=\"%.0f\">%s</text>", LEFT + 30, y + 4, SvgPanel.escape(first)));
        if (secondClass != null) {
            if (secondClass.equals("band") || secondClass.equals("spread")) {
                svg.append(String.format(
                        Locale.ROOT,
                        "<rect class=\"%s\" x=\"%.0f\" y=\"%.0f\" width=\"24\" height=\"10\"/>",
                        secondClass,
                        LEFT + 300,
                        y - 5));
            } else {
                svg.append(String.format(
                        Locale.ROOT,
                        "<line class=\"%s\" x1=\"%.0f\" y1=\"%.0f\" x2=\"%.0f\"" + " y2=\"%.0f\"/>",
                        secondClass,
                        LEFT + 300,
                        y,
                        LEFT + 324,
                        y));
            }
            svg.append(String.format(
                    Locale.ROOT, "<text x=\"%.0f\" y=\"%.0f\">%s</text>", LEFT + 330, y + 4, SvgPanel.escape(second)));
        }
        svg.append("</g>\n");
    }

    private static String close(StringBuilder svg) {
        return svg.append("</svg>\n").toString();
    }

    /** Four significant digits without trailing zeros (0.15, 1.5, 0.0985). */
    static String format(double value) {
        String text = new java.math.BigDecimal(value)
                .round(new java.math.MathContext(4))
                .stripTrailingZeros()
                .toPlainString();
        return text.equals("-0") ? "0" : text;
    }

    private static double min(double[] values) {
        double m = Double.POSITIVE_INFINITY;
        for (double v : values) {
            m = Math.min(m, v);
        }
        return m;
    }

    private static double max(double[] values) {
        double m = Double.NEGATIVE_INFINITY;
        for (double v : values) {
            m = Math.max(m, v);
        }
        return m;
    }
}
