package com.loopwright.solver.pipeline;

import com.loopwright.solver.cancel.ComputationCancelledException;
import com.loopwright.solver.design.DesignSpaceCell;
import com.loopwright.solver.design.DesignSpaceGrid;
import com.loopwright.solver.design.DesignSpaceMap;
import com.loopwright.solver.designspace.BoxCases;
import com.loopwright.solver.designspace.DesignSpaceMapper;
import com.loopwright.solver.designspace.MapConditions;
import com.loopwright.solver.plant.CanonicalPlant;
import java.util.List;

/**
 * The front door of the design-space map: what one plant can do over a grid of time spec and overshoot, with
 * the caps on the grid and the box checked before anything is computed. Every failure is a {@link SolverFailure};
 * a cancellation passes through. Stateless and thread-safe.
 */
public final class DesignSpacePipeline {

    /** Cap on the points of each axis (a map has at most 64 x 64 cells). */
    public static final int MAX_AXIS_POINTS = 64;
    /** Cap on the seeded samples of the box, besides its at most 16 corners. */
    public static final int MAX_BOX_SAMPLES = 64;
    /** Subjects of the cap-exceeded failures. */
    public static final String TIME_AXIS = "timeAxis";

    public static final String OVERSHOOT_AXIS = "overshootAxis";
    public static final String BOX_SAMPLES = "boxSamples";

    private final DesignSpaceMapper mapper = new DesignSpaceMapper();

    /**
     * @throws SolverFailure CAP_EXCEEDED (subject TIME_AXIS, OVERSHOOT_AXIS or BOX_SAMPLES) or
     *                       CHECK_NOT_COMPUTABLE when a number leaves double precision
     */
    public DesignSpaceMap map(CanonicalPlant plant, DesignSpaceGrid grid, DesignSpaceOptions options) {
        requireCap(TIME_AXIS, grid.timeCount(), MAX_AXIS_POINTS, "time axis points");
        requireCap(OVERSHOOT_AXIS, grid.overshootCount(), MAX_AXIS_POINTS, "overshoot axis points");
        MapConditions conditions = conditions(options);
        try {
            return mapper.map(plant, grid, conditions);
        } catch (ComputationCancelledException e) {
            throw e; // the deadline passed: stop, there is nobody to answer
        } catch (RuntimeException e) {
            throw SolverFailure.of(SolverFailure.Kind.CHECK_NOT_COMPUTABLE, e.getMessage(), e);
        }
    }

    /**
     * One spec judged as a cell of a map with this grid's time axis and band: the requested spec a map marks.
     *
     * @throws SolverFailure as {@link #map}
     */
    public DesignSpaceCell spec(
            CanonicalPlant plant,
            DesignSpaceGrid grid,
            double timeSeconds,
            double overshootPercent,
            DesignSpaceOptions options) {
        MapConditions conditions = conditions(options);
        try {
            return mapper.cell(plant, grid, timeSeconds, overshootPercent, conditions);
        } catch (ComputationCancelledException e) {
            throw e;
        } catch (RuntimeException e) {
            throw SolverFailure.of(SolverFailure.Kind.CHECK_NOT_COMPUTABLE, e.getMessage(), e);
        }
    }

    /** Case evaluations of a map: each cell on the nominal plant and on every case of the box. */
    public static long caseEvaluations(int cells, int boxSamples, int varyingParameters) {
        long cases = varyingParameters == 0 && boxSamples == 0 ? 0 : (1L << varyingParameters) + boxSamples;
        return (long) cells * (1 + cases);
    }

    private static MapConditions conditions(DesignSpaceOptions options) {
        requireCap(BOX_SAMPLES, options.boxSamples(), MAX_BOX_SAMPLES, "box samples");
        List<CanonicalPlant> cases =
                options.box() == null ? List.of() : BoxCases.of(options.box(), options.boxSamples(), options.seed());
        return new MapConditions(
                options.actuatorLimit(),
                options.samplePeriod(),
                options.stepSize(),
                cases,
                options.toleranceFraction());
    }

    private static void requireCap(String subject, int count, int cap, String what) {
        if (count > cap) {
            throw SolverFailure.about(
                    SolverFailure.Kind.CAP_EXCEEDED,
                    subject,
                    -1,
                    "a design-space map takes at most " + cap + " " + what + " per request, got " + count
                            + " (the cap); split the range over several requests",
                    null);
        }
    }
}
