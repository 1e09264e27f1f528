package com.loopwright.solver.plant;

/** Sign and finiteness checks of physical parameters, reported as {@link PlantParameterException}. */
final class PhysicalCheck {

    private PhysicalCheck() {
    }

    static void positive(String parameter, double value, String quantity) {
        if (!(value > 0) || !Double.isFinite(value)) {
            throw new PlantParameterException(parameter, quantity + " must be positive (got " + value
                    + "); a zero or negative value is not a physical " + quantity);
        }
    }

    static void nonNegative(String parameter, double value, String quantity) {
        if (!(value >= 0) || !Double.isFinite(value)) {
            throw new PlantParameterException(parameter, quantity + " must not be negative (got " + value
                    + "); a negative value would feed energy into the mechanism");
        }
    }

    static void nonZero(String parameter, double value, String quantity) {
        if (value == 0 || !Double.isFinite(value)) {
            throw new PlantParameterException(parameter, quantity + " must be non-zero and finite (got " + value
                    + "); without it the actuator cannot move the plant");
        }
    }
}
