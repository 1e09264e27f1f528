package com.loopwright.api.design;

import com.fasterxml.jackson.annotation.JsonInclude;
import com.loopwright.api.loop.Law;
import com.loopwright.api.loop.LoadStep;
import com.loopwright.api.loop.Observer;
import com.loopwright.api.loop.OutputFeedback;
import com.loopwright.api.result.Gain;
import com.loopwright.api.result.GammaBound;
import com.loopwright.api.result.GammaInterval;
import com.loopwright.api.result.Pole;
import com.loopwright.api.result.Riccati;
import com.loopwright.api.result.Simulated;
import com.loopwright.api.result.Target;
import com.loopwright.api.result.Verification;
import com.loopwright.api.robustness.RobustnessResponse;
import java.util.List;

/**
 * Body of a successful POST /v1/designs. Units: seconds, rad/s, the caller's x1 and u units; gamma is the
 * L2 gain bound from w to z = [rho1 x1, rho2 x2, u]. target, riccati, gammaBounds, gammaIntervals, weights, gain,
 * simulated and verification are the records every design result shares (package {@code api.result}); this
 * order-2 result adds plant and model. {@code robustness} is present only when the request asked
 * for it (verify); law, observer, outputFeedback and loadStep only when it asked for integral action or position-only
 * sensing (observer and outputFeedback only for the latter); {@code robust} only for a robust design (robust).
 * {@code noteCodes} holds the stable code of each note, index for index (notes stay plain
 * strings; a client that acts on a note matches its code).
 */
@JsonInclude(JsonInclude.Include.NON_NULL)
public record DesignResponse(
        Plant plant,
        Target target,
        Riccati riccati,
        List<GammaBound> gammaBounds,
        List<GammaInterval> gammaIntervals,
        double gammaMin,
        double gamma,
        List<Double> weights,
        Gain gain,
        Simulated simulated,
        Verification verification,
        List<String> notes,
        List<String> noteCodes,
        List<String> cautions,
        Model model,
        RobustnessResponse robustness,
        Law law,
        Observer observer,
        OutputFeedback outputFeedback,
        LoadStep loadStep,
        RobustDesign robust) {

    public DesignResponse {
        gammaBounds = List.copyOf(gammaBounds);
        gammaIntervals = List.copyOf(gammaIntervals);
        weights = List.copyOf(weights);
        notes = List.copyOf(notes);
        noteCodes = List.copyOf(noteCodes);
        cautions = List.copyOf(cautions);
    }

    /** The canonical plant the design used. */
    public record Plant(double a0, double a1, double b, double d) {}

    /**
     * The plant description the caller sent and what the design made of it.
     *
     * @param form        wire name of the description (canonical, rotaryAxis, massSpringDamper,
     *                    secondOrderTransferFunction, stateSpace)
     * @param canonical   the derived canonical coefficients (the same as {@code plant})
     * @param units       units of the states, inputs and coefficients for this description
     * @param assumptions what the conversion assumed
     * @param physicalLaw the law in physical units (rotaryAxis and massSpringDamper only)
     * @param stateSpace  the design in the caller's coordinates (stateSpace only)
     */
    @JsonInclude(JsonInclude.Include.NON_NULL)
    public record Model(
            String form,
            Plant canonical,
            Units units,
            List<String> assumptions,
            PhysicalLaw physicalLaw,
            StateSpaceView stateSpace) {
        public Model {
            assumptions = List.copyOf(assumptions);
        }
    }

    /** Units of x1, x2, u, w and the canonical coefficients. */
    public record Units(String x1, String x2, String u, String w, String a0, String a1, String b, String d) {}

    /**
     * The law in physical units: command = positionGain (r - x1) - velocityGain x2 + setpointFeedforward r,
     * which is u = kr r - (k1 x1 + k2 x2) with setpointFeedforward = kr - k1 = a0/b.
     *
     * @param setpointFeedforward command per unit setpoint needed to hold a non-zero setpoint (0 when a0 = 0)
     * @param meaning             what the feedforward is physically
     */
    public record PhysicalLaw(
            String law,
            double positionGain,
            String positionGainUnit,
            double velocityGain,
            String velocityGainUnit,
            double referenceGain,
            double setpointFeedforward,
            String setpointFeedforwardUnit,
            String meaning) {}

    /**
     * The design in the caller's coordinates x = T z (z the canonical coordinates the design was made in).
     *
     * @param coordinates     which coordinates each matrix is in
     * @param transform       T, rows of x = T z
     * @param p               Riccati solution P_x = T^-T P_z T^-1 (caller's coordinates)
     * @param gain            K_x = K_z T^-1 (caller's coordinates): u = kr r - K_x x
     * @param stateWeight     C1'C1 = T^-T diag(rho1^2, rho2^2) T^-1 (caller's coordinates)
     * @param trackedOutput   c, first row of T^-1: the output y = c x that tracks r with the specs
     * @param referenceGain   kr (unit DC gain from r to y)
     * @param riccatiResidual relative residual of P_x in the Riccati equation of the caller's A, B1, B2
     * @param closedLoopPoles eigenvalues of A - B2 K_x
     */
    @JsonInclude(JsonInclude.Include.NON_NULL)
    public record StateSpaceView(
            String coordinates,
            List<List<Double>> transform,
            List<List<Double>> p,
            List<Double> gain,
            List<List<Double>> stateWeight,
            List<Double> trackedOutput,
            double referenceGain,
            double riccatiResidual,
            List<Pole> closedLoopPoles,
            String law,
            double controllabilityCondition,
            LoopLawView loopLaw) {
        public StateSpaceView {
            transform = List.copyOf(transform);
            p = List.copyOf(p);
            gain = List.copyOf(gain);
            stateWeight = List.copyOf(stateWeight);
            trackedOutput = List.copyOf(trackedOutput);
            closedLoopPoles = List.copyOf(closedLoopPoles);
        }
    }

    /**
     * The law of the loop with integral action and/or an observer in the caller's coordinates (stateSpace only).
     *
     * @param k             K_x on the caller's states
     * @param integralGain  ki, absent without integral action
     * @param referenceGain kr
     * @param observerGain  L_x, absent with full-state sensing
     * @param law           the law written out with these numbers
     */
    @JsonInclude(JsonInclude.Include.NON_NULL)
    public record LoopLawView(
            List<Double> k, Double integralGain, double referenceGain, List<Double> observerGain, String law) {
        public LoopLawView {
            k = List.copyOf(k);
            observerGain = observerGain == null ? null : List.copyOf(observerGain);
        }
    }
}
