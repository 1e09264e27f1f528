package com.loopwright.solver.export;

import com.loopwright.solver.discrete.ControllerSettings;

/**
 * How a generic controller is written.
 *
 * @param prefix    the name prefix of the block, functions and macros
 * @param precision LREAL/double or REAL/float
 * @param settings  limits (min, max), bias (u0, y0) and the period tolerance
 */
public record ControllerExportOptions(BlockPrefix prefix, Precision precision, ControllerSettings settings) {

    public ControllerExportOptions {
        if (prefix == null || precision == null || settings == null) {
            throw new IllegalArgumentException("prefix, precision and settings are required");
        }
    }
}
