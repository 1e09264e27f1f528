package com.loopwright.solver.design;

/**
 * The fastest feasible time spec at one overshoot: the fastest feasible cell of the row, refined by bisection
 * towards its faster infeasible neighbour.
 *
 * @param overshootPercent the row's overshoot [%]
 * @param fastestSeconds   the fastest feasible settling (or rise) time [s], or null when no cell of the row is
 *                         feasible
 * @param limitedBy        what stops a faster spec (GRID_EDGE: the fastest cell is the grid's first column);
 *                         for a row without a feasible cell, why its slowest cell fails
 * @param condition        the gamma requirement when limitedBy is GAMMA_CONDITION, else null
 */
public record DesignSpaceRow(
        double overshootPercent, Double fastestSeconds, DesignSpaceLimit limitedBy, GammaCondition condition) {}
