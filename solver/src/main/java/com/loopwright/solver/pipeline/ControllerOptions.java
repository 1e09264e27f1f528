package com.loopwright.solver.pipeline;

import com.loopwright.solver.discrete.ControllerSettings;
import com.loopwright.solver.export.BlockPrefix;
import java.util.Optional;

/**
 * What the caller chooses for an exported controller: the task period, the command range, the operating point, the
 * tolerance of the measured-period check, the name prefix and the arithmetic.
 *
 * <p>The law works on deviations from the operating point: yd = y - outputBias is fed to the law, and the command
 * is u = clamp(commandBias + v, commandMin, commandMax) with v the law's output.
 *
 * @param samplePeriod            T, the task period the law is built for [s]
 * @param commandMin              the lowest command the actuator takes [u units]
 * @param commandMax              the highest command the actuator takes, above commandMin [u units]
 * @param outputBias              y0, the measured position at the operating point, subtracted before the law
 * @param commandBias             u0, the command at the operating point, added after the law [u units]
 * @param periodToleranceFraction the measured task period is flagged when |Tm - T| &gt; tolerance T (0 &lt; tol &lt; 1)
 * @param prefix                  the name prefix of the block, C functions and macros ({@link #prefixProblem})
 * @param singlePrecision         REAL/float arithmetic instead of LREAL/double
 */
public record ControllerOptions(
        double samplePeriod,
        double commandMin,
        double commandMax,
        double outputBias,
        double commandBias,
        double periodToleranceFraction,
        String prefix,
        boolean singlePrecision) {

    /** The prefix when the caller names none. */
    public static final String DEFAULT_PREFIX = BlockPrefix.DEFAULT.value();
    /** Longest prefix. */
    public static final int MAX_PREFIX_LENGTH = BlockPrefix.MAX_LENGTH;
    /** The period tolerance when the caller states none (a fraction of T). */
    public static final double DEFAULT_PERIOD_TOLERANCE = ControllerSettings.DEFAULT_PERIOD_TOLERANCE;

    /** Why a prefix cannot name a block, function and macros in both IEC 61131-3 and C; empty when it can. */
    public static Optional<String> prefixProblem(String prefix) {
        try {
            new BlockPrefix(prefix);
            return Optional.empty();
        } catch (IllegalArgumentException e) {
            return Optional.of(e.getMessage());
        }
    }
}
