package com.loopwright.solver.plant;

/**
 * A plant description that is well-formed but not physical or not usable: a negative mass, an uncontrollable
 * state-space model, a disturbance channel the design form cannot carry. Names the offending parameter.
 */
public final class PlantParameterException extends RuntimeException {

    private final String parameter;

    /**
     * @param parameter name of the offending parameter of the plant description (e.g. "mass", "b2")
     * @param reason    what is wrong, in engineering words
     */
    public PlantParameterException(String parameter, String reason) {
        super(reason);
        this.parameter = parameter;
    }

    public String parameter() {
        return parameter;
    }
}
