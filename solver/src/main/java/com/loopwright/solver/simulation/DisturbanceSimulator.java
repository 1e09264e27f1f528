package com.loopwright.solver.simulation;

import com.loopwright.solver.design.DenseTrajectory;
import com.loopwright.solver.design.DisturbanceResponse;
import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.linalg.MatrixExponential;
import com.loopwright.solver.loop.LoopMatrices;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.plant.DisturbanceProfile;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;

/**
 * The continuous loop x' = A_cl x + B1 w (r = 0) driven by a held disturbance profile, with the energies of x1 and of
 * the performance output z = C_z x over the horizon computed exactly for the held signal.
 *
 * <p>Energy over one grid step: with xi = [x; w], xi' = F xi, F = [[A_cl, B1], [0, 0]], the step contributes
 * xi_k' W xi_k with W = integral_0^h e^(F' t) C' C e^(F t) dt, C = [C_z, 0]. Van Loan's block exponential gives W:
 * exp([[-F', C'C], [0, F]] h) = [[E11, E12], [0, E22]] and W = E22' E12. Hence the observed gain
 * ||z||_2 / ||w||_2 is the exact finite-horizon gain of the held signal from zero state, which never exceeds the
 * H-infinity norm of w to z.
 */
public final class DisturbanceSimulator {

    public static final int GRID_POINTS = SaturatedStepSimulator.GRID_POINTS;
    /** Recovery band: 2% of the peak deviation (common practice for a settling band). */
    public static final double RECOVERY_BAND_FRACTION = 0.02;

    /**
     * @param performanceOutput C_z, p x 2 (z = C_z x); for example [[rho1, 0], [0, rho2], [-k1, -k2]]
     */
    public DisturbanceResponse simulate(
            CanonicalPlant plant,
            FeedbackGains gains,
            DisturbanceProfile profile,
            DMatrixRMaj performanceOutput,
            double horizonSeconds) {
        DMatrixRMaj closed = LoopMatrices.closedLoop(plant, gains);
        DMatrixRMaj b1 = LoopMatrices.disturbanceInput(plant);
        int steps = GRID_POINTS - 1;
        double h = horizonSeconds / steps;
        DiscreteStateSpace hold = ZeroOrderHold.discretize(closed, b1, h);
        DMatrixRMaj ad = hold.ad();
        DMatrixRMaj bd = hold.bd();
        DMatrixRMaj positionOutput = new DMatrixRMaj(new double[][] {{1, 0}});
        DMatrixRMaj outputWeight = energyWeight(closed, b1, performanceOutput, h);
        DMatrixRMaj positionWeight = energyWeight(closed, b1, positionOutput, h);
        double[] w = profile.heldValues(steps, h);
        double[] t = new double[GRID_POINTS];
        double[] x1 = new double[GRID_POINTS];
        double[] x2 = new double[GRID_POINTS];
        double[] u = new double[GRID_POINTS];
        double[] wOut = new double[GRID_POINTS];
        double[] x = {0, 0};
        double outputEnergySquared = 0;
        double positionEnergySquared = 0;
        double disturbanceEnergySquared = 0;
        double absoluteIntegral = 0;
        double peak = 0;
        double peakControl = 0;
        for (int k = 0; k <= steps; k++) {
            t[k] = horizonSeconds * ((double) k / steps);
            x1[k] = x[0];
            x2[k] = x[1];
            u[k] = -gains.positionGain() * x[0] - gains.velocityGain() * x[1];
            wOut[k] = k < steps ? w[k] : w[steps - 1];
            peak = Math.max(peak, Math.abs(x[0]));
            peakControl = Math.max(peakControl, Math.abs(u[k]));
            if (k == steps) {
                break;
            }
            double[] xi = {x[0], x[1], w[k]};
            outputEnergySquared += quadratic(outputWeight, xi);
            positionEnergySquared += quadratic(positionWeight, xi);
            disturbanceEnergySquared += w[k] * w[k] * h;
            double[] next = CheckedHoldStep.apply(ad, bd, x, w[k]);
            absoluteIntegral += 0.5 * h * (Math.abs(x[0]) + Math.abs(next[0]));
            x = next;
        }
        double outputEnergy = Math.sqrt(Math.max(0, outputEnergySquared));
        double disturbanceEnergy = Math.sqrt(disturbanceEnergySquared);
        Double recovery = recovery(profile, plant, gains, t, x1, w, peak);
        return new DisturbanceResponse(
                peak,
                absoluteIntegral,
                Math.max(0, positionEnergySquared),
                recovery,
                peakControl,
                disturbanceEnergy,
                outputEnergy,
                disturbanceEnergy == 0 ? 0 : outputEnergy / disturbanceEnergy,
                new DenseTrajectory(t, x1, x2, u, wOut));
    }

    private static Double recovery(
            DisturbanceProfile profile,
            CanonicalPlant plant,
            FeedbackGains gains,
            double[] t,
            double[] x1,
            double[] w,
            double peak) {
        double from = profile.settledFromSeconds();
        if (from < 0 || peak == 0) {
            return null;
        }
        // final x1 under the constant last w: x = -A_cl^-1 B1 w gives x1 = d w / c0
        double finalPosition = plant.d() * w[w.length - 1] / LoopMatrices.closedLoopStiffness(plant, gains);
        double band = RECOVERY_BAND_FRACTION * peak;
        int n = t.length;
        if (Math.abs(x1[n - 1] - finalPosition) > band) {
            return null;
        }
        for (int k = n - 1; k >= 0; k--) {
            if (Math.abs(x1[k] - finalPosition) > band) {
                return Math.max(0, t[Math.min(n - 1, k + 1)] - from);
            }
        }
        return 0.0;
    }

    private static double quadratic(DMatrixRMaj m, double[] v) {
        double sum = 0;
        for (int i = 0; i < v.length; i++) {
            for (int j = 0; j < v.length; j++) {
                sum += v[i] * m.unsafe_get(i, j) * v[j];
            }
        }
        return sum;
    }

    /** W = integral_0^h e^(F' t) C'C e^(F t) dt by Van Loan's block exponential, C = [output, 0]. */
    public static DMatrixRMaj energyWeight(DMatrixRMaj closed, DMatrixRMaj b1, DMatrixRMaj output, double h) {
        DMatrixRMaj f = new DMatrixRMaj(3, 3);
        CommonOps_DDRM.insert(closed, f, 0, 0);
        CommonOps_DDRM.insert(b1, f, 0, 2);
        DMatrixRMaj c = new DMatrixRMaj(output.numRows, 3);
        CommonOps_DDRM.insert(output, c, 0, 0);
        DMatrixRMaj q = new DMatrixRMaj(3, 3);
        CommonOps_DDRM.multTransA(c, c, q);
        DMatrixRMaj block = new DMatrixRMaj(6, 6);
        DMatrixRMaj minusFTransposed = new DMatrixRMaj(3, 3);
        CommonOps_DDRM.transpose(f, minusFTransposed);
        CommonOps_DDRM.scale(-1, minusFTransposed);
        CommonOps_DDRM.insert(minusFTransposed, block, 0, 0);
        CommonOps_DDRM.insert(q, block, 0, 3);
        CommonOps_DDRM.insert(f, block, 3, 3);
        CommonOps_DDRM.scale(h, block);
        DMatrixRMaj e = MatrixExponential.of(block);
        DMatrixRMaj e12 = CommonOps_DDRM.extract(e, 0, 3, 3, 6);
        DMatrixRMaj e22 = CommonOps_DDRM.extract(e, 3, 6, 3, 6);
        DMatrixRMaj w = new DMatrixRMaj(3, 3);
        CommonOps_DDRM.multTransA(e22, e12, w);
        // symmetrize against rounding
        DMatrixRMaj wt = new DMatrixRMaj(3, 3);
        CommonOps_DDRM.transpose(w, wt);
        CommonOps_DDRM.add(0.5, w, 0.5, wt, w);
        return w;
    }
}
