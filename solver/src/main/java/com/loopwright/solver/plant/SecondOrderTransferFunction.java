package com.loopwright.solver.plant;

/**
 * A second-order transfer function without zeros from the command u to the output y, and from a disturbance w
 * to y over the same denominator:
 * <pre>
 *   Y(s) = (n U(s) + m W(s)) / (c2 s^2 + c1 s + c0)
 * </pre>
 * Its phase-variable realization x1 = y, x2 = y' has the canonical coefficients a0 = c0/c2, a1 = c1/c2,
 * b = n/c2, d = m/c2. The gain-frequency-damping form K wn^2/(s^2 + 2 zeta wn s + wn^2) is n = K wn^2,
 * c2 = 1, c1 = 2 zeta wn, c0 = wn^2.
 *
 * @param numerator            n, non-zero
 * @param disturbanceNumerator m (0 when there is no disturbance channel)
 * @param s2                   c2, non-zero
 * @param s1                   c1
 * @param s0                   c0
 */
public record SecondOrderTransferFunction(
        double numerator, double disturbanceNumerator, double s2, double s1, double s0) implements PlantForm {

    public SecondOrderTransferFunction {
        PhysicalCheck.nonZero("numerator", numerator, "numerator");
        if (s2 == 0 || !Double.isFinite(s2)) {
            throw new PlantParameterException(
                    "denominator",
                    "the s^2 coefficient of the denominator must be" + " non-zero: the model must be of second order");
        }
        if (!Double.isFinite(s1) || !Double.isFinite(s0) || !Double.isFinite(disturbanceNumerator)) {
            throw new PlantParameterException("denominator", "coefficients must be finite");
        }
    }

    /**
     * K wn^2/(s^2 + 2 zeta wn s + wn^2), with the disturbance numerator m.
     *
     * @throws PlantParameterException when wn is not positive or zeta is negative
     */
    public static SecondOrderTransferFunction ofGainFrequencyDamping(
            double gain, double naturalFrequencyRadPerSec, double dampingRatio, double disturbanceNumerator) {
        PhysicalCheck.nonZero("gain", gain, "steady-state gain");
        PhysicalCheck.positive("naturalFrequency", naturalFrequencyRadPerSec, "natural frequency");
        PhysicalCheck.nonNegative("dampingRatio", dampingRatio, "damping ratio");
        double wn2 = naturalFrequencyRadPerSec * naturalFrequencyRadPerSec;
        return new SecondOrderTransferFunction(
                gain * wn2, disturbanceNumerator, 1, 2 * dampingRatio * naturalFrequencyRadPerSec, wn2);
    }

    @Override
    public CanonicalPlant canonical() {
        return PhysicalCheck.canonical(
                s0 / s2, s1 / s2, numerator / s2, disturbanceNumerator / s2, disturbanceNumerator != 0);
    }
}
