package com.loopwright.solver.pipeline;

import com.loopwright.solver.design.HInfinityNorm;
import com.loopwright.solver.design.LoadStepResponse;
import com.loopwright.solver.design.ObserverDesign;
import com.loopwright.solver.design.PlantInputMargins;
import com.loopwright.solver.design.StepMetrics;
import com.loopwright.solver.design.TrackingLaw;
import com.loopwright.solver.frequency.StateSpaceMargins;
import com.loopwright.solver.integral.IntegralAugmentation;
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

/**
 * The front door that checks a law the caller already has on the canonical plant: u = kr r + ki xi - K x_hat with
 * xi' = r - x1 (ki = 0: no integrator) and x_hat the measured state or the estimate of an observer whose gain the
 * caller gives or asks to be designed (steady-state Kalman filter). The loop as it runs is assembled and measured:
 * the peak gain from w to the performance output, the margins at the plant input, the gain from measurement noise to
 * the command, the unit reference step and the load step. Stateless and thread-safe.
 */
public final class LoopCheckPipeline {

    private final ObserverDesigner observers = new ObserverDesigner();
    private final HInfinityNormCalculator norm = new HInfinityNormCalculator();
    private final StateSpaceMargins margins = new StateSpaceMargins();
    private final LoadStepSimulator loadSteps = new LoadStepSimulator();

    /**
     * @param plant           the canonical plant (d != 0: the load enters through d)
     * @param stateGain       [k1, k2]
     * @param integralGain    ki, 0 without an integrator
     * @param referenceGain   kr
     * @param observerGain    the caller's L = [l1, l2], or null
     * @param kalman          an observer to design for the caller, or null (not with observerGain)
     * @param rho1            position weight of z = [rho1 x1, rho2 x2, u], or null for z = x1
     * @param rho2            velocity weight, or null
     * @param loadStepSize    the load step w0, non-zero
     * @param bandFraction    settling band of the step metrics
     * @param settlingSeconds the settling-time spec when given (the step window covers three of it), or null
     */
    public record Request(
            CanonicalPlant plant,
            double[] stateGain,
            double integralGain,
            double referenceGain,
            double[] observerGain,
            ObserverChoice.Kalman kalman,
            Double rho1,
            Double rho2,
            double loadStepSize,
            double bandFraction,
            Double settlingSeconds) {
        public Request {
            stateGain = stateGain.clone();
            observerGain = observerGain == null ? null : observerGain.clone();
            if (stateGain.length != 2 || (observerGain != null && observerGain.length != 2)) {
                throw new IllegalArgumentException("two state gains and two observer gains");
            }
            if (observerGain != null && kalman != null) {
                throw new IllegalArgumentException("give the observer gain or ask for one, not both");
            }
        }

        boolean observed() {
            return observerGain != null || kalman != null;
        }
    }

    /**
     * The checked loop.
     *
     * @param law                 the law as checked (the integral pole field holds the feedforward's zero -ki/kr)
     * @param observer            the observer designed for the caller, null otherwise
     * @param observerGain        the observer gain used, null with full-state sensing
     * @param peakDisturbanceGain the peak gain from w to the performance output
     * @param noiseToCommandGain  the peak gain from measurement noise to u, null with full-state sensing
     * @param margins             at the plant input
     * @param step                the unit reference step
     * @param loadStep            the load step
     */
    public record Report(
            TrackingLaw law,
            ObserverDesign observer,
            double[] observerGain,
            HInfinityNorm peakDisturbanceGain,
            HInfinityNorm noiseToCommandGain,
            PlantInputMargins margins,
            StepMetrics step,
            LoadStepResponse loadStep) {
        public Report {
            observerGain = observerGain == null ? null : observerGain.clone();
        }

        @Override
        public double[] observerGain() {
            return observerGain == null ? null : observerGain.clone();
        }
    }

    /**
     * @throws SolverFailure PLANT_MODEL (subject "d") when d = 0, UNSTABLE_LOOP when the loop as it runs is not
     *                       stable, UNVERIFIABLE when a figure cannot be computed
     */
    public Report check(Request request) {
        CanonicalPlant canonical = request.plant();
        if (canonical.d() == 0) {
            throw SolverFailure.about(
                    SolverFailure.Kind.PLANT_MODEL,
                    "d",
                    -1,
                    "the load enters through d: the loop check needs d != 0",
                    null);
        }
        CompanionPlant plant = IntegralAugmentation.companionOf(canonical);
        double[] row = plant.outputRow().data;
        boolean integral = request.integralGain() != 0;
        // the feedforward kr s + ki has its zero at -ki/kr (0 when kr = 0: no zero, only the marker of integral action)
        Double zero = integral
                ? (request.referenceGain() == 0 ? 0.0 : -request.integralGain() / request.referenceGain())
                : null;
        TrackingLaw law = new TrackingLaw(request.stateGain(), request.integralGain(), request.referenceGain(), zero);
        try {
            ObserverDesign observer = request.kalman() == null
                    ? null
                    : observers.kalman(
                            plant.stateMatrix(),
                            plant.disturbanceInput(),
                            plant.outputRow(),
                            request.kalman().processIntensity(),
                            request.kalman().measurementIntensity());
            double[] observerGain = observer != null ? observer.gain() : request.observerGain();
            LoopSystem loop = OutputFeedbackLoop.closed(
                    plant, row, law, observerGain, new double[integral ? plant.order() + 1 : plant.order()]);
            OpenLoopAtInput open = OutputFeedbackLoop.atPlantInput(plant, row, law, observerGain);
            PlantInputMargins m = margins.margins(open.a(), open.input(), open.command(), loop.a());
            if (!m.closedLoopStable()) {
                throw SolverFailure.of(
                        SolverFailure.Kind.UNSTABLE_LOOP,
                        "the loop as it runs (with the integral gain and/or the observer) is not stable",
                        null);
            }
            HInfinityNorm disturbanceGain = norm.compute(loop.a(), loop.disturbance(), performance(request, loop));
            HInfinityNorm noiseGain = request.observed() ? norm.compute(loop.a(), loop.noise(), loop.command()) : null;
            double horizon = RealLoopPipeline.horizon(
                    loop.a(), request.settlingSeconds() == null ? 0 : request.settlingSeconds());
            StepMetrics step = RealLoopPipeline.step(loop, law, horizon, request.bandFraction());
            LoadStepResponse load = loadSteps.simulate(
                    loop.a(), loop.disturbance(), loop.output(), loop.command(), request.loadStepSize());
            return new Report(law, observer, observerGain, disturbanceGain, noiseGain, m, step, load);
        } catch (UnstableSystemException e) {
            throw SolverFailure.of(SolverFailure.Kind.UNSTABLE_LOOP, e.getMessage(), e);
        } catch (NormComputationException | NoStabilizingSolutionException e) {
            throw SolverFailure.of(SolverFailure.Kind.UNVERIFIABLE, e.getMessage(), e);
        } catch (IllegalArgumentException e) {
            throw SolverFailure.of(SolverFailure.Kind.LOOP_NOT_SIMULABLE, e.getMessage(), e);
        }
    }

    /**
     * z = x1 without weights; z = [rho1 x1, rho2 x2, u] with them (as the plain verification weights it), the
     * integrator unweighted.
     */
    private static org.ejml.data.DMatrixRMaj performance(Request request, LoopSystem loop) {
        if (request.rho1() == null) {
            return loop.output();
        }
        org.ejml.data.DMatrixRMaj z = new org.ejml.data.DMatrixRMaj(3, loop.stateDimension());
        z.set(0, 0, request.rho1());
        z.set(1, 1, request.rho2());
        org.ejml.data.DMatrixRMaj u = loop.command();
        for (int j = 0; j < loop.stateDimension(); j++) {
            z.set(2, j, u.get(0, j));
        }
        return z;
    }
}
