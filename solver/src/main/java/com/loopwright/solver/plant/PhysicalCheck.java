package com.loopwright.solver.plant;

/** Sign and finiteness checks of physical parameters, reported as {@link PlantParameterException}. */
final class PhysicalCheck {

    private PhysicalCheck() {}

    static void positive(String parameter, double value, String quantity) {
        if (!(value > 0) || !Double.isFinite(value)) {
            throw new PlantParameterException(
                    parameter,
                    quantity + " must be positive (got " + value + "); a zero or negative value is not a physical "
                            + quantity);
        }
    }

    static void nonNegative(String parameter, double value, String quantity) {
        if (!(value >= 0) || !Double.isFinite(value)) {
            throw new PlantParameterException(
                    parameter,
                    quantity + " must not be negative (got " + value
                            + "); a negative value would feed energy into the mechanism");
        }
    }

    static void nonZero(String parameter, double value, String quantity) {
        if (value == 0 || !Double.isFinite(value)) {
            throw new PlantParameterException(
                    parameter,
                    quantity + " must be non-zero and finite (got " + value
                            + "); without it the actuator cannot move the plant");
        }
    }

    /**
     * The canonical coefficients derived from a description, checked for what division and multiplication in double
     * precision can do to values that are each in range: overflow to Infinity (a tiny divisor) and underflow of a
     * non-zero gain to zero (a tiny factor). Reported with an empty parameter: several fields drive each
     * coefficient, and the caller knows which.
     *
     * @param disturbanceGiven whether the description has a non-zero disturbance gain (d must then stay non-zero)
     */
    static CanonicalPlant canonical(double a0, double a1, double b, double d, boolean disturbanceGiven) {
        String failing = !Double.isFinite(a0)
                ? "a0"
                : !Double.isFinite(a1) ? "a1" : !Double.isFinite(b) ? "b" : !Double.isFinite(d) ? "d" : null;
        if (failing != null) {
            throw new PlantParameterException(
                    "",
                    "the derived canonical coefficient " + failing
                            + " overflows double precision (a divisor is too small for the other factors)");
        }
        if (b == 0 || (disturbanceGiven && d == 0)) {
            throw new PlantParameterException(
                    "",
                    "the derived canonical coefficient " + (b == 0 ? "b" : "d")
                            + " underflows to zero in double precision (a factor is too small)");
        }
        return new CanonicalPlant(a0, a1, b, d);
    }
}
