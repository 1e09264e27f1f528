/**
 * The loop broken at the plant input in the frequency domain: one analyzer ({@link
 * com.loopwright.solver.frequency.LoopFrequencyAnalyzer}) for Bode data of any rational loop and the closed-form
 * margins of the canonical second-order loop, reported in one margins record ({@link
 * com.loopwright.solver.design.LoopMargins}, with {@link com.loopwright.solver.design.FrequencyPoint}).
 *
 * <p>Invariant: phase and delay margins follow one rule over every gain crossover ({@link
 * com.loopwright.solver.frequency.CrossoverMargins}), so the Bode figure and the verification report the same numbers.
 */
package com.loopwright.solver.frequency;
