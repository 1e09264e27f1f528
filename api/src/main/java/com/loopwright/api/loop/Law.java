package com.loopwright.api.loop;

import com.fasterxml.jackson.annotation.JsonInclude;
import com.loopwright.api.result.Pole;
import java.util.List;

/**
 * The law that runs: u = kr r + ki xi - K x, with xi' = r - y the integral of the tracking error (ki and xi only with
 * integral action) and x the plant state (measured, or estimated by the observer). With integral action
 * kr = ki / (-p_i): the feedforward's zero cancels the integral pole p_i, so r -> y is the second-order response
 * of the specs.
 *
 * @param law                          the law as a formula
 * @param coordinates                  the coordinates of k
 * @param k                            K, one entry per plant state (the name of gain.k)
 * @param integralGain                 ki (integral action only)
 * @param referenceGain                kr, the feedforward of the reference
 * @param integralPole                 p_i [1/s], negative (integral action only)
 * @param gammaMin                     the least feasible gamma of the design that runs (augmented with integral
 *                                     action)
 * @param gamma                        its gamma
 * @param weights                      its performance weights rho_1 .. rho_m of z = [rho_1 z_1, ..., u]
 * @param closedLoopPoles              the designed poles of the state-feedback loop
 * @param peakDisturbanceGain          the state-feedback loop's peak gain from w to z (its H-infinity norm)
 * @param peakDisturbanceGainFrequency where it peaks [rad/s]
 * @param certified                    peakDisturbanceGain &lt;= gamma: the certificate of the state-feedback loop
 * @param step                         the state-feedback loop's unit reference step
 * @param margins                      margins at the plant input of the state-feedback loop
 */
@JsonInclude(JsonInclude.Include.NON_NULL)
public record Law(
        String law,
        String coordinates,
        List<Double> k,
        Double integralGain,
        double referenceGain,
        Double integralPole,
        double gammaMin,
        double gamma,
        List<Double> weights,
        List<Pole> closedLoopPoles,
        double peakDisturbanceGain,
        double peakDisturbanceGainFrequency,
        boolean certified,
        LoopStep step,
        InputMargins margins) {

    public Law {
        k = List.copyOf(k);
        weights = List.copyOf(weights);
        closedLoopPoles = List.copyOf(closedLoopPoles);
    }
}
