package com.loopwright.api.robustness;

import static com.loopwright.api.robustness.VerifyLimits.DEFAULT_SEED;
import static com.loopwright.api.robustness.VerifyLimits.DEFAULT_TOLERANCE_PERCENT;
import static com.loopwright.api.robustness.VerifyLimits.MAX_ABS_AMPLITUDE;
import static com.loopwright.api.robustness.VerifyLimits.MAX_ACTUATOR_LIMIT;
import static com.loopwright.api.robustness.VerifyLimits.MAX_DISTURBANCES;
import static com.loopwright.api.robustness.VerifyLimits.MAX_FREQUENCY;
import static com.loopwright.api.robustness.VerifyLimits.MAX_FREQUENCY_POINTS;
import static com.loopwright.api.robustness.VerifyLimits.MAX_MONTE_CARLO_SAMPLES;
import static com.loopwright.api.robustness.VerifyLimits.MAX_SPREAD_PERCENT;
import static com.loopwright.api.robustness.VerifyLimits.MAX_TIME_SECONDS;
import static com.loopwright.api.robustness.VerifyLimits.MAX_TIME_SERIES_POINTS;
import static com.loopwright.api.robustness.VerifyLimits.MAX_TOLERANCE_PERCENT;
import static com.loopwright.api.robustness.VerifyLimits.MIN_SAMPLE_PERIOD;
import static com.loopwright.api.robustness.VerifyLimits.MIN_TIME_SERIES_POINTS;

import com.loopwright.api.problem.FieldError;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.plant.DisturbanceProfile;
import com.loopwright.solver.robustness.ParameterBox;
import com.loopwright.solver.robustness.RobustnessOptions;
import java.util.ArrayList;
import java.util.List;

/** Checks the verify options; adds every offending field (JSON pointer under {@code prefix}) to the list. */
public final class VerifyInputValidator {

    /** @return the options, or null when there were errors (they are in {@code errors}) */
    public ValidatedVerify validate(VerifyInput verify, CanonicalPlant plant, String prefix, List<FieldError> errors) {
        int before = errors.size();
        ParameterBox box = null;
        int samples = 0;
        long seed = DEFAULT_SEED;
        UncertaintyInput uncertainty = verify.uncertainty();
        if (uncertainty != null) {
            String p = prefix + "/uncertainty";
            double[] a0 = range(errors, p + "/a0", uncertainty.a0(), plant.a0());
            double[] a1 = range(errors, p + "/a1", uncertainty.a1(), plant.a1());
            double[] b = range(errors, p + "/b", uncertainty.b(), plant.b());
            double[] d = range(errors, p + "/d", uncertainty.d(), plant.d());
            if (b != null && b[0] <= 0 && b[1] >= 0) {
                errors.add(new FieldError(p + "/b", "the range of b must not contain 0 (the actuator would vanish)"));
            }
            if (uncertainty.monteCarloSamples() != null) {
                samples = uncertainty.monteCarloSamples();
                if (samples < 0 || samples > MAX_MONTE_CARLO_SAMPLES) {
                    errors.add(new FieldError(
                            p + "/monteCarloSamples", "must be from 0 to " + MAX_MONTE_CARLO_SAMPLES + " (the cap)"));
                }
            }
            if (uncertainty.seed() != null) {
                seed = uncertainty.seed();
            }
            if (errors.size() == before) {
                box = new ParameterBox(a0[0], a0[1], a1[0], a1[1], b[0], b[1], d[0], d[1]);
            }
        }
        List<DisturbanceProfile> profiles = new ArrayList<>();
        List<DisturbanceInput> disturbances = verify.disturbances() == null ? List.of() : verify.disturbances();
        if (disturbances.size() > MAX_DISTURBANCES) {
            errors.add(new FieldError(prefix + "/disturbances", "at most " + MAX_DISTURBANCES + " profiles (the cap)"));
        } else {
            for (int i = 0; i < disturbances.size(); i++) {
                DisturbanceProfile profile = profile(errors, prefix + "/disturbances/" + i, disturbances.get(i));
                if (profile != null) {
                    profiles.add(profile);
                }
            }
        }
        if (verify.actuatorLimit() != null
                && !(verify.actuatorLimit() > 0 && verify.actuatorLimit() <= MAX_ACTUATOR_LIMIT)) {
            errors.add(new FieldError(prefix + "/actuatorLimit", "must be positive and at most " + MAX_ACTUATOR_LIMIT));
        }
        Double samplePeriod = null;
        boolean findLongest = false;
        if (verify.sampling() != null) {
            samplePeriod = verify.sampling().samplePeriod();
            if (samplePeriod == null) {
                errors.add(new FieldError(prefix + "/sampling/samplePeriod", "required"));
            } else if (!(samplePeriod >= MIN_SAMPLE_PERIOD && samplePeriod <= MAX_TIME_SECONDS)) {
                errors.add(new FieldError(
                        prefix + "/sampling/samplePeriod",
                        "must be from " + MIN_SAMPLE_PERIOD + " to " + fmt(MAX_TIME_SECONDS) + " s"));
            }
            findLongest = Boolean.TRUE.equals(verify.sampling().findLongest());
        }
        if (verify.inputDelay() != null && !(verify.inputDelay() >= 0 && verify.inputDelay() <= MAX_TIME_SECONDS)) {
            errors.add(new FieldError(prefix + "/inputDelay", "must be from 0 to " + fmt(MAX_TIME_SECONDS) + " s"));
        }
        int frequencyPoints = verify.frequencyPoints() == null ? 0 : verify.frequencyPoints();
        if (frequencyPoints < 0 || frequencyPoints > MAX_FREQUENCY_POINTS) {
            errors.add(new FieldError(
                    prefix + "/frequencyPoints", "must be from 0 to " + MAX_FREQUENCY_POINTS + " (the cap)"));
        }
        int seriesPoints = verify.timeSeriesPoints() == null ? 0 : verify.timeSeriesPoints();
        if (verify.timeSeriesPoints() != null
                && (seriesPoints < MIN_TIME_SERIES_POINTS || seriesPoints > MAX_TIME_SERIES_POINTS)) {
            errors.add(new FieldError(
                    prefix + "/timeSeriesPoints",
                    "must be from " + MIN_TIME_SERIES_POINTS + " to " + MAX_TIME_SERIES_POINTS + " (the cap)"));
        }
        double tolerance = verify.tolerancePercent() == null ? DEFAULT_TOLERANCE_PERCENT : verify.tolerancePercent();
        if (!(tolerance >= 0 && tolerance <= MAX_TOLERANCE_PERCENT)) {
            errors.add(new FieldError(prefix + "/tolerancePercent", "must be from 0 to " + fmt(MAX_TOLERANCE_PERCENT)));
        }
        if (errors.size() > before) {
            return null;
        }
        return new ValidatedVerify(
                new RobustnessOptions(
                        box,
                        samples,
                        seed,
                        profiles,
                        verify.actuatorLimit(),
                        samplePeriod,
                        findLongest,
                        verify.inputDelay(),
                        frequencyPoints,
                        seriesPoints),
                tolerance / 100);
    }

    /** {lowest, highest} of one parameter, or null with an error. Absent: fixed at nominal. */
    public static double[] range(List<FieldError> errors, String pointer, ParameterRangeInput input, double nominal) {
        if (input == null) {
            return new double[] {nominal, nominal};
        }
        boolean relative = input.spreadPercent() != null;
        boolean absolute = input.lowest() != null || input.highest() != null;
        if (relative == absolute) {
            errors.add(new FieldError(pointer, "give either spreadPercent or both lowest and highest"));
            return null;
        }
        if (relative) {
            double percent = input.spreadPercent();
            if (!(percent >= 0 && percent <= MAX_SPREAD_PERCENT)) {
                errors.add(new FieldError(pointer + "/spreadPercent", "must be from 0 to " + fmt(MAX_SPREAD_PERCENT)));
                return null;
            }
            double spread = Math.abs(nominal) * percent / 100;
            return new double[] {nominal - spread, nominal + spread};
        }
        if (input.lowest() == null || input.highest() == null) {
            errors.add(new FieldError(
                    pointer + (input.lowest() == null ? "/lowest" : "/highest"), "required with the other bound"));
            return null;
        }
        double limit = 1e8;
        if (!(Math.abs(input.lowest()) <= limit && Math.abs(input.highest()) <= limit)) {
            errors.add(new FieldError(pointer, "bounds must be finite with magnitude at most 1e8"));
            return null;
        }
        if (input.lowest() > input.highest()) {
            errors.add(new FieldError(pointer + "/lowest", "must not exceed highest"));
            return null;
        }
        return new double[] {input.lowest(), input.highest()};
    }

    private static DisturbanceProfile profile(List<FieldError> errors, String pointer, DisturbanceInput input) {
        if (input == null || input.shape() == null) {
            errors.add(new FieldError(pointer + "/shape", "required: step, pulse, sinusoid or randomBounded"));
            return null;
        }
        int before = errors.size();
        Double amplitude = input.amplitude();
        if (amplitude == null || !(Math.abs(amplitude) <= MAX_ABS_AMPLITUDE)) {
            errors.add(new FieldError(pointer + "/amplitude", "required, magnitude at most " + MAX_ABS_AMPLITUDE));
        }
        double start = time(errors, pointer + "/start", input.start(), 0);
        String shape = input.shape();
        List<String> allowed = switch (shape) {
            case "step" -> List.of("start");
            case "pulse" -> List.of("start", "duration");
            case "sinusoid" -> List.of("frequency");
            case "randomBounded" -> List.of("holdTime", "seed");
            default -> null;
        };
        if (allowed == null) {
            errors.add(new FieldError(pointer + "/shape", "must be step, pulse, sinusoid or randomBounded"));
            return null;
        }
        notFor(errors, pointer, "start", input.start(), allowed, shape);
        notFor(errors, pointer, "duration", input.duration(), allowed, shape);
        notFor(errors, pointer, "frequency", input.frequency(), allowed, shape);
        notFor(errors, pointer, "holdTime", input.holdTime(), allowed, shape);
        notFor(errors, pointer, "seed", input.seed() == null ? null : 0.0, allowed, shape);
        DisturbanceProfile profile = null;
        switch (shape) {
            case "step" -> profile = errors.size() > before ? null : new DisturbanceProfile.Step(amplitude, start);
            case "pulse" -> {
                if (input.duration() == null || !(input.duration() > 0 && input.duration() <= MAX_TIME_SECONDS)) {
                    errors.add(new FieldError(
                            pointer + "/duration", "required, positive, at most " + fmt(MAX_TIME_SECONDS) + " s"));
                }
                profile = errors.size() > before
                        ? null
                        : new DisturbanceProfile.Pulse(amplitude, start, input.duration());
            }
            case "sinusoid" -> {
                if (input.frequency() == null || !(input.frequency() > 0 && input.frequency() <= MAX_FREQUENCY)) {
                    errors.add(new FieldError(
                            pointer + "/frequency", "required, positive, at most " + fmt(MAX_FREQUENCY) + " rad/s"));
                }
                profile = errors.size() > before ? null : new DisturbanceProfile.Sinusoid(amplitude, input.frequency());
            }
            default -> {
                if (input.holdTime() == null || !(input.holdTime() > 0 && input.holdTime() <= MAX_TIME_SECONDS)) {
                    errors.add(new FieldError(
                            pointer + "/holdTime", "required, positive, at most " + fmt(MAX_TIME_SECONDS) + " s"));
                }
                profile = errors.size() > before
                        ? null
                        : new DisturbanceProfile.BoundedRandom(
                                amplitude, input.holdTime(), input.seed() == null ? DEFAULT_SEED : input.seed());
            }
        }
        return profile;
    }

    private static void notFor(
            List<FieldError> errors, String pointer, String member, Double value, List<String> allowed, String shape) {
        if (value != null && !allowed.contains(member)) {
            errors.add(new FieldError(pointer + "/" + member, "not used by the " + shape + " shape"));
        }
    }

    private static double time(List<FieldError> errors, String pointer, Double value, double fallback) {
        if (value == null) {
            return fallback;
        }
        if (!(value >= 0 && value <= MAX_TIME_SECONDS)) {
            errors.add(new FieldError(pointer, "must be from 0 to " + fmt(MAX_TIME_SECONDS) + " s"));
            return fallback;
        }
        return value;
    }

    private static String fmt(double value) {
        return value == Math.rint(value) && Math.abs(value) < 1e6
                ? String.valueOf((long) value)
                : String.valueOf(value);
    }
}
