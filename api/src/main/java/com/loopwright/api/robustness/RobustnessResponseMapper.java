package com.loopwright.api.robustness;

import com.loopwright.solver.design.DenseTrajectory;
import com.loopwright.solver.design.DisturbanceResponse;
import com.loopwright.solver.design.GridMetrics;
import com.loopwright.solver.design.LoopMargins;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.plant.DisturbanceProfile;
import com.loopwright.solver.robustness.AcceptanceLimits;
import com.loopwright.solver.robustness.DelayReport;
import com.loopwright.solver.robustness.DisturbanceCheck;
import com.loopwright.solver.robustness.MetricSummary;
import com.loopwright.solver.robustness.RobustnessReport;
import com.loopwright.solver.robustness.SampledReport;
import com.loopwright.solver.robustness.SaturationReport;
import com.loopwright.solver.robustness.UncertainCase;
import com.loopwright.solver.robustness.UncertaintyReport;
import com.loopwright.solver.robustness.Verdict;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/** Solver robustness results to the wire records, with one pass/fail check per judged section. */
public final class RobustnessResponseMapper {

    /** The methods behind the numbers, stated once per response. */
    static final List<String> METHODS = List.of(
            "Nominal and uncertainty step metrics: exact zero-order-hold simulation refined between samples by root"
                    + " finding.",
            "Saturated step: exact hold of the linear or saturated mode between switching instants, located by"
                    + " bisection inside a 20000-step grid; metrics interpolated on the grid.",
            "Sampled and delayed steps: the plant's exact hold over each piece of constant input (the delay is"
                    + " split exactly inside the sample interval), observed between samples.",
            "Disturbances: w held constant on a 20000-step grid; energies of z and x1 exact for the held signal"
                    + " (Van Loan), integralAbsoluteError by the trapezoid rule; recovery to 2% of the peak"
                    + " deviation, at grid resolution.",
            "Margins in closed form for the loop broken at the plant input; peak sensitivity on a log grid refined"
                    + " by golden section.");

    public RobustnessResponse toResponse(
            RobustnessReport report,
            AcceptanceLimits limits,
            double tolerancePercent,
            double stepSize,
            String performanceOutput,
            Double gamma,
            int seriesPoints) {
        List<RobustnessResponse.Check> checks = new ArrayList<>();
        verdict(
                checks,
                "nominal",
                wire(report.nominalMeetsSpec()),
                "nominal continuous loop against the acceptance limits");
        UncertaintyReport u = report.uncertainty();
        RobustnessResponse.Uncertainty uncertainty = null;
        if (u != null) {
            uncertainty = new RobustnessResponse.Uncertainty(
                    u.cornerCount(),
                    u.sampleCount(),
                    u.seed(),
                    u.unstableCount(),
                    u.meetingFraction(),
                    summary(u.settlingTime()),
                    summary(u.riseTime()),
                    summary(u.overshootPercent()),
                    summary(u.peakControl()),
                    summary(u.disturbanceGain()),
                    u.worstCase() == null ? null : caseView(u.worstCase()),
                    u.cases().stream().map(RobustnessResponseMapper::caseView).toList());
            if (u.meetingFraction() != null) {
                verdict(
                        checks,
                        "uncertainty",
                        u.meetingFraction() == 1.0,
                        String.format(
                                Locale.US,
                                "%.4g of %d parameter sets meet the limits, %d unstable",
                                u.meetingFraction(),
                                u.cornerCount() + u.sampleCount(),
                                u.unstableCount()));
            }
        }
        List<RobustnessResponse.DisturbanceResult> disturbances = new ArrayList<>();
        for (DisturbanceCheck c : report.disturbances()) {
            DisturbanceResponse r = c.response();
            disturbances.add(new RobustnessResponse.DisturbanceResult(
                    shape(c.profile()),
                    amplitude(c.profile()),
                    r.peakDeviation(),
                    r.integralAbsoluteError(),
                    r.integralSquaredError(),
                    r.recoverySeconds(),
                    r.peakControl(),
                    r.disturbanceEnergy(),
                    r.outputEnergy(),
                    r.observedGain(),
                    c.withinNorm(),
                    wire(c.withinGamma())));
        }
        if (!report.disturbances().isEmpty()) {
            boolean within = report.disturbances().stream()
                    .allMatch(c -> c.withinNorm() && !c.withinGamma().failed());
            verdict(
                    checks,
                    "disturbanceGain",
                    within,
                    "observed L2 gain w to z of every profile at most the" + " H-infinity norm"
                            + (gamma == null ? "" : " and gamma"));
        }
        RobustnessResponse.Saturation saturation = null;
        if (report.saturation() != null) {
            SaturationReport s = report.saturation();
            saturation = new RobustnessResponse.Saturation(
                    s.limit(),
                    s.unsaturatedPeakControl(),
                    s.saturates(),
                    s.largestUnsaturatedStep(),
                    s.diverged(),
                    s.metrics() == null ? null : metrics(s.metrics()),
                    wire(s.meetsSpec()));
            verdict(
                    checks,
                    "saturation",
                    wire(s.meetsSpec()),
                    s.saturates()
                            ? "the step saturates the actuator; saturated step against the limits"
                            : "the step stays within the actuator limit");
        }
        RobustnessResponse.Sampled sampled = null;
        if (report.sampled() != null) {
            SampledReport s = report.sampled();
            sampled = new RobustnessResponse.Sampled(
                    s.samplePeriod(),
                    s.spectralRadius(),
                    s.emulated() == null ? null : metrics(s.emulated()),
                    wire(s.emulatedMeetsSpec()),
                    s.directGains() == null
                            ? null
                            : new RobustnessResponse.GainView(
                                    s.directGains().positionGain(),
                                    s.directGains().velocityGain(),
                                    s.directGains().referenceGain()),
                    s.direct() == null ? null : metrics(s.direct()),
                    wire(s.directMeetsSpec()),
                    s.longestPeriodSeconds(),
                    s.longestPeriodIsLowerBound(),
                    s.searchEvaluations());
            verdict(
                    checks,
                    "sampledEmulated",
                    wire(s.emulatedMeetsSpec()),
                    "continuous gains run at the sample period");
            verdict(checks, "sampledDirect", wire(s.directMeetsSpec()), "direct discrete design at the sample period");
        }
        RobustnessResponse.Delay delay = null;
        if (report.delay() != null) {
            DelayReport d = report.delay();
            delay = new RobustnessResponse.Delay(
                    d.delaySeconds(),
                    d.samplePeriod(),
                    d.delayMarginSeconds(),
                    wire(d.withinMargin()),
                    d.diverges(),
                    d.metrics() == null ? null : metrics(d.metrics()),
                    wire(d.meetsSpec()));
            verdict(
                    checks,
                    "inputDelay",
                    d.meetsSpec() == Verdict.NOT_JUDGED
                            ? null
                            : d.meetsSpec() == Verdict.MET && !d.withinMargin().failed(),
                    "delayed step against the limits" + " and the delay below the delay margin");
        }
        LoopMargins m = report.margins();
        RobustnessResponse.Margins margins = new RobustnessResponse.Margins(
                m.crossoverRadPerSec(),
                m.phaseMarginDegrees(),
                m.delayMarginSeconds(),
                m.gainMargin(),
                m.gainMarginUnbounded(),
                m.gainReductionMargin(),
                m.peakSensitivity(),
                m.peakSensitivityRadPerSec(),
                m.bandwidthRadPerSec(),
                m.response().stream()
                        .map(p -> new RobustnessResponse.FrequencyPointView(
                                p.frequencyRadPerSec(),
                                p.loopGainDb(),
                                p.loopPhaseDegrees(),
                                p.sensitivityDb(),
                                p.closedLoopGainDb()))
                        .toList());
        List<RobustnessResponse.Series> series = new ArrayList<>();
        if (seriesPoints > 0) {
            add(series, "nominalStep", report.nominalTrajectory(), seriesPoints);
            if (report.saturation() != null) {
                add(series, "saturatedStep", report.saturation().trajectory(), seriesPoints);
            }
            if (report.sampled() != null) {
                add(series, "sampledStep", report.sampled().trajectory(), seriesPoints);
            }
            if (report.delay() != null && report.delay().trajectory() != null) {
                add(series, "delayedStep", report.delay().trajectory(), seriesPoints);
            }
            for (int i = 0; i < report.disturbances().size(); i++) {
                add(
                        series,
                        "disturbance" + i,
                        report.disturbances().get(i).response().trajectory(),
                        seriesPoints);
            }
        }
        double widen = 1 + tolerancePercent / 100;
        return new RobustnessResponse(
                new RobustnessResponse.Acceptance(
                        scale(limits.settlingTimeSeconds(), widen),
                        scale(limits.riseTimeSeconds(), widen),
                        scale(limits.overshootPercent(), widen),
                        100 * limits.bandFraction(),
                        tolerancePercent,
                        stepSize),
                new RobustnessResponse.Metrics(
                        report.nominal().riseTimeSeconds(),
                        report.nominal().settlingTimeSeconds(),
                        report.nominal().overshootPercent(),
                        report.nominal().peakControl()),
                wire(report.nominalMeetsSpec()),
                report.horizonSeconds(),
                new RobustnessResponse.Disturbance(performanceOutput, report.hinfNorm(), gamma),
                margins,
                uncertainty,
                disturbances,
                saturation,
                sampled,
                delay,
                checks,
                series,
                METHODS,
                RobustnessCautions.ALL);
    }

    /** A verdict on the wire: true, false, or absent (null) when not judged. */
    private static Boolean wire(Verdict verdict) {
        return verdict == Verdict.NOT_JUDGED ? null : verdict == Verdict.MET;
    }

    private static Double scale(Double value, double factor) {
        return value == null ? null : value * factor;
    }

    private static void verdict(List<RobustnessResponse.Check> checks, String name, Boolean passed, String detail) {
        if (passed != null) {
            checks.add(new RobustnessResponse.Check(name, passed, detail));
        }
    }

    private static void add(
            List<RobustnessResponse.Series> series, String name, DenseTrajectory trajectory, int points) {
        if (trajectory == null) {
            return;
        }
        DenseTrajectory d = trajectory.decimate(points);
        double[] t = d.timeSeconds();
        double[] x1 = d.x1();
        double[] x2 = d.x2();
        double[] u = d.control();
        double[] w = d.disturbance();
        List<RobustnessResponse.SeriesPoint> list = new ArrayList<>(t.length);
        for (int i = 0; i < t.length; i++) {
            list.add(new RobustnessResponse.SeriesPoint(t[i], x1[i], x2[i], u[i], w[i]));
        }
        series.add(new RobustnessResponse.Series(name, list));
    }

    private static RobustnessResponse.Metrics metrics(GridMetrics m) {
        return new RobustnessResponse.Metrics(
                m.riseTimeSeconds(), m.settlingTimeSeconds(), m.overshootPercent(), m.peakControl());
    }

    private static RobustnessResponse.PlantView plant(CanonicalPlant p) {
        return new RobustnessResponse.PlantView(p.a0(), p.a1(), p.b(), p.d());
    }

    private static RobustnessResponse.Summary summary(MetricSummary s) {
        return s == null
                ? null
                : new RobustnessResponse.Summary(s.min(), s.median(), s.max(), plant(s.worstAt()), s.count());
    }

    private static RobustnessResponse.CaseView caseView(UncertainCase c) {
        return new RobustnessResponse.CaseView(
                plant(c.plant()),
                c.stable(),
                c.settlingTimeSeconds(),
                c.riseTimeSeconds(),
                c.overshootPercent(),
                c.peakControl(),
                c.disturbanceGain(),
                c.meetsSpec());
    }

    private static String shape(DisturbanceProfile profile) {
        if (profile instanceof DisturbanceProfile.Step) {
            return "step";
        }
        if (profile instanceof DisturbanceProfile.Pulse) {
            return "pulse";
        }
        return profile instanceof DisturbanceProfile.Sinusoid ? "sinusoid" : "randomBounded";
    }

    private static double amplitude(DisturbanceProfile profile) {
        if (profile instanceof DisturbanceProfile.Step s) {
            return s.amplitude();
        }
        if (profile instanceof DisturbanceProfile.Pulse p) {
            return p.amplitude();
        }
        if (profile instanceof DisturbanceProfile.Sinusoid s) {
            return s.amplitude();
        }
        return ((DisturbanceProfile.BoundedRandom) profile).amplitude();
    }
}
