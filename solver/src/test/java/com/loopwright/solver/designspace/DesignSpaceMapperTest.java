package com.loopwright.solver.designspace;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.solver.design.DesignSpaceBox;
import com.loopwright.solver.design.DesignSpaceCell;
import com.loopwright.solver.design.DesignSpaceGrid;
import com.loopwright.solver.design.DesignSpaceLimit;
import com.loopwright.solver.design.DesignSpaceMap;
import com.loopwright.solver.design.DesignSpaceRow;
import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.design.GammaChoice;
import com.loopwright.solver.design.GammaCondition;
import com.loopwright.solver.design.InfeasibleDesignException;
import com.loopwright.solver.pipeline.LoopDesigner;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.robustness.AcceptanceLimits;
import com.loopwright.solver.robustness.ParameterBox;
import com.loopwright.solver.robustness.UncertaintyAnalyzer;
import com.loopwright.solver.robustness.UncertaintyReport;
import com.loopwright.solver.spec.DesignSpec;
import com.loopwright.solver.spec.TimeSpec;
import java.util.List;
import org.ejml.data.DMatrixRMaj;
import org.junit.jupiter.api.Test;

class DesignSpaceMapperTest {

    /** The README's indexing axis: J q'' + c q' = kt i + w with a1 = 0.48, b = d = 400. */
    private static final CanonicalPlant AXIS = new CanonicalPlant(0, 0.48, 400, 400);

    private static final MapConditions NOMINAL = new MapConditions(null, null, 1, List.of(), 0.1);

    private final DesignSpaceMapper mapper = new DesignSpaceMapper();

    @Test
    void readmeSpecIsFeasibleAndTenPercentOvershootFailsTheVelocityWeight() {
        DesignSpaceGrid grid = new DesignSpaceGrid(true, 0.15, 0.3, 2, 1.5, 10, 2, 0.02);
        DesignSpaceMap map = mapper.map(AXIS, grid, NOMINAL);
        DesignSpaceCell readme = map.cell(0, 0);
        assertTrue(readme.feasible());
        // README example output: gammaMin 2.1062, simulated peakControl 1.5723
        assertEquals(2.1062, readme.gammaMin(), 1e-4);
        assertEquals(1.5723, readme.peakControl(), 1e-4);
        // method section 6: with a0 = 0 rho2 is real for some gamma only if zeta >= 1/sqrt(2) (overshoot <= 4.3 %);
        // 10 % overshoot is zeta 0.591 (method section 5), so no settling time helps
        for (int column = 0; column < 2; column++) {
            DesignSpaceCell tenPercent = map.cell(1, column);
            assertFalse(tenPercent.feasible());
            assertEquals(DesignSpaceLimit.GAMMA_CONDITION, tenPercent.limit());
            assertEquals(GammaCondition.VELOCITY_WEIGHT_REAL, tenPercent.condition());
            assertNull(tenPercent.gammaMin());
        }
        DesignSpaceRow tenPercentRow = map.rows().get(1);
        assertNull(tenPercentRow.fastestSeconds());
        assertEquals(GammaCondition.VELOCITY_WEIGHT_REAL, tenPercentRow.condition());
    }

    @Test
    void feasibilityAgreesWithTheDesignOnEveryCell() {
        // the design (pipeline/LoopDesigner, with its independent verification) is the reference for each cell
        LoopDesigner designer = new LoopDesigner();
        for (CanonicalPlant plant :
                List.of(AXIS, new CanonicalPlant(400, 12, 50, 10), new CanonicalPlant(-30, 2, 8, 0))) {
            for (boolean settling : new boolean[] {true, false}) {
                DesignSpaceGrid grid = new DesignSpaceGrid(settling, 0.02, 2, 7, 0.5, 25, 6, 0.02);
                DesignSpaceMap map = mapper.map(plant, grid, NOMINAL);
                for (DesignSpaceCell cell : map.cells()) {
                    TimeSpec timeSpec = settling
                            ? new TimeSpec.SettlingTime(cell.timeSeconds(), 0.02)
                            : new TimeSpec.RiseTime(cell.timeSeconds());
                    boolean designed;
                    try {
                        designer.design(
                                plant,
                                new DesignSpec(cell.overshootPercent() / 100, timeSpec),
                                new GammaChoice.MarginOverMinimum(1.2),
                                1,
                                0.02);
                        designed = true;
                    } catch (InfeasibleDesignException e) {
                        designed = false;
                    }
                    assertEquals(designed, cell.feasible(), plant + " " + cell);
                }
            }
        }
    }

    @Test
    void actuatorLimitAndSamplePeriodMakeFastCellsInfeasible() {
        DesignSpaceGrid grid = new DesignSpaceGrid(true, 0.05, 0.3, 6, 1, 2, 2, 0.02);
        // the README cell needs 1.5723 peak command for a unit step: a 1.0 limit refuses it, 3.0 admits it
        DesignSpaceMap limited = mapper.map(AXIS, grid, new MapConditions(1.0, null, 1, List.of(), 0.1));
        assertEquals(DesignSpaceLimit.ACTUATOR_LIMIT, limited.cell(0, 0).limit());
        assertTrue(limited.cell(0, 5).feasible());
        assertTrue(limited.cell(0, 0).gammaMin() > 0); // the design exists; the actuator stops it
        DesignSpaceRow row = limited.rows().get(0);
        assertEquals(DesignSpaceLimit.ACTUATOR_LIMIT, row.limitedBy());
        // at the fastest feasible time the peak command meets the limit (bisection to the boundary)
        DesignSpaceCell boundary = mapper.map(
                        AXIS, new DesignSpaceGrid(true, row.fastestSeconds(), 1, 2, 1, 2, 2, 0.02), NOMINAL)
                .cell(0, 0);
        assertEquals(1.0, boundary.peakControl(), 1e-6);
        // controller export rule (wn T <= 0.5): a 20 ms period refuses the 0.05 s loop (wn about 75 rad/s)
        DesignSpaceMap sampled = mapper.map(AXIS, grid, new MapConditions(null, 0.02, 1, List.of(), 0.1));
        assertEquals(DesignSpaceLimit.SAMPLE_PERIOD, sampled.cell(0, 0).limit());
        assertTrue(sampled.cell(0, 5).feasible());
    }

    @Test
    void boxFiguresAgreeWithTheSimulatedUncertaintyAnalysis() {
        // independent route: robustness/UncertaintyAnalyzer simulates every case (exact ZOH, refined metrics)
        ParameterBox box = new ParameterBox(0, 0, 0.384, 0.576, 320, 600, 400, 400);
        List<CanonicalPlant> cases = BoxCases.of(box, 40, 7);
        DesignSpaceGrid grid = new DesignSpaceGrid(true, 0.15, 0.3, 2, 1.5, 3, 2, 0.02);
        DesignSpaceMap map = mapper.map(AXIS, grid, new MapConditions(null, null, 1, cases, 0.1));
        DesignSpaceCell cell = map.cell(0, 0);
        DesignSpaceBox judged = cell.box();
        assertEquals(44, judged.cases());
        FeedbackGains gains = new FeedbackGains(1.57230, 0.0992069, 1.57230);
        UncertaintyReport simulated = new UncertaintyAnalyzer()
                .analyze(
                        box,
                        gains,
                        1,
                        new AcceptanceLimits(0.15 * 1.1, null, 1.5 * 1.1, 0.02),
                        new DMatrixRMaj(new double[][] {{1, 0}}),
                        40,
                        7);
        assertEquals(simulated.meetingFraction(), judged.meetingFraction(), 1e-12);
        assertEquals(simulated.overshootPercent().max(), judged.worstOvershootPercent(), 1e-3);
        assertEquals(simulated.settlingTime().max(), judged.worstTimeSeconds(), 1e-4);
        assertEquals(simulated.peakControl().max(), judged.worstPeakControl(), 1e-4);
    }
}
