package com.loopwright.api.highorder;

import static com.loopwright.api.highorder.HighOrderLimits.*;
import static com.loopwright.api.validation.FieldLimits.*;

import com.loopwright.api.design.DesignRequestValidator;
import com.loopwright.api.highorder.HighOrderDesignRequest.AuxiliaryPolesInput;
import com.loopwright.api.highorder.HighOrderDesignRequest.HighOrderPlantInput;
import com.loopwright.api.highorder.HighOrderDesignRequest.HighOrderSpecInput;
import com.loopwright.api.highorder.HighOrderDesignRequest.PoleInput;
import com.loopwright.api.loop.LoopInputValidator;
import com.loopwright.api.loop.ValidatedLoop;
import com.loopwright.api.problem.FieldError;
import com.loopwright.api.robustness.ParameterRangeInput;
import com.loopwright.api.robustness.VerifyInputValidator;
import com.loopwright.api.robustness.VerifyLimits;
import com.loopwright.api.validation.Checks;
import com.loopwright.api.validation.InvalidRequestException;
import com.loopwright.solver.design.GammaChoice;
import com.loopwright.solver.pipeline.HighOrderRobustPipeline;
import com.loopwright.solver.pipeline.SolverFailure;
import com.loopwright.solver.plant.CompanionPlant;
import com.loopwright.solver.robustness.CompanionBox;
import com.loopwright.solver.spec.AuxiliaryPlacement;
import com.loopwright.solver.spec.DesignSpec;
import com.loopwright.solver.spec.DesiredPoles;
import com.loopwright.solver.spec.TargetDynamics;
import com.loopwright.solver.spec.TimeSpec;
import java.util.ArrayList;
import java.util.List;

/** Checks a high-order request; reports every offending field with its JSON pointer. */
public final class HighOrderRequestValidator {

    private static final String ROBUST = "/robust";
    private static final String UNCERTAINTY = ROBUST + "/uncertainty";

    private final LoopInputValidator loops = new LoopInputValidator();

    public ValidatedHighOrderDesign validate(HighOrderDesignRequest request) {
        if (request == null) {
            throw new InvalidRequestException(List.of(new FieldError("", "a JSON object with plant and spec")));
        }
        List<FieldError> errors = new ArrayList<>();
        HighOrderPlantInput plant = request.plant();
        int n = -1;
        double[] denominator = null;
        double[] numerator = null;
        double[] disturbance = null;
        ValidatedHighOrderDesign.StateSpace stateSpace = null;
        if (plant == null) {
            errors.add(new FieldError("/plant", "required"));
        } else if (plant.stateSpace() != null) {
            if (plant.denominator() != null
                    || plant.numerator() != null
                    || plant.b() != null
                    || plant.disturbance() != null) {
                errors.add(new FieldError(
                        "/plant/stateSpace",
                        "give either stateSpace or the companion fields"
                                + " (denominator, numerator, b, disturbance), not both"));
            } else {
                stateSpace = stateSpace(errors, plant.stateSpace());
                n = stateSpace == null ? -1 : stateSpace.a().numRows;
            }
        } else {
            denominator = denominator(errors, plant.denominator());
            n = denominator == null ? -1 : denominator.length - 1;
            numerator = numerator(errors, plant.numerator(), n);
            if (plant.b() == null) {
                errors.add(new FieldError("/plant/b", "required"));
            } else if (!Double.isFinite(plant.b())
                    || Math.abs(plant.b()) < MIN_ABS_B
                    || Math.abs(plant.b()) > MAX_ABS_B) {
                errors.add(new FieldError(
                        "/plant/b", "magnitude must be from " + MIN_ABS_B + " to " + MAX_ABS_B + " (non-zero)"));
            }
            disturbance = coefficients(errors, "/plant/disturbance", plant.disturbance(), n, MAX_ABS_DISTURBANCE);
            if (disturbance != null && java.util.Arrays.stream(disturbance).allMatch(v -> v == 0)) {
                errors.add(new FieldError(
                        "/plant/disturbance",
                        "must not be all zero: gamma bounds the gain from" + " this disturbance"));
            }
        }
        HighOrderSpecInput spec = request.spec();
        if (spec == null) {
            errors.add(new FieldError("/spec", "required"));
            throw new InvalidRequestException(errors);
        }
        DesignRequestValidator.overshoot(errors, spec.overshootPercent());
        Checks.range(errors, "/spec/settlingTime", spec.settlingTime(), MIN_TIME_SECONDS, MAX_TIME_SECONDS, true);
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
        if (spec.gamma() != null && !(spec.gamma() > 0 && spec.gamma() <= MAX_GAMMA)) {
            errors.add(new FieldError("/spec/gamma", "must be positive and at most " + MAX_GAMMA));
        }
        if (spec.gammaMargin() != null && !(spec.gammaMargin() > 1 && spec.gammaMargin() <= MAX_GAMMA_MARGIN)) {
            errors.add(new FieldError("/spec/gammaMargin", "must be above 1 and at most " + MAX_GAMMA_MARGIN));
        }
        if (spec.stepSize() != null
                && !(Double.isFinite(spec.stepSize())
                        && spec.stepSize() != 0
                        && Math.abs(spec.stepSize()) <= MAX_ABS_STEP)) {
            errors.add(new FieldError("/spec/stepSize", "magnitude must be non-zero and at most " + MAX_ABS_STEP));
        }
        Checks.range(
                errors,
                "/spec/maxUndershootPercent",
                spec.maxUndershootPercent(),
                MIN_UNDERSHOOT_PERCENT,
                MAX_UNDERSHOOT_PERCENT,
                false);
        AuxiliaryPlacement auxiliary = auxiliary(errors, request.auxiliaryPoles(), n);
        ValidatedLoop loop = loops.validate(request.loop(), errors);
        if (loop != null && stateSpace != null) {
            errors.add(new FieldError(
                    "/plant/stateSpace",
                    "integral action and position-only sensing take the companion form (denominator, numerator, b,"
                            + " disturbance): the numerator says what is measured"));
        }
        ValidatedHighOrderRobust robust = null;
        if (request.robust() != null) {
            robust = robust(errors, request, denominator, plant == null ? null : plant.b(), loop);
        }
        if (!errors.isEmpty()) {
            throw new InvalidRequestException(errors);
        }
        if (denominator != null && denominator[0] != 1) {
            // well-formed but not a description the design takes: 422 at the leading coefficient
            throw SolverFailure.about(
                    SolverFailure.Kind.PLANT_MODEL,
                    "denominator/0",
                    -1,
                    "must be 1: the denominator is monic, s^n + a_{n-1} s^{n-1} + ... + a_0, highest power first;"
                            + " divide the denominator and the numerator by the leading coefficient (got "
                            + denominator[0] + ")",
                    null);
        }
        double band = (spec.settlingBandPercent() == null ? DEFAULT_BAND_PERCENT : spec.settlingBandPercent()) / 100;
        GammaChoice gamma = spec.gamma() != null
                ? new GammaChoice.Fixed(spec.gamma())
                : new GammaChoice.MarginOverMinimum(
                        spec.gammaMargin() == null ? DEFAULT_GAMMA_MARGIN : spec.gammaMargin());
        return new ValidatedHighOrderDesign(
                stateSpace != null
                        ? null
                        : new CompanionPlant(
                                CoefficientOrder.fromMonicHighestFirst(denominator), numerator, plant.b(), disturbance),
                new DesignSpec(spec.overshootPercent() / 100, new TimeSpec.SettlingTime(spec.settlingTime(), band)),
                auxiliary,
                Boolean.TRUE.equals(request.matchSpecs()),
                gamma,
                spec.stepSize() == null ? DEFAULT_STEP : spec.stepSize(),
                band,
                spec.maxUndershootPercent() == null ? DEFAULT_MAX_UNDERSHOOT_PERCENT : spec.maxUndershootPercent(),
                stateSpace,
                loop,
                robust);
    }

    /**
     * The robust member: a box over the companion coefficients (the denominator's ranges in its wire order, the
     * leading 1 fixed, and b), at most {@value CompanionBox#MAX_RANGED} ranged; null after an error. It takes the
     * companion form, without matchSpecs; with integral action and/or position-only sensing the loop that runs is
     * judged.
     */
    private static ValidatedHighOrderRobust robust(
            List<FieldError> errors,
            HighOrderDesignRequest request,
            double[] denominator,
            Double b,
            ValidatedLoop loop) {
        HighOrderRobustInput input = request.robust();
        int before = errors.size();
        if (request.plant() != null && request.plant().stateSpace() != null) {
            errors.add(new FieldError(
                    ROBUST,
                    "a robust order-n design takes the companion form (denominator, numerator, b, disturbance):"
                            + " its box ranges those coefficients; send the companion form (a plain design's"
                            + " coordinates give it)"));
        }
        if (Boolean.TRUE.equals(request.matchSpecs())) {
            errors.add(new FieldError(
                    "/matchSpecs",
                    "not with robust: the robust search chooses the dominant pair itself, by simulating every case"
                            + " of the box; drop matchSpecs"));
        }
        if (input.actuatorLimit() != null
                && !(input.actuatorLimit() > 0 && input.actuatorLimit() <= VerifyLimits.MAX_ACTUATOR_LIMIT)) {
            errors.add(new FieldError(
                    ROBUST + "/actuatorLimit", "must be positive and at most " + VerifyLimits.MAX_ACTUATOR_LIMIT));
        }
        HighOrderRobustInput.HighOrderUncertaintyInput box = input.uncertainty();
        if (box == null) {
            errors.add(new FieldError(UNCERTAINTY, "required"));
            return null;
        }
        int samples = box.monteCarloSamples() == null ? 0 : box.monteCarloSamples();
        if (samples < 0 || samples > HighOrderRobustPipeline.MAX_SAMPLES) {
            errors.add(new FieldError(
                    UNCERTAINTY + "/monteCarloSamples",
                    "must be from 0 to " + HighOrderRobustPipeline.MAX_SAMPLES
                            + " (each sample is simulated at every target the search tries)"));
        }
        List<ParameterRangeInput> ranges = box.denominator();
        if (ranges != null && ranges.size() > MAX_ORDER + 1) {
            errors.add(new FieldError(UNCERTAINTY + "/denominator", "at most " + (MAX_ORDER + 1) + " entries"));
            return null;
        }
        if (denominator == null || b == null || !errors.isEmpty()) {
            return null; // the nominal plant is needed for the ranges
        }
        int n = denominator.length - 1;
        if (ranges != null && ranges.size() != n + 1) {
            errors.add(new FieldError(
                    UNCERTAINTY + "/denominator",
                    "needs one entry per coefficient of plant.denominator (" + (n + 1) + ", highest power first;"
                            + " spreadPercent 0 or null for a fixed one), got " + ranges.size()));
            return null;
        }
        double[] lows = new double[n];
        double[] highs = new double[n];
        for (int i = 0; i <= n; i++) {
            ParameterRangeInput range = ranges == null ? null : ranges.get(i);
            String pointer = UNCERTAINTY + "/denominator/" + i;
            double[] r = VerifyInputValidator.range(errors, pointer, range, denominator[i]);
            if (i == 0) {
                if (r != null && r[0] < r[1]) {
                    errors.add(new FieldError(
                            pointer,
                            "must keep the leading 1 fixed (null or spreadPercent 0): the denominator is monic"));
                }
            } else if (r != null) {
                // wire index i is a_{n-i}
                lows[n - i] = r[0];
                highs[n - i] = r[1];
            }
        }
        double[] bRange = VerifyInputValidator.range(errors, UNCERTAINTY + "/b", box.b(), b);
        if (bRange != null && bRange[0] <= 0 && bRange[1] >= 0) {
            errors.add(
                    new FieldError(UNCERTAINTY + "/b", "the range must not contain 0 (the input gain keeps its sign)"));
            return null;
        }
        if (errors.size() > before) {
            return null;
        }
        int ranged = bRange[0] < bRange[1] ? 1 : 0;
        for (int j = 0; j < n; j++) {
            ranged += lows[j] < highs[j] ? 1 : 0;
        }
        if (ranged > CompanionBox.MAX_RANGED) {
            errors.add(new FieldError(
                    UNCERTAINTY,
                    "at most " + CompanionBox.MAX_RANGED + " ranged parameters (16 corners), got " + ranged));
            return null;
        }
        return new ValidatedHighOrderRobust(
                new CompanionBox(lows, highs, bRange[0], bRange[1]),
                samples,
                box.seed() == null ? VerifyLimits.DEFAULT_SEED : box.seed(),
                input.actuatorLimit());
    }

    private static AuxiliaryPlacement auxiliary(List<FieldError> errors, AuxiliaryPolesInput input, int n) {
        if (input == null || (input.realPartMultiple() == null && input.poles() == null)) {
            return new AuxiliaryPlacement.RealPartMultiple(DEFAULT_REAL_PART_MULTIPLE);
        }
        if (input.realPartMultiple() != null && input.poles() != null) {
            errors.add(new FieldError("/auxiliaryPoles/poles", "give either realPartMultiple or poles, not both"));
            return null;
        }
        if (input.realPartMultiple() != null) {
            Checks.range(
                    errors,
                    "/auxiliaryPoles/realPartMultiple",
                    input.realPartMultiple(),
                    MIN_REAL_PART_MULTIPLE,
                    MAX_REAL_PART_MULTIPLE,
                    true);
            return errors.isEmpty() ? new AuxiliaryPlacement.RealPartMultiple(input.realPartMultiple()) : null;
        }
        List<PoleInput> poles = input.poles();
        if (poles.size() > MAX_ORDER - 2) {
            errors.add(new FieldError("/auxiliaryPoles/poles", "at most " + (MAX_ORDER - 2) + " poles"));
            return null;
        }
        if (n > 0 && poles.size() != n - 2) {
            errors.add(new FieldError(
                    "/auxiliaryPoles/poles",
                    "needs n - 2 = " + (n - 2) + " poles for a plant of order " + n + ", got " + poles.size()));
            return null;
        }
        List<TargetDynamics.Pole> list = new ArrayList<>();
        int before = errors.size();
        for (int i = 0; i < poles.size(); i++) {
            PoleInput p = poles.get(i);
            String pointer = "/auxiliaryPoles/poles/" + i;
            if (p == null || p.re() == null || p.im() == null) {
                errors.add(new FieldError(pointer, "needs re and im"));
                continue;
            }
            if (!(p.re() < 0)
                    || !Double.isFinite(p.re())
                    || !Double.isFinite(p.im())
                    || Math.hypot(p.re(), p.im()) > MAX_POLE_MAGNITUDE) {
                errors.add(new FieldError(
                        pointer + "/re",
                        "must be negative (a stable pole), with |pole| at most " + MAX_POLE_MAGNITUDE));
                continue;
            }
            list.add(new TargetDynamics.Pole(p.re(), p.im()));
        }
        if (errors.size() > before) {
            return null;
        }
        int unpaired = DesiredPoles.unpairedIndex(list);
        if (unpaired >= 0) {
            errors.add(new FieldError(
                    "/auxiliaryPoles/poles/" + unpaired + "/im", "a complex pole needs its conjugate in the list"));
            return null;
        }
        return new AuxiliaryPlacement.Explicit(list);
    }

    private static ValidatedHighOrderDesign.StateSpace stateSpace(
            List<FieldError> errors, HighOrderDesignRequest.StateSpaceInput input) {
        List<List<Double>> rows = input.a();
        if (rows == null) {
            errors.add(new FieldError("/plant/stateSpace/a", "required"));
            return null;
        }
        int n = rows.size();
        if (n < MIN_ORDER || n > MAX_ORDER) {
            errors.add(new FieldError(
                    "/plant/stateSpace/a",
                    "needs " + MIN_ORDER + " to " + MAX_ORDER + " rows (the plant order), got " + n));
            return null;
        }
        int before = errors.size();
        org.ejml.data.DMatrixRMaj a = new org.ejml.data.DMatrixRMaj(n, n);
        for (int i = 0; i < n; i++) {
            double[] row = coefficients(errors, "/plant/stateSpace/a/" + i, rows.get(i), n, MAX_ABS_COEFFICIENT);
            if (row != null) {
                for (int j = 0; j < n; j++) {
                    a.set(i, j, row[j]);
                }
            }
        }
        double[] b2 = coefficients(errors, "/plant/stateSpace/b2", input.b2(), n, MAX_ABS_COEFFICIENT);
        double[] b1 = coefficients(errors, "/plant/stateSpace/b1", input.b1(), n, MAX_ABS_DISTURBANCE);
        double[] output;
        if (input.output() == null) {
            output = new double[n];
            output[0] = 1;
        } else {
            output = coefficients(errors, "/plant/stateSpace/output", input.output(), n, MAX_ABS_COEFFICIENT);
        }
        if (b1 != null && java.util.Arrays.stream(b1).allMatch(v -> v == 0)) {
            errors.add(new FieldError(
                    "/plant/stateSpace/b1", "must not be all zero: gamma bounds the gain from" + " this disturbance"));
        }
        if (errors.size() > before) {
            return null;
        }
        return new ValidatedHighOrderDesign.StateSpace(
                a,
                new org.ejml.data.DMatrixRMaj(n, 1, true, b2),
                new org.ejml.data.DMatrixRMaj(n, 1, true, b1),
                new org.ejml.data.DMatrixRMaj(1, n, true, output));
    }

    /**
     * The denominator [1, a_{n-1}, ..., a_0], highest power first, as sent (its leading 1 is checked once every
     * field is well-formed); null after an error.
     */
    private static double[] denominator(List<FieldError> errors, List<Double> values) {
        String pointer = "/plant/denominator";
        if (values != null && (values.size() < MIN_ORDER + 1 || values.size() > MAX_ORDER + 1)) {
            errors.add(new FieldError(
                    pointer,
                    "needs " + (MIN_ORDER + 1) + " to " + (MAX_ORDER + 1) + " coefficients, highest power first"
                            + " (1 and a_{n-1} .. a_0 for a plant of order n = " + MIN_ORDER + " to " + MAX_ORDER
                            + "), got " + values.size()));
            return null;
        }
        double[] highestFirst = coefficients(errors, pointer, values, -1, MAX_ABS_COEFFICIENT);
        if (highestFirst == null) {
            return null;
        }
        return highestFirst;
    }

    /**
     * The numerator, highest power first and right-aligned (1..n entries, default [1]: y = z_1), as the solver's
     * c_0 .. c_{n-1}; null after an error or when the order is unknown.
     */
    private static double[] numerator(List<FieldError> errors, List<Double> values, int n) {
        String pointer = "/plant/numerator";
        if (values == null) {
            return n > 0 ? CoefficientOrder.numeratorLowestFirst(new double[] {1}, n) : null;
        }
        if (values.isEmpty() || (n > 0 && values.size() > n)) {
            errors.add(new FieldError(
                    pointer,
                    "needs 1 to " + (n > 0 ? n : "n") + " coefficients (the plant order), highest power first,"
                            + " got " + values.size()));
            return null;
        }
        double[] highestFirst = coefficients(errors, pointer, values, -1, MAX_ABS_COEFFICIENT);
        if (highestFirst == null || n <= 0) {
            return null;
        }
        int last = highestFirst.length - 1;
        if (highestFirst[last] == 0) {
            errors.add(new FieldError(
                    pointer + "/" + last,
                    "must be non-zero: a zero at s = 0 gives the loop no DC gain to scale the reference by"));
            return null;
        }
        return CoefficientOrder.numeratorLowestFirst(highestFirst, n);
    }

    /** A list of finite numbers within +-maxAbs, of the expected length (when known). */
    private static double[] coefficients(
            List<FieldError> errors, String pointer, List<Double> values, int length, double maxAbs) {
        if (values == null) {
            errors.add(new FieldError(pointer, "required"));
            return null;
        }
        if (values.size() > MAX_ORDER + 1) {
            errors.add(new FieldError(pointer, "at most " + (MAX_ORDER + 1) + " entries"));
            return null;
        }
        if (length >= 0 && values.size() != length) {
            errors.add(new FieldError(pointer, "needs one entry per state (" + length + "), got " + values.size()));
            return null;
        }
        double[] out = new double[values.size()];
        boolean ok = true;
        for (int i = 0; i < out.length; i++) {
            Double v = values.get(i);
            if (v == null || !Double.isFinite(v) || Math.abs(v) > maxAbs) {
                errors.add(new FieldError(pointer + "/" + i, "must be a finite number of magnitude at most " + maxAbs));
                ok = false;
            } else {
                out[i] = v;
            }
        }
        return ok ? out : null;
    }
}
