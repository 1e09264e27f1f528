package com.loopwright.solver.design;

/**
 * A cell's design judged over a parameter box: the gains of the nominal design on every corner and on the seeded
 * samples, each case's step metrics exact for its two-state loop.
 *
 * @param cases               corners plus samples evaluated
 * @param unstableCases       cases whose loop is unstable (they never meet the limits)
 * @param worstTimeSeconds    largest settling (or rise) time over the stable cases, or null when none is stable
 *                            or one is not measurable in double precision (then the two below are null too)
 * @param worstOvershootPercent largest overshoot over the stable cases, or null
 * @param worstPeakControl    largest peak |u| over the stable cases for the map's step, or null
 * @param meetingFraction     fraction of the cases meeting the cell's spec widened by the tolerance (and the
 *                            actuator limit when given)
 */
public record DesignSpaceBox(
        int cases,
        int unstableCases,
        Double worstTimeSeconds,
        Double worstOvershootPercent,
        Double worstPeakControl,
        double meetingFraction) {}
