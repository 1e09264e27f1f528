package com.loopwright.api.loop;

import com.loopwright.solver.pipeline.ObserverChoice;

/** Documented ranges and defaults of the loop-structure fields (openapi.yaml states the same numbers). */
public final class LoopLimits {

    /** The integral pole at 4 x the dominant real part unless the caller says otherwise. */
    public static final double DEFAULT_INTEGRAL_POLE_MULTIPLE = 4;
    /** At least the dominant real part: a slower integral pole would make the load recovery the slowest mode. */
    public static final double MIN_INTEGRAL_POLE_MULTIPLE = 1;
    /** Beyond 20 x the integral gain dwarfs the state gains and the stiff loop is poorly conditioned. */
    public static final double MAX_INTEGRAL_POLE_MULTIPLE = 20;

    public static final double DEFAULT_OBSERVER_MULTIPLE = ObserverChoice.PoleMultiple.DEFAULT_MULTIPLE;
    public static final double MIN_OBSERVER_MULTIPLE = 1;
    public static final double MAX_OBSERVER_MULTIPLE = 50;

    /** Noise intensities (white-noise spectral densities) accepted by the Kalman observer. */
    public static final double MIN_NOISE_INTENSITY = 1e-30;

    public static final double MAX_NOISE_INTENSITY = 1e12;
    public static final double MIN_SENSOR_RESOLUTION = 1e-12;
    public static final double MAX_SENSOR_RESOLUTION = 1e6;
    public static final double MIN_SAMPLE_PERIOD = 1e-7;
    public static final double MAX_SAMPLE_PERIOD = 10;

    /** The load step of the recovery figures: one unit of w unless the caller says otherwise. */
    public static final double DEFAULT_LOAD_STEP = 1;

    public static final double MIN_ABS_LOAD_STEP = 1e-9;
    public static final double MAX_ABS_LOAD_STEP = 1e9;

    public static final String FULL_STATE = "fullState";
    public static final String POSITION = "position";
    public static final String KALMAN = "kalman";
    public static final String POLE_MULTIPLE = "poleMultiple";

    private LoopLimits() {}
}
