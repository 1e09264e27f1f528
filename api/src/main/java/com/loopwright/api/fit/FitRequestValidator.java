package com.loopwright.api.fit;

import static com.loopwright.api.fit.FitLimits.*;

import com.loopwright.api.problem.FieldError;
import com.loopwright.api.validation.Checks;
import com.loopwright.api.validation.InvalidRequestException;
import com.loopwright.solver.plant.FitOptions;
import com.loopwright.solver.plant.StepTestData;
import java.util.ArrayList;
import java.util.List;

/** Checks a fit request: array sizes, finite entries, increasing time, the step; reports every bad field. */
public final class FitRequestValidator {

    /** The step counts as clean when the input stays within this fraction of the step of its final value. */
    static final double CLEAN_STEP_TOLERANCE = 0.05;

    public ValidatedFit validate(FitRequest request) {
        if (request == null || request.samples() == null) {
            throw new InvalidRequestException(List.of(new FieldError("/samples", "required")));
        }
        List<FieldError> errors = new ArrayList<>();
        SamplesInput samples = request.samples();
        double[] time = array(errors, "/samples/time", samples.time(), MAX_ABS_TIME_SECONDS);
        double[] output = array(errors, "/samples/output", samples.output(), MAX_ABS_SIGNAL);
        double[] input =
                samples.input() == null ? null : array(errors, "/samples/input", samples.input(), MAX_ABS_SIGNAL);
        if (time != null) {
            for (int i = 1; i < time.length; i++) {
                if (!(time[i] > time[i - 1])) {
                    errors.add(new FieldError("/samples/time/" + i, "time must increase strictly"));
                    break;
                }
            }
        }
        if (time != null && output != null && output.length != time.length) {
            errors.add(new FieldError("/samples/output", "must have as many entries as time (" + time.length + ")"));
        }
        if (time != null && input != null && input.length != time.length) {
            errors.add(new FieldError("/samples/input", "must have as many entries as time (" + time.length + ")"));
        }
        if (input != null && request.stepAmplitude() != null) {
            errors.add(new FieldError("/stepAmplitude", "give either samples.input or stepAmplitude, not both"));
        }
        Checks.magnitude(errors, "/stepTime", request.stepTime(), 0, MAX_ABS_TIME_SECONDS, false);
        Checks.magnitude(errors, "/stepAmplitude", request.stepAmplitude(), Double.MIN_NORMAL, MAX_ABS_SIGNAL, false);
        if (!errors.isEmpty()) {
            throw new InvalidRequestException(errors);
        }
        FitNotes notes = FitNotes.NONE;
        double stepTime = request.stepTime() == null ? 0 : request.stepTime();
        double amplitude = request.stepAmplitude() == null ? 1 : request.stepAmplitude();
        String source = request.stepTime() == null && request.stepAmplitude() == null ? "default" : "request";
        if (input != null) {
            int tail = Math.max(1, input.length / 10);
            double initial = input[0];
            double last = 0;
            for (int i = input.length - tail; i < input.length; i++) {
                last += input[i] / tail;
            }
            amplitude = last - initial;
            if (amplitude == 0 || Math.abs(amplitude) < 1e-12 * Math.max(Math.abs(initial), Math.abs(last))) {
                throw new InvalidRequestException(List.of(new FieldError(
                        "/samples/input", "the logged input does not step: its final value equals its initial value")));
            }
            int stepIndex = 0;
            while (stepIndex < input.length && Math.abs(input[stepIndex] - initial) < 0.5 * Math.abs(amplitude)) {
                stepIndex++;
            }
            if (request.stepTime() == null) {
                stepTime = time[Math.min(stepIndex, time.length - 1)];
            }
            double worst = 0;
            for (int i = stepIndex; i < input.length; i++) {
                worst = Math.max(worst, Math.abs(input[i] - last));
            }
            for (int i = 0; i < stepIndex; i++) {
                worst = Math.max(worst, Math.abs(input[i] - initial));
            }
            if (worst > CLEAN_STEP_TOLERANCE * Math.abs(amplitude)) {
                notes = notes.with(
                        FitNotes.INPUT_NOT_CLEAN_STEP,
                        String.format(
                                "The logged input is not a clean step (it strays %.0f%% of the step from"
                                        + " its levels); the fit assumes an ideal step of %.6g at t = %.6g s.",
                                100 * worst / Math.abs(amplitude), amplitude, stepTime));
            }
            source = "input";
        }
        // The step must come before the last sample, or there is no response to fit.
        if (!(stepTime < time[time.length - 1])) {
            throw new InvalidRequestException(List.of(new FieldError(
                    request.stepTime() != null ? "/stepTime" : "/samples/time",
                    "the step at t = " + stepTime + " s is not before the last sample (t = " + time[time.length - 1]
                            + " s): the record holds no response")));
        }
        FitOptions options = new FitOptions(
                Boolean.TRUE.equals(request.estimateDeadTime()),
                request.estimateInitialOffset() == null || request.estimateInitialOffset());
        return new ValidatedFit(new StepTestData(time, output, stepTime, amplitude), options, source, notes);
    }

    /** Entries finite, count within [MIN_SAMPLES, MAX_SAMPLES]; the first bad entry is named. */
    private static double[] array(List<FieldError> errors, String pointer, List<Double> values, double maxAbs) {
        if (values == null) {
            errors.add(new FieldError(pointer, "required"));
            return null;
        }
        if (values.size() < MIN_SAMPLES || values.size() > MAX_SAMPLES) {
            errors.add(new FieldError(pointer, "must have from " + MIN_SAMPLES + " to " + MAX_SAMPLES + " samples"));
            return null;
        }
        double[] out = new double[values.size()];
        for (int i = 0; i < out.length; i++) {
            Double value = values.get(i);
            if (value == null || !Double.isFinite(value) || Math.abs(value) > maxAbs) {
                errors.add(new FieldError(
                        pointer + "/" + i, "must be a finite number of magnitude at most " + Checks.fmt(maxAbs)));
                return null;
            }
            out[i] = value;
        }
        return out;
    }
}
