package com.loopwright.solver.discrete;

/**
 * The inputs of one closed-loop run, sample by sample: setpoint, load (added to the plant input, u units),
 * enable, gain scale and the measured task period.
 */
public record Scenario(
        String name,
        double[] setpoint,
        double[] load,
        boolean[] enable,
        double[] gainScale,
        double[] measuredPeriodSeconds) {

    /** Longest run in samples. */
    public static final int MAX_STEPS = 100_000;

    public Scenario {
        int n = setpoint.length;
        if (n < 1 || n > MAX_STEPS) {
            throw new IllegalArgumentException("steps must be in [1, " + MAX_STEPS + "]");
        }
        if (load.length != n || enable.length != n || gainScale.length != n || measuredPeriodSeconds.length != n) {
            throw new IllegalArgumentException("every schedule needs one entry per sample");
        }
        setpoint = setpoint.clone();
        load = load.clone();
        enable = enable.clone();
        gainScale = gainScale.clone();
        measuredPeriodSeconds = measuredPeriodSeconds.clone();
    }

    public int steps() {
        return setpoint.length;
    }

    @Override
    public double[] setpoint() {
        return setpoint.clone();
    }

    @Override
    public double[] load() {
        return load.clone();
    }

    @Override
    public boolean[] enable() {
        return enable.clone();
    }

    @Override
    public double[] gainScale() {
        return gainScale.clone();
    }

    @Override
    public double[] measuredPeriodSeconds() {
        return measuredPeriodSeconds.clone();
    }
}
