package com.loopwright.solver.design;

/**
 * One frequency of the loop broken at the plant input.
 *
 * @param frequencyRadPerSec    omega
 * @param loopGainDb            20 log10 |L(j omega)|
 * @param loopPhaseDegrees      arg L(j omega), unwrapped continuously from the low end
 * @param sensitivityDb         20 log10 |1 / (1 + L(j omega))|
 * @param closedLoopGainDb      20 log10 |T(j omega)| of the reference r to x1
 */
public record FrequencyPoint(
        double frequencyRadPerSec,
        double loopGainDb,
        double loopPhaseDegrees,
        double sensitivityDb,
        double closedLoopGainDb) {}
