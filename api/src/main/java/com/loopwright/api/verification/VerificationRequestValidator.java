package com.loopwright.api.verification;

import static com.loopwright.api.robustness.VerifyLimits.MAX_ABS_GAIN;
import static com.loopwright.api.robustness.VerifyLimits.MAX_WEIGHT;
import static com.loopwright.api.validation.FieldLimits.DEFAULT_BAND_PERCENT;
import static com.loopwright.api.validation.FieldLimits.DEFAULT_STEP;
import static com.loopwright.api.validation.FieldLimits.MAX_ABS_A0;
import static com.loopwright.api.validation.FieldLimits.MAX_ABS_A1;
import static com.loopwright.api.validation.FieldLimits.MAX_ABS_B;
import static com.loopwright.api.validation.FieldLimits.MAX_ABS_D;
import static com.loopwright.api.validation.FieldLimits.MAX_ABS_STEP;
import static com.loopwright.api.validation.FieldLimits.MAX_BAND_PERCENT;
import static com.loopwright.api.validation.FieldLimits.MAX_GAMMA;
import static com.loopwright.api.validation.FieldLimits.MAX_OVERSHOOT_PERCENT;
import static com.loopwright.api.validation.FieldLimits.MAX_TIME_SECONDS;
import static com.loopwright.api.validation.FieldLimits.MIN_ABS_B;
import static com.loopwright.api.validation.FieldLimits.MIN_BAND_PERCENT;
import static com.loopwright.api.validation.FieldLimits.MIN_OVERSHOOT_PERCENT;
import static com.loopwright.api.validation.FieldLimits.MIN_TIME_SECONDS;

import com.loopwright.api.loop.LoopInputValidator;
import com.loopwright.api.loop.LoopLimits;
import com.loopwright.api.problem.FieldError;
import com.loopwright.api.robustness.ValidatedVerify;
import com.loopwright.api.robustness.VerifyInput;
import com.loopwright.api.robustness.VerifyInputValidator;
import com.loopwright.api.robustness.VerifyLimits;
import com.loopwright.api.validation.Checks;
import com.loopwright.api.validation.InvalidRequestException;
import com.loopwright.api.validation.SpecInput;
import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.pipeline.LoopCheckPipeline;
import com.loopwright.solver.pipeline.ObserverChoice;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.robustness.AcceptanceLimits;
import java.util.ArrayList;
import java.util.List;

/** Checks a verification request; reports every offending field with its JSON pointer. */
public final class VerificationRequestValidator {

    private final VerifyInputValidator verifyValidator = new VerifyInputValidator();
    private final LoopInputValidator loops = new LoopInputValidator();

    public ValidatedVerification validate(VerificationRequest request) {
        if (request == null) {
            throw new InvalidRequestException(List.of(new FieldError("", "a JSON object with plant and gain")));
        }
        List<FieldError> errors = new ArrayList<>();
        VerificationPlantInput plant = request.plant();
        if (plant == null) {
            errors.add(new FieldError("/plant", "required"));
        } else {
            if (!VerificationPlantInput.CANONICAL_FORM.equals(plant.form())) {
                errors.add(new FieldError(
                        "/plant/form",
                        (plant.form() == null ? "required: " : "not taken here: ")
                                + "\"canonical\", the only form /v1/verifications takes (the gains act on the"
                                + " canonical states x1, x2)"));
            }
            Checks.magnitude(errors, "/plant/a0", plant.a0(), 0, MAX_ABS_A0, true);
            Checks.magnitude(errors, "/plant/a1", plant.a1(), 0, MAX_ABS_A1, true);
            Checks.magnitude(errors, "/plant/b", plant.b(), MIN_ABS_B, MAX_ABS_B, true);
            Checks.magnitude(errors, "/plant/d", plant.d(), 0, MAX_ABS_D, true);
        }
        GainInput gain = request.gain();
        if (gain == null) {
            errors.add(new FieldError("/gain", "required"));
        } else {
            Checks.magnitude(errors, "/gain/k1", gain.k1(), 0, MAX_ABS_GAIN, true);
            Checks.magnitude(errors, "/gain/k2", gain.k2(), 0, MAX_ABS_GAIN, true);
            Checks.magnitude(errors, "/gain/referenceGain", gain.referenceGain(), 0, MAX_ABS_GAIN, true);
            Checks.magnitude(errors, "/gain/integralGain", gain.integralGain(), 0, MAX_ABS_GAIN, false);
        }
        ObserverChoice.Kalman kalman = loopFields(request, errors);
        SpecInput spec = request.spec();
        Double settling = null;
        Double rise = null;
        Double overshoot = null;
        double band = DEFAULT_BAND_PERCENT / 100;
        double step = DEFAULT_STEP;
        if (spec != null) {
            settling = spec.settlingTime();
            rise = spec.riseTime();
            overshoot = spec.overshootPercent();
            range(errors, "/spec/overshootPercent", overshoot, MIN_OVERSHOOT_PERCENT, MAX_OVERSHOOT_PERCENT);
            range(errors, "/spec/settlingTime", settling, MIN_TIME_SECONDS, MAX_TIME_SECONDS);
            range(errors, "/spec/riseTime", rise, MIN_TIME_SECONDS, MAX_TIME_SECONDS);
            range(errors, "/spec/settlingBandPercent", spec.settlingBandPercent(), MIN_BAND_PERCENT, MAX_BAND_PERCENT);
            Checks.magnitude(errors, "/spec/stepSize", spec.stepSize(), Double.MIN_NORMAL, MAX_ABS_STEP, false);
            if (spec.gamma() != null) {
                errors.add(new FieldError("/spec/gamma", "not used by verifications; give performance.gamma"));
            }
            if (spec.gammaMargin() != null) {
                errors.add(new FieldError("/spec/gammaMargin", "not used by verifications"));
            }
            if (spec.settlingBandPercent() != null) {
                band = spec.settlingBandPercent() / 100;
            }
            if (spec.stepSize() != null) {
                step = spec.stepSize();
            }
        }
        PerformanceInput performance = request.performance();
        if (performance != null) {
            if (performance.rho1() == null || !(performance.rho1() >= 0 && performance.rho1() <= MAX_WEIGHT)) {
                errors.add(new FieldError("/performance/rho1", "required, from 0 to " + MAX_WEIGHT));
            }
            if (performance.rho2() == null || !(performance.rho2() >= 0 && performance.rho2() <= MAX_WEIGHT)) {
                errors.add(new FieldError("/performance/rho2", "required, from 0 to " + MAX_WEIGHT));
            }
            if (performance.gamma() != null && !(performance.gamma() > 0 && performance.gamma() <= MAX_GAMMA)) {
                errors.add(new FieldError("/performance/gamma", "must be positive and at most " + MAX_GAMMA));
            }
        }
        if (!errors.isEmpty()) {
            throw new InvalidRequestException(VerifyLimits.capped(errors));
        }
        CanonicalPlant canonical = new CanonicalPlant(plant.a0(), plant.a1(), plant.b(), plant.d());
        ValidatedVerify verify = verifyValidator.validate(
                request.verify() == null
                        ? new VerifyInput(null, null, null, null, null, null, null, null)
                        : request.verify(),
                canonical,
                "/verify",
                errors);
        if (!errors.isEmpty()) {
            throw new InvalidRequestException(VerifyLimits.capped(errors));
        }
        return new ValidatedVerification(
                canonical,
                new FeedbackGains(gain.k1(), gain.k2(), gain.referenceGain()),
                step,
                new AcceptanceLimits(settling, rise, overshoot, band),
                performance == null ? null : performance.rho1(),
                performance == null ? null : performance.rho2(),
                performance == null ? null : performance.gamma(),
                verify,
                request.asksForLoop()
                        ? new LoopCheckPipeline.Request(
                                canonical,
                                new double[] {gain.k1(), gain.k2()},
                                gain.integralGain() == null ? 0 : gain.integralGain(),
                                gain.referenceGain(),
                                request.observerGain() == null
                                        ? null
                                        : request.observerGain().stream()
                                                .mapToDouble(Double::doubleValue)
                                                .toArray(),
                                kalman,
                                performance == null ? null : performance.rho1(),
                                performance == null ? null : performance.rho2(),
                                request.loadStepSize() == null ? LoopLimits.DEFAULT_LOAD_STEP : request.loadStepSize(),
                                band,
                                settling)
                        : null);
    }

    /**
     * measurement, observerGain, observer and loadStepSize: the observer gain is the caller's or a kalman observer
     * designed for it, only with position sensing.
     *
     * @return the kalman observer asked for, or null
     */
    private ObserverChoice.Kalman loopFields(VerificationRequest request, List<FieldError> errors) {
        String measurement = request.measurement() == null ? LoopLimits.FULL_STATE : request.measurement();
        boolean position = LoopLimits.POSITION.equals(measurement);
        if (!position && !LoopLimits.FULL_STATE.equals(measurement)) {
            errors.add(new FieldError(
                    "/measurement", "must be \"" + LoopLimits.FULL_STATE + "\" or \"" + LoopLimits.POSITION + "\""));
            return null;
        }
        Checks.magnitude(
                errors,
                "/loadStepSize",
                request.loadStepSize(),
                LoopLimits.MIN_ABS_LOAD_STEP,
                LoopLimits.MAX_ABS_LOAD_STEP,
                false);
        List<Double> observerGain = request.observerGain();
        if (!position) {
            if (observerGain != null) {
                errors.add(new FieldError("/observerGain", "only with measurement \"position\""));
            }
            if (request.observer() != null) {
                errors.add(new FieldError("/observer", "only with measurement \"position\""));
            }
            return null;
        }
        if (observerGain != null && request.observer() != null) {
            errors.add(new FieldError("/observer", "give either observerGain or observer, not both"));
            return null;
        }
        if (observerGain != null) {
            if (observerGain.size() != 2) {
                errors.add(new FieldError("/observerGain", "needs two entries [l1, l2], got " + observerGain.size()));
                return null;
            }
            for (int i = 0; i < 2; i++) {
                Checks.magnitude(errors, "/observerGain/" + i, observerGain.get(i), 0, MAX_ABS_GAIN, true);
            }
            return null;
        }
        if (request.observer() == null) {
            errors.add(new FieldError(
                    "/observerGain", "required with measurement \"position\" (or ask for a kalman observer)"));
            return null;
        }
        if (!LoopLimits.KALMAN.equals(request.observer().method())) {
            errors.add(new FieldError(
                    "/observer/method",
                    "must be \"kalman\" here: the poleMultiple observer multiplies designed poles; for your own gains"
                            + " give observerGain or ask for a kalman observer"));
            return null;
        }
        return (ObserverChoice.Kalman) loops.observerChoice(request.observer(), errors);
    }

    private static void range(List<FieldError> errors, String pointer, Double value, double min, double max) {
        if (value != null && !(value >= min && value <= max)) {
            errors.add(new FieldError(pointer, "must be a finite number from " + min + " to " + max));
        }
    }
}
