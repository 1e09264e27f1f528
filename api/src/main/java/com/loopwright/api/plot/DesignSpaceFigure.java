package com.loopwright.api.plot;

import com.loopwright.solver.design.DesignSpaceCell;
import com.loopwright.solver.design.DesignSpaceGrid;
import com.loopwright.solver.design.DesignSpaceLimit;
import com.loopwright.solver.design.DesignSpaceMap;
import com.loopwright.solver.design.DesignSpaceRow;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * Draws a design-space map as a self-contained SVG figure (inline style, no scripts, no external references): the
 * cells coloured by verdict (feasible; feasible but not over the whole box; stopped by a gamma requirement, by the
 * plant's own stiffness or damping, by the actuator limit or by the sample period), the fastest feasible time of
 * each overshoot, the contour where the peak command equals the actuator limit, and the requested spec. Stateless
 * and thread-safe.
 */
public final class DesignSpaceFigure {

    static final double WIDTH = 720;
    static final double PANEL_HEIGHT = 360;
    static final double LEFT = 80;
    static final double RIGHT = 24;
    static final double TOP = 48;
    static final double BOTTOM = 56;
    static final double LEGEND_HEIGHT = 64;
    /** A row-to-row change of the fastest time above this many grid columns breaks the fastest-time line. */
    static final int JUMP_COLUMNS = 2;

    private static final String STYLE = "<style>"
            + "svg{background:#fbfaf7}text{font-family:sans-serif;font-size:12px;fill:#2b2d42}"
            + ".title{font-size:15px;font-weight:bold}.axis-title{font-size:12px;fill:#44475a}"
            + ".frame{fill:#ffffff;stroke:#2b2d42;stroke-width:1}.grid line{stroke:#e4e2dc;stroke-width:1}"
            + ".feasible{fill:#0f7c80;fill-opacity:0.55}.partial{fill:#0f7c80;fill-opacity:0.25}"
            + ".gamma{fill:#8d8d99;fill-opacity:0.35}.reach{fill:#f2b134;fill-opacity:0.35}"
            + ".actuator{fill:#d1495b;fill-opacity:0.35}.sampled{fill:#7a4fb0;fill-opacity:0.35}"
            + ".series{fill:none;stroke:#0f7c80;stroke-width:2}"
            + ".limit{fill:none;stroke:#d1495b;stroke-width:2;stroke-dasharray:6 4}"
            + ".point{fill:#2b2d42}"
            + "</style>\n";

    /**
     * @param map           the map
     * @param actuatorLimit the limit whose contour is drawn, or null
     * @param spec          the requested spec judged as a cell, or null
     */
    public String draw(DesignSpaceMap map, Double actuatorLimit, DesignSpaceCell spec) {
        DesignSpaceGrid grid = map.grid();
        long feasible = map.cells().stream().filter(DesignSpaceCell::feasible).count();
        String timeName = grid.settlingAxis() ? "settling time" : "rise time";
        String title = "Design space: " + feasible + " of " + map.cells().size() + " cells feasible"
                + (map.boxCases() > 0 ? " (box of " + map.boxCases() + " parameter sets)" : "");
        double height = TOP + PANEL_HEIGHT + BOTTOM + LEGEND_HEIGHT;
        StringBuilder svg = new StringBuilder(64 * 1024);
        svg.append(String.format(
                Locale.ROOT,
                "<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"%.0f\" height=\"%.0f\" viewBox=\"0 0 %.0f %.0f\""
                        + " role=\"img\">\n",
                WIDTH,
                height,
                WIDTH,
                height));
        svg.append("<title>")
                .append(SvgPanel.escape(title))
                .append("</title>\n")
                .append(STYLE);
        svg.append(String.format(
                Locale.ROOT, "<text class=\"title\" x=\"%.0f\" y=\"26\">%s</text>\n", LEFT, SvgPanel.escape(title)));
        double timeStep = (grid.timeHighestSeconds() - grid.timeLowestSeconds()) / (grid.timeCount() - 1);
        double overshootStep =
                (grid.overshootHighestPercent() - grid.overshootLowestPercent()) / (grid.overshootCount() - 1);
        NiceTicks x = NiceTicks.covering(
                grid.timeLowestSeconds() - timeStep / 2, grid.timeHighestSeconds() + timeStep / 2, 8);
        NiceTicks y = NiceTicks.covering(
                Math.max(0, grid.overshootLowestPercent() - overshootStep / 2),
                grid.overshootHighestPercent() + overshootStep / 2,
                8);
        SvgPanel panel = new SvgPanel(svg, LEFT, TOP, WIDTH - LEFT - RIGHT, PANEL_HEIGHT, x, y, false);
        panel.frame(timeName + " [s]", "overshoot [%]");
        cells(svg, panel, y, map, timeStep, overshootStep);
        fastest(panel, map);
        if (actuatorLimit != null) {
            contour(panel, map, actuatorLimit);
        }
        if (spec != null) {
            panel.marker(
                    "point",
                    spec.timeSeconds(),
                    spec.overshootPercent(),
                    "spec " + DesignFigures.format(spec.timeSeconds()) + " s, "
                            + DesignFigures.format(spec.overshootPercent()) + " %: "
                            + (spec.feasible() ? "feasible" : "infeasible (" + reason(spec) + ")"));
        }
        legend(svg, actuatorLimit);
        return svg.append("</svg>\n").toString();
    }

    /** The cells, each row's runs of one verdict merged into one rectangle. */
    private static void cells(
            StringBuilder svg, SvgPanel panel, NiceTicks y, DesignSpaceMap map, double timeStep, double osStep) {
        DesignSpaceGrid grid = map.grid();
        svg.append("<g class=\"cells\">\n");
        for (int row = 0; row < grid.overshootCount(); row++) {
            double overshoot = grid.overshootAt(row);
            double top = panel.py(Math.min(overshoot + osStep / 2, y.end()));
            double bottom = panel.py(Math.max(overshoot - osStep / 2, y.start()));
            int start = 0;
            while (start < grid.timeCount()) {
                String verdict = verdict(map.cell(row, start));
                int end = start;
                while (end + 1 < grid.timeCount()
                        && verdict(map.cell(row, end + 1)).equals(verdict)) {
                    end++;
                }
                double left = panel.px(grid.timeAt(start) - timeStep / 2);
                double right = panel.px(grid.timeAt(end) + timeStep / 2);
                svg.append(String.format(
                        Locale.ROOT,
                        "<rect class=\"%s\" x=\"%.2f\" y=\"%.2f\" width=\"%.2f\" height=\"%.2f\"/>\n",
                        verdict,
                        left,
                        top,
                        Math.max(0, right - left),
                        Math.max(0, bottom - top)));
                start = end + 1;
            }
        }
        svg.append("</g>\n");
    }

    private static String verdict(DesignSpaceCell cell) {
        if (cell.feasible()) {
            return cell.box() != null && cell.box().meetingFraction() < 1 ? "partial" : "feasible";
        }
        return switch (cell.limit()) {
            case GAMMA_CONDITION -> "gamma";
            case STIFFNESS_ABOVE_PLANT, DAMPING_ABOVE_PLANT, GRID_EDGE -> "reach";
            case ACTUATOR_LIMIT -> "actuator";
            case SAMPLE_PERIOD -> "sampled";
        };
    }

    private static String reason(DesignSpaceCell cell) {
        return switch (cell.limit()) {
            case GAMMA_CONDITION -> "fails for every gamma: " + cell.condition().meaning();
            case STIFFNESS_ABOVE_PLANT -> "not stiffer than the plant";
            case DAMPING_ABOVE_PLANT -> "not more damped than the plant";
            case ACTUATOR_LIMIT -> "peak command above the actuator limit";
            case SAMPLE_PERIOD -> "sample period too long";
            case GRID_EDGE -> "grid edge";
        };
    }

    /**
     * The fastest feasible time of each overshoot, joined over neighbouring rows that have one; where it jumps by
     * more than {@value #JUMP_COLUMNS} columns between two rows (for example where the overshoot passes the settling
     * band and the settling time is set after the first peak) the line is broken rather than drawn across the gap.
     */
    private static void fastest(SvgPanel panel, DesignSpaceMap map) {
        double column = (map.grid().timeHighestSeconds() - map.grid().timeLowestSeconds())
                / (map.grid().timeCount() - 1);
        List<double[]> points = new ArrayList<>();
        for (DesignSpaceRow row : map.rows()) {
            boolean drawn = row.fastestSeconds() != null && row.limitedBy() != DesignSpaceLimit.GRID_EDGE;
            boolean jump = drawn
                    && !points.isEmpty()
                    && Math.abs(row.fastestSeconds() - points.get(points.size() - 1)[0]) > JUMP_COLUMNS * column;
            if (!drawn || jump) {
                line(panel, "series", points);
                points = new ArrayList<>();
            }
            if (drawn) {
                points.add(new double[] {row.fastestSeconds(), row.overshootPercent()});
            }
        }
        line(panel, "series", points);
    }

    /** Per row, where the peak command crosses the limit (linear between the two cells around the crossing). */
    private static void contour(SvgPanel panel, DesignSpaceMap map, double limit) {
        DesignSpaceGrid grid = map.grid();
        List<double[]> points = new ArrayList<>();
        for (int row = 0; row < grid.overshootCount(); row++) {
            for (int column = 0; column + 1 < grid.timeCount(); column++) {
                double here = map.cell(row, column).peakControl() - limit;
                double next = map.cell(row, column + 1).peakControl() - limit;
                if (here == 0 || here * next < 0) {
                    double share = here == 0 ? 0 : here / (here - next);
                    double time = grid.timeAt(column) + share * (grid.timeAt(column + 1) - grid.timeAt(column));
                    points.add(new double[] {time, grid.overshootAt(row)});
                    break;
                }
            }
        }
        line(panel, "limit", points);
    }

    private static void line(SvgPanel panel, String cssClass, List<double[]> points) {
        if (points.size() < 2) {
            return;
        }
        double[] xs = new double[points.size()];
        double[] ys = new double[points.size()];
        for (int i = 0; i < points.size(); i++) {
            xs[i] = points.get(i)[0];
            ys[i] = points.get(i)[1];
        }
        panel.polyline(cssClass, xs, ys);
    }

    private static void legend(StringBuilder svg, Double actuatorLimit) {
        double y = TOP + PANEL_HEIGHT + BOTTOM + 4;
        String[][] swatches = {
            {"feasible", "feasible"},
            {"partial", "feasible, not over the whole box"},
            {"gamma", "no gamma"},
            {"reach", "not beyond the plant"},
            {"actuator", "actuator limit"},
            {"sampled", "sample period"}
        };
        svg.append("<g class=\"legend\">");
        for (int i = 0; i < swatches.length; i++) {
            double left = LEFT + (i % 3) * 200;
            double top = y + (i / 3) * 18;
            svg.append(String.format(
                    Locale.ROOT,
                    "<rect class=\"%s\" x=\"%.0f\" y=\"%.0f\" width=\"18\" height=\"10\"/><text x=\"%.0f\" y=\"%.0f\">%s</text>",
                    swatches[i][0],
                    left,
                    top,
                    left + 24,
                    top + 9,
                    SvgPanel.escape(swatches[i][1])));
        }
        double lineY = y + 44;
        svg.append(String.format(
                Locale.ROOT,
                "<line class=\"series\" x1=\"%.0f\" y1=\"%.0f\" x2=\"%.0f\" y2=\"%.0f\"/><text x=\"%.0f\" y=\"%.0f\">"
                        + "fastest feasible time</text>",
                LEFT,
                lineY,
                LEFT + 18,
                lineY,
                LEFT + 24,
                lineY + 4));
        if (actuatorLimit != null) {
            svg.append(String.format(
                    Locale.ROOT,
                    "<line class=\"limit\" x1=\"%.0f\" y1=\"%.0f\" x2=\"%.0f\" y2=\"%.0f\"/><text x=\"%.0f\" y=\"%.0f\">"
                            + "%s</text>",
                    LEFT + 200,
                    lineY,
                    LEFT + 218,
                    lineY,
                    LEFT + 224,
                    lineY + 4,
                    SvgPanel.escape("peak command = actuatorLimit " + DesignFigures.format(actuatorLimit))));
        }
        svg.append("</g>\n");
    }
}
