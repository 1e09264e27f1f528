package com.loopwright.solver.highorder;

import static org.junit.jupiter.api.Assertions.*;

import com.loopwright.solver.design.GammaChoice;
import com.loopwright.solver.design.HighOrderDesign;
import com.loopwright.solver.design.PoleMatchedSolution;
import com.loopwright.solver.plant.CompanionPlant;
import com.loopwright.solver.spec.DesiredPoles;
import com.loopwright.solver.spec.TargetDynamics;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.junit.jupiter.api.Test;

/**
 * For n = 3 the quadratic system has at most two real solutions, and all of them can be written down (below). On a
 * grid of gamma every real solution that passes the Hamiltonian check (stabilizing solution equal to P, same K)
 * must lie in the reported set or be found by {@link FeasibleGammaSearch#seek} when that gamma is requested.
 */
class SecondBranchTest {

    /** Seeded random n = 3 designs. */
    static final int DESIGNS = 150;
    /** gamma points per design, geometric from the w-to-u gain to 10^4 times it. */
    static final int GAMMAS = 60;

    private final FeasibleGammaSearch search = new FeasibleGammaSearch();

    /**
     * Every real solution at mu for n = 3. The off-diagonal equations (1,3) and (2,3) are linear in
     * x = (p11, p12, p22) (their P B1 B1' P term holds (P B1)_3, fixed by pole matching), so x lies on a line
     * x0 + t v (v the cross product of their rows); (1,2) is a quadratic in t there, fitted exactly through
     * t = -1, 0, 1; its real roots are all solutions (elementary algebra). Each root is polished by Newton.
     */
    static List<PoleMatchedSolution> all(CompanionPlant plant, double[] desired, double mu) {
        int n = 3;
        DMatrixRMaj a = plant.stateMatrix();
        DMatrixRMaj r = PoleMatchedRiccati.quadraticTerm(plant, mu);
        double[] col = PoleMatchedRiccati.matchedColumn(plant, desired);
        java.util.function.Function<double[], DMatrixRMaj> pOf = x -> {
            DMatrixRMaj p = new DMatrixRMaj(n, n);
            p.set(0, 0, x[0]);
            p.set(0, 1, x[1]);
            p.set(1, 0, x[1]);
            p.set(1, 1, x[2]);
            for (int j = 0; j < n; j++) {
                p.set(j, 2, col[j]);
                p.set(2, j, col[j]);
            }
            return p;
        };
        java.util.function.Function<double[], double[]> eqs = x -> {
            DMatrixRMaj f = PoleMatchedRiccati.riccati(a, r, pOf.apply(x), new DMatrixRMaj(n, n));
            return new double[] {f.get(0, 2), f.get(1, 2), f.get(0, 1)};
        };
        // linear part of eqs 0,1: affine in x
        double[] f0 = eqs.apply(new double[3]);
        double[][] m = new double[2][3];
        for (int k = 0; k < 3; k++) {
            double[] e = new double[3];
            e[k] = 1;
            double[] fk = eqs.apply(e);
            m[0][k] = fk[0] - f0[0];
            m[1][k] = fk[1] - f0[1];
        }
        // null vector v = row0 x row1
        double[] v = {
            m[0][1] * m[1][2] - m[0][2] * m[1][1],
            m[0][2] * m[1][0] - m[0][0] * m[1][2],
            m[0][0] * m[1][1] - m[0][1] * m[1][0]
        };
        // particular solution: least squares via pseudo-inverse of 2x3
        DMatrixRMaj mm = new DMatrixRMaj(2, 3, true, m[0][0], m[0][1], m[0][2], m[1][0], m[1][1], m[1][2]);
        DMatrixRMaj pinv = new DMatrixRMaj(3, 2);
        CommonOps_DDRM.pinv(mm, pinv);
        DMatrixRMaj x0 = new DMatrixRMaj(3, 1);
        CommonOps_DDRM.mult(pinv, new DMatrixRMaj(2, 1, true, -f0[0], -f0[1]), x0);
        double vn = Math.sqrt(v[0] * v[0] + v[1] * v[1] + v[2] * v[2]);
        double scale = Math.max(1, Math.abs(x0.get(0)) + Math.abs(x0.get(1)) + Math.abs(x0.get(2)));
        java.util.function.DoubleFunction<double[]> xt = t -> new double[] {
            x0.get(0) + t * v[0] / vn * scale, x0.get(1) + t * v[1] / vn * scale, x0.get(2) + t * v[2] / vn * scale
        };
        double qm = eqs.apply(xt.apply(-1))[2], q0 = eqs.apply(xt.apply(0))[2], qp = eqs.apply(xt.apply(1))[2];
        double alpha = (qp + qm) / 2 - q0, beta = (qp - qm) / 2, gamma0 = q0;
        List<PoleMatchedSolution> out = new ArrayList<>();
        double disc = beta * beta - 4 * alpha * gamma0;
        if (disc < 0) return out;
        double[] ts = alpha == 0
                ? new double[] {-gamma0 / beta}
                : new double[] {(-beta + Math.sqrt(disc)) / (2 * alpha), (-beta - Math.sqrt(disc)) / (2 * alpha)};
        for (double t : ts) {
            DMatrixRMaj p = pOf.apply(xt.apply(t));
            DMatrixRMaj f = PoleMatchedRiccati.riccati(a, r, p, new DMatrixRMaj(n, n));
            double[] w = {-f.get(0, 0), -f.get(1, 1), -f.get(2, 2)};
            // polish with Newton
            try {
                out.add(new PoleMatchedRiccati().solveFrom(plant, desired, mu, new PoleMatchedSolution(p, w, 0, 0, 0)));
            } catch (RuntimeException e) {
            }
        }
        return out;
    }

    @Test
    void everyFeasibleRealSolutionIsInTheSetOrFoundOnRequest() {
        Random random = new Random(7);
        int solutions = 0;
        int otherBranch = 0;
        for (int design = 0; design < DESIGNS; design++) {
            double[] a = {random.nextGaussian() * 2, random.nextGaussian() * 2, random.nextGaussian() * 2};
            double[] d = {random.nextGaussian(), random.nextGaussian(), random.nextGaussian()};
            CompanionPlant plant = new CompanionPlant(a, new double[] {1, 0, 0}, 0.5 + 2 * random.nextDouble(), d);
            TargetDynamics target = new TargetDynamics(0.72 + 0.25 * random.nextDouble(), 1 + 3 * random.nextDouble());
            double multiple = 2 + 2 * random.nextDouble();
            double[] desired = new DesiredPoles(
                            target, List.of(new TargetDynamics.Pole(target.poleRealPart() * multiple, 0)))
                    .coefficients();
            FeasibleGammaSearch.FeasibleGammaSet set = search.search(plant, desired);
            for (int i = 1; i <= GAMMAS; i++) {
                double gamma = set.inputGain() * Math.pow(1e4, (double) i / GAMMAS);
                double mu = 1 / (gamma * gamma);
                for (PoleMatchedSolution s : all(plant, desired, mu)) {
                    solutions++;
                    if (search.independentCheck(plant, mu, s) != null || set.contains(gamma)) {
                        continue;
                    }
                    otherBranch++;
                    FeasibleGammaSearch.FeasibleGammaSet more = search.seek(plant, desired, set, gamma);
                    assertTrue(
                            more.contains(gamma),
                            "design " + design + ": a feasible solution at gamma " + gamma + " is neither in "
                                    + set.intervals() + " nor found by seek");
                    DirectFeasibility.assertFeasible(plant, desired, more, gamma, "second branch, design " + design);
                }
            }
        }
        System.out.printf(
                "n = 3: %d real solutions, %d feasible ones on a second branch, all found%n", solutions, otherBranch);
        assertTrue(solutions > DESIGNS * GAMMAS, "two real solutions at many points");
        assertTrue(otherBranch >= 1, "the seed holds feasible points that only a second branch reaches");
    }

    /**
     * A requested gamma that only a second solution branch makes feasible (design 15 of the seed above): the
     * design is accepted, lies in the reported set, and says where it came from.
     */
    @Test
    void requestedGammaOnASecondBranchIsAccepted() {
        Random random = new Random(7);
        CompanionPlant plant = null;
        DesiredPoles poles = null;
        for (int design = 0; design <= 15; design++) {
            double[] a = {random.nextGaussian() * 2, random.nextGaussian() * 2, random.nextGaussian() * 2};
            double[] d = {random.nextGaussian(), random.nextGaussian(), random.nextGaussian()};
            plant = new CompanionPlant(a, new double[] {1, 0, 0}, 0.5 + 2 * random.nextDouble(), d);
            TargetDynamics target = new TargetDynamics(0.72 + 0.25 * random.nextDouble(), 1 + 3 * random.nextDouble());
            double multiple = 2 + 2 * random.nextDouble();
            poles = new DesiredPoles(target, List.of(new TargetDynamics.Pole(target.poleRealPart() * multiple, 0)));
        }
        double gamma = 3.5205422035887146;
        FeasibleGammaSearch.FeasibleGammaSet principal = search.search(plant, poles.coefficients());
        assertFalse(principal.contains(gamma), "not on the branch from gamma = infinity: " + principal.intervals());
        HighOrderDesign design = new HighOrderDesigner().design(plant, poles, new GammaChoice.Fixed(gamma));
        assertTrue(
                design.feasibleSet().stream().anyMatch(i -> i.contains(gamma)),
                design.feasibleSet().toString());
        assertTrue(design.gammaMin() < principal.gammaMin());
        assertTrue(
                design.notes().stream().anyMatch(n -> n.contains("second solution branch")),
                design.notes().toString());
        assertNull(search.independentCheck(plant, 1 / (gamma * gamma), design.solution()));
    }
}
