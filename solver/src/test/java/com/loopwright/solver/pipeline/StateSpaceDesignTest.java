package com.loopwright.solver.pipeline;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.solver.design.GammaChoice;
import com.loopwright.solver.design.RiccatiSolution;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.plant.PlantParameterException;
import com.loopwright.solver.plant.TwoStateModel;
import com.loopwright.solver.riccati.HamiltonianRiccatiSolver;
import com.loopwright.solver.spec.DesignSpec;
import com.loopwright.solver.spec.TargetDynamics;
import com.loopwright.solver.spec.TimeSpec;
import java.util.Comparator;
import java.util.List;
import java.util.Random;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.ejml.dense.row.NormOps_DDRM;
import org.junit.jupiter.api.Test;

/**
 * Similarity-transformed state spaces: a canonical plant seen through a random x = S z must give the same
 * canonical coefficients (up to the scale of b), the target closed-loop poles, and a P that solves the Riccati
 * equation built from the caller's own A, B1, B2, checked against an independent numeric Riccati solve in the
 * caller's coordinates.
 */
class StateSpaceDesignTest {

    private final LoopDesigner designer = new LoopDesigner();

    @Test
    void randomSimilarityTransformsGiveTheSameLoopInTheCallersCoordinates() {
        Random random = new Random(20261202L);
        HamiltonianRiccatiSolver numeric = new HamiltonianRiccatiSolver();
        int designed = 0;
        for (int trial = 0; trial < 60; trial++) {
            CanonicalPlant base = new CanonicalPlant(
                    -5 + 30 * random.nextDouble(),
                    2 * random.nextDouble(),
                    1 + 50 * random.nextDouble(),
                    20 * random.nextDouble());
            DMatrixRMaj s;
            do {
                s = new DMatrixRMaj(new double[][] {
                    {random.nextGaussian(), random.nextGaussian()}, {random.nextGaussian(), random.nextGaussian()}
                });
            } while (Math.abs(CommonOps_DDRM.det(s)) < 0.2);
            DMatrixRMaj sInv = new DMatrixRMaj(2, 2);
            CommonOps_DDRM.invert(s, sInv);
            DMatrixRMaj a = product(s, new DMatrixRMaj(new double[][] {{0, 1}, {-base.a0(), -base.a1()}}), sInv);
            DMatrixRMaj b2 = product(s, new DMatrixRMaj(2, 1, true, 0, base.b()));
            DMatrixRMaj b1 = product(s, new DMatrixRMaj(2, 1, true, 0, base.d()));
            TwoStateModel model = new TwoStateModel(
                    new double[][] {{a.get(0, 0), a.get(0, 1)}, {a.get(1, 0), a.get(1, 1)}}, b2.data, b1.data);
            CanonicalPlant canonical = model.canonical();
            // source: the characteristic polynomial is invariant under similarity (any linear algebra text).
            assertEquals(base.a0(), canonical.a0(), 1e-9 * (1 + Math.abs(base.a0())));
            assertEquals(base.a1(), canonical.a1(), 1e-9 * (1 + Math.abs(base.a1())));
            // d/b is invariant: B1 = (d/b) B2 in any coordinates.
            assertEquals(base.d() / base.b(), canonical.d() / canonical.b(), 1e-9);
            DesignSpec spec = new DesignSpec(0.01, new TimeSpec.SettlingTime(0.5 + random.nextDouble(), 0.02));
            DesignReport report;
            try {
                report = designer.design(canonical, spec, new GammaChoice.MarginOverMinimum(1.5), 1, 0.02);
            } catch (com.loopwright.solver.design.InfeasibleDesignException e) {
                continue;
            }
            designed++;
            StateSpaceDesign inCaller = CallerCoordinates.of(model, report.design());
            assertTrue(inCaller.relativeResidual() < 1e-10, "residual " + inCaller.relativeResidual());
            TargetDynamics target = report.design().target();
            List<TargetDynamics.Pole> expected = sorted(target.poles());
            List<TargetDynamics.Pole> actual = sorted(inCaller.closedLoopPoles());
            double wn = target.naturalFrequencyRadPerSec();
            for (int i = 0; i < 2; i++) {
                assertEquals(expected.get(i).re(), actual.get(i).re(), 1e-8 * wn);
                assertEquals(expected.get(i).im(), actual.get(i).im(), 1e-8 * wn);
            }
            // Independent route: solve the caller-coordinate Riccati equation numerically.
            double gamma = report.design().gamma();
            DMatrixRMaj r = new DMatrixRMaj(2, 2);
            CommonOps_DDRM.multTransB(b2, b2, r);
            CommonOps_DDRM.scale(-1, r);
            if (base.d() != 0) {
                DMatrixRMaj b1b1 = new DMatrixRMaj(2, 2);
                CommonOps_DDRM.multTransB(b1, b1, b1b1);
                CommonOps_DDRM.addEquals(r, 1 / (gamma * gamma), b1b1);
            }
            RiccatiSolution solution = numeric.solve(a, r, inCaller.stateWeight());
            DMatrixRMaj difference = solution.p();
            CommonOps_DDRM.subtractEquals(difference, inCaller.p());
            assertTrue(
                    NormOps_DDRM.normF(difference) < 1e-7 * NormOps_DDRM.normF(inCaller.p()),
                    "numeric P differs by " + NormOps_DDRM.normF(difference));
            // K_x = B2' P_x (the central law in the caller's coordinates).
            DMatrixRMaj k = new DMatrixRMaj(1, 2);
            CommonOps_DDRM.multTransA(b2, inCaller.p(), k);
            assertEquals(k.get(0), inCaller.gain().get(0), 1e-8 * NormOps_DDRM.normF(k));
            assertEquals(k.get(1), inCaller.gain().get(1), 1e-8 * NormOps_DDRM.normF(k));
            // The tracked output c x equals z1: c S = [s-scale, 0] (a multiple of the base position).
            DMatrixRMaj cs = product(inCaller.trackedOutput(), s);
            assertEquals(0, cs.get(1), 1e-9 * Math.abs(cs.get(0)));
        }
        assertTrue(designed >= 30, "designed " + designed);
    }

    @Test
    void canonicalModelInCanonicalCoordinatesHasTheIdentityTransform() {
        TwoStateModel model =
                new TwoStateModel(new double[][] {{0, 1}, {-4, -0.5}}, new double[] {0, 20}, new double[] {0, 5});
        DMatrixRMaj t = model.transform();
        assertTrue(NormOps_DDRM.normF(difference(t, CommonOps_DDRM.identity(2))) < 1e-14, t.toString());
        assertEquals(20, model.canonical().b(), 1e-13);
        assertEquals(5, model.canonical().d(), 1e-13);
    }

    // source: J q'' + c q' = kt i + w written in angle and angular momentum h = J q' (common practice):
    // q' = h/J, h' = -(c/J) h + kt i + w. The tracked output is the angle itself, so z1 = q and b = kt/J.
    @Test
    void angleAndMomentumStatesTrackTheAngleInItsOwnUnits() {
        double j = 0.02;
        double c = 0.04;
        double kt = 3;
        TwoStateModel model =
                new TwoStateModel(new double[][] {{0, 1 / j}, {0, -c / j}}, new double[] {0, kt}, new double[] {0, 1});
        assertEquals(0, model.canonical().a0(), 1e-15);
        assertEquals(c / j, model.canonical().a1(), 1e-13);
        assertEquals(kt / j, model.canonical().b(), 1e-12);
        assertEquals(1 / j, model.canonical().d(), 1e-12);
        DMatrixRMaj tInv = model.inverseTransform();
        assertEquals(1, tInv.get(0, 0), 1e-15);
        assertEquals(0, tInv.get(0, 1), 1e-15);
    }

    @Test
    void uncontrollableModelsAndMisalignedDisturbancesAreRejected() {
        // Two decoupled first-order modes with the actuator on only one of them.
        assertEquals(
                "b2",
                assertThrows(
                                PlantParameterException.class,
                                () -> new TwoStateModel(
                                        new double[][] {{-1, 0}, {0, -2}}, new double[] {1, 0}, new double[] {0, 0}))
                        .parameter());
        // B2 an eigenvector of A: A B2 = -3 B2.
        assertEquals(
                "b2",
                assertThrows(
                                PlantParameterException.class,
                                () -> new TwoStateModel(
                                        new double[][] {{-1, 2}, {2, -1}}, new double[] {1, -1}, new double[] {0, 0}))
                        .parameter());
        assertEquals(
                "b1",
                assertThrows(
                                PlantParameterException.class,
                                () -> new TwoStateModel(
                                        new double[][] {{0, 1}, {0, -1}}, new double[] {0, 1}, new double[] {1, 0}))
                        .parameter());
    }

    private static List<TargetDynamics.Pole> sorted(List<TargetDynamics.Pole> poles) {
        return poles.stream()
                .sorted(Comparator.comparingDouble(TargetDynamics.Pole::im))
                .toList();
    }

    private static DMatrixRMaj product(DMatrixRMaj... factors) {
        DMatrixRMaj out = factors[0];
        for (int i = 1; i < factors.length; i++) {
            DMatrixRMaj next = new DMatrixRMaj(out.numRows, factors[i].numCols);
            CommonOps_DDRM.mult(out, factors[i], next);
            out = next;
        }
        return out;
    }

    private static DMatrixRMaj difference(DMatrixRMaj x, DMatrixRMaj y) {
        DMatrixRMaj out = x.copy();
        CommonOps_DDRM.subtractEquals(out, y);
        return out;
    }
}
