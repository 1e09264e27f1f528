package com.loopwright.solver.pipeline;

import com.loopwright.solver.design.GammaChoice;
import com.loopwright.solver.design.HInfinityNorm;
import com.loopwright.solver.design.HighOrderDesign;
import com.loopwright.solver.design.Infeasibility;
import com.loopwright.solver.design.InfeasibleDesignException;
import com.loopwright.solver.design.LoadStepResponse;
import com.loopwright.solver.design.ObserverDesign;
import com.loopwright.solver.design.OutputFeedbackFigures;
import com.loopwright.solver.design.PlantInputMargins;
import com.loopwright.solver.design.SpecProposal;
import com.loopwright.solver.design.SpecQuantity;
import com.loopwright.solver.design.StepMetrics;
import com.loopwright.solver.design.TrackingLaw;
import com.loopwright.solver.frequency.StateSpaceMargins;
import com.loopwright.solver.highorder.HighOrderDesigner;
import com.loopwright.solver.highorder.PoleMatchedRiccati;
import com.loopwright.solver.highorder.SpecMatcher;
import com.loopwright.solver.integral.IntegralAugmentation;
import com.loopwright.solver.integral.IntegralDesigner;
import com.loopwright.solver.integral.LoadStepSimulator;
import com.loopwright.solver.norm.HInfinityNormCalculator;
import com.loopwright.solver.norm.NormComputationException;
import com.loopwright.solver.norm.UnstableSystemException;
import com.loopwright.solver.observer.LoopSystem;
import com.loopwright.solver.observer.ObserverDesigner;
import com.loopwright.solver.observer.OpenLoopAtInput;
import com.loopwright.solver.observer.OutputFeedbackLoop;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.plant.CompanionPlant;
import com.loopwright.solver.riccati.NoStabilizingSolutionException;
import com.loopwright.solver.simulation.LinearLoop;
import com.loopwright.solver.simulation.StepResponse;
import com.loopwright.solver.simulation.StepResponseMetrics;
import com.loopwright.solver.simulation.StepSimulator;
import com.loopwright.solver.spec.AuxiliaryPlacement;
import com.loopwright.solver.spec.DesignSpec;
import com.loopwright.solver.spec.DesiredPoles;
import com.loopwright.solver.spec.SpecInverter;
import com.loopwright.solver.spec.TargetDynamics;
import com.loopwright.solver.spec.TimeSpec;
import java.util.ArrayList;
import java.util.List;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.interfaces.decomposition.EigenDecomposition_F64;

/**
 * The front door of the loop with integral action and/or position-only sensing. The specs are inverted in closed
 * form for the dominant pair; the plain or augmented plant is designed by the order-n pole-matched machinery; the
 * state-feedback loop is verified (H-infinity norm from w to z at most gamma, step against the specs, margins at
 * the plant input); with position-only sensing the observer is designed and the full output-feedback loop is
 * assembled and measured (its norm, margins, noise-to-command gain and step); the load step is simulated on the
 * loop that runs. Every failure is a {@link SolverFailure}. Stateless and thread-safe.
 */
public final class RealLoopPipeline {

    /** Settling time within this fraction of the spec (the step specs hold exactly up to simulation accuracy). */
    public static final double SETTLING_TOLERANCE = 0.005;
    /** Overshoot within this many percentage points of the spec. */
    public static final double OVERSHOOT_TOLERANCE_POINTS = 0.02;
    /** Relative slack of the certificate check ||T_wz|| <= gamma (the norm's own tolerance). */
    static final double CERTIFICATE_TOLERANCE = 1e-9;
    /** The step window covers this many slowest time constants, and at least this many settling times. */
    static final double HORIZON_TIME_CONSTANTS = 14;

    static final double HORIZON_SETTLING_TIMES = 3;
    /** Samples per radian of the fastest oscillation (the metrics need at most pi/2). */
    static final double SAMPLES_PER_RADIAN = 1.5;

    static final int MIN_SAMPLES = 4000;
    /** Lower-overshoot designs tried when the augmented design is infeasible (each a full design). */
    static final int MAX_PROPOSAL_TRIES = 8;
    /** Each try asks for this fraction of the previous overshoot. */
    static final double PROPOSAL_OVERSHOOT_FACTOR = 0.6;

    private final HighOrderDesigner designer = new HighOrderDesigner();
    private final SpecMatcher matcher = new SpecMatcher();
    private final IntegralDesigner integralDesigner = new IntegralDesigner();
    private final ObserverDesigner observerDesigner = new ObserverDesigner();
    private final HInfinityNormCalculator norm = new HInfinityNormCalculator();
    private final StateSpaceMargins margins = new StateSpaceMargins();
    private final LoadStepSimulator loadSteps = new LoadStepSimulator();

    /**
     * @param plant        the plant in companion form; its output row is what POSITION measures
     * @param spec         overshoot and settling time
     * @param auxiliary    where the plant's n - 2 auxiliary poles go (ignored for order 2)
     * @param gammaChoice  how gamma is chosen
     * @param structure    integral action, measurement, observer
     * @param loadStepSize the constant load w0 of the load-step figures, non-zero
     * @param maxUndershootPercent the undershoot accepted while matching the specs of an order-n plant (n &gt; 2)
     */
    public record Request(
            CompanionPlant plant,
            DesignSpec spec,
            AuxiliaryPlacement auxiliary,
            GammaChoice gammaChoice,
            LoopStructure structure,
            double loadStepSize,
            double maxUndershootPercent) {

        public Request {
            if (plant == null || spec == null || auxiliary == null || gammaChoice == null || structure == null) {
                throw new IllegalArgumentException(
                        "plant, spec, auxiliary placement, gamma choice and structure are" + " required");
            }
            if (!(loadStepSize != 0) || !Double.isFinite(loadStepSize)) {
                throw new IllegalArgumentException("the load step must be finite and non-zero");
            }
            if (!(maxUndershootPercent >= 0) || !Double.isFinite(maxUndershootPercent)) {
                throw new IllegalArgumentException("the accepted undershoot must be finite and at least 0");
            }
        }

        /**
         * The canonical plant (position x1 measured and tracked).
         *
         * @throws SolverFailure PLANT_MODEL (subject "d") when d = 0: the load enters through d, and the companion
         *                       plant of the H-infinity design needs a disturbance input
         */
        public static Request canonical(
                CanonicalPlant plant,
                DesignSpec spec,
                GammaChoice gammaChoice,
                LoopStructure structure,
                double loadStepSize) {
            if (plant.d() == 0) {
                throw SolverFailure.about(
                        SolverFailure.Kind.PLANT_MODEL,
                        "d",
                        -1,
                        "the load enters through d: a loop with integral action or an observer needs d != 0",
                        null);
            }
            return new Request(
                    IntegralAugmentation.companionOf(plant),
                    spec,
                    new AuxiliaryPlacement.RealPartMultiple(DesiredPoles.DEFAULT_REAL_PART_MULTIPLE),
                    gammaChoice,
                    structure,
                    loadStepSize,
                    0);
        }
    }

    /**
     * @throws SolverFailure PLANT_MODEL (integral action on an output with zeros, or past the largest order),
     *                       INFEASIBLE_SPEC (with a proposal when one is found), UNVERIFIABLE, LOOP_NOT_SIMULABLE
     */
    public RealLoopReport design(Request request) {
        checkStructure(request);
        return assembled(request, designOrFail(request), true);
    }

    /**
     * The loop designed for a given dominant pair instead of the inversion of the spec (order 2; the robust search
     * chooses the pair); the spec is still what the step is checked against.
     *
     * @throws SolverFailure as {@link #design(Request)}
     */
    RealLoopReport designAt(Request request, TargetDynamics target) {
        checkStructure(request);
        return assembled(request, designedAtOrFail(request, target), false);
    }

    /** The designed law, observer and weights for a dominant pair, without the loop's figures (the search's step). */
    LoopParts partsAt(Request request, TargetDynamics target) {
        Designed designed = designWith(
                request, request.auxiliary().place(target, request.plant().order()));
        ObserverDesign observer = request.structure().measurement() == LoopStructure.Measurement.POSITION
                ? observer(
                        request.plant(),
                        request.plant().outputRow(),
                        designed.poles(),
                        request.structure().observer())
                : null;
        return new LoopParts(
                designed.law(),
                observer == null ? null : observer.gain(),
                designed.design().weights());
    }

    /**
     * A designed law, its observer gain (null with full-state sensing) and its performance weights.
     */
    record LoopParts(TrackingLaw law, double[] observerGain, double[] weights) {}

    private Designed designedAtOrFail(Request request, TargetDynamics target) {
        try {
            return designWith(
                    request, request.auxiliary().place(target, request.plant().order()));
        } catch (InfeasibleDesignException e) {
            throw SolverFailure.infeasible(e.infeasibility(), e);
        } catch (PoleMatchedRiccati.SystemFailure e) {
            throw SolverFailure.of(SolverFailure.Kind.UNVERIFIABLE, e.getMessage(), e);
        }
    }

    static void checkStructure(Request request) {
        CompanionPlant plant = request.plant();
        LoopStructure structure = request.structure();
        if (!(request.spec().timeSpec() instanceof TimeSpec.SettlingTime)) {
            throw new IllegalArgumentException("this loop is designed from a settling-time spec");
        }
        if (structure.integralAction()) {
            if (!IntegralAugmentation.outputWithoutZeros(plant)) {
                throw SolverFailure.of(
                        SolverFailure.Kind.PLANT_MODEL,
                        "integral action needs a tracked output without plant zeros (output row c0 z1)",
                        null);
            }
            if (plant.order() + 1 > CompanionPlant.MAX_ORDER) {
                throw SolverFailure.of(
                        SolverFailure.Kind.PLANT_MODEL,
                        "integral action adds a state: order " + plant.order() + " + 1 exceeds "
                                + CompanionPlant.MAX_ORDER,
                        null);
            }
        }
    }

    /** @param matched the dominant pair was matched to the spec (else given, by the robust search) */
    private RealLoopReport assembled(Request request, Designed designed, boolean matched) {
        CompanionPlant plant = request.plant();
        LoopStructure structure = request.structure();
        TimeSpec.SettlingTime settling = (TimeSpec.SettlingTime) request.spec().timeSpec();
        List<String> notes = new ArrayList<>();
        TargetDynamics target = designed.poles().dominant();
        DesiredPoles plantPoles = designed.poles();
        if (plant.order() > 2 && !matched) {
            notes.add("order " + plant.order() + ": the dominant pair is the robust search's; the integral pole is"
                    + " cancelled, so the same pair serves the augmented loop");
        } else if (plant.order() > 2) {
            notes.add("order " + plant.order() + ": the dominant pair is matched by simulating the plain loop with its"
                    + " auxiliary poles; the integral pole is cancelled, so the same pair serves the augmented loop");
        }
        HighOrderDesign design = designed.design();
        TrackingLaw law = designed.law();
        double[] weights = design.weights();
        DMatrixRMaj measuredRow = plant.outputRow();
        try {
            LoopSystem stateFeedback = OutputFeedbackLoop.closed(plant, measuredRow.data, law, null, weights);
            HInfinityNorm certificate =
                    norm.compute(stateFeedback.a(), stateFeedback.disturbance(), stateFeedback.performance());
            if (!(certificate.attainedGain() <= design.gamma() * (1 + CERTIFICATE_TOLERANCE))) {
                throw SolverFailure.of(
                        SolverFailure.Kind.UNVERIFIABLE,
                        String.format(
                                "the state-feedback loop's norm from w to z, %.6g, exceeds gamma %.6g",
                                certificate.attainedGain(), design.gamma()),
                        null);
            }
            double horizon = horizon(stateFeedback.a(), settling.seconds());
            StepMetrics stateStep = step(stateFeedback, law, horizon, settling.bandFraction());
            PlantInputMargins stateMargins = margins(plant, measuredRow.data, law, null, stateFeedback);
            ObserverDesign observer = null;
            OutputFeedbackFigures figures = null;
            LoopSystem running = stateFeedback;
            StepMetrics runningStep = stateStep;
            notes.add("the H-infinity certificate (norm from w to z at most gamma) covers the state-feedback loop");
            if (structure.measurement() == LoopStructure.Measurement.POSITION) {
                observer = observer(plant, measuredRow, plantPoles, structure.observer());
                notes.add(
                        observer.method() == ObserverDesign.Method.STEADY_STATE_KALMAN
                                ? "observer: steady-state Kalman filter from the Riccati equation (process noise at the"
                                        + " disturbance input, measurement noise as given)"
                                : "observer: poles at " + observer.poleMultiple() + " x the controller poles");
                running = OutputFeedbackLoop.closed(plant, measuredRow.data, law, observer.gain(), weights);
                double fullHorizon = Math.max(horizon, horizon(running.a(), settling.seconds()));
                runningStep = step(running, law, fullHorizon, settling.bandFraction());
                HInfinityNorm fullNorm = norm.compute(running.a(), running.disturbance(), running.performance());
                HInfinityNorm noiseGain = norm.compute(running.a(), running.noise(), running.command());
                PlantInputMargins fullMargins = margins(plant, measuredRow.data, law, observer.gain(), running);
                double difference = largestDifference(stateFeedback, running, law, fullHorizon);
                boolean exceeds = fullNorm.attainedGain() > design.gamma();
                figures = new OutputFeedbackFigures(fullNorm, exceeds, fullMargins, noiseGain, runningStep, difference);
                notes.add(String.format(
                        "with the observer the norm from w to z is %.6g (%s gamma %.6g): the certificate does not"
                                + " cover the output-feedback loop",
                        fullNorm.attainedGain(), exceeds ? "above" : "not above", design.gamma()));
            }
            LoadStepResponse load = loadSteps.simulate(
                    running.a(), running.disturbance(), running.output(), running.command(), request.loadStepSize());
            return new RealLoopReport(
                    structure,
                    target,
                    design,
                    law,
                    certificate,
                    stateStep,
                    stateMargins,
                    observer,
                    figures,
                    specCheck(request.spec(), settling.seconds(), runningStep),
                    load,
                    notes);
        } catch (UnstableSystemException | NormComputationException | NoStabilizingSolutionException e) {
            throw SolverFailure.of(SolverFailure.Kind.UNVERIFIABLE, e.getMessage(), e);
        } catch (IllegalArgumentException e) {
            throw SolverFailure.of(SolverFailure.Kind.LOOP_NOT_SIMULABLE, e.getMessage(), e);
        }
    }

    private record Designed(DesiredPoles poles, HighOrderDesign design, TrackingLaw law) {}

    private Designed designOrFail(Request request) {
        try {
            return designFor(request, request.spec());
        } catch (InfeasibleDesignException e) {
            Infeasibility infeasibility = e.infeasibility();
            if (infeasibility.proposals().isEmpty() && request.structure().integralAction()) {
                infeasibility = infeasibility.withProposals(lowerOvershoot(request));
            }
            throw SolverFailure.infeasible(infeasibility, e);
        } catch (PoleMatchedRiccati.SystemFailure e) {
            throw SolverFailure.of(SolverFailure.Kind.UNVERIFIABLE, e.getMessage(), e);
        }
    }

    /**
     * Order 2: the exact closed-form inversion of the specs (with the integral pole cancelled, r -> y is exactly the
     * second-order response). Order n: the dominant pair matched by simulating the plain loop with its auxiliary
     * poles, which is also the augmented loop's r -> y response.
     */
    private Designed designFor(Request request, DesignSpec spec) {
        CompanionPlant plant = request.plant();
        TargetDynamics target = plant.order() == 2
                ? new SpecInverter().invert(spec).target()
                : matcher.match(plant, spec, request.auxiliary(), 1, request.maxUndershootPercent())
                        .target();
        return designWith(request, request.auxiliary().place(target, plant.order()));
    }

    private Designed designWith(Request request, DesiredPoles plantPoles) {
        CompanionPlant plant = request.plant();
        if (request.structure().integralAction()) {
            IntegralDesigner.IntegralDesign d = integralDesigner.design(
                    plant, plantPoles, request.structure().integralPoleMultiple(), request.gammaChoice());
            return new Designed(plantPoles, d.augmented(), d.law());
        }
        HighOrderDesign d = designer.design(plant, plantPoles, request.gammaChoice());
        return new Designed(plantPoles, d, IntegralDesigner.plainLaw(d));
    }

    /** The largest tried overshoot (a fraction 0.6^k of the asked one) whose augmented design is feasible. */
    private List<SpecProposal> lowerOvershoot(Request request) {
        double overshoot = request.spec().overshootFraction();
        for (int k = 0; k < MAX_PROPOSAL_TRIES; k++) {
            overshoot *= PROPOSAL_OVERSHOOT_FACTOR;
            DesignSpec lower = request.spec().withOvershoot(overshoot);
            try {
                designFor(request, lower);
                return List.of(new SpecProposal(
                        SpecQuantity.OVERSHOOT_PERCENT,
                        100 * overshoot,
                        "the augmented design (integral action) is feasible at this overshoot with the same settling"
                                + " time"));
            } catch (InfeasibleDesignException | PoleMatchedRiccati.SystemFailure | IllegalArgumentException e) {
                // try a lower overshoot
            }
        }
        return List.of();
    }

    private ObserverDesign observer(
            CompanionPlant plant, DMatrixRMaj measuredRow, DesiredPoles plantPoles, ObserverChoice choice) {
        if (choice instanceof ObserverChoice.Kalman kalman) {
            return observerDesigner.kalman(
                    plant.stateMatrix(),
                    plant.disturbanceInput(),
                    measuredRow,
                    kalman.processIntensity(),
                    kalman.measurementIntensity());
        }
        return observerDesigner.poleMultiple(
                plant.stateMatrix(), measuredRow, plantPoles, ((ObserverChoice.PoleMultiple) choice).multiple());
    }

    private PlantInputMargins margins(
            CompanionPlant plant, double[] measuredRow, TrackingLaw law, double[] observerGain, LoopSystem closed) {
        OpenLoopAtInput open = OutputFeedbackLoop.atPlantInput(plant, measuredRow, law, observerGain);
        return margins.margins(open.a(), open.input(), open.command(), closed.a());
    }

    static StepMetrics step(LoopSystem loop, TrackingLaw law, double horizon, double band) {
        LinearLoop linear = linear(loop, law);
        return new StepResponseMetrics().measure(linear, 1, horizon, samples(loop.a(), horizon), band);
    }

    static LinearLoop linear(LoopSystem loop, TrackingLaw law) {
        return new LinearLoop(loop.a(), loop.reference(), loop.output(), loop.command(), law.referenceGain());
    }

    /** max |y_full - y_state| on one grid for a unit step. */
    private static double largestDifference(LoopSystem state, LoopSystem full, TrackingLaw law, double horizon) {
        int samples = samples(full.a(), horizon);
        StepSimulator simulator = new StepSimulator();
        StepResponse a = simulator.simulate(linear(state, law), 1, horizon, samples);
        StepResponse b = simulator.simulate(linear(full, law), 1, horizon, samples);
        double largest = 0;
        for (int k = 0; k < samples; k++) {
            largest = Math.max(largest, Math.abs(a.outputAt(k) - b.outputAt(k)));
        }
        return largest;
    }

    static double horizon(DMatrixRMaj a, double settlingSeconds) {
        double[] rates = rates(a);
        return Math.max(HORIZON_SETTLING_TIMES * settlingSeconds, HORIZON_TIME_CONSTANTS / rates[0]);
    }

    static int samples(DMatrixRMaj a, double horizon) {
        long wanted = (long) Math.ceil(horizon * rates(a)[1] * SAMPLES_PER_RADIAN) + 1;
        if (wanted > StepSimulator.MAX_SAMPLES) {
            throw new IllegalArgumentException("the loop oscillates too fast for its slowest mode to be simulated");
        }
        return (int) Math.max(MIN_SAMPLES, wanted);
    }

    /** {slowest decay rate min(-Re), fastest oscillation max|Im|}. */
    private static double[] rates(DMatrixRMaj a) {
        EigenDecomposition_F64<DMatrixRMaj> eig = DecompositionFactory_DDRM.eig(a.numRows, false);
        if (!eig.decompose(a.copy())) {
            throw new IllegalArgumentException("the closed-loop poles could not be computed");
        }
        double slowest = Double.POSITIVE_INFINITY;
        double fastest = 0;
        for (int i = 0; i < eig.getNumberOfEigenvalues(); i++) {
            slowest = Math.min(slowest, -eig.getEigenvalue(i).real);
            fastest = Math.max(fastest, Math.abs(eig.getEigenvalue(i).imaginary));
        }
        if (!(slowest > 0)) {
            throw new IllegalArgumentException("the closed loop is not stable");
        }
        return new double[] {slowest, fastest};
    }

    private static HighOrderPipeline.SpecCheck specCheck(DesignSpec spec, double ts, StepMetrics step) {
        double overshoot = 100 * spec.overshootFraction();
        boolean met = step.settlingTimeSeconds() <= ts * (1 + SETTLING_TOLERANCE)
                && step.overshootPercent() <= overshoot + OVERSHOOT_TOLERANCE_POINTS;
        return new HighOrderPipeline.SpecCheck(
                met, step.settlingTimeSeconds() / ts - 1, step.overshootPercent() - overshoot);
    }
}
