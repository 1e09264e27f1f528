package com.loopwright.solver.pipeline;

import com.loopwright.solver.cancel.ComputationCancelledException;
import com.loopwright.solver.design.ClosedFormDesign;
import com.loopwright.solver.design.ClosedFormDesigner;
import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.design.GammaChoice;
import com.loopwright.solver.design.Infeasibility;
import com.loopwright.solver.design.InfeasibleDesignException;
import com.loopwright.solver.design.SpecProposal;
import com.loopwright.solver.design.SpecQuantity;
import com.loopwright.solver.design.StepMetrics;
import com.loopwright.solver.loop.LoopMatrices;
import com.loopwright.solver.norm.HInfinityNormCalculator;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.robustness.AcceptanceLimits;
import com.loopwright.solver.robustness.ParameterBox;
import com.loopwright.solver.robustness.ParameterSampler;
import com.loopwright.solver.robustness.RobustTargetSearch;
import com.loopwright.solver.robustness.UncertainCase;
import com.loopwright.solver.robustness.UncertaintyAnalyzer;
import com.loopwright.solver.robustness.UncertaintyReport;
import com.loopwright.solver.simulation.TwoStateStepMetrics;
import com.loopwright.solver.spec.DesignSpec;
import com.loopwright.solver.spec.NormalizedRiseTime;
import com.loopwright.solver.spec.NormalizedSettlingTime;
import com.loopwright.solver.spec.SpecInversion;
import com.loopwright.solver.spec.SpecInverter;
import com.loopwright.solver.spec.TargetDynamics;
import com.loopwright.solver.spec.TimeSpec;
import com.loopwright.solver.verify.VerificationFailedException;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.ejml.data.DMatrixRMaj;

/**
 * The front door of the robust design: the nominal target whose gains meet the spec on every corner and seeded
 * Monte Carlo sample of a parameter box ({@link RobustTargetSearch}, rule: least bandwidth), its closed-form design
 * verified as any design, the gains over the box, and each corner's certified H-infinity norm. Every failure is a
 * {@link SolverFailure}; a box no target meets is INFEASIBLE_SPEC with the best spec the box allows. Stateless and
 * thread-safe. The loop with integral action or an observer has no closed form over the box: {@link #designLoop}
 * judges it by simulation ({@link RobustLoopSearch}).
 */
public final class RobustDesignPipeline {

    /** A proposed time or overshoot is rounded up by this fraction so that the search meets it when sent. */
    static final double PROPOSAL_ROOM = 1e-3;

    private final SpecInverter inverter = new SpecInverter();
    private final ClosedFormDesigner designer = new ClosedFormDesigner();
    private final LoopDesigner loops = new LoopDesigner();
    private final UncertaintyAnalyzer analyzer = new UncertaintyAnalyzer();
    private final HInfinityNormCalculator norms = new HInfinityNormCalculator();
    private final RealLoopPipeline realLoops = new RealLoopPipeline();

    /** Monte Carlo samples of a robust design of the loop with integral action or an observer (each simulated). */
    public static final int MAX_LOOP_SAMPLES = 200;

    /**
     * @param box           the parameter box (the nominal plant need not be a corner)
     * @param samples       Monte Carlo samples, 0 to {@value UncertaintyAnalyzer#MAX_SAMPLES}
     * @param actuatorLimit bound on max |u| of every case, or null
     * @throws SolverFailure INFEASIBLE_SPEC with the best spec the box allows, or UNVERIFIABLE
     */
    public RobustDesignReport design(
            CanonicalPlant plant,
            DesignSpec spec,
            GammaChoice gammaChoice,
            double stepSize,
            double bandFraction,
            ParameterBox box,
            int samples,
            long seed,
            Double actuatorLimit) {
        return design(plant, spec, gammaChoice, stepSize, bandFraction, box, samples, seed, actuatorLimit, null);
    }

    /**
     * As {@link #design}, with every case judged by the sampled law the exports emit at {@code samplePeriod} when it
     * is given ({@link SampledLawJudge}, searched by {@link SimulatedTargetSearch}; samples 0 to
     * {@value #MAX_LOOP_SAMPLES}). The corner norms stay those of the continuous loop.
     *
     * @param samplePeriod T [s], or null to judge in continuous time
     * @throws SolverFailure as {@link #design}, and SAMPLED_LAW_INFEASIBLE about
     *     {@link SolverFailure#ROBUST_SAMPLE_PERIOD} when the period cannot work for the spec or cannot be simulated
     */
    public RobustDesignReport design(
            CanonicalPlant plant,
            DesignSpec spec,
            GammaChoice gammaChoice,
            double stepSize,
            double bandFraction,
            ParameterBox box,
            int samples,
            long seed,
            Double actuatorLimit,
            Double samplePeriod) {
        if (samplePeriod != null) {
            return designSampledLaw(
                    plant, spec, gammaChoice, stepSize, bandFraction, box, samples, seed, actuatorLimit, samplePeriod);
        }
        AcceptanceLimits limits = limits(spec, bandFraction);
        TargetDynamics requested = inverter.invert(spec).target();
        RobustTargetSearch.Outcome outcome;
        try {
            outcome = new RobustTargetSearch(plant, box, samples, seed, limits, actuatorLimit, stepSize)
                    .search(requested, target -> designable(plant, target, gammaChoice));
        } catch (ComputationCancelledException e) {
            throw e;
        } catch (RobustTargetSearch.SearchCapException e) {
            throw SolverFailure.about(
                    SolverFailure.Kind.CAP_EXCEEDED, SolverFailure.ROBUST_SEARCH, -1, e.getMessage(), e);
        } catch (RuntimeException e) {
            throw SolverFailure.of(SolverFailure.Kind.CHECK_NOT_COMPUTABLE, e.getMessage(), e);
        }
        if (outcome.target() == null) {
            throw SolverFailure.infeasible(infeasibility(limits, actuatorLimit, outcome), null);
        }
        TargetDynamics target = outcome.target();
        DesignReport report = verifiedAt(plant, spec, target, gammaChoice, stepSize, bandFraction);
        ClosedFormDesign design = report.design();
        FeedbackGains gains = new FeedbackGains(design.positionGain(), design.velocityGain(), design.referenceGain());
        DMatrixRMaj output = new DMatrixRMaj(
                new double[][] {{design.rho1(), 0}, {0, design.rho2()}, {-gains.positionGain(), -gains.velocityGain()}
                });
        UncertaintyReport uncertainty = analyzer.analyze(box, gains, stepSize, limits, output, samples, seed);
        List<RobustDesignReport.CornerNorm> corners = new ArrayList<>();
        for (UncertainCase corner : uncertainty.cases()) {
            double norm = cornerNorm(corner.plant(), gains, output);
            corners.add(new RobustDesignReport.CornerNorm(corner.plant(), corner, norm, norm <= design.gamma()));
        }
        RobustDesignReport partial =
                new RobustDesignReport(report, requested, limits, actuatorLimit, outcome, uncertainty, corners, null);
        CanonicalPlant worstAt = partial.binding().at();
        StepMetrics worst =
                worstAt == null ? null : TwoStateStepMetrics.measure(worstAt, gains, stepSize, bandFraction);
        return new RobustDesignReport(report, requested, limits, actuatorLimit, outcome, uncertainty, corners, worst);
    }

    /**
     * The robust design of the loop with integral action and/or position-only sensing ({@link RobustLoopSearch}:
     * every case simulated, the law and observer designed for the nominal plant), then that loop designed as
     * {@link RealLoopPipeline} designs it, at the chosen target, and judged over every corner and sample. The design
     * report is the two-state design of the same target (the response's gains section).
     *
     * @param samples Monte Carlo samples, 0 to {@value #MAX_LOOP_SAMPLES}
     * @throws SolverFailure as {@link #design} and {@link RealLoopPipeline#design}
     */
    public RobustDesignReport designLoop(
            CanonicalPlant plant,
            DesignSpec spec,
            GammaChoice gammaChoice,
            LoopStructure structure,
            double loadStepSize,
            double stepSize,
            double bandFraction,
            ParameterBox box,
            int samples,
            long seed,
            Double actuatorLimit) {
        return designLoop(
                plant,
                spec,
                gammaChoice,
                structure,
                loadStepSize,
                stepSize,
                bandFraction,
                box,
                samples,
                seed,
                actuatorLimit,
                null);
    }

    /**
     * As {@link #designLoop}, with every case judged by the discrete controller the loop exports emit at
     * {@code samplePeriod} on the zero-order-hold perturbed plant when it is given ({@link SampledLoopJudge}). The
     * corner norms stay those of the continuous loop.
     *
     * @param samplePeriod T [s], or null to judge in continuous time
     * @throws SolverFailure as {@link #designLoop}, and SAMPLED_LAW_INFEASIBLE about
     *     {@link SolverFailure#ROBUST_SAMPLE_PERIOD} when the period cannot work for the spec or cannot be simulated
     */
    public RobustDesignReport designLoop(
            CanonicalPlant plant,
            DesignSpec spec,
            GammaChoice gammaChoice,
            LoopStructure structure,
            double loadStepSize,
            double stepSize,
            double bandFraction,
            ParameterBox box,
            int samples,
            long seed,
            Double actuatorLimit,
            Double samplePeriod) {
        if (samples < 0 || samples > MAX_LOOP_SAMPLES) {
            throw new IllegalArgumentException("samples must be 0 to " + MAX_LOOP_SAMPLES);
        }
        if (!(spec.timeSpec() instanceof TimeSpec.SettlingTime)) {
            throw new IllegalArgumentException("this loop is designed from a settling-time spec");
        }
        RealLoopPipeline.Request request =
                RealLoopPipeline.Request.canonical(plant, spec, gammaChoice, structure, loadStepSize);
        AcceptanceLimits limits =
                new AcceptanceLimits(spec.timeSpec().seconds(), null, 100 * spec.overshootFraction(), bandFraction);
        TargetDynamics requested = inverter.invert(spec).target();
        RobustLoopSearch<CanonicalPlant> search = RobustLoopSearch.canonical(
                realLoops, request, plant, box, samples, seed, limits, actuatorLimit, stepSize);
        SampledLoopJudge sampledJudge = null;
        RobustTargetSearch.Outcome outcome;
        if (samplePeriod == null) {
            outcome = searched(() -> search.search(requested));
            if (outcome.target() == null) {
                throw SolverFailure.infeasible(infeasibility(limits, actuatorLimit, outcome), null);
            }
        } else {
            SampledRobustRules.requireReachable(requested, samplePeriod, limits);
            SampledLoopJudge judge = new SampledLoopJudge(
                    search,
                    plant,
                    samplePeriod,
                    stepSize,
                    limits,
                    structure.measurement() == LoopStructure.Measurement.POSITION);
            sampledJudge = judge;
            outcome = searched(() -> new SimulatedTargetSearch<>(
                            judge,
                            search.corners().size(),
                            search.everyCase().size(),
                            limits,
                            actuatorLimit,
                            SampledLawJudge.frequencyCeiling(samplePeriod),
                            Double.NaN)
                    .search(requested));
            if (outcome.target() == null) {
                throw SampledRobustRules.sampledInfeasible(limits, actuatorLimit, outcome, samplePeriod);
            }
        }
        TargetDynamics target = outcome.target();
        RealLoopReport loop = realLoops.designAt(request, target);
        DesignReport report = verifiedAt(plant, spec, target, gammaChoice, stepSize, bandFraction);
        RealLoopPipeline.LoopParts parts = realLoops.partsAt(request, target);
        SampledLoopJudge.Design sampledDesign = sampledJudge == null ? null : sampledJudge.designAt(target);
        if (sampledJudge != null && sampledDesign == null) {
            throw SolverFailure.of(
                    SolverFailure.Kind.UNVERIFIABLE, "the chosen target's sampled controller could not be built", null);
        }
        List<UncertainCase> corners = new ArrayList<>();
        List<UncertainCase> all = new ArrayList<>();
        List<CanonicalPlant> cases = search.everyCase();
        try {
            for (int i = 0; i < cases.size(); i++) {
                boolean corner = i < search.corners().size();
                UncertainCase judged = sampledJudge == null
                        ? judged(search, parts, cases.get(i), corner)
                        : sampledJudge.judged(sampledDesign, cases.get(i), corner);
                (judged.corner() ? corners : all).add(judged);
            }
        } catch (SamplePeriodException e) {
            throw SampledRobustRules.samplePeriodFailure(e.getMessage(), e);
        }
        all.addAll(0, corners);
        UncertaintyReport uncertainty = analyzer.summarize(corners, all, samples, seed, limits);
        double gamma = loop.design().gamma();
        List<RobustDesignReport.CornerNorm> norms = new ArrayList<>();
        for (UncertainCase corner : corners) {
            if (corner.disturbanceGain() == null) {
                throw SolverFailure.of(
                        SolverFailure.Kind.UNVERIFIABLE, "a corner's norm from w to z could not be computed", null);
            }
            double norm = corner.disturbanceGain();
            norms.add(new RobustDesignReport.CornerNorm(corner.plant(), corner, norm, norm <= gamma));
        }
        RobustDesignReport partial = new RobustDesignReport(
                report, requested, limits, actuatorLimit, outcome, uncertainty, norms, null, loop);
        CanonicalPlant worstAt = partial.binding().at();
        if (sampledJudge == null) {
            StepMetrics worst = worstAt == null ? null : search.metrics(parts, worstAt);
            return new RobustDesignReport(
                    report, requested, limits, actuatorLimit, outcome, uncertainty, norms, worst, loop);
        }
        SampledLoopJudge.Design chosen = sampledDesign;
        SampledLoopJudge judge = sampledJudge;
        StepMetrics worst =
                worstAt == null ? null : SampledRobustRules.sampledMetrics(() -> judge.metrics(chosen, worstAt));
        StepMetrics nominalSampled = SampledRobustRules.requireNominal(
                SampledRobustRules.sampledMetrics(() -> judge.metrics(chosen, plant)));
        return new RobustDesignReport(
                report,
                requested,
                limits,
                actuatorLimit,
                outcome,
                uncertainty,
                norms,
                worst,
                loop,
                new RobustDesignReport.SampledJudging(samplePeriod, nominalSampled));
    }

    /**
     * One case judged for the report: its step metrics and, at a corner, the norm from w to z of the perturbed loop
     * (the disturbance column is [0, d]: the norm scales with |d| / |d_nominal|, so it is computed with the nominal
     * d and scaled).
     */
    private static UncertainCase judged(
            RobustLoopSearch<CanonicalPlant> search,
            RealLoopPipeline.LoopParts parts,
            CanonicalPlant plant,
            boolean corner) {
        StepMetrics m = search.metrics(parts, plant);
        Double gain = null;
        if (corner && m != null) {
            gain = search.cornerNorm(parts, plant);
        }
        if (m == null) {
            return new UncertainCase(plant, corner, false, null, null, null, null, gain, false);
        }
        return new UncertainCase(
                plant,
                corner,
                true,
                m.settlingTimeSeconds(),
                m.riseTimeSeconds(),
                m.overshootPercent(),
                m.peakControl(),
                gain,
                search.limits().met(m.settlingTimeSeconds(), m.riseTimeSeconds(), m.overshootPercent()));
    }

    /**
     * The robust design of the full-state law run sampled: {@link SampledLawJudge} in {@link SimulatedTargetSearch}
     * (frequency ceiling wn T &lt;= 0.5), the chosen target designed and verified as any design, every case judged
     * again with the designed gains, the corner norms of the continuous loop.
     */
    private RobustDesignReport designSampledLaw(
            CanonicalPlant plant,
            DesignSpec spec,
            GammaChoice gammaChoice,
            double stepSize,
            double bandFraction,
            ParameterBox box,
            int samples,
            long seed,
            Double actuatorLimit,
            double samplePeriod) {
        if (samples < 0 || samples > MAX_LOOP_SAMPLES) {
            throw new IllegalArgumentException("samples must be 0 to " + MAX_LOOP_SAMPLES);
        }
        AcceptanceLimits limits = limits(spec, bandFraction);
        TargetDynamics requested = inverter.invert(spec).target();
        SampledRobustRules.requireReachable(requested, samplePeriod, limits);
        List<CanonicalPlant> cornerPlants = box.corners();
        List<CanonicalPlant> cases = new ArrayList<>(cornerPlants);
        ParameterSampler sampler = new ParameterSampler(box, seed);
        for (int s = 0; s < samples; s++) {
            cases.add(ParameterBox.plant(sampler.next()));
        }
        SampledLawJudge judge = new SampledLawJudge(
                plant, cases, samplePeriod, stepSize, bandFraction, t -> designable(plant, t, gammaChoice));
        // the continuous robust design's damping ratio (refined on a finer grid, closed form: milliseconds) is tried
        // after the coarse grid's: where sampling changes little, the sampled search finds that target's neighbour
        double continuousDamping =
                continuousDamping(plant, requested, box, samples, seed, limits, actuatorLimit, stepSize, gammaChoice);
        RobustTargetSearch.Outcome outcome = searched(() -> new SimulatedTargetSearch<>(
                        judge,
                        cornerPlants.size(),
                        cases.size(),
                        limits,
                        actuatorLimit,
                        SampledLawJudge.frequencyCeiling(samplePeriod),
                        continuousDamping)
                .search(requested));
        if (outcome.target() == null) {
            throw SampledRobustRules.sampledInfeasible(limits, actuatorLimit, outcome, samplePeriod);
        }
        TargetDynamics target = outcome.target();
        DesignReport report = verifiedAt(plant, spec, target, gammaChoice, stepSize, bandFraction);
        ClosedFormDesign design = report.design();
        // the exported law's gains: those of the verified design
        FeedbackGains gains = new FeedbackGains(design.positionGain(), design.velocityGain(), design.referenceGain());
        DMatrixRMaj output = new DMatrixRMaj(
                new double[][] {{design.rho1(), 0}, {0, design.rho2()}, {-gains.positionGain(), -gains.velocityGain()}
                });
        List<UncertainCase> corners = new ArrayList<>();
        List<UncertainCase> all = new ArrayList<>();
        for (int i = 0; i < cases.size(); i++) {
            boolean corner = i < cornerPlants.size();
            CanonicalPlant casePlant = cases.get(i);
            UncertainCase judged = SampledRobustRules.sampledCase(() -> judge.judged(gains, casePlant, corner, limits));
            (corner ? corners : all).add(judged);
        }
        all.addAll(0, corners);
        UncertaintyReport uncertainty = analyzer.summarize(corners, all, samples, seed, limits);
        List<RobustDesignReport.CornerNorm> norms = new ArrayList<>();
        for (UncertainCase corner : corners) {
            double norm = cornerNorm(corner.plant(), gains, output);
            norms.add(new RobustDesignReport.CornerNorm(corner.plant(), corner, norm, norm <= design.gamma()));
        }
        RobustDesignReport partial =
                new RobustDesignReport(report, requested, limits, actuatorLimit, outcome, uncertainty, norms, null);
        CanonicalPlant worstAt = partial.binding().at();
        StepMetrics worst =
                worstAt == null ? null : SampledRobustRules.sampledMetrics(() -> judge.metrics(gains, worstAt));
        StepMetrics nominalSampled =
                SampledRobustRules.requireNominal(SampledRobustRules.sampledMetrics(() -> judge.metrics(gains, plant)));
        return new RobustDesignReport(
                report,
                requested,
                limits,
                actuatorLimit,
                outcome,
                uncertainty,
                norms,
                worst,
                null,
                new RobustDesignReport.SampledJudging(samplePeriod, nominalSampled));
    }

    /** The damping ratio of the continuous robust search's target, or NaN when it finds none or fails. */
    private double continuousDamping(
            CanonicalPlant plant,
            TargetDynamics requested,
            ParameterBox box,
            int samples,
            long seed,
            AcceptanceLimits limits,
            Double actuatorLimit,
            double stepSize,
            GammaChoice gammaChoice) {
        try {
            RobustTargetSearch.Outcome continuous = new RobustTargetSearch(
                            plant, box, samples, seed, limits, actuatorLimit, stepSize)
                    .search(requested, target -> designable(plant, target, gammaChoice));
            return continuous.target() == null
                    ? Double.NaN
                    : continuous.target().dampingRatio();
        } catch (RobustTargetSearch.SearchCapException e) {
            return Double.NaN;
        }
    }

    /** A search run with its failures as {@link SolverFailure}s. */
    private static RobustTargetSearch.Outcome searched(java.util.function.Supplier<RobustTargetSearch.Outcome> run) {
        try {
            return run.get();
        } catch (ComputationCancelledException e) {
            throw e;
        } catch (SamplePeriodException e) {
            throw SampledRobustRules.samplePeriodFailure(e.getMessage(), e);
        } catch (RobustTargetSearch.SearchCapException e) {
            throw SolverFailure.about(
                    SolverFailure.Kind.CAP_EXCEEDED, SolverFailure.ROBUST_SEARCH, -1, e.getMessage(), e);
        } catch (SolverFailure e) {
            throw e;
        } catch (RuntimeException e) {
            throw SolverFailure.of(SolverFailure.Kind.CHECK_NOT_COMPUTABLE, e.getMessage(), e);
        }
    }

    /** The spec as sent, not widened: the limits every case of a robust design must meet. */
    private static AcceptanceLimits limits(DesignSpec spec, double bandFraction) {
        TimeSpec timeSpec = spec.timeSpec();
        return new AcceptanceLimits(
                timeSpec instanceof TimeSpec.SettlingTime ? timeSpec.seconds() : null,
                timeSpec instanceof TimeSpec.RiseTime ? timeSpec.seconds() : null,
                100 * spec.overshootFraction(),
                bandFraction);
    }

    /** The closed-form design of the chosen target, verified as any design (its failures as SolverFailures). */
    private DesignReport verifiedAt(
            CanonicalPlant plant,
            DesignSpec spec,
            TargetDynamics target,
            GammaChoice gammaChoice,
            double stepSize,
            double bandFraction) {
        try {
            return loops.designed(
                    plant,
                    spec,
                    new SpecInversion(target, handbook(target, spec.timeSpec(), bandFraction), 0),
                    gammaChoice,
                    stepSize,
                    bandFraction);
        } catch (InfeasibleDesignException e) {
            throw SolverFailure.infeasible(e.infeasibility(), e);
        } catch (VerificationFailedException e) {
            throw SolverFailure.of(SolverFailure.Kind.UNVERIFIABLE, e.getMessage(), e);
        }
    }

    /** The certified norm from w to z (the Hamiltonian test, as the design's own certificate); 0 when d = 0. */
    private double cornerNorm(CanonicalPlant corner, FeedbackGains gains, DMatrixRMaj output) {
        if (corner.d() == 0) {
            return 0;
        }
        if (!LoopMatrices.stable(corner, gains)) {
            throw SolverFailure.of(
                    SolverFailure.Kind.CHECK_NOT_COMPUTABLE, "a corner of the box is unstable with the gains", null);
        }
        return norms.compute(LoopMatrices.closedLoop(corner, gains), LoopMatrices.disturbanceInput(corner), output)
                .value();
    }

    private boolean designable(CanonicalPlant plant, TargetDynamics target, GammaChoice gammaChoice) {
        if (designer.obstacle(plant, target).isPresent()) {
            return false;
        }
        try {
            designer.design(plant, target, gammaChoice);
            return true;
        } catch (InfeasibleDesignException e) {
            return false;
        }
    }

    /** The handbook estimate for the target's own nominal time: ln(1/band)/(zeta ts) or 1.8/tr (common practice). */
    private static double handbook(TargetDynamics target, TimeSpec timeSpec, double bandFraction) {
        double zeta = target.dampingRatio();
        double wn = target.naturalFrequencyRadPerSec();
        if (timeSpec instanceof TimeSpec.RiseTime) {
            return 1.8 / (NormalizedRiseTime.of(zeta) / wn);
        }
        double settling = NormalizedSettlingTime.of(zeta, bandFraction) / wn;
        return Math.log(1 / bandFraction) / (zeta * settling);
    }

    static Infeasibility infeasibility(
            AcceptanceLimits limits, Double actuatorLimit, RobustTargetSearch.Outcome outcome) {
        String box = String.format(
                Locale.US,
                "no nominal target within a factor %.0f of the requested natural frequency meets the spec on all %d"
                        + " cases of the box (%d targets evaluated)",
                RobustTargetSearch.FREQUENCY_SPAN,
                outcome.caseCount(),
                outcome.evaluations());
        String limit = actuatorLimit == null
                ? ""
                : String.format(Locale.US, " with max |u| <= actuatorLimit %.6g", actuatorLimit);
        List<SpecProposal> proposals = new ArrayList<>();
        if (outcome.proposedTimeSeconds() != null) {
            double time = outcome.proposedTimeSeconds() * (1 + PROPOSAL_ROOM);
            proposals.add(new SpecProposal(
                    SpecQuantity.TIME_SPEC,
                    time,
                    String.format(
                            Locale.US,
                            "the shortest %s every case of the box meets%s, overshoot kept",
                            limits.riseTimeSeconds() != null ? "rise time" : "settling time",
                            limit)));
            return new Infeasibility(SpecQuantity.TIME_SPEC, box + limit, proposals);
        }
        if (outcome.proposedOvershootPercent() != null) {
            proposals.add(new SpecProposal(
                    SpecQuantity.OVERSHOOT_PERCENT,
                    outcome.proposedOvershootPercent() * (1 + PROPOSAL_ROOM),
                    "the smallest worst-case overshoot over the box" + limit
                            + "; the time spec may need loosening too"));
        }
        return new Infeasibility(SpecQuantity.OVERSHOOT_PERCENT, box + limit, proposals);
    }
}
