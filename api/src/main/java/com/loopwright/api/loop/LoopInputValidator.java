package com.loopwright.api.loop;

import static com.loopwright.api.loop.LoopLimits.*;

import com.loopwright.api.problem.FieldError;
import com.loopwright.api.validation.Checks;
import com.loopwright.solver.pipeline.LoopStructure;
import com.loopwright.solver.pipeline.ObserverChoice;
import java.util.List;

/**
 * The one validator of the loop-structure fields of both design requests: ranges, exclusive choices and fields that
 * belong to a choice not made, each reported at its pointer. Stateless.
 */
public final class LoopInputValidator {

    /**
     * @param loop   the fields as sent
     * @param errors where field errors go
     * @return the loop structure, or null when the fields are all absent (today's plain design) or invalid
     */
    public ValidatedLoop validate(LoopInput loop, List<FieldError> errors) {
        if (loop == null || loop.absent()) {
            return null;
        }
        int before = errors.size();
        boolean integral = Boolean.TRUE.equals(loop.integralAction());
        if (loop.integralPoleMultiple() != null && !integral) {
            errors.add(new FieldError("/integralPoleMultiple", "only with integralAction true"));
        }
        Checks.range(
                errors,
                "/integralPoleMultiple",
                loop.integralPoleMultiple(),
                MIN_INTEGRAL_POLE_MULTIPLE,
                MAX_INTEGRAL_POLE_MULTIPLE,
                false);
        String measurement = loop.measurement() == null ? FULL_STATE : loop.measurement();
        boolean position = POSITION.equals(measurement);
        if (!position && !FULL_STATE.equals(measurement)) {
            errors.add(new FieldError("/measurement", "must be \"" + FULL_STATE + "\" or \"" + POSITION + "\""));
        } else if (!position && loop.observer() != null) {
            errors.add(new FieldError(
                    "/observer", "only with measurement \"position\": full-state sensing needs no observer"));
        }
        if (!integral && !position) {
            errors.add(new FieldError(
                    loop.loadStepSize() != null ? "/loadStepSize" : "/integralAction",
                    "the loop fields need integralAction true or measurement \"position\" (without either the"
                            + " design is the plain full-state loop)"));
        }
        Checks.magnitude(errors, "/loadStepSize", loop.loadStepSize(), MIN_ABS_LOAD_STEP, MAX_ABS_LOAD_STEP, false);
        ObserverChoice observer = position ? observer(loop.observer(), errors) : null;
        if (errors.size() > before) {
            return null;
        }
        return new ValidatedLoop(
                new LoopStructure(
                        integral,
                        loop.integralPoleMultiple() == null
                                ? DEFAULT_INTEGRAL_POLE_MULTIPLE
                                : loop.integralPoleMultiple(),
                        position ? LoopStructure.Measurement.POSITION : LoopStructure.Measurement.FULL_STATE,
                        observer),
                loop.loadStepSize() == null ? DEFAULT_LOAD_STEP : loop.loadStepSize(),
                position && loop.observer() != null ? loop.observer().samplePeriod() : null);
    }

    /**
     * The observer object alone (pointers under /observer), for POST /v1/verifications.
     *
     * @return the choice, or null when invalid (errors added)
     */
    public ObserverChoice observerChoice(ObserverInput input, List<FieldError> errors) {
        return observer(input, errors);
    }

    /** The observer choice; poles at the default multiple when the caller gives none. */
    private static ObserverChoice observer(ObserverInput input, List<FieldError> errors) {
        if (input == null) {
            return new ObserverChoice.PoleMultiple(DEFAULT_OBSERVER_MULTIPLE);
        }
        String method = input.method();
        if (KALMAN.equals(method)) {
            return kalman(input, errors);
        }
        if (POLE_MULTIPLE.equals(method)) {
            notFor(errors, "processNoise", input.processNoise(), POLE_MULTIPLE);
            notFor(errors, "measurementNoise", input.measurementNoise(), POLE_MULTIPLE);
            notFor(errors, "sensorResolution", input.sensorResolution(), POLE_MULTIPLE);
            notFor(errors, "samplePeriod", input.samplePeriod(), POLE_MULTIPLE);
            Checks.range(
                    errors,
                    "/observer/multiple",
                    input.multiple(),
                    MIN_OBSERVER_MULTIPLE,
                    MAX_OBSERVER_MULTIPLE,
                    false);
            double multiple = input.multiple() == null ? DEFAULT_OBSERVER_MULTIPLE : input.multiple();
            return Double.isFinite(multiple) && multiple > 0 ? new ObserverChoice.PoleMultiple(multiple) : null;
        }
        errors.add(new FieldError(
                "/observer/method",
                method == null ? "required" : "must be \"" + KALMAN + "\" or \"" + POLE_MULTIPLE + "\""));
        return null;
    }

    private static ObserverChoice kalman(ObserverInput input, List<FieldError> errors) {
        int before = errors.size();
        notFor(errors, "multiple", input.multiple(), KALMAN);
        Checks.range(
                errors, "/observer/processNoise", input.processNoise(), MIN_NOISE_INTENSITY, MAX_NOISE_INTENSITY, true);
        boolean noise = input.measurementNoise() != null;
        boolean sensor = input.sensorResolution() != null || input.samplePeriod() != null;
        if (noise && sensor) {
            errors.add(new FieldError(
                    "/observer/measurementNoise", "give either measurementNoise or sensorResolution and samplePeriod"));
        } else if (noise) {
            Checks.range(
                    errors,
                    "/observer/measurementNoise",
                    input.measurementNoise(),
                    MIN_NOISE_INTENSITY,
                    MAX_NOISE_INTENSITY,
                    true);
        } else if (sensor) {
            Checks.range(
                    errors,
                    "/observer/sensorResolution",
                    input.sensorResolution(),
                    MIN_SENSOR_RESOLUTION,
                    MAX_SENSOR_RESOLUTION,
                    true);
            Checks.range(
                    errors, "/observer/samplePeriod", input.samplePeriod(), MIN_SAMPLE_PERIOD, MAX_SAMPLE_PERIOD, true);
        } else {
            errors.add(new FieldError(
                    "/observer/measurementNoise",
                    "required for the Kalman observer (or give sensorResolution and samplePeriod)"));
        }
        if (errors.size() > before) {
            return null;
        }
        return noise
                ? new ObserverChoice.Kalman(input.processNoise(), input.measurementNoise())
                : ObserverChoice.Kalman.fromResolution(
                        input.processNoise(), input.sensorResolution(), input.samplePeriod());
    }

    private static void notFor(List<FieldError> errors, String field, Double value, String method) {
        if (value != null) {
            errors.add(new FieldError("/observer/" + field, "not a field of the \"" + method + "\" observer"));
        }
    }
}
