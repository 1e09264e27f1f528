package com.loopwright.solver.export;

import com.loopwright.solver.design.SampledLaw;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.simulation.DiscreteStateSpace;
import org.ejml.data.DMatrixRMaj;

/**
 * The plant under the sampled, clamped law from x(0) = 0 with a constant setpoint: exact at the samples
 * (zero-order hold), x[k+1] = Ad x[k] + Bd u[k], u[k] = law(r, x1[k], x2[k]).
 */
public final class SampledLawSimulator {

    /** Largest number of simulated samples. */
    public static final int MAX_STEPS = 100_000;

    /**
     * @return rows {x1[k], x2[k], u[k]} for k = 0 .. steps - 1
     */
    public double[][] run(CanonicalPlant plant, SampledLaw law, double setpoint, int steps) {
        if (steps < 1 || steps > MAX_STEPS) {
            throw new IllegalArgumentException("steps must be in [1, " + MAX_STEPS + "]");
        }
        DiscreteStateSpace sampled = SampledLawDesigner.sampledPlant(plant, law.samplePeriod());
        DMatrixRMaj ad = sampled.ad();
        DMatrixRMaj bd = sampled.bd();
        double[][] rows = new double[steps][];
        double x1 = 0;
        double x2 = 0;
        for (int k = 0; k < steps; k++) {
            double u = law.command(setpoint, x1, x2);
            rows[k] = new double[] {x1, x2, u};
            double next1 = ad.get(0, 0) * x1 + ad.get(0, 1) * x2 + bd.get(0, 0) * u;
            double next2 = ad.get(1, 0) * x1 + ad.get(1, 1) * x2 + bd.get(1, 0) * u;
            x1 = next1;
            x2 = next2;
        }
        return rows;
    }
}
