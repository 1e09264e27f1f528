package com.loopwright.solver.designspace;

import com.loopwright.solver.cancel.Cancellation;
import com.loopwright.solver.design.ClosedFormDesigner;
import com.loopwright.solver.design.DesignSpaceBox;
import com.loopwright.solver.design.DesignSpaceCell;
import com.loopwright.solver.design.DesignSpaceGrid;
import com.loopwright.solver.design.DesignSpaceLimit;
import com.loopwright.solver.design.DesignSpaceMap;
import com.loopwright.solver.design.DesignSpaceRow;
import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.design.GammaBound;
import com.loopwright.solver.design.GammaCondition;
import com.loopwright.solver.design.PoleMatch;
import com.loopwright.solver.export.SampledLawDesigner;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.simulation.DiscreteStateSpace;
import com.loopwright.solver.simulation.TwoStateStepMetrics;
import com.loopwright.solver.spec.DesignSpec;
import com.loopwright.solver.spec.SpecInverter;
import com.loopwright.solver.spec.TargetDynamics;
import com.loopwright.solver.spec.TimeSpec;
import java.util.ArrayList;
import java.util.List;

/**
 * The design-space map of one plant. Each cell's spec is inverted exactly to (zeta, wn) as a design does; the
 * pole-matched gains K = [b p12, b p22], kr = wn^2/b depend only on the spec, so every cell has a peak command,
 * and the cell is feasible when p12, p22 &gt; 0, every gamma requirement can be met (the same checks, in the same
 * order, as the closed-form design), the peak command is within the actuator limit and the emulated sampled loop
 * passes the controller export's test (wn T &lt;= 0.5, spectral radius of Ad - Bd K below 1). A feasible cell's
 * gains are then judged on every parameter set of the box with the exact two-state step metrics
 * ({@link TwoStateStepMetrics}, no simulation); the peak command is the same metric's. Stateless and thread-safe.
 */
public final class DesignSpaceMapper {

    /** Bisection steps refining a row's fastest feasible time (relative width 2^-40 of the last cell gap). */
    static final int BISECTION_STEPS = 40;

    private final SpecInverter inverter = new SpecInverter();
    private final ClosedFormDesigner designer = new ClosedFormDesigner();

    /** The nominal verdict of one spec: its gains, its peak command and what fails first. */
    record Nominal(
            FeedbackGains gains,
            double peakControl,
            DesignSpaceLimit limit,
            GammaCondition condition,
            Double gammaMin) {}

    public DesignSpaceMap map(CanonicalPlant plant, DesignSpaceGrid grid, MapConditions conditions) {
        DiscreteStateSpace sampled = conditions.samplePeriod() == null
                ? null
                : SampledLawDesigner.sampledPlant(plant, conditions.samplePeriod());
        List<DesignSpaceCell> cells = new ArrayList<>(grid.cellCount());
        List<DesignSpaceRow> rows = new ArrayList<>(grid.overshootCount());
        for (int row = 0; row < grid.overshootCount(); row++) {
            Cancellation.checkpoint(); // a row of the grid is the unit of cancellation
            double overshoot = grid.overshootAt(row);
            int fastest = -1;
            for (int column = 0; column < grid.timeCount(); column++) {
                double time = grid.timeAt(column);
                Nominal nominal = nominal(plant, grid, time, overshoot, conditions, sampled);
                DesignSpaceBox box =
                        nominal.limit() == null && !conditions.boxCases().isEmpty()
                                ? box(nominal.gains(), grid, time, overshoot, conditions)
                                : null;
                cells.add(new DesignSpaceCell(
                        time,
                        overshoot,
                        nominal.limit(),
                        nominal.condition(),
                        nominal.gammaMin(),
                        nominal.peakControl(),
                        box));
                if (fastest < 0 && nominal.limit() == null) {
                    fastest = column;
                }
            }
            rows.add(fastestOfRow(plant, grid, overshoot, fastest, cells, row, conditions, sampled));
        }
        return new DesignSpaceMap(grid, cells, rows, conditions.boxCases().size());
    }

    /**
     * One spec judged as a cell of a map on this grid's time axis and band (the spec need not lie on the grid).
     */
    public DesignSpaceCell cell(
            CanonicalPlant plant,
            DesignSpaceGrid grid,
            double timeSeconds,
            double overshootPercent,
            MapConditions conditions) {
        DiscreteStateSpace sampled = conditions.samplePeriod() == null
                ? null
                : SampledLawDesigner.sampledPlant(plant, conditions.samplePeriod());
        return judge(plant, grid, timeSeconds, overshootPercent, conditions, sampled);
    }

    private DesignSpaceCell judge(
            CanonicalPlant plant,
            DesignSpaceGrid grid,
            double time,
            double overshoot,
            MapConditions conditions,
            DiscreteStateSpace sampled) {
        Nominal nominal = nominal(plant, grid, time, overshoot, conditions, sampled);
        DesignSpaceBox box = nominal.limit() == null && !conditions.boxCases().isEmpty()
                ? box(nominal.gains(), grid, time, overshoot, conditions)
                : null;
        return new DesignSpaceCell(
                time, overshoot, nominal.limit(), nominal.condition(), nominal.gammaMin(), nominal.peakControl(), box);
    }

    /** The verdict of one spec on the nominal plant. */
    Nominal nominal(
            CanonicalPlant plant,
            DesignSpaceGrid grid,
            double timeSeconds,
            double overshootPercent,
            MapConditions conditions,
            DiscreteStateSpace sampled) {
        TimeSpec timeSpec = grid.settlingAxis()
                ? new TimeSpec.SettlingTime(timeSeconds, grid.bandFraction())
                : new TimeSpec.RiseTime(timeSeconds);
        TargetDynamics target = inverter.invert(new DesignSpec(overshootPercent / 100, timeSpec))
                .target();
        double wn = target.naturalFrequencyRadPerSec();
        PoleMatch match = PoleMatch.of(plant, target);
        FeedbackGains gains = new FeedbackGains(plant.b() * match.p12(), plant.b() * match.p22(), wn * wn / plant.b());
        // the closed loop has the target's poles, so it is stable whatever the plant
        double peak = TwoStateStepMetrics.measure(plant, gains, conditions.stepSize(), grid.bandFraction())
                .peakControl();
        if (!(match.p12() > 0)) {
            return new Nominal(gains, peak, DesignSpaceLimit.STIFFNESS_ABOVE_PLANT, null, null);
        }
        if (!(match.p22() > 0)) {
            return new Nominal(gains, peak, DesignSpaceLimit.DAMPING_ABOVE_PLANT, null, null);
        }
        double gammaMin = 0;
        for (GammaBound bound : designer.bounds(plant, match)) {
            if (!bound.satisfiable()) {
                return new Nominal(gains, peak, DesignSpaceLimit.GAMMA_CONDITION, bound.condition(), null);
            }
            gammaMin = Math.max(gammaMin, bound.gammaLowerBound());
        }
        if (conditions.actuatorLimit() != null && !(peak <= conditions.actuatorLimit())) {
            return new Nominal(gains, peak, DesignSpaceLimit.ACTUATOR_LIMIT, null, gammaMin);
        }
        if (sampled != null && !sampledLoopPasses(sampled, gains, wn, conditions.samplePeriod())) {
            return new Nominal(gains, peak, DesignSpaceLimit.SAMPLE_PERIOD, null, gammaMin);
        }
        return new Nominal(gains, peak, null, null, gammaMin);
    }

    /** The controller export's test of the emulated law: T &lt;= 0.5/wn and Ad - Bd K stable. */
    private static boolean sampledLoopPasses(
            DiscreteStateSpace sampled, FeedbackGains gains, double wn, double samplePeriod) {
        if (samplePeriod > SampledLawDesigner.MAX_PERIOD_PER_TIME_CONSTANT / wn) {
            return false;
        }
        double k1 = gains.positionGain();
        double k2 = gains.velocityGain();
        double radius = SampledLawDesigner.spectralRadius(
                sampled.ad().get(0, 0) - sampled.bd().get(0, 0) * k1,
                sampled.ad().get(0, 1) - sampled.bd().get(0, 0) * k2,
                sampled.ad().get(1, 0) - sampled.bd().get(1, 0) * k1,
                sampled.ad().get(1, 1) - sampled.bd().get(1, 0) * k2);
        return radius < 1;
    }

    /** The cell's gains on every parameter set of the box. */
    private static DesignSpaceBox box(
            FeedbackGains gains,
            DesignSpaceGrid grid,
            double timeSeconds,
            double overshootPercent,
            MapConditions conditions) {
        double timeLimit = timeSeconds * (1 + conditions.toleranceFraction());
        double overshootLimit = overshootPercent * (1 + conditions.toleranceFraction());
        int unstable = 0;
        int meeting = 0;
        double worstTime = Double.NEGATIVE_INFINITY;
        double worstOvershoot = Double.NEGATIVE_INFINITY;
        double worstPeak = Double.NEGATIVE_INFINITY;
        boolean unmeasured = false;
        for (CanonicalPlant plant : conditions.boxCases()) {
            TwoStateStep step =
                    TwoStateStep.of(plant, gains, grid.settlingAxis(), grid.bandFraction(), conditions.stepSize());
            if (!step.stable()) {
                unstable++;
                continue;
            }
            if (step.timeSeconds() == null) {
                unmeasured = true; // stable but not measurable: it never meets the limits
                continue;
            }
            worstTime = Math.max(worstTime, step.timeSeconds());
            worstPeak = Math.max(worstPeak, step.peakControl());
            worstOvershoot = Math.max(worstOvershoot, step.overshootPercent());
            boolean meets = step.timeSeconds() <= timeLimit
                    && step.overshootPercent() <= overshootLimit
                    && (conditions.actuatorLimit() == null || step.peakControl() <= conditions.actuatorLimit());
            if (meets) {
                meeting++;
            }
        }
        int cases = conditions.boxCases().size();
        boolean anyStable = unstable < cases;
        return new DesignSpaceBox(
                cases,
                unstable,
                anyStable && !unmeasured ? worstTime : null,
                anyStable && !unmeasured ? worstOvershoot : null,
                anyStable && !unmeasured ? worstPeak : null,
                (double) meeting / cases);
    }

    /** The row's fastest feasible time: bisection between its fastest feasible cell and the faster neighbour. */
    private DesignSpaceRow fastestOfRow(
            CanonicalPlant plant,
            DesignSpaceGrid grid,
            double overshoot,
            int fastest,
            List<DesignSpaceCell> cells,
            int row,
            MapConditions conditions,
            DiscreteStateSpace sampled) {
        int rowStart = row * grid.timeCount();
        if (fastest < 0) {
            DesignSpaceCell slowest = cells.get(rowStart + grid.timeCount() - 1);
            return new DesignSpaceRow(overshoot, null, slowest.limit(), slowest.condition());
        }
        if (fastest == 0) {
            return new DesignSpaceRow(overshoot, grid.timeAt(0), DesignSpaceLimit.GRID_EDGE, null);
        }
        DesignSpaceCell outside = cells.get(rowStart + fastest - 1);
        double infeasible = outside.timeSeconds();
        double feasible = grid.timeAt(fastest);
        DesignSpaceLimit limit = outside.limit();
        GammaCondition condition = outside.condition();
        for (int i = 0; i < BISECTION_STEPS; i++) {
            double middle = 0.5 * (infeasible + feasible);
            if (middle <= infeasible || middle >= feasible) {
                break;
            }
            Nominal nominal = nominal(plant, grid, middle, overshoot, conditions, sampled);
            if (nominal.limit() == null) {
                feasible = middle;
            } else {
                infeasible = middle;
                limit = nominal.limit();
                condition = nominal.condition();
            }
        }
        return new DesignSpaceRow(overshoot, feasible, limit, condition);
    }
}
