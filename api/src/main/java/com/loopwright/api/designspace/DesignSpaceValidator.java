package com.loopwright.api.designspace;

import static com.loopwright.api.validation.FieldLimits.DEFAULT_BAND_PERCENT;
import static com.loopwright.api.validation.FieldLimits.DEFAULT_STEP;
import static com.loopwright.api.validation.FieldLimits.MAX_ABS_STEP;
import static com.loopwright.api.validation.FieldLimits.MAX_BAND_PERCENT;
import static com.loopwright.api.validation.FieldLimits.MAX_OVERSHOOT_PERCENT;
import static com.loopwright.api.validation.FieldLimits.MAX_TIME_SECONDS;
import static com.loopwright.api.validation.FieldLimits.MIN_BAND_PERCENT;
import static com.loopwright.api.validation.FieldLimits.MIN_OVERSHOOT_PERCENT;
import static com.loopwright.api.validation.FieldLimits.MIN_TIME_SECONDS;

import com.loopwright.api.design.DesignRequestValidator;
import com.loopwright.api.plant.PlantInputValidator;
import com.loopwright.api.plant.ResolvedPlant;
import com.loopwright.api.problem.FieldError;
import com.loopwright.api.robustness.ValidatedVerify;
import com.loopwright.api.robustness.VerifyInput;
import com.loopwright.api.robustness.VerifyInputValidator;
import com.loopwright.api.robustness.VerifyLimits;
import com.loopwright.api.validation.Checks;
import com.loopwright.api.validation.InvalidRequestException;
import com.loopwright.api.validation.SpecInput;
import com.loopwright.solver.design.DesignSpaceGrid;
import com.loopwright.solver.pipeline.DesignSpaceOptions;
import com.loopwright.solver.robustness.RobustnessOptions;
import java.util.ArrayList;
import java.util.List;

/**
 * Checks a design-space request and reports every offending field. The box, the actuator limit and the tolerance
 * are checked by the verify object's validator (the same shape and ranges as verify.uncertainty); the axis counts
 * and box samples above their caps are left to the front door, which answers 422 cap-exceeded.
 */
final class DesignSpaceValidator {

    private final PlantInputValidator plants = new PlantInputValidator();
    private final VerifyInputValidator verify = new VerifyInputValidator();

    ValidatedDesignSpace validate(DesignSpaceRequest request) {
        if (request == null) {
            throw new InvalidRequestException(List.of(new FieldError("", "a JSON object with plant and the axes")));
        }
        List<FieldError> errors = new ArrayList<>();
        ResolvedPlant plant = null;
        if (request.plant() == null) {
            errors.add(new FieldError("/plant", "required"));
        } else {
            plant = plants.resolve(request.plant(), errors);
        }
        boolean settling = request.settlingTime() != null;
        if (settling && request.riseTime() != null) {
            errors.add(new FieldError("/riseTime", "give either settlingTime or riseTime, not both"));
        } else if (!settling && request.riseTime() == null) {
            errors.add(new FieldError("/settlingTime", "required (or give riseTime instead)"));
        }
        String timePointer = settling ? "/settlingTime" : "/riseTime";
        AxisInput time = settling ? request.settlingTime() : request.riseTime();
        axis(errors, timePointer, time, MIN_TIME_SECONDS, MAX_TIME_SECONDS);
        if (request.overshootPercent() == null) {
            errors.add(new FieldError("/overshootPercent", "required"));
        } else {
            axis(errors, "/overshootPercent", request.overshootPercent(), MIN_OVERSHOOT_PERCENT, MAX_OVERSHOOT_PERCENT);
        }
        Checks.range(
                errors,
                "/settlingBandPercent",
                request.settlingBandPercent(),
                MIN_BAND_PERCENT,
                MAX_BAND_PERCENT,
                false);
        Checks.range(
                errors,
                "/samplePeriod",
                request.samplePeriod(),
                VerifyLimits.MIN_SAMPLE_PERIOD,
                VerifyLimits.MAX_TIME_SECONDS,
                false);
        Checks.magnitude(errors, "/stepSize", request.stepSize(), Double.MIN_NORMAL, MAX_ABS_STEP, false);
        spec(errors, request.spec(), settling);
        ValidatedVerify checks = null;
        if (plant != null) {
            checks = verify.validate(
                    new VerifyInput(
                            request.uncertainty(),
                            null,
                            request.actuatorLimit(),
                            null,
                            null,
                            null,
                            null,
                            request.tolerancePercent()),
                    plant.canonical(),
                    "",
                    errors);
        }
        if (!errors.isEmpty()) {
            throw new InvalidRequestException(VerifyLimits.capped(errors));
        }
        double band =
                (request.settlingBandPercent() == null ? DEFAULT_BAND_PERCENT : request.settlingBandPercent()) / 100;
        DesignSpaceGrid grid = new DesignSpaceGrid(
                settling,
                time.lowest(),
                time.highest(),
                time.count(),
                request.overshootPercent().lowest(),
                request.overshootPercent().highest(),
                request.overshootPercent().count(),
                band);
        RobustnessOptions robustness = checks.options();
        DesignSpaceOptions options = new DesignSpaceOptions(
                robustness.actuatorLimit(),
                request.samplePeriod(),
                request.stepSize() == null ? DEFAULT_STEP : request.stepSize(),
                robustness.parameterBox(),
                robustness.monteCarloSamples(),
                robustness.seed(),
                checks.toleranceFraction());
        SpecInput spec = request.spec();
        return new ValidatedDesignSpace(
                plant.canonical(),
                grid,
                options,
                spec == null ? null : settling ? spec.settlingTime() : spec.riseTime(),
                spec == null ? null : spec.overshootPercent());
    }

    /** lowest &lt; highest inside [min, max]; count from 2 (above the cap is the front door's 422). */
    private static void axis(List<FieldError> errors, String pointer, AxisInput axis, double min, double max) {
        if (axis == null) {
            return;
        }
        int before = errors.size();
        Checks.range(errors, pointer + "/lowest", axis.lowest(), min, max, true);
        Checks.range(errors, pointer + "/highest", axis.highest(), min, max, true);
        if (errors.size() == before && !(axis.lowest() < axis.highest())) {
            errors.add(new FieldError(pointer + "/highest", "must be above lowest"));
        }
        if (axis.count() == null) {
            errors.add(new FieldError(pointer + "/count", "required"));
        } else if (axis.count() < 2) {
            errors.add(new FieldError(pointer + "/count", "at least 2"));
        }
    }

    /** The spec to mark: the axis's time spec and the overshoot; the design-only members are refused. */
    private static void spec(List<FieldError> errors, SpecInput spec, boolean settling) {
        if (spec == null) {
            return;
        }
        DesignRequestValidator.overshoot(errors, spec.overshootPercent());
        String time = settling ? "settlingTime" : "riseTime";
        String other = settling ? "riseTime" : "settlingTime";
        Checks.range(
                errors,
                "/spec/" + time,
                settling ? spec.settlingTime() : spec.riseTime(),
                MIN_TIME_SECONDS,
                MAX_TIME_SECONDS,
                true);
        if ((settling ? spec.riseTime() : spec.settlingTime()) != null) {
            errors.add(new FieldError("/spec/" + other, "the map's time axis is " + time + "; mark a " + time));
        }
        refuse(errors, "/spec/settlingBandPercent", spec.settlingBandPercent(), "give it at the top level");
        refuse(errors, "/spec/gamma", spec.gamma(), "a map reports gammaMin per cell");
        refuse(errors, "/spec/gammaMargin", spec.gammaMargin(), "a map reports gammaMin per cell");
        refuse(errors, "/spec/stepSize", spec.stepSize(), "give it at the top level");
    }

    private static void refuse(List<FieldError> errors, String pointer, Double value, String why) {
        if (value != null) {
            errors.add(new FieldError(pointer, "not used by a design-space map: " + why));
        }
    }
}
