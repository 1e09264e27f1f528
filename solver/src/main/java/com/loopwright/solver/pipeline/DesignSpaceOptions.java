package com.loopwright.solver.pipeline;

import com.loopwright.solver.robustness.ParameterBox;

/**
 * What a design-space map judges besides the gamma requirements.
 *
 * @param actuatorLimit     largest |u| the actuator gives, or null (not judged)
 * @param samplePeriod      period of the emulated sampled law [s], or null (not judged)
 * @param stepSize          the reference step the peak command is computed for (1: a unit step)
 * @param box               the parameter box each feasible cell is judged over, or null
 * @param boxSamples        seeded samples of the box besides its corners
 * @param seed              seed of the samples
 * @param toleranceFraction a box case meets the cell's spec widened by this fraction of each limit
 */
public record DesignSpaceOptions(
        Double actuatorLimit,
        Double samplePeriod,
        double stepSize,
        ParameterBox box,
        int boxSamples,
        long seed,
        double toleranceFraction) {}
