package com.loopwright.solver.design;

/** The spec cannot be met by this plant with this method; carries the reason and nearby feasible specs. */
public final class InfeasibleDesignException extends RuntimeException {

    private final transient Infeasibility infeasibility;

    public InfeasibleDesignException(Infeasibility infeasibility) {
        super(infeasibility.reason());
        this.infeasibility = infeasibility;
    }

    public Infeasibility infeasibility() {
        return infeasibility;
    }
}
