/**
 * The closed loop of the canonical second-order plant under a state-feedback law u = kr r - (k1 x1 + k2 x2): the
 * loop matrices (A, B1, B2, A_cl), stability, final value and the simulated horizon. A package of its
 * own rather than {@code plant/}, which keeps the open-loop plant and its physical forms free of any controller;
 * simulation, robustness checks and frequency analysis all read the loop from here. The gains
 * themselves are a result record ({@code design.FeedbackGains}).
 *
 * <p>Invariant: every closed-loop quantity (c0 = a0 + b k1, c1 = a1 + b k2, A_cl = A - B2 K) is formed in one
 * place, so every check sees the same loop bit for bit.
 */
package com.loopwright.solver.loop;
