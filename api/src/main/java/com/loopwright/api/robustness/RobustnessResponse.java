package com.loopwright.api.robustness;

import com.fasterxml.jackson.annotation.JsonInclude;
import java.util.List;

/**
 * Robustness checks of one loop: the `robustness` member of a design response and the body of a successful
 * POST /v1/verifications. Units: seconds, rad/s, degrees, the caller's x1, u and w units. Members of checks that were
 * not requested are absent.
 */
@JsonInclude(JsonInclude.Include.NON_NULL)
public record RobustnessResponse(
        Acceptance acceptance,
        Metrics nominal,
        Boolean nominalMeetsSpec,
        double horizon,
        Disturbance disturbanceChannel,
        Margins margins,
        Uncertainty uncertainty,
        List<DisturbanceResult> disturbances,
        Saturation saturation,
        Sampled sampled,
        Delay delay,
        List<Check> checks,
        List<Series> timeSeries,
        List<String> methods,
        List<String> cautions) {

    public RobustnessResponse {
        disturbances = List.copyOf(disturbances);
        checks = List.copyOf(checks);
        timeSeries = List.copyOf(timeSeries);
        methods = List.copyOf(methods);
        cautions = List.copyOf(cautions);
    }

    /** The limits judged: the spec widened by tolerancePercent of each limit. */
    @JsonInclude(JsonInclude.Include.NON_NULL)
    public record Acceptance(
            Double settlingTime,
            Double riseTime,
            Double overshootPercent,
            double settlingBandPercent,
            double tolerancePercent,
            double stepSize) {}

    /** Step metrics; a time that is not reached within the horizon is absent. */
    @JsonInclude(JsonInclude.Include.NON_NULL)
    public record Metrics(Double riseTime, Double settlingTime, double overshootPercent, double peakControl) {}

    /**
     * @param performanceOutput what z is: "z = [rho1 x1, rho2 x2, u]" or "x1"
     * @param peakDisturbanceGain the peak over frequency of the gain from w to z of the nominal loop (its H-infinity norm)
     * @param gamma             the bound it is checked against, if known
     */
    @JsonInclude(JsonInclude.Include.NON_NULL)
    public record Disturbance(String performanceOutput, double peakDisturbanceGain, Double gamma) {}

    /**
     * Margins of the loop broken at the plant input. An unbounded gain margin is stated by gainMarginUnbounded
     * (always present); gainMargin is present only when it is bounded (JSON has no infinity).
     *
     * @param gainMargin          factor the loop gain may grow by before instability; absent when unbounded
     * @param gainMarginUnbounded true when no phase crossover of -180 deg with |L| &lt; 1 exists, so the gain can
     *                            grow without bound
     */
    @JsonInclude(JsonInclude.Include.NON_NULL)
    public record Margins(
            Double crossoverFrequency,
            Double phaseMargin,
            Double delayMargin,
            Double gainMargin,
            boolean gainMarginUnbounded,
            Double gainReductionMargin,
            double peakSensitivity,
            Double peakSensitivityFrequency,
            double bandwidth,
            List<FrequencyPointView> response) {
        public Margins {
            response = List.copyOf(response);
        }
    }

    public record FrequencyPointView(
            double frequency,
            double loopGainDb,
            double loopPhaseDegrees,
            double sensitivityDb,
            double closedLoopGainDb) {}

    public record PlantView(double a0, double a1, double b, double d) {}

    public record Summary(double min, double median, double max, PlantView worstAt, int count) {}

    @JsonInclude(JsonInclude.Include.NON_NULL)
    public record CaseView(
            PlantView plant,
            boolean stable,
            Double settlingTime,
            Double riseTime,
            Double overshootPercent,
            Double peakControl,
            Double disturbanceGain,
            boolean meetsSpec) {}

    @JsonInclude(JsonInclude.Include.NON_NULL)
    public record Uncertainty(
            int cornerCount,
            int monteCarloSamples,
            long seed,
            int unstableCount,
            Double meetingFraction,
            Summary settlingTime,
            Summary riseTime,
            Summary overshootPercent,
            Summary peakControl,
            Summary disturbanceGain,
            CaseView worstCase,
            List<CaseView> corners) {
        public Uncertainty {
            corners = List.copyOf(corners);
        }
    }

    @JsonInclude(JsonInclude.Include.NON_NULL)
    public record DisturbanceResult(
            String shape,
            double amplitude,
            double peakDeviation,
            double integralAbsoluteError,
            double integralSquaredError,
            Double recoveryTime,
            double peakControl,
            double disturbanceEnergy,
            double outputEnergy,
            double observedGain,
            boolean withinNorm,
            Boolean withinGamma) {}

    @JsonInclude(JsonInclude.Include.NON_NULL)
    public record Saturation(
            double limit,
            double unsaturatedPeakControl,
            boolean saturates,
            Double largestUnsaturatedStep,
            boolean diverged,
            Metrics metrics,
            Boolean meetsSpec) {}

    public record GainView(double k1, double k2, double referenceGain) {}

    @JsonInclude(JsonInclude.Include.NON_NULL)
    public record Sampled(
            double samplePeriod,
            double spectralRadius,
            Metrics emulated,
            Boolean emulatedMeetsSpec,
            GainView directGain,
            Metrics direct,
            Boolean directMeetsSpec,
            Double longestSamplePeriod,
            boolean longestIsLowerBound,
            int searchEvaluations) {}

    @JsonInclude(JsonInclude.Include.NON_NULL)
    public record Delay(
            double inputDelay,
            double samplePeriod,
            Double delayMargin,
            Boolean withinMargin,
            boolean diverged,
            Metrics metrics,
            Boolean meetsSpec) {}

    /** One pass/fail verdict against the acceptance limits. */
    public record Check(String check, boolean passed, String detail) {}

    public record Series(String name, List<SeriesPoint> points) {
        public Series {
            points = List.copyOf(points);
        }
    }

    public record SeriesPoint(double t, double x1, double x2, double u, double w) {}
}
