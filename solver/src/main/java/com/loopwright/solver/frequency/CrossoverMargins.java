package com.loopwright.solver.frequency;

import java.util.Optional;

/**
 * Phase and delay margins from every gain crossover of an open loop L (|L(j w_i)| = 1), one rule for the Bode
 * figure and the verification.
 *
 * <p>At crossover i a phase lag phi added at the plant input moves L(j w_i) onto -1 when
 * phi = lag_i = (180 deg + arg L(j w_i)) mod 360 deg, and an input delay tau does when w_i tau = lag_i (mod 2 pi),
 * first at tau_i = lag_i [rad] / w_i. Closed-loop poles can reach the imaginary axis only at such (phi, w_i) or
 * (tau, w_i); starting from a stable closed loop, the first one reached destabilizes it. So for a stable closed
 * loop the phase margin is min_i lag_i and the delay margin min_i lag_i / w_i over all crossovers, whichever way
 * |L| crosses 1 there (a crossover where |L| rises, as with an open-loop unstable plant, has arg L + 180 deg
 * in (-180, 0) and still bounds the delay at (arg L + 540 deg) / w_i). For an unstable closed loop there is nothing
 * to lose: the delay margin is 0 and the phase margin is the least 180 + arg L wrapped to (-180, 180].
 *
 * @param crossoverRadPerSec the crossover that sets the phase margin
 * @param phaseMarginDegrees stable closed loop: min_i lag_i in [0, 360); unstable: min_i of 180 + arg L wrapped
 *                           to (-180, 180]
 * @param delayMarginSeconds stable closed loop: min_i lag_i / w_i; unstable: 0
 */
public record CrossoverMargins(double crossoverRadPerSec, double phaseMarginDegrees, double delayMarginSeconds) {

    /** Most crossovers accepted (a rational loop of degree 15 has at most 15 positive crossovers). */
    public static final int MAX_CROSSOVERS = 64;

    /**
     * @param crossoversRadPerSec positive frequencies where |L(j w)| = 1
     * @param loopPhaseRadians    arg L(j w) at each, any branch
     * @param closedLoopStable    whether 1 + L has all its zeros in the open left half plane
     * @return empty without a crossover
     */
    public static Optional<CrossoverMargins> of(
            double[] crossoversRadPerSec, double[] loopPhaseRadians, boolean closedLoopStable) {
        if (crossoversRadPerSec.length != loopPhaseRadians.length || crossoversRadPerSec.length > MAX_CROSSOVERS) {
            throw new IllegalArgumentException(
                    "need equal numbers of crossovers and phases, at most " + MAX_CROSSOVERS);
        }
        double crossover = Double.NaN;
        double phaseMargin = Double.NaN;
        double delayMargin = Double.POSITIVE_INFINITY;
        for (int i = 0; i < crossoversRadPerSec.length; i++) {
            double w = crossoversRadPerSec[i];
            double lag = lagRadians(loopPhaseRadians[i]);
            double margin = closedLoopStable ? Math.toDegrees(lag) : wrappedDegrees(loopPhaseRadians[i]);
            if (Double.isNaN(phaseMargin) || margin < phaseMargin) {
                phaseMargin = margin;
                crossover = w;
            }
            delayMargin = Math.min(delayMargin, lag / w);
        }
        if (Double.isNaN(phaseMargin)) {
            return Optional.empty();
        }
        return Optional.of(new CrossoverMargins(crossover, phaseMargin, closedLoopStable ? delayMargin : 0));
    }

    /** (pi + arg) mod 2 pi in [0, 2 pi). */
    static double lagRadians(double loopPhaseRadians) {
        double lag = (Math.PI + loopPhaseRadians) % (2 * Math.PI);
        if (lag < 0) {
            lag += 2 * Math.PI;
        }
        return lag >= 2 * Math.PI ? 0 : lag;
    }

    /** 180 + arg L in degrees, wrapped to (-180, 180]. */
    static double wrappedDegrees(double loopPhaseRadians) {
        double lag = Math.toDegrees(lagRadians(loopPhaseRadians));
        return lag > 180 ? lag - 360 : lag;
    }
}
