package com.loopwright.solver.frequency;

import java.util.OptionalDouble;

/**
 * Classical margins of an open loop L inside a frequency window, over every crossing in it.
 *
 * @param gainCrossoverRadPerSec  the w with |L(j w)| = 1 that sets the phase margin, if any in the window
 * @param phaseMarginDegrees      least destabilizing phase lag, min over crossovers of (180 + arg L) mod 360 for a
 *                                stable closed loop (see {@link CrossoverMargins})
 * @param delayMarginSeconds      least destabilizing input delay, min over crossovers of lag [rad] / w
 * @param phaseCrossoverRadPerSec where L(j w) crosses the negative real axis with the gain margin below
 * @param gainMarginDecibels      -20 log10 |L| there: the least positive one, else the one nearest 0 dB
 */
public record StabilityMargins(OptionalDouble gainCrossoverRadPerSec, OptionalDouble phaseMarginDegrees,
                               OptionalDouble delayMarginSeconds, OptionalDouble phaseCrossoverRadPerSec,
                               OptionalDouble gainMarginDecibels) {
}
