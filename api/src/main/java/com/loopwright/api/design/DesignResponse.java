package com.loopwright.api.design;

import com.fasterxml.jackson.annotation.JsonInclude;
import com.loopwright.api.robustness.RobustnessResponse;
import java.util.List;

/**
 * Body of a successful POST /v1/designs. Units: seconds, rad/s, the caller's x1 and u units; gamma is the
 * L2 gain bound from w to z = [rho1 x1, rho2 x2, u]. {@code robustness} is present only when the request asked
 * for it (verify). {@code noteCodes} holds the stable code of each note, index for index (notes stay plain
 * strings; a client that acts on a note matches its code).
 */
@JsonInclude(JsonInclude.Include.NON_NULL)
public record DesignResponse(
        Plant plant,
        Target target,
        Riccati riccati,
        List<GammaBoundView> gammaBounds,
        double gammaMin,
        double gamma,
        Weights weights,
        Gain gain,
        Simulated simulated,
        Verification verification,
        List<String> notes,
        List<String> noteCodes,
        List<String> cautions,
        Model model,
        RobustnessResponse robustness) {

    public DesignResponse {
        gammaBounds = List.copyOf(gammaBounds);
        notes = List.copyOf(notes);
        noteCodes = List.copyOf(noteCodes);
        cautions = List.copyOf(cautions);
    }

    /** The canonical plant the design used. */
    public record Plant(double a0, double a1, double b, double d) {}

    /**
     * Target closed-loop dynamics.
     *
     * @param handbookNaturalFrequency wn from the textbook rule of thumb, for comparison only
     * @param bindingSpecs             the specs met with equality by the target (the others are met with room)
     */
    public record Target(
            double dampingRatio,
            double naturalFrequency,
            List<PoleView> poles,
            double handbookNaturalFrequency,
            List<String> bindingSpecs) {
        public Target {
            poles = List.copyOf(poles);
            bindingSpecs = List.copyOf(bindingSpecs);
        }
    }

    public record PoleView(double re, double im) {}

    /**
     * Closed-form Riccati solution P = [[p11, p12], [p12, p22]] and its relative residual in the Riccati
     * equation, with the independent numeric solution beside it.
     */
    public record Riccati(double p11, double p12, double p22, double residualNorm, NumericRiccati numeric) {}

    /**
     * @param relativeDifference ||P_numeric - P_closed||_F / ||P_closed||_F
     * @param iterations         matrix-sign iterations used
     */
    public record NumericRiccati(
            double p11, double p12, double p22, double residualNorm, double relativeDifference, int iterations) {}

    /**
     * @param condition wire name of the requirement
     * @param value     gamma lower bound d/sqrt(D)
     * @param meaning   what holds above it
     * @param binding   true for the bound that sets gamma_min
     */
    public record GammaBoundView(String condition, double value, String meaning, boolean binding) {}

    public record Weights(double rho1, double rho2) {}

    /**
     * Law u = kr r - (k1 x1 + k2 x2).
     *
     * @param referenceGain kr, which gives unit DC gain from the reference r to x1
     */
    public record Gain(double k1, double k2, double referenceGain, String law) {}

    /** Metrics of the simulated closed-loop step of size stepSize. */
    public record Simulated(
            double riseTime,
            double settlingTime,
            double overshootPercent,
            double peakTime,
            double steadyStateError,
            double peakControl,
            double stepSize,
            double settlingBandPercent,
            double horizon,
            int samples) {}

    /**
     * Independent checks of the design.
     *
     * @param hinfNorm                    H-infinity norm of the closed loop from w to z, by Hamiltonian test
     * @param hinfPeakFrequency           frequency where it peaks [rad/s]
     * @param certified                   hinfNorm &lt;= gamma and numeric and closed-form P agree
     * @param positionPerDisturbanceBound certified ||x1||_2 / ||w||_2 &lt;= gamma/rho1 (absent when rho1 = 0)
     * @param specChecks                  each requested spec against its simulated value
     */
    @JsonInclude(JsonInclude.Include.NON_NULL)
    public record Verification(
            double hinfNorm,
            double hinfPeakFrequency,
            boolean certified,
            Double positionPerDisturbanceBound,
            boolean specsMet,
            List<SpecCheck> specChecks) {
        public Verification {
            specChecks = List.copyOf(specChecks);
        }
    }

    /**
     * @param spec      request field name
     * @param requested requested value (an upper limit)
     * @param simulated simulated value
     */
    public record SpecCheck(String spec, double requested, double simulated, boolean met) {}

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
    public record StateSpaceView(
            String coordinates,
            List<List<Double>> transform,
            List<List<Double>> p,
            List<Double> gain,
            List<List<Double>> stateWeight,
            List<Double> trackedOutput,
            double referenceGain,
            double riccatiResidual,
            List<PoleView> closedLoopPoles,
            String law,
            double controllabilityCondition) {
        public StateSpaceView {
            transform = List.copyOf(transform);
            p = List.copyOf(p);
            gain = List.copyOf(gain);
            stateWeight = List.copyOf(stateWeight);
            trackedOutput = List.copyOf(trackedOutput);
            closedLoopPoles = List.copyOf(closedLoopPoles);
        }
    }
}
