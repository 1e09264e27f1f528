package com.loopwright.solver.simulation;

/**
 * Receives the samples of a step response from {@link StepSimulator#stream} one at a time, in
 * order k = 0, 1, ..., samples - 1: the state x_k, the value and rate of a weighted output
 * signal z = w . x and of the control u = cControl x + dControl r.
 */
interface StepSampleSink {

    /**
     * Sample k.
     *
     * @param state x_k in state[0 .. n); it stays unchanged until the call for sample k + 1
     *     returns (so a sink may read x_k while it handles sample k + 1), then it is reused
     * @param outputValue z_k = 0 + sum_i w_i x_i
     * @param outputRate z'_k = 0 + sum_i w_i (bRef_i r + sum_j a_ij x_j)
     * @param controlValue u_k, exactly as in {@link StepResponse#control()}
     * @param controlRate u'_k = 0 + sum_i cControl_i (bRef_i r + sum_j a_ij x_j)
     */
    void accept(int k, double[] state, double outputValue, double outputRate, double controlValue, double controlRate);
}
