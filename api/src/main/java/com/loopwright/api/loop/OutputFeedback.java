package com.loopwright.api.loop;

/**
 * What the observer costs, computed on the full output-feedback loop (plant + observer + law). None of it is covered
 * by the state-feedback certificate.
 *
 * @param peakDisturbanceGain          the full loop's peak gain from w to z (its H-infinity norm)
 * @param peakDisturbanceGainFrequency where it peaks [rad/s]
 * @param gamma                        the design's gamma, for comparison
 * @param exceedsGamma                 peakDisturbanceGain &gt; gamma
 * @param noiseToCommandGain           peak gain from measurement noise to the command u (its H-infinity norm), in u
 *                                     per unit of position
 * @param noiseToCommandGainFrequency  where it peaks [rad/s]
 * @param margins                      margins at the plant input of the full loop
 * @param step                         the full loop's unit reference step
 * @param specsMet                     that step meets the specs (settling within 0.5 %, overshoot within 0.02 points)
 * @param largestStepDifference        max over the samples of |y_full - y_stateFeedback| for the same unit step
 */
public record OutputFeedback(
        double peakDisturbanceGain,
        double peakDisturbanceGainFrequency,
        double gamma,
        boolean exceedsGamma,
        double noiseToCommandGain,
        double noiseToCommandGainFrequency,
        InputMargins margins,
        LoopStep step,
        boolean specsMet,
        double largestStepDifference) {}
