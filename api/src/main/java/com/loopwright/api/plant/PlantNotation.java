package com.loopwright.api.plant;

/**
 * How a plant form names the quantities of the canonical model, for the {@code model} section of a design
 * response. The units of a0, a1, b and d follow from these (1/s^2, 1/s, x1/(s^2 u), x1/(s^2 w)).
 *
 * @param x1           the first canonical state and its unit
 * @param x2           the second canonical state and its unit
 * @param command      the unit of the command u
 * @param disturbance  the unit of the disturbance w
 * @param x1Short      the unit of x1 as it appears in a quotient
 * @param law          the quantities of the control law written in physical units, or null when the form has none
 */
public record PlantNotation(String x1, String x2, String command, String disturbance, String x1Short, LawTerms law) {

    /**
     * The control law in a form's physical quantities: command = k1 (r - position) - k2 position' + feedforward r.
     *
     * @param command              symbol of the command
     * @param commandUnit          its unit
     * @param position             symbol of the controlled position
     * @param positionUnit         its unit
     * @param feedforwardMeaning   what the setpoint feedforward a0/b stands for in this form
     */
    public record LawTerms(
            String command, String commandUnit, String position, String positionUnit, String feedforwardMeaning) {}
}
