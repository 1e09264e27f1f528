package com.loopwright.solver.highorder;

import static org.junit.jupiter.api.Assertions.*;

import com.loopwright.solver.design.ClosedFormDesign;
import com.loopwright.solver.design.ClosedFormDesigner;
import com.loopwright.solver.design.GammaBound;
import com.loopwright.solver.design.GammaChoice;
import com.loopwright.solver.design.HighOrderDesign;
import com.loopwright.solver.design.PoleMatchedSolution;
import com.loopwright.solver.design.RiccatiSolution;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.plant.CompanionPlant;
import com.loopwright.solver.riccati.HamiltonianRiccatiSolver;
import com.loopwright.solver.riccati.RiccatiResidual;
import com.loopwright.solver.spec.DesiredPoles;
import com.loopwright.solver.spec.TargetDynamics;
import java.util.Arrays;
import java.util.List;
import java.util.Random;
import org.ejml.data.Complex_F64;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.ejml.dense.row.NormOps_DDRM;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.interfaces.decomposition.EigenDecomposition_F64;
import org.junit.jupiter.api.Test;

class HighOrderDesignerTest {

    private final HighOrderDesigner designer = new HighOrderDesigner();
    private final HamiltonianRiccatiSolver numeric = new HamiltonianRiccatiSolver();

    /** n = 2 with B1 = [0, d]': the closed form of method.md section 3 (ClosedFormDesigner) is the reference. */
    @Test
    void secondOrderReproducesTheClosedForm() {
        double[][] cases = {
            {0, 0.48, 400, 400, 0.80075, 25.078},
            {4, 0.5, 2, 1, 0.8, 5},
            {-3, 1, 1.5, 0.7, 0.9, 4},
            {10, -0.2, 3, 2, 0.75, 8},
        };
        ClosedFormDesigner closedForm = new ClosedFormDesigner();
        for (double[] c : cases) {
            CanonicalPlant plant = new CanonicalPlant(c[0], c[1], c[2], c[3]);
            TargetDynamics target = new TargetDynamics(c[4], c[5]);
            ClosedFormDesign expected = closedForm.design(plant, target, new GammaChoice.MarginOverMinimum(1.2));
            CompanionPlant companion =
                    new CompanionPlant(new double[] {c[0], c[1]}, new double[] {1, 0}, c[2], new double[] {0, c[3]});
            HighOrderDesign actual = designer.design(
                    companion, new DesiredPoles(target, List.of()), new GammaChoice.MarginOverMinimum(1.2));
            String where = Arrays.toString(c);
            assertRelative(expected.gammaMin(), actual.gammaMin(), 1e-12, "gammaMin " + where);
            DMatrixRMaj p = actual.solution().p();
            assertRelative(expected.p11(), p.get(0, 0), 1e-12, "p11 " + where);
            assertRelative(expected.p12(), p.get(0, 1), 1e-12, "p12 " + where);
            assertRelative(expected.p22(), p.get(1, 1), 1e-12, "p22 " + where);
            assertRelative(expected.rho1(), actual.weights()[0], 1e-12, "rho1 " + where);
            assertRelative(expected.rho2(), actual.weights()[1], 1e-12, "rho2 " + where);
        }
    }

    /** Seeded random stable and unstable plants, n = 3..8, matched and unmatched disturbances. */
    @Test
    void randomPlantsSolveTheRiccatiEquationAndPlaceThePoles() {
        Random random = new Random(20261202);
        int designs = 0;
        for (int trial = 0; trial < 24 && designs < 12; trial++) {
            int n = 3 + trial % 6;
            double[] a = new double[n];
            for (int i = 0; i < n; i++) {
                a[i] = random.nextGaussian() * 2;
            }
            double[] d = new double[n];
            if (trial % 2 == 0) {
                d[n - 1] = 0.5 + random.nextDouble();
            } else {
                for (int i = 0; i < n; i++) {
                    d[i] = random.nextGaussian() * 0.5;
                }
            }
            double[] c = new double[n];
            c[0] = 1;
            CompanionPlant plant = new CompanionPlant(a, c, 0.5 + 2 * random.nextDouble(), d);
            TargetDynamics target = new TargetDynamics(0.75 + 0.2 * random.nextDouble(), 1 + 3 * random.nextDouble());
            // distinct auxiliary poles (a repeated root would make the eigenvalue check itself ill-conditioned)
            double multiple = 2 + 2 * random.nextDouble();
            List<TargetDynamics.Pole> auxiliary = new java.util.ArrayList<>();
            for (int i = 2; i < n; i++) {
                auxiliary.add(new TargetDynamics.Pole(target.poleRealPart() * (multiple + 0.6 * (i - 2)), 0));
            }
            DesiredPoles poles = new DesiredPoles(target, auxiliary);
            HighOrderDesign design;
            try {
                design = designer.design(plant, poles, new GammaChoice.MarginOverMinimum(1.2));
            } catch (RuntimeException e) {
                continue;
            }
            designs++;
            DMatrixRMaj aMat = plant.stateMatrix();
            DMatrixRMaj r = PoleMatchedRiccati.quadraticTerm(plant, 1 / (design.gamma() * design.gamma()));
            DMatrixRMaj q = PoleMatchedRiccati.weightMatrix(design.solution().weightsSquared());
            double residual =
                    RiccatiResidual.relative(aMat, r, q, design.solution().p());
            assertTrue(residual < 1e-9, "residual " + residual);
            RiccatiSolution reference = numeric.solve(aMat, r, q);
            DMatrixRMaj diff = reference.p();
            CommonOps_DDRM.subtractEquals(diff, design.solution().p());
            double rel = NormOps_DDRM.normF(diff) / NormOps_DDRM.normF(reference.p());
            assertTrue(rel < 1e-7, "numeric P differs by " + rel + " n=" + n);
            assertPolesPlaced(plant, design);
            assertTight(plant, design);
        }
        assertTrue(designs >= 12, "designs " + designs);
    }

    /** eig(A - B2 K) against the requested poles (EJML eigenvalues as the independent route). */
    private static void assertPolesPlaced(CompanionPlant plant, HighOrderDesign design) {
        DMatrixRMaj closedLoop = plant.stateMatrix();
        double[] k = design.gain();
        for (int j = 0; j < plant.order(); j++) {
            closedLoop.add(plant.order() - 1, j, -plant.b() * k[j]);
        }
        EigenDecomposition_F64<DMatrixRMaj> eig = DecompositionFactory_DDRM.eig(plant.order(), false);
        assertTrue(eig.decompose(closedLoop));
        List<TargetDynamics.Pole> requested = design.poles().all();
        double scale = requested.stream()
                .mapToDouble(p -> Math.hypot(p.re(), p.im()))
                .max()
                .orElse(1);
        boolean[] used = new boolean[requested.size()];
        for (int i = 0; i < eig.getNumberOfEigenvalues(); i++) {
            Complex_F64 lambda = eig.getEigenvalue(i);
            int best = -1;
            double bestDistance = Double.POSITIVE_INFINITY;
            for (int j = 0; j < requested.size(); j++) {
                double distance = Math.hypot(
                        lambda.real - requested.get(j).re(),
                        lambda.imaginary - requested.get(j).im());
                if (!used[j] && distance < bestDistance) {
                    best = j;
                    bestDistance = distance;
                }
            }
            used[best] = true;
            // companion matrices with roots 0.6 apart have eigenvalue condition numbers near 1e10 (common practice)
            assertTrue(bestDistance < 1e-5 * scale, "pole " + lambda + " off by " + bestDistance);
        }
    }

    /**
     * Slightly above gamma_min every requirement holds on the branch; slightly below (Newton from the solution
     * above, the same branch) the binding one fails.
     */
    private void assertTight(CompanionPlant plant, HighOrderDesign design) {
        double[] desired = design.poles().coefficients();
        double above = design.gammaMin() * (1 + 1e-6);
        double below = design.gammaMin() * (1 - 1e-6);
        FeasibleGammaSearch search = new FeasibleGammaSearch();
        FeasibleGammaSearch.FeasibleGammaSet set = search.search(plant, desired);
        PoleMatchedSolution atAbove = search.solutionAt(plant, desired, set, above);
        double[] marginsAbove = FeasibleGammaSearch.margins(plant, 1 / (above * above), atAbove);
        for (int c = 0; c < marginsAbove.length; c++) {
            assertTrue(
                    FeasibleGammaSearch.holds(c, marginsAbove[c], plant.order()),
                    "all requirements hold just above gamma_min, not " + c);
        }
        PoleMatchedSolution atBelow = new PoleMatchedRiccati().solveFrom(plant, desired, 1 / (below * below), atAbove);
        double[] marginsBelow = FeasibleGammaSearch.margins(plant, 1 / (below * below), atBelow);
        List<GammaBound> bounds = design.gammaBounds();
        boolean bindingFails = false;
        for (int c = 0; c < bounds.size(); c++) {
            if (bounds.get(c).binding() && !FeasibleGammaSearch.holds(c, marginsBelow[c], plant.order())) {
                bindingFails = true;
            }
        }
        assertTrue(bindingFails, "a binding requirement fails just below gamma_min " + bounds);
    }

    private static void assertRelative(double expected, double actual, double tolerance, String what) {
        assertEquals(expected, actual, tolerance * Math.abs(expected), what);
    }
}
