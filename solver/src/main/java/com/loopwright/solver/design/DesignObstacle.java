package com.loopwright.solver.design;

/**
 * Why a target (zeta, wn) admits no design.
 *
 * @param reason        the failing condition with its numbers, in engineering words
 * @param dampingBound  true when no natural frequency can cure it at this damping ratio, so the overshoot spec
 *                      must change; false when a faster (or slower) loop can
 */
public record DesignObstacle(String reason, boolean dampingBound) {}
