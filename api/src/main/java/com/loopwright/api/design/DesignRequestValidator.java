package com.loopwright.api.design;

import static com.loopwright.api.validation.FieldLimits.*;

import com.loopwright.api.loop.LoopInputValidator;
import com.loopwright.api.loop.ValidatedLoop;
import com.loopwright.api.plant.PlantInput;
import com.loopwright.api.plant.PlantInputValidator;
import com.loopwright.api.plant.ResolvedPlant;
import com.loopwright.api.problem.FieldError;
import com.loopwright.api.validation.Checks;
import com.loopwright.api.validation.InvalidRequestException;
import com.loopwright.api.validation.SpecInput;
import com.loopwright.solver.design.GammaChoice;
import com.loopwright.solver.spec.DesignSpec;
import com.loopwright.solver.spec.OvershootDamping;
import com.loopwright.solver.spec.TimeSpec;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/** Checks presence, finiteness, ranges and exclusive choices of a design request; reports every offending field. */
public final class DesignRequestValidator {

    private final PlantInputValidator plants = new PlantInputValidator();
    private final LoopInputValidator loops = new LoopInputValidator();

    /**
     * @throws InvalidRequestException            for missing, malformed or out-of-range fields (400)
     * @throws com.loopwright.solver.plant.PlantParameterException for a non-physical plant description (422); a
     *                                    description the api refuses itself raises a SolverFailure PLANT_MODEL
     */
    public ValidatedDesign validate(DesignRequest request) {
        List<FieldError> errors = new ArrayList<>();
        if (request == null) {
            throw new InvalidRequestException(List.of(new FieldError("", "a JSON object with plant and spec")));
        }
        PlantInput plant = request.plant();
        SpecInput spec = request.spec();
        ResolvedPlant resolved = null;
        if (plant == null) {
            errors.add(new FieldError("/plant", "required"));
        } else {
            resolved = plants.resolve(plant, errors);
        }
        if (spec == null) {
            errors.add(new FieldError("/spec", "required"));
            throw new InvalidRequestException(errors);
        }
        overshoot(errors, spec.overshootPercent());
        boolean settling = spec.settlingTime() != null;
        boolean rise = spec.riseTime() != null;
        if (settling && rise) {
            errors.add(new FieldError("/spec/riseTime", "give either settlingTime or riseTime, not both"));
        } else if (!settling && !rise) {
            errors.add(new FieldError("/spec/settlingTime", "required (or give riseTime instead)"));
        }
        Checks.range(errors, "/spec/settlingTime", spec.settlingTime(), MIN_TIME_SECONDS, MAX_TIME_SECONDS, false);
        Checks.range(errors, "/spec/riseTime", spec.riseTime(), MIN_TIME_SECONDS, MAX_TIME_SECONDS, false);
        Checks.range(
                errors,
                "/spec/settlingBandPercent",
                spec.settlingBandPercent(),
                MIN_BAND_PERCENT,
                MAX_BAND_PERCENT,
                false);
        if (spec.gamma() != null && spec.gammaMargin() != null) {
            errors.add(new FieldError("/spec/gammaMargin", "give either gamma or gammaMargin, not both"));
        }
        Checks.positive(errors, "/spec/gamma", spec.gamma(), MAX_GAMMA);
        if (spec.gammaMargin() != null && !(spec.gammaMargin() > 1 && spec.gammaMargin() <= MAX_GAMMA_MARGIN)) {
            errors.add(
                    new FieldError("/spec/gammaMargin", "must be above 1 and at most " + Checks.fmt(MAX_GAMMA_MARGIN)));
        }
        Checks.magnitude(errors, "/spec/stepSize", spec.stepSize(), Double.MIN_NORMAL, MAX_ABS_STEP, false);
        ValidatedLoop loop = loops.validate(request.loop(), errors);
        if (loop != null && rise) {
            errors.add(new FieldError(
                    "/spec/riseTime",
                    "integral action and position-only sensing are designed from settlingTime: give settlingTime"
                            + " instead"));
        }
        if (!errors.isEmpty()) {
            throw new InvalidRequestException(errors);
        }
        double band = (spec.settlingBandPercent() == null ? DEFAULT_BAND_PERCENT : spec.settlingBandPercent()) / 100;
        TimeSpec timeSpec = settling
                ? new TimeSpec.SettlingTime(spec.settlingTime(), band)
                : new TimeSpec.RiseTime(spec.riseTime());
        GammaChoice gamma = spec.gamma() != null
                ? new GammaChoice.Fixed(spec.gamma())
                : new GammaChoice.MarginOverMinimum(
                        spec.gammaMargin() == null ? DEFAULT_GAMMA_MARGIN : spec.gammaMargin());
        return new ValidatedDesign(
                resolved.canonical(),
                new DesignSpec(spec.overshootPercent() / 100, timeSpec),
                gamma,
                spec.stepSize() == null ? DEFAULT_STEP : spec.stepSize(),
                band,
                settling ? "/spec/settlingTime" : "/spec/riseTime",
                resolved,
                loop);
    }

    /**
     * Range check of the overshoot, with advice for the two commonest mistakes: zero (the exact overshoot formula
     * needs zeta &lt; 1) and a fraction typed as a percentage. The same advice for every design order.
     */
    public static void overshoot(List<FieldError> errors, Double overshootPercent) {
        String pointer = "/spec/overshootPercent";
        List<FieldError> found = new ArrayList<>(1);
        Checks.range(found, pointer, overshootPercent, MIN_OVERSHOOT_PERCENT, MAX_OVERSHOOT_PERCENT, true);
        if (found.isEmpty() || overshootPercent == null || !Double.isFinite(overshootPercent)) {
            errors.addAll(found);
            return;
        }
        String range = found.get(0).detail();
        if (overshootPercent == 0) {
            errors.add(new FieldError(
                    pointer,
                    range
                            + String.format(
                                    Locale.US,
                                    ". 0 %% asks for a critically damped loop (damping ratio 1), which has no overshoot"
                                            + " to match: the exact overshoot formula OS = exp(-pi zeta/sqrt(1 - zeta^2))"
                                            + " needs zeta < 1. Give the largest overshoot you accept; the smallest"
                                            + " accepted, %s %%, means damping ratio %.3g (0.1 %% means %.3g)",
                                    Checks.fmt(MIN_OVERSHOOT_PERCENT),
                                    OvershootDamping.dampingRatio(MIN_OVERSHOOT_PERCENT / 100),
                                    OvershootDamping.dampingRatio(FRACTION_SUSPECT_PERCENT / 100))));
        } else if (overshootPercent > 0 && overshootPercent < MIN_OVERSHOOT_PERCENT) {
            errors.add(new FieldError(
                    pointer,
                    range
                            + String.format(
                                    Locale.US,
                                    ". The value is in percent: %s looks like a fraction typed as a percentage (as a"
                                            + " fraction it is %s %%; send that number instead)",
                                    overshootPercent,
                                    Checks.fmt(100 * overshootPercent))));
        } else {
            errors.addAll(found);
        }
    }

    /** Overshoots below this percentage read like a fraction typed as a percentage. */
    static final double FRACTION_SUSPECT_PERCENT = 0.1;
}
