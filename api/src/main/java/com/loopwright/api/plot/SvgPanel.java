package com.loopwright.api.plot;

import java.util.Locale;

/**
 * One chart panel drawn into an SVG document: a frame with nice-number ticks and labelled axes, data mapped
 * linearly (or logarithmically in x) into the frame. Coordinates are written with two decimals and are
 * always finite (non-finite data is refused).
 */
final class SvgPanel {

    private final StringBuilder svg;
    private final double left;
    private final double top;
    private final double width;
    private final double height;
    private final NiceTicks xTicks;
    private final NiceTicks yTicks;
    private final boolean logX;

    /**
     * @param logX when true, x values are log10 of the quantity and ticks are at decades
     */
    SvgPanel(
            StringBuilder svg,
            double left,
            double top,
            double width,
            double height,
            NiceTicks xTicks,
            NiceTicks yTicks,
            boolean logX) {
        this.svg = svg;
        this.left = left;
        this.top = top;
        this.width = width;
        this.height = height;
        this.xTicks = xTicks;
        this.yTicks = yTicks;
        this.logX = logX;
    }

    double px(double x) {
        return left + width * (x - xTicks.start()) / (xTicks.end() - xTicks.start());
    }

    double py(double y) {
        return top + height * (1 - (y - yTicks.start()) / (yTicks.end() - yTicks.start()));
    }

    void frame(String xLabel, String yLabel) {
        svg.append(String.format(
                Locale.ROOT,
                "<rect class=\"frame\" x=\"%.2f\" y=\"%.2f\" width=\"%.2f\" height=\"%.2f\"/>\n",
                left,
                top,
                width,
                height));
        svg.append("<g class=\"grid\">\n");
        for (int i = 0; i < xTicks.count(); i++) {
            double x = px(xTicks.tick(i));
            svg.append(String.format(
                    Locale.ROOT, "<line x1=\"%.2f\" y1=\"%.2f\" x2=\"%.2f\" y2=\"%.2f\"/>\n", x, top, x, top + height));
        }
        for (int i = 0; i < yTicks.count(); i++) {
            double y = py(yTicks.tick(i));
            svg.append(String.format(
                    Locale.ROOT,
                    "<line x1=\"%.2f\" y1=\"%.2f\" x2=\"%.2f\" y2=\"%.2f\"/>\n",
                    left,
                    y,
                    left + width,
                    y));
        }
        svg.append("</g>\n<g class=\"ticks\">\n");
        for (int i = 0; i < xTicks.count(); i++) {
            String label = logX ? decade(xTicks.tick(i)) : xTicks.label(i);
            text(px(xTicks.tick(i)), top + height + 16, "middle", label);
        }
        for (int i = 0; i < yTicks.count(); i++) {
            text(left - 6, py(yTicks.tick(i)) + 4, "end", yTicks.label(i));
        }
        svg.append("</g>\n");
        svg.append(String.format(
                Locale.ROOT,
                "<text class=\"axis-title\" x=\"%.2f\" y=\"%.2f\" text-anchor=\"middle\">%s</text>\n",
                left + width / 2,
                top + height + 34,
                escape(xLabel)));
        svg.append(String.format(
                Locale.ROOT,
                "<text class=\"axis-title\" transform=\"translate(%.2f %.2f) rotate(-90)\" text-anchor=\"middle\">%s</text>\n",
                left - 46,
                top + height / 2,
                escape(yLabel)));
    }

    void polyline(String cssClass, double[] x, double[] y) {
        StringBuilder points = new StringBuilder();
        for (int i = 0; i < x.length; i++) {
            double sx = clampX(px(x[i]));
            double sy = clampY(py(y[i]));
            points.append(String.format(Locale.ROOT, i == 0 ? "%.2f,%.2f" : " %.2f,%.2f", sx, sy));
        }
        svg.append("<polyline class=\"")
                .append(cssClass)
                .append("\" points=\"")
                .append(points)
                .append("\"/>\n");
    }

    /** A filled region between two curves over the same x samples (a polygon: upper forward, lower back). */
    void envelope(String cssClass, double[] x, double[] lower, double[] upper) {
        StringBuilder points = new StringBuilder();
        for (int i = 0; i < x.length; i++) {
            points.append(String.format(
                    Locale.ROOT, i == 0 ? "%.2f,%.2f" : " %.2f,%.2f", clampX(px(x[i])), clampY(py(upper[i]))));
        }
        for (int i = x.length - 1; i >= 0; i--) {
            points.append(String.format(Locale.ROOT, " %.2f,%.2f", clampX(px(x[i])), clampY(py(lower[i]))));
        }
        svg.append("<polygon class=\"")
                .append(cssClass)
                .append("\" points=\"")
                .append(points)
                .append("\"/>\n");
    }

    void horizontal(String cssClass, double y, String label) {
        double sy = clampY(py(y));
        svg.append(String.format(
                Locale.ROOT,
                "<line class=\"%s\" x1=\"%.2f\" y1=\"%.2f\" x2=\"%.2f\" y2=\"%.2f\"/>\n",
                cssClass,
                left,
                sy,
                left + width,
                sy));
        if (label != null) {
            text(left + width - 4, sy - 4, "end", label);
        }
    }

    void vertical(String cssClass, double x, String label) {
        double sx = clampX(px(x));
        svg.append(String.format(
                Locale.ROOT,
                "<line class=\"%s\" x1=\"%.2f\" y1=\"%.2f\" x2=\"%.2f\" y2=\"%.2f\"/>\n",
                cssClass,
                sx,
                top,
                sx,
                top + height));
        if (label != null) {
            text(sx + 4, top + 14, "start", label);
        }
    }

    /** A horizontal band between two levels, in either order. */
    void band(String cssClass, double levelA, double levelB) {
        double y1 = clampY(py(Math.max(levelA, levelB)));
        double y2 = clampY(py(Math.min(levelA, levelB)));
        svg.append(String.format(
                Locale.ROOT,
                "<rect class=\"%s\" x=\"%.2f\" y=\"%.2f\" width=\"%.2f\" height=\"%.2f\"/>\n",
                cssClass,
                left,
                y1,
                width,
                Math.max(0, y2 - y1)));
    }

    void marker(String cssClass, double x, double y, String label) {
        double sx = clampX(px(x));
        double sy = clampY(py(y));
        svg.append(String.format(
                Locale.ROOT, "<circle class=\"%s\" cx=\"%.2f\" cy=\"%.2f\" r=\"4\"/>\n", cssClass, sx, sy));
        if (label != null) {
            text(sx + 6, sy - 6, "start", label);
        }
    }

    void text(double x, double y, String anchor, String content) {
        svg.append(String.format(
                Locale.ROOT,
                "<text x=\"%.2f\" y=\"%.2f\" text-anchor=\"%s\">%s</text>\n",
                finite(x),
                finite(y),
                anchor,
                escape(content)));
    }

    private double clampX(double x) {
        return Math.max(left, Math.min(left + width, finite(x)));
    }

    private double clampY(double y) {
        return Math.max(top, Math.min(top + height, finite(y)));
    }

    private static double finite(double v) {
        if (!Double.isFinite(v)) {
            throw new IllegalArgumentException("non-finite plot coordinate");
        }
        return v;
    }

    private static String decade(double exponent) {
        double value = Math.pow(10, exponent);
        if (exponent >= 0 && exponent <= 4) {
            return String.format(Locale.ROOT, "%.0f", value);
        }
        if (exponent < 0 && exponent >= -3) {
            return String.format(Locale.ROOT, "%." + (int) Math.round(-exponent) + "f", value);
        }
        return String.format(Locale.ROOT, "1e%d", (int) Math.round(exponent));
    }

    static String escape(String text) {
        return text.replace("&", "&amp;")
                .replace("<", "&lt;")
                .replace(">", "&gt;")
                .replace("\"", "&quot;");
    }
}
