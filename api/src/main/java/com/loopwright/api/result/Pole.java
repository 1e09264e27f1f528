package com.loopwright.api.result;

/** A pole re + j im: re [1/s], im [rad/s]. */
public record Pole(double re, double im) {}
