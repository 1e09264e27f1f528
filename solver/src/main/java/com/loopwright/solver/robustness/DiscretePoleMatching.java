package com.loopwright.solver.robustness;

import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.loop.LoopMatrices;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.simulation.DiscreteStateSpace;
import com.loopwright.solver.simulation.ZeroOrderHold;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;

/**
 * A sampled-data design made directly in discrete time: the continuous closed-loop poles lambda map to
 * z = e^(lambda Ts), and the gain of x[k+1] = Ad x[k] + Bd u[k] (the plant's zero-order hold) places the poles of
 * Ad - Bd K there by Ackermann's formula K = [0 1] [Bd, Ad Bd]^-1 phi(Ad), phi(z) = z^2 + alpha1 z + alpha0 with
 * alpha1 = -(z1 + z2), alpha0 = z1 z2 = e^(-c1 Ts). The reference gain gives unit DC gain from r to x1[k]:
 * kr = 1 / (e1' (I - Ad + Bd K)^-1 Bd).
 */
public final class DiscretePoleMatching {

    /**
     * @param continuous the continuous gains whose closed-loop poles are matched
     * @throws IllegalArgumentException when the sampled plant is not controllable (pathological sampling)
     */
    public FeedbackGains design(CanonicalPlant plant, FeedbackGains continuous, double samplePeriod) {
        DiscreteStateSpace hold =
                ZeroOrderHold.discretize(LoopMatrices.openLoop(plant), LoopMatrices.actuatorInput(plant), samplePeriod);
        DMatrixRMaj ad = hold.ad();
        DMatrixRMaj bd = hold.bd();
        double c0 = LoopMatrices.closedLoopStiffness(plant, continuous);
        double c1 = LoopMatrices.closedLoopDamping(plant, continuous);
        double decay = Math.exp(-0.5 * c1 * samplePeriod);
        double discriminant = 0.25 * c1 * c1 - c0;
        double sum = discriminant < 0
                ? 2 * decay * Math.cos(Math.sqrt(-discriminant) * samplePeriod)
                : 2 * decay * Math.cosh(Math.sqrt(discriminant) * samplePeriod);
        double alpha1 = -sum;
        double alpha0 = decay * decay;
        DMatrixRMaj phi = new DMatrixRMaj(2, 2);
        CommonOps_DDRM.mult(ad, ad, phi);
        CommonOps_DDRM.addEquals(phi, alpha1, ad);
        phi.add(0, 0, alpha0);
        phi.add(1, 1, alpha0);
        DMatrixRMaj adBd = new DMatrixRMaj(2, 1);
        CommonOps_DDRM.mult(ad, bd, adBd);
        DMatrixRMaj controllability =
                new DMatrixRMaj(new double[][] {{bd.get(0, 0), adBd.get(0, 0)}, {bd.get(1, 0), adBd.get(1, 0)}});
        double det = CommonOps_DDRM.det(controllability);
        if (!(Math.abs(det) > 0) || !Double.isFinite(det)) {
            throw new IllegalArgumentException("the sampled plant is not controllable at Ts = " + samplePeriod + " s");
        }
        // last row of W^-1 for W = [[w00, w01], [w10, w11]]: [-w10, w00] / det
        double r0 = -controllability.get(1, 0) / det;
        double r1 = controllability.get(0, 0) / det;
        double k1 = r0 * phi.get(0, 0) + r1 * phi.get(1, 0);
        double k2 = r0 * phi.get(0, 1) + r1 * phi.get(1, 1);
        // (I - Ad + Bd K) x = Bd kr r, x1 = r
        DMatrixRMaj m = new DMatrixRMaj(new double[][] {
            {1 - ad.get(0, 0) + bd.get(0, 0) * k1, -ad.get(0, 1) + bd.get(0, 0) * k2},
            {-ad.get(1, 0) + bd.get(1, 0) * k1, 1 - ad.get(1, 1) + bd.get(1, 0) * k2}
        });
        DMatrixRMaj x = new DMatrixRMaj(2, 1);
        if (!CommonOps_DDRM.solve(m, bd, x)) {
            throw new IllegalArgumentException("the discrete loop has a pole at z = 1");
        }
        double kr = 1 / x.get(0, 0);
        return new FeedbackGains(k1, k2, kr);
    }
}
