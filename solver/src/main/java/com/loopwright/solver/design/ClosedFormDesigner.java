package com.loopwright.solver.design;

import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.spec.TargetDynamics;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * Closed-form H-infinity state-feedback design for the canonical second-order plant. With p12, p22 from pole
 * matching and k = b^2 - d^2/gamma^2, the three distinct entries of
 * A'P + PA + P(B1B1'/gamma^2 - B2B2')P + C1'C1 = 0 give
 * <pre>
 *   rho1^2 = 2 a0 p12 + k p12^2
 *   p11    = a1 p12 + a0 p22 + k p12 p22
 *   rho2^2 = 2 a1 p22 - 2 p12 + k p22^2
 * </pre>
 */
public final class ClosedFormDesigner {

    /** Why no design exists for this target, or empty when some gamma completes it. */
    public Optional<DesignObstacle> obstacle(CanonicalPlant plant, TargetDynamics target) {
        PoleMatch match = PoleMatch.of(plant, target);
        Optional<DesignObstacle> unmatched = matchObstacle(plant, target, match);
        return unmatched.isPresent() ? unmatched : boundObstacle(bounds(plant, match), plant, target);
    }

    /** p12 and p22 of the pole match must be positive, or the target is out of the plant's reach. */
    private static Optional<DesignObstacle> matchObstacle(
            CanonicalPlant plant, TargetDynamics target, PoleMatch match) {
        double zeta = target.dampingRatio();
        double wn = target.naturalFrequencyRadPerSec();
        if (!(match.p12() > 0)) {
            return Optional.of(new DesignObstacle(
                    String.format(
                            "natural frequency %.6g rad/s is not above the plant's own sqrt(a0) = %.6g rad/s: the spec asks"
                                    + " for a loop no stiffer than the plant already is (p12 = (wn^2 - a0)/b^2 must be > 0)",
                            wn, Math.sqrt(Math.max(plant.a0(), 0))),
                    false));
        }
        if (!(match.p22() > 0)) {
            return Optional.of(new DesignObstacle(
                    String.format(
                            "2 zeta wn = %.6g 1/s is not above the plant's own damping a1 = %.6g 1/s: the spec asks for less"
                                    + " damping than the plant already has (p22 = (2 zeta wn - a1)/b^2 must be > 0)",
                            2 * zeta * wn, plant.a1()),
                    false));
        }
        return Optional.empty();
    }

    /** The first bound no gamma can meet, as an obstacle. */
    private static Optional<DesignObstacle> boundObstacle(
            List<GammaBound> bounds, CanonicalPlant plant, TargetDynamics target) {
        for (GammaBound bound : bounds) {
            if (!bound.satisfiable()) {
                return Optional.of(obstacleFor(bound, plant, target));
            }
        }
        return Optional.empty();
    }

    /**
     * The six lower bounds on gamma for a pole match; gammaLowerBound is d/sqrt(D) where D &gt; 0. The binding one is
     * the first largest, when d is not 0.
     */
    public List<GammaBound> bounds(CanonicalPlant plant, PoleMatch match) {
        double a0 = plant.a0();
        double a1 = plant.a1();
        double b2 = plant.b() * plant.b();
        double p12 = match.p12();
        double p22 = match.p22();
        List<GammaBound> bounds = new ArrayList<>(GammaCondition.CLOSED_FORM.size());
        int binding = 0;
        for (GammaCondition condition : GammaCondition.CLOSED_FORM) {
            double headroom = switch (condition) {
                case POSITION_WEIGHT_REAL -> b2 + 2 * a0 / p12;
                case VELOCITY_WEIGHT_REAL -> b2 - (2 * p12 - 2 * a1 * p22) / (p22 * p22);
                case P11_POSITIVE -> b2 + (a1 * p12 + a0 * p22) / (p12 * p22);
                case P_POSITIVE_DEFINITE -> b2 - (p12 * p12 - a1 * p12 * p22 - a0 * p22 * p22) / (p12 * p22 * p22);
                case STABILIZING_DAMPING -> b2 + a1 / p22;
                case STABILIZING_STIFFNESS -> b2 + a0 / p12;
                default -> throw new IllegalStateException(condition + " is not a closed-form condition");
            };
            double lowerBound = plant.d() == 0 ? 0 : headroom > 0 ? Math.abs(plant.d()) / Math.sqrt(headroom) : 0;
            bounds.add(GammaBound.closedForm(condition, headroom, lowerBound, false));
            if (Double.compare(lowerBound, bounds.get(binding).gammaLowerBound()) > 0) {
                binding = bounds.size() - 1; // the first largest bound sets gamma_min
            }
        }
        if (plant.d() != 0) {
            GammaBound first = bounds.get(binding);
            bounds.set(
                    binding,
                    GammaBound.closedForm(
                            first.condition(), first.headroom().getAsDouble(), first.gammaLowerBound(), true));
        }
        return bounds;
    }

    /**
     * The design for a feasible target and a gamma choice.
     *
     * @throws InfeasibleDesignException when the target has an obstacle or a fixed gamma is not above gamma_min
     */
    public ClosedFormDesign design(CanonicalPlant plant, TargetDynamics target, GammaChoice choice) {
        // one pole match and one set of bounds serve the feasibility check and the design
        PoleMatch match = PoleMatch.of(plant, target);
        Optional<DesignObstacle> obstacle = matchObstacle(plant, target, match);
        List<GammaBound> bounds = obstacle.isPresent() ? List.of() : bounds(plant, match);
        if (obstacle.isEmpty()) {
            obstacle = boundObstacle(bounds, plant, target);
        }
        if (obstacle.isPresent()) {
            throw new InfeasibleDesignException(new Infeasibility(
                    obstacle.get().dampingBound() ? SpecQuantity.OVERSHOOT_PERCENT : SpecQuantity.TIME_SPEC,
                    obstacle.get().reason(),
                    List.of()));
        }
        double gammaMin =
                bounds.stream().mapToDouble(GammaBound::gammaLowerBound).max().orElse(0);
        double gamma = choice instanceof GammaChoice.Fixed fixed
                ? requireAbove(fixed.gamma(), gammaMin, plant)
                : gammaMin * ((GammaChoice.MarginOverMinimum) choice).factor();
        double k = curvature(plant, gamma);
        double p12 = match.p12();
        double p22 = match.p22();
        double rho1Squared = 2 * plant.a0() * p12 + k * p12 * p12;
        double rho2Squared = 2 * plant.a1() * p22 - 2 * p12 + k * p22 * p22;
        double p11 = plant.a1() * p12 + plant.a0() * p22 + k * p12 * p22;
        // Above gamma_min both squares are >= 0 in exact arithmetic; clamp rounding dust at the boundary.
        return new ClosedFormDesign(
                plant,
                target,
                p11,
                p12,
                p22,
                Math.sqrt(Math.max(rho1Squared, 0)),
                Math.sqrt(Math.max(rho2Squared, 0)),
                bounds,
                gammaMin,
                gamma);
    }

    /** k = b^2 - d^2/gamma^2; with d = 0 the disturbance channel is absent and k = b^2 for any gamma. */
    static double curvature(CanonicalPlant plant, double gamma) {
        double b2 = plant.b() * plant.b();
        return plant.d() == 0 ? b2 : b2 - plant.d() * plant.d() / (gamma * gamma);
    }

    private static double requireAbove(double gamma, double gammaMin, CanonicalPlant plant) {
        if (plant.d() != 0 && !(gamma > gammaMin)) {
            throw new InfeasibleDesignException(new Infeasibility(
                    SpecQuantity.GAMMA,
                    String.format(
                            "gamma %.6g is not above gamma_min %.6g: some Riccati requirement fails at this gamma",
                            gamma, gammaMin),
                    List.of(new SpecProposal(
                            SpecQuantity.GAMMA,
                            gammaMin * GammaChoice.MarginOverMinimum.DEFAULT_FACTOR,
                            "the default margin of 1.2 over gamma_min"))));
        }
        return gamma;
    }

    private static DesignObstacle obstacleFor(GammaBound bound, CanonicalPlant plant, TargetDynamics target) {
        double zeta = target.dampingRatio();
        if (bound.condition() == GammaCondition.VELOCITY_WEIGHT_REAL) {
            // D2 > 0 <=> wn^2 (4 zeta^2 - 2) > a1^2 - 2 a0: no wn helps when both sides say no.
            boolean dampingBound = 4 * zeta * zeta - 2 <= 0 && plant.a1() * plant.a1() - 2 * plant.a0() >= 0;
            return new DesignObstacle(
                    String.format(
                            "the velocity weight rho2 is imaginary for every gamma: wn^2 (4 zeta^2 - 2) = %.6g must exceed"
                                    + " a1^2 - 2 a0 = %.6g%s",
                            Math.pow(target.naturalFrequencyRadPerSec(), 2) * (4 * zeta * zeta - 2),
                            plant.a1() * plant.a1() - 2 * plant.a0(),
                            dampingBound
                                    ? String.format(
                                            "; with damping ratio %.4g below 1/sqrt(2) (overshoot above about"
                                                    + " 4.3%%) no natural frequency can fix it. This is a limit of the"
                                                    + " certified method, not a fault of the plant: a loop this lightly"
                                                    + " damped is not the optimum of any real weights, so it cannot"
                                                    + " carry the H-infinity certificate; for a plant without"
                                                    + " stiffness (a0 = 0) the guaranteed-robust optimal loop cannot be"
                                                    + " damped below 1/sqrt(2)",
                                            zeta)
                                    : ""),
                    dampingBound);
        }
        return new DesignObstacle(
                String.format(
                        "no gamma makes the %s (its headroom D = %.6g is not positive)",
                        bound.condition().meaning(), bound.headroom().getAsDouble()),
                false);
    }
}
