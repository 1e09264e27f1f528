package com.loopwright.solver.highorder;

import com.loopwright.solver.design.HighOrderStep;
import com.loopwright.solver.design.StepMetrics;
import com.loopwright.solver.plant.CompanionPlant;
import com.loopwright.solver.simulation.LinearLoop;
import com.loopwright.solver.simulation.StepResponseMetrics;
import com.loopwright.solver.simulation.StepSimulator;
import com.loopwright.solver.spec.DesiredPoles;
import java.util.List;
import org.ejml.data.DMatrixRMaj;

/**
 * The step response of the actual closed loop of a companion plant under pole placement, zeros included:
 * u = kr r - K z with K_j = (alpha_j - a_j)/b, so A - B2 K has last row -alpha, and kr = alpha_0/(b c_0)
 * for unit DC gain from r to y = c z.
 */
public final class ClosedLoopStep {

    /** The horizon covers this many slowest time constants 1/min|Re p| (2% of e^-t is passed at 3.9). */
    static final double HORIZON_TIME_CONSTANTS = 14;
    /** Samples per radian of the fastest oscillation (the metrics need at most pi/2). */
    static final double SAMPLES_PER_RADIAN = 1.5;

    static final int MIN_SAMPLES = 2000;

    private final StepResponseMetrics metrics = new StepResponseMetrics();

    public static LinearLoop loop(CompanionPlant plant, double[] desired) {
        int n = plant.order();
        double[] a = plant.denominator();
        DMatrixRMaj closed = plant.stateMatrix();
        DMatrixRMaj control = new DMatrixRMaj(1, n);
        for (int j = 0; j < n; j++) {
            closed.set(n - 1, j, -desired[j]);
            control.set(0, j, -(desired[j] - a[j]) / plant.b());
        }
        double kr = desired[0] / (plant.b() * plant.numerator()[0]);
        DMatrixRMaj bRef = new DMatrixRMaj(n, 1);
        bRef.set(n - 1, 0, plant.b() * kr);
        return new LinearLoop(closed, bRef, plant.outputRow(), control, kr);
    }

    public HighOrderStep simulate(
            CompanionPlant plant,
            DesiredPoles poles,
            double stepSize,
            double bandFraction,
            double minimumHorizonSeconds) {
        List<com.loopwright.solver.spec.TargetDynamics.Pole> all = poles.all();
        double slowest = Double.POSITIVE_INFINITY;
        double fastestOscillation = 0;
        for (var p : all) {
            slowest = Math.min(slowest, -p.re());
            fastestOscillation = Math.max(fastestOscillation, Math.abs(p.im()));
        }
        double horizon = Math.max(minimumHorizonSeconds, HORIZON_TIME_CONSTANTS / slowest);
        long wanted = (long) Math.ceil(horizon * fastestOscillation * SAMPLES_PER_RADIAN) + 1;
        int samples = (int) Math.min(StepSimulator.MAX_SAMPLES, Math.max(MIN_SAMPLES, wanted));
        LinearLoop loop = loop(plant, poles.coefficients());
        StepMetrics m = metrics.measure(loop, stepSize, horizon, samples, bandFraction);
        return new HighOrderStep(m, m.undershootPercent(), horizon, samples);
    }
}
