package com.loopwright.solver.pipeline;

import com.loopwright.solver.design.ClosedFormDesign;
import com.loopwright.solver.design.ClosedFormDesigner;
import com.loopwright.solver.design.DesignObstacle;
import com.loopwright.solver.design.FeasibilityAdvisor;
import com.loopwright.solver.design.GammaChoice;
import com.loopwright.solver.design.Infeasibility;
import com.loopwright.solver.design.InfeasibleDesignException;
import com.loopwright.solver.design.SpecProposal;
import com.loopwright.solver.design.SpecQuantity;
import com.loopwright.solver.design.SpecRanges;
import com.loopwright.solver.design.Verification;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.spec.DesignSpec;
import com.loopwright.solver.spec.NormalizedSettlingTime;
import com.loopwright.solver.spec.SpecInversion;
import com.loopwright.solver.spec.SpecInverter;
import com.loopwright.solver.spec.TargetDynamics;
import com.loopwright.solver.verify.DesignVerifier;
import java.util.List;
import java.util.Optional;

/**
 * The whole design: specs to exact (zeta, wn), feasibility (with proposals when infeasible), the closed-form
 * design, and its independent verification. Stateless and thread-safe.
 */
public final class LoopDesigner {

    /** Simulation grid size; refinement between samples makes the metrics exact, the grid only brackets. */
    public static final int SIMULATION_SAMPLES = 2000;
    /** Simulated time in multiples of the expected settling time (long enough to see the settled tail). */
    static final double HORIZON_PER_SETTLING_TIME = 3;

    private final SpecInverter inverter = new SpecInverter();
    private final ClosedFormDesigner designer = new ClosedFormDesigner();
    private final FeasibilityAdvisor advisor = new FeasibilityAdvisor(designer);
    private final DesignVerifier verifier = new DesignVerifier();
    private final SpecRanges ranges;

    /** A designer whose proposals are bounded only by the quantities themselves. */
    public LoopDesigner() {
        this(SpecRanges.UNBOUNDED);
    }

    /** A designer whose proposals lie in the ranges a request accepts. */
    public LoopDesigner(SpecRanges ranges) {
        this.ranges = ranges;
    }

    /** What the reason adds when a quantity has no proposal: none within the accepted ranges works. */
    private static String missing(List<SpecProposal> proposals) {
        StringBuilder text = new StringBuilder();
        if (proposals.stream().noneMatch(p -> p.quantity() == SpecQuantity.TIME_SPEC)) {
            text.append(
                    "; no time spec within the accepted range makes this plant feasible with the overshoot" + " kept");
        }
        if (proposals.stream().noneMatch(p -> p.quantity() == SpecQuantity.OVERSHOOT_PERCENT)) {
            text.append(
                    "; no overshoot within the accepted range makes this plant feasible with the time spec" + " kept");
        }
        return text.toString();
    }

    /**
     * @throws InfeasibleDesignException when the plant cannot meet the spec (with computed proposals)
     * @throws com.loopwright.solver.verify.VerificationFailedException when a check cannot be computed
     */
    public DesignReport design(
            CanonicalPlant plant, DesignSpec spec, GammaChoice gammaChoice, double stepSize, double bandFraction) {
        SpecInversion inversion = inverter.invert(spec);
        TargetDynamics target = inversion.target();
        Optional<DesignObstacle> obstacle = designer.obstacle(plant, target);
        if (obstacle.isPresent()) {
            SpecQuantity blamed =
                    obstacle.get().dampingBound() ? SpecQuantity.OVERSHOOT_PERCENT : SpecQuantity.TIME_SPEC;
            List<SpecProposal> proposals = advisor.propose(plant, spec, gammaChoice, ranges);
            String reason = obstacle.get().reason() + missing(proposals);
            throw new InfeasibleDesignException(new Infeasibility(blamed, reason, proposals));
        }
        return designed(plant, spec, inversion, gammaChoice, stepSize, bandFraction);
    }

    /**
     * The design of a given target (the robust search's), verified against the spec as requested: the same
     * closed-form design, horizon and independent verification as {@link #design}.
     *
     * @param inversion the target with its handbook estimate
     * @throws InfeasibleDesignException when no gamma completes the design (a fixed gamma below gamma_min)
     */
    DesignReport designed(
            CanonicalPlant plant,
            DesignSpec spec,
            SpecInversion inversion,
            GammaChoice gammaChoice,
            double stepSize,
            double bandFraction) {
        TargetDynamics target = inversion.target();
        ClosedFormDesign design;
        try {
            design = designer.design(plant, target, gammaChoice);
        } catch (InfeasibleDesignException e) {
            // a fixed gamma below gamma_min: keep only the gamma proposals a request accepts
            List<SpecProposal> inRange = e.infeasibility().proposals().stream()
                    .filter(p -> p.quantity() != SpecQuantity.GAMMA || ranges.gammaInRange(p.value()))
                    .toList();
            if (inRange.size() == e.infeasibility().proposals().size()) {
                throw e;
            }
            throw new InfeasibleDesignException(e.infeasibility().withProposals(inRange));
        }
        double expectedSettling =
                NormalizedSettlingTime.of(target.dampingRatio(), bandFraction) / target.naturalFrequencyRadPerSec();
        double horizon = HORIZON_PER_SETTLING_TIME * expectedSettling;
        Verification verification = verifier.verify(design, spec, stepSize, bandFraction, horizon, SIMULATION_SAMPLES);
        return new DesignReport(
                spec, inversion, design, verification, stepSize, bandFraction, horizon, SIMULATION_SAMPLES);
    }
}
