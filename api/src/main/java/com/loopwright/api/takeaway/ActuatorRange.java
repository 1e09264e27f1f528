package com.loopwright.api.takeaway;

/**
 * The command range of an actuator that is not symmetric about 0 (a valve 0..100 %, a 4..20 mA loop).
 *
 * @param lowest  the lowest command the actuator takes [u units]
 * @param highest the highest command, above lowest [u units]
 */
public record ActuatorRange(Double lowest, Double highest) {}
