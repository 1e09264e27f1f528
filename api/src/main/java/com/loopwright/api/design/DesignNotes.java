package com.loopwright.api.design;

import com.loopwright.solver.design.ClosedFormDesign;
import com.loopwright.solver.design.StepMetrics;
import com.loopwright.solver.pipeline.DesignReport;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.spec.SpecInversion;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * The notes of a design response, each with a stable machine-readable code in a parallel list (same order):
 * the notes stay the plain strings clients already show, and a client that acts on a note matches its code.
 * Notes are advice and sanity warnings, never errors: a request that gets a note still gets its design.
 *
 * @param texts the notes, in engineering words
 * @param codes the code of each note, index for index
 */
public record DesignNotes(List<String> texts, List<String> codes) {

    /** Exact and handbook natural frequency side by side (every design). */
    public static final String EXACT_INVERSION = "exactInversion";
    /** A step-response peak near the settling band edge. */
    public static final String SETTLING_BAND_TOUCH = "settlingBandTouch";
    /** No disturbance input: gamma is free. */
    public static final String GAMMA_FREE = "gammaFree";
    /** The gamma that minimizes the disturbance-to-position bound. */
    public static final String POSITION_BOUND_BEST_GAMMA = "positionBoundBestGamma";
    /** An ill-conditioned state-space description. */
    public static final String PLANT_CONDITIONING = "plantConditioning";
    /** An overshoot below 0.1 % that reads like a fraction typed as a percentage. */
    public static final String OVERSHOOT_LOOKS_LIKE_FRACTION = "overshootLooksLikeFraction";
    /** Peak command far above verify.actuatorLimit. */
    public static final String PEAK_COMMAND_ABOVE_ACTUATOR_LIMIT = "peakCommandAboveActuatorLimit";
    /** Peak command above 1e3 times the plant's own command scale. */
    public static final String PEAK_COMMAND_ABOVE_PLANT_SCALE = "peakCommandAbovePlantScale";
    /** Settling time shorter than 10 sample periods of verify.sampling. */
    public static final String SETTLING_WITHIN_FEW_SAMPLES = "settlingWithinFewSamples";

    /** At most this many notes (the contract's maxItems). */
    public static final int MAX_NOTES = 16;
    /** Overshoots below this percentage get the fraction-typed-as-percentage advice. */
    static final double FRACTION_SUSPECT_PERCENT = DesignRequestValidator.FRACTION_SUSPECT_PERCENT;
    /** Relative rounding of percent -> fraction -> percent. */
    private static final double PERCENT_ROUND_TRIP = 1e-12;
    /** "Far above" the actuator limit: the simulated peak command exceeds the limit by more than this factor. */
    static final double ACTUATOR_LIMIT_FACTOR = 10;
    /** The peak command per unit step may exceed the plant's own command scale by at most this factor. */
    static final double PLANT_SCALE_FACTOR = 1e3;
    /** A sampled law should settle over at least this many sample periods (common practice: 10 or more). */
    static final int MIN_SAMPLES_PER_SETTLING = 10;

    public DesignNotes {
        texts = List.copyOf(texts);
        codes = List.copyOf(codes);
        if (texts.size() != codes.size()) {
            throw new IllegalArgumentException("one code per note");
        }
    }

    /**
     * What the service can check without more input, plus the checks the request made possible.
     *
     * @param overshootPercent      the overshoot as sent [%]
     * @param actuatorLimit         verify.actuatorLimit in u units, or null
     * @param samplePeriod   verify.sampling.samplePeriod [s], or null
     * @param conditionNote         the ill-conditioning note of a state-space plant, or null
     */
    static DesignNotes of(
            DesignReport report,
            double overshootPercent,
            Double actuatorLimit,
            Double samplePeriod,
            String conditionNote) {
        Builder notes = new Builder();
        ClosedFormDesign design = report.design();
        SpecInversion inversion = report.inversion();
        double exactWn = design.target().naturalFrequencyRadPerSec();
        double handbookWn = inversion.handbookNaturalFrequencyRadPerSec();
        notes.add(
                EXACT_INVERSION,
                String.format(
                        Locale.US,
                        "Exact inversion gives wn = %.6g rad/s; the handbook rule would give %.6g rad/s (%+.1f%%).",
                        exactWn,
                        handbookWn,
                        100 * (handbookWn - exactWn) / exactWn));
        if (inversion.nearBandTouch()) {
            notes.add(
                    SETTLING_BAND_TOUCH,
                    "A peak of the step response lies within 5% of the settling band edge: the settling time"
                            + " jumps for small changes in damping, so expect it to be sensitive to model error.");
        }
        if (design.plant().d() == 0) {
            notes.add(
                    GAMMA_FREE, "The plant has no disturbance input (d = 0): gamma is free and the bound is trivial.");
        } else {
            design.positionCertificateBestGamma()
                    .ifPresent(best -> notes.add(
                            POSITION_BOUND_BEST_GAMMA,
                            String.format(
                                    Locale.US,
                                    "gamma = %.6g minimizes the disturbance-to-position bound gamma/rho1 for this"
                                            + " spec.",
                                    best)));
        }
        if (conditionNote != null) {
            notes.add(PLANT_CONDITIONING, conditionNote);
        }
        overshootFractionNote(overshootPercent, design.target().dampingRatio())
                .ifPresent(text -> notes.add(OVERSHOOT_LOOKS_LIKE_FRACTION, text));
        StepMetrics metrics = report.stepMetrics();
        double peakCommand = metrics.peakControl();
        if (actuatorLimit != null && peakCommand > ACTUATOR_LIMIT_FACTOR * actuatorLimit) {
            notes.add(
                    PEAK_COMMAND_ABOVE_ACTUATOR_LIMIT,
                    String.format(
                            Locale.US,
                            "The peak command of the unsaturated step, %.4g, is %.3g times verify.actuatorLimit = %.4g:"
                                    + " the loop will spend the step in saturation. Ask for a slower time spec or a"
                                    + " smaller stepSize, or check the limit's units.",
                            peakCommand,
                            peakCommand / actuatorLimit,
                            actuatorLimit));
        }
        double scale = plantCommandScale(design.plant()) * Math.abs(report.stepSize());
        if (scale > 0 && peakCommand > PLANT_SCALE_FACTOR * scale) {
            notes.add(
                    PEAK_COMMAND_ABOVE_PLANT_SCALE,
                    String.format(
                            Locale.US,
                            "The peak command, %.4g, is %.3g times the plant's own command scale for this step,"
                                    + " %.4g ((|a0| + |a1| wp + wp^2)/|b| with wp = sqrt|a0| = %.4g rad/s,"
                                    + " times |stepSize|): the spec asks for a loop far faster than the plant moves"
                                    + " by itself. Check the units of the coefficients and the time spec.",
                            peakCommand,
                            peakCommand / scale,
                            scale,
                            ownFrequency(design.plant())));
        }
        double settling = metrics.settlingTimeSeconds();
        if (samplePeriod != null && settling < MIN_SAMPLES_PER_SETTLING * samplePeriod) {
            notes.add(
                    SETTLING_WITHIN_FEW_SAMPLES,
                    String.format(
                            Locale.US,
                            "The settling time %.4g s is %.3g sample periods of verify.sampling.samplePeriod = %.4g s,"
                                    + " fewer than %d: a controller sampled this slowly cannot be judged as the"
                                    + " continuous design; sample faster or ask for a slower loop.",
                            settling,
                            settling / samplePeriod,
                            samplePeriod,
                            MIN_SAMPLES_PER_SETTLING));
        }
        return notes.build();
    }

    /**
     * The plant's own frequency wp = sqrt|a0| [rad/s], set by its stiffness (0 without stiffness: an axis with only
     * inertia and friction has no pace of its own to compare a command with).
     */
    static double ownFrequency(CanonicalPlant plant) {
        return Math.sqrt(Math.abs(plant.a0()));
    }

    /**
     * The plant's own command scale per unit step, (|a0| + |a1| wp + wp^2)/|b| with wp = sqrt|a0|: the command that
     * holds a unit step against the stiffness, plus the damping and acceleration terms of a move at the plant's own
     * natural frequency. The target's wn would not do: the pole-matched law starts at u(0+) = kr r = wn^2 r/b, so a
     * scale built on wn never sees a spec that is too fast for the plant. 0 when a0 = 0 (no note then).
     */
    static double plantCommandScale(CanonicalPlant plant) {
        double wp = ownFrequency(plant);
        return (Math.abs(plant.a0()) + Math.abs(plant.a1()) * wp + wp * wp) / Math.abs(plant.b());
    }

    /**
     * The note for an overshoot below 0.1 % (code {@link #OVERSHOOT_LOOKS_LIKE_FRACTION}), the same for every
     * design order: it reads like a fraction typed as a percentage.
     *
     * @param overshootPercent the requested overshoot [percent]
     * @param dampingRatio     the damping ratio the design met it with
     */
    public static java.util.Optional<String> overshootFractionNote(double overshootPercent, double dampingRatio) {
        // the percentage comes back from a fraction: a relative slack keeps 0.1 itself out
        if (!(overshootPercent < FRACTION_SUSPECT_PERCENT * (1 - PERCENT_ROUND_TRIP))) {
            return java.util.Optional.empty();
        }
        return java.util.Optional.of(String.format(
                Locale.US,
                "overshootPercent = %s is in percent: the design meets %s %% (damping ratio %.3g, nearly"
                        + " critically damped). If it was meant as a fraction, that is %s %%: send"
                        + " overshootPercent = %s.",
                number(overshootPercent),
                number(overshootPercent),
                dampingRatio,
                number(100 * overshootPercent),
                number(100 * overshootPercent)));
    }

    private static String number(double value) {
        return String.format(Locale.US, "%.6g", value).replaceAll("\\.?0+$", "");
    }

    /** Collects notes and codes together, capped at {@link #MAX_NOTES}. */
    private static final class Builder {
        private final List<String> texts = new ArrayList<>(MAX_NOTES);
        private final List<String> codes = new ArrayList<>(MAX_NOTES);

        void add(String code, String text) {
            if (texts.size() < MAX_NOTES) {
                codes.add(code);
                texts.add(text);
            }
        }

        DesignNotes build() {
            return new DesignNotes(texts, codes);
        }
    }
}
