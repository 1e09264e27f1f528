package com.loopwright.solver.frequency;

import java.util.OptionalDouble;

/**
 * Classical margins of an open loop L inside a frequency window.
 *
 * @param gainCrossoverRadPerSec  lowest w with |L(j w)| = 1, if any in the window
 * @param phaseMarginDegrees      180 + arg L at the gain crossover, arg taken in (-360, 0]
 * @param phaseCrossoverRadPerSec lowest w where L(j w) crosses the negative real axis, if any in the window
 * @param gainMarginDecibels      -20 log10 |L| at the phase crossover
 */
public record StabilityMargins(OptionalDouble gainCrossoverRadPerSec, OptionalDouble phaseMarginDegrees,
                               OptionalDouble phaseCrossoverRadPerSec, OptionalDouble gainMarginDecibels) {
}
