package com.loopwright.solver.design;

/**
 * One cell of a design-space map: the spec (time, overshoot) and what the plant can do with it.
 *
 * @param timeSeconds      the settling (or rise) time of the cell [s]
 * @param overshootPercent the overshoot of the cell [%]
 * @param limit            why the cell has no usable design, or null when it is feasible
 * @param condition        the gamma requirement that fails when limit is GAMMA_CONDITION, else null
 * @param gammaMin         the infimum of the feasible gamma set when some gamma completes the design, else null
 * @param peakControl      peak |u| of the nominal step of the map's step size (the gains depend only on the spec)
 * @param box              the design over the parameter box, or null (no box, or no design)
 */
public record DesignSpaceCell(
        double timeSeconds,
        double overshootPercent,
        DesignSpaceLimit limit,
        GammaCondition condition,
        Double gammaMin,
        double peakControl,
        DesignSpaceBox box) {

    public boolean feasible() {
        return limit == null;
    }
}
