package com.loopwright.solver.plant;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.ejml.data.Complex_F64;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.interfaces.decomposition.EigenDecomposition_F64;
import org.junit.jupiter.api.Test;

/**
 * Each physical form maps to the canonical coefficients its equation of motion gives after division by the
 * leading coefficient; an independent route (the eigenvalues of the canonical A against the roots of the
 * physical characteristic polynomial) checks each mapping.
 */
class PlantFormsTest {

    // source: Newton's second law for rotation about a fixed axis, J q'' = sum of torques, with viscous friction
    // -c q' and a gearbox multiplying the motor torque kt i by N at the load (Ogata, Modern Control Engineering,
    // ch. 3, mechanical systems; Nise, Control Systems Engineering, sec. 2.7 gears).
    @Test
    void rotaryAxisDividesTheTorqueBalanceByTheInertia() {
        CanonicalPlant plant = new RotaryAxis(0.0025, 0.0012, 0.5, 2).canonical();
        assertEquals(0, plant.a0());
        assertEquals(0.0012 / 0.0025, plant.a1(), 1e-15);
        assertEquals(2 * 0.5 / 0.0025, plant.b(), 1e-12);
        assertEquals(1 / 0.0025, plant.d(), 1e-12);
        // The README indexing axis: a1 = 0.48, b = d = 400 for J = 0.0025, c = 0.0012, kt = 1, N = 1.
        CanonicalPlant readme = new RotaryAxis(0.0025, 0.0012, 1, 1).canonical();
        assertEquals(400, readme.b(), 1e-12);
        assertEquals(0.48, readme.a1(), 1e-15);
    }

    // source: m y'' + c y' + k y = F (Ogata ch. 3; any dynamics text): poles are the roots of m s^2 + c s + k.
    @Test
    void massSpringDamperPolesAreTheRootsOfItsCharacteristicPolynomial() {
        double m = 4;
        double c = 12;
        double k = 400;
        CanonicalPlant plant = new MassSpringDamper(m, c, k).canonical();
        assertEquals(k / m, plant.a0(), 1e-15);
        assertEquals(c / m, plant.a1(), 1e-15);
        assertEquals(1 / m, plant.b(), 1e-15);
        assertEquals(1 / m, plant.d(), 1e-15);
        // Independent route: eigenvalues of [[0, 1], [-a0, -a1]] against the quadratic formula on m s^2 + c s + k.
        double re = -c / (2 * m);
        double im = Math.sqrt(4 * m * k - c * c) / (2 * m);
        Complex_F64[] poles = eigenvalues(new double[][] {{0, 1}, {-plant.a0(), -plant.a1()}});
        assertEquals(re, poles[0].real, 1e-12);
        assertEquals(im, Math.abs(poles[0].imaginary), 1e-12);
    }

    // source: standard second-order form K wn^2/(s^2 + 2 zeta wn s + wn^2) (any control textbook): DC gain K,
    // poles -zeta wn +- j wn sqrt(1 - zeta^2).
    @Test
    void transferFunctionFormsAgreeAndKeepTheDcGain() {
        CanonicalPlant fromGain = SecondOrderTransferFunction.ofGainFrequencyDamping(2.5, 8, 0.3, 1)
                .canonical();
        assertEquals(64, fromGain.a0(), 1e-12);
        assertEquals(2 * 0.3 * 8, fromGain.a1(), 1e-12);
        assertEquals(2.5 * 64, fromGain.b(), 1e-12);
        // The same model as coefficients, scaled by 3: 480/(3 s^2 + 14.4 s + 192).
        CanonicalPlant fromCoefficients = new SecondOrderTransferFunction(480, 3, 3, 14.4, 192).canonical();
        assertEquals(fromGain.a0(), fromCoefficients.a0(), 1e-12);
        assertEquals(fromGain.a1(), fromCoefficients.a1(), 1e-12);
        assertEquals(fromGain.b(), fromCoefficients.b(), 1e-12);
        assertEquals(fromGain.d(), fromCoefficients.d(), 1e-12);
        // DC gain b/a0 = K.
        assertEquals(2.5, fromGain.b() / fromGain.a0(), 1e-14);
        Complex_F64[] poles = eigenvalues(new double[][] {{0, 1}, {-fromGain.a0(), -fromGain.a1()}});
        assertEquals(-0.3 * 8, poles[0].real, 1e-12);
        assertEquals(8 * Math.sqrt(1 - 0.09), Math.abs(poles[0].imaginary), 1e-12);
    }

    @Test
    void nonPhysicalParametersAreNamed() {
        assertEquals(
                "mass",
                assertThrows(PlantParameterException.class, () -> new MassSpringDamper(-1, 1, 1))
                        .parameter());
        assertEquals(
                "damping",
                assertThrows(PlantParameterException.class, () -> new MassSpringDamper(1, -1, 1))
                        .parameter());
        assertEquals(
                "inertia",
                assertThrows(PlantParameterException.class, () -> new RotaryAxis(0, 1, 1, 1))
                        .parameter());
        assertEquals(
                "torqueConstant",
                assertThrows(PlantParameterException.class, () -> new RotaryAxis(1, 1, 0, 1))
                        .parameter());
        assertEquals(
                "naturalFrequency",
                assertThrows(
                                PlantParameterException.class,
                                () -> SecondOrderTransferFunction.ofGainFrequencyDamping(1, -2, 0.5, 0))
                        .parameter());
        assertEquals(
                "denominator",
                assertThrows(PlantParameterException.class, () -> new SecondOrderTransferFunction(1, 0, 0, 1, 1))
                        .parameter());
    }

    static Complex_F64[] eigenvalues(double[][] a) {
        EigenDecomposition_F64<DMatrixRMaj> eigen = DecompositionFactory_DDRM.eig(a.length, false);
        if (!eigen.decompose(new DMatrixRMaj(a))) {
            throw new AssertionError("eigen decomposition failed");
        }
        Complex_F64[] values = new Complex_F64[a.length];
        for (int i = 0; i < a.length; i++) {
            values[i] = eigen.getEigenvalue(i);
        }
        return values;
    }
}
