package com.loopwright.api.verification;

/** Optional performance output z = [rho1 x1, rho2 x2, u] and the gamma to check the disturbance gain against. */
public record PerformanceInput(Double rho1, Double rho2, Double gamma) {}
