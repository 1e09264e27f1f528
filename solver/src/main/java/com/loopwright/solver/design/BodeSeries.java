package com.loopwright.solver.design;

/**
 * Samples of L(j w) on a logarithmic frequency grid.
 *
 * @param angularFrequencyRadPerSec strictly increasing grid [rad/s]
 * @param magnitudeDecibels          20 log10 |L(j w)| [dB]
 * @param phaseDegrees               arg L(j w) [deg], unwrapped along the grid (continuous)
 */
public record BodeSeries(double[] angularFrequencyRadPerSec, double[] magnitudeDecibels, double[] phaseDegrees) {

    public BodeSeries {
        if (angularFrequencyRadPerSec.length != magnitudeDecibels.length
                || angularFrequencyRadPerSec.length != phaseDegrees.length) {
            throw new IllegalArgumentException("series must have equal lengths");
        }
        angularFrequencyRadPerSec = angularFrequencyRadPerSec.clone();
        magnitudeDecibels = magnitudeDecibels.clone();
        phaseDegrees = phaseDegrees.clone();
    }

    @Override
    public double[] angularFrequencyRadPerSec() {
        return angularFrequencyRadPerSec.clone();
    }

    @Override
    public double[] magnitudeDecibels() {
        return magnitudeDecibels.clone();
    }

    @Override
    public double[] phaseDegrees() {
        return phaseDegrees.clone();
    }

    public int size() {
        return angularFrequencyRadPerSec.length;
    }
}
