package com.loopwright.api.loop;

/**
 * How the unmeasured states are estimated (nullable until validated).
 *
 * @param method           "kalman" (steady-state Kalman filter) or "poleMultiple"
 * @param processNoise     kalman: white-noise intensity q at the disturbance input [w^2 s]
 * @param measurementNoise kalman: white-noise intensity v of the position measurement [y^2 s]; instead of
 *                         sensorResolution and samplePeriod
 * @param sensorResolution kalman: the sensor's resolution Delta [y units]; with samplePeriod, v = Delta^2 / 12 T
 * @param samplePeriod     kalman: the period T [s] the sensor is read at
 * @param multiple         poleMultiple: the observer poles at this multiple of the controller poles
 */
public record ObserverInput(
        String method,
        Double processNoise,
        Double measurementNoise,
        Double sensorResolution,
        Double samplePeriod,
        Double multiple) {}
