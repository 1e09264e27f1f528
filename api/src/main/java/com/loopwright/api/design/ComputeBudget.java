package com.loopwright.api.design;

import com.fasterxml.jackson.databind.JsonNode;
import com.loopwright.api.problem.FieldError;
import com.loopwright.api.problem.Problem;
import com.loopwright.api.problem.ProblemType;
import com.loopwright.api.robustness.VerifyLimits;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.function.IntFunction;

/**
 * The cost model of design requests, in abstract work units, estimated from the request before anything is
 * computed (docs/limits-and-budgets.md, section Compute). One work unit is about 0.1 ms of CPU on the machine the
 * model was calibrated on: a design without checks is {@value #DESIGN_UNITS} units; the robustness checks add,
 * per check, the simulations they run (one uncertain case, one disturbance run, ...). Sampled-data and delay
 * checks are charged as if simulated at their interval cap, because the number of intervals depends on the
 * designed loop, which is not known before the design. A request (a batch with all its items) may cost at most
 * {@value #MAX_REQUEST_WORK_UNITS} units; the worst single design with every check is about 4,300 units, so the cap
 * binds batches.
 */
public final class ComputeBudget {

    /** The cap on one request's estimated work (a batch: the sum over its items). */
    public static final long MAX_REQUEST_WORK_UNITS = 50_000;
    /** A design with its independent verification (numeric Riccati, norm, step simulation): about 0.8 ms. */
    public static final long DESIGN_UNITS = 10;
    /**
     * The loop with integral action or an observer (integralAction true or measurement position): the augmented
     * design, the norms, the margins on the log grid and the 20000-sample load step; timed at about 39 ms (a busy
     * 2-core machine, in process, after warm-up).
     */
    public static final long LOOP_UNITS = 400;
    /** The observer on top (measurement position): its Riccati or pole placement and the full loop's figures, 65 ms. */
    public static final long OBSERVER_UNITS = 300;
    /** A verify object: nominal step, norm and loop margins. */
    public static final long VERIFY_UNITS = 10;
    /** One uncertain case (a corner or a Monte Carlo sample): a step simulation on the 2000-point grid. */
    public static final long UNCERTAIN_CASE_UNITS = 1;
    /** Corners of the parameter box (2^4), evaluated whenever uncertainty is given. */
    public static final long CORNER_CASES = 16;
    /** One disturbance profile: a simulation over its horizon. */
    public static final long DISTURBANCE_UNITS = 25;
    /** The saturated step (actuatorLimit) over three horizons. */
    public static final long SATURATION_UNITS = 40;
    /** The sampled-data check: the emulated and the directly designed law, at the interval cap. */
    public static final long SAMPLING_UNITS = 700;
    /** The longest-period search (sampling.findLongest): up to 38 sampled simulations. */
    public static final long LONGEST_PERIOD_UNITS = 500;
    /** The input-delay simulation at the interval cap. */
    public static final long DELAY_UNITS = 700;
    /**
     * A robust design's target search over the corners (12 damping ratios, 20 evaluations each, 16 corners, a few
     * microseconds per closed-form case) and the certified corner norms.
     */
    public static final long ROBUST_SEARCH_UNITS = 200;
    /**
     * A robust design, per Monte Carlo sample: the search's checks over every case, charged at its cap of case
     * evaluations (RobustTargetSearch.MAX_CASE_EVALUATIONS over 2,016 cases is about 125 evaluations per case at
     * 4 us each, 0.5 ms = 5 units); typical searches use a tenth of it.
     */
    public static final long ROBUST_UNITS_PER_SAMPLE = 5;
    /**
     * A robust design of the loop with integral action or an observer (integralAction or measurement position with
     * robust): every case of the search is a simulated step of the perturbed loop and every target a loop design.
     * The search over the corners, charged at a typical search (measured: see docs/limits-and-budgets.md).
     */
    public static final long ROBUST_LOOP_SEARCH_UNITS = 2_000;
    /** The same search, per Monte Carlo sample (each sample simulated at each target that reaches every case). */
    public static final long ROBUST_LOOP_UNITS_PER_SAMPLE = 20;
    /**
     * A robust design judged sampled (robust.samplePeriod), the full-state law or the loop with integral action or an
     * observer (whose own units are charged apart): every case of the search is a sampled step of the exported
     * controller on the perturbed plant (about 20,000 observation points, 1.2-1.5 ms of CPU each), the corners tried
     * at up to four frequencies and ten bisections for each of five damping ratios. Measured for the README axis at
     * 2-12 ms periods without samples: 60-150 ms; a box infeasible at the period with 40 samples 330 ms (see
     * docs/limits-and-budgets.md).
     */
    public static final long ROBUST_SAMPLED_SEARCH_UNITS = 2_000;
    /**
     * A sampled robust design, per Monte Carlo sample: measured 1.3-2.8 ms per sample when a target is found (each
     * sample simulated two to three times) and up to 10 ms when none is (the best spec the box allows simulates
     * every case at up to 20 targets); charged between the two.
     */
    public static final long ROBUST_SAMPLED_UNITS_PER_SAMPLE = 50;
    /** Frequency-response and time-series points returned, per unit. */
    public static final long POINTS_PER_UNIT = 30;
    /**
     * A design-space map (POST /v1/design-spaces): one unit per this many cell evaluations, a cell's nominal
     * verdict counting as two and each box case as one (about 8 us and 4 us of CPU, measured by
     * bench DesignSpaceBenchmark).
     */
    public static final long DESIGN_SPACE_EVALUATIONS_PER_UNIT = 25;
    /** At most this many cost drivers are named in a refusal (Problem.errors holds at most 32). */
    private static final int MAX_DRIVERS = VerifyLimits.MAX_FIELD_ERRORS - 1;

    /**
     * The estimated work of one design request (a single body or a batch item), each part by the field that asks
     * for it (pointers relative to the request, e.g. "/verify/uncertainty/monteCarloSamples").
     */
    public Map<String, Long> designParts(JsonNode request) {
        Map<String, Long> parts = new LinkedHashMap<>();
        parts.put("", DESIGN_UNITS);
        boolean integral = request != null && request.path("integralAction").asBoolean(false);
        boolean position =
                request != null && "position".equals(request.path("measurement").asText(""));
        if (integral || position) {
            parts.put(integral ? "/integralAction" : "/measurement", LOOP_UNITS);
        }
        if (position) {
            parts.put("/observer", OBSERVER_UNITS);
        }
        JsonNode robust = request == null ? null : request.get("robust");
        if (robust != null && robust.isObject()) {
            boolean simulated = integral || position;
            boolean sampled = present(robust.get("samplePeriod"));
            JsonNode box = robust.get("uncertainty");
            long samples = box == null ? 0 : count(box.get("monteCarloSamples"), VerifyLimits.MAX_MONTE_CARLO_SAMPLES);
            if (sampled) {
                parts.put("/robust/samplePeriod", ROBUST_SAMPLED_SEARCH_UNITS);
                if (samples > 0) {
                    parts.put("/robust/uncertainty/monteCarloSamples", samples * ROBUST_SAMPLED_UNITS_PER_SAMPLE);
                }
            } else {
                parts.put("/robust", simulated ? ROBUST_LOOP_SEARCH_UNITS : ROBUST_SEARCH_UNITS);
                if (samples > 0) {
                    parts.put(
                            "/robust/uncertainty/monteCarloSamples",
                            samples * (simulated ? ROBUST_LOOP_UNITS_PER_SAMPLE : ROBUST_UNITS_PER_SAMPLE));
                }
            }
        }
        JsonNode verify = request == null ? null : request.get("verify");
        if (verify == null || !verify.isObject()) {
            return parts;
        }
        parts.put("/verify", VERIFY_UNITS);
        JsonNode uncertainty = verify.get("uncertainty");
        if (uncertainty != null && uncertainty.isObject()) {
            parts.put("/verify/uncertainty", CORNER_CASES * UNCERTAIN_CASE_UNITS);
            long samples = count(uncertainty.get("monteCarloSamples"), VerifyLimits.MAX_MONTE_CARLO_SAMPLES);
            if (samples > 0) {
                parts.put("/verify/uncertainty/monteCarloSamples", samples * UNCERTAIN_CASE_UNITS);
            }
        }
        JsonNode disturbances = verify.get("disturbances");
        if (disturbances != null && disturbances.isArray() && !disturbances.isEmpty()) {
            parts.put(
                    "/verify/disturbances",
                    Math.min(disturbances.size(), VerifyLimits.MAX_DISTURBANCES) * DISTURBANCE_UNITS);
        }
        if (present(verify.get("actuatorLimit"))) {
            parts.put("/verify/actuatorLimit", SATURATION_UNITS);
        }
        JsonNode sampling = verify.get("sampling");
        if (sampling != null && sampling.isObject()) {
            parts.put("/verify/sampling", SAMPLING_UNITS);
            if (sampling.path("findLongest").asBoolean(false)) {
                parts.put("/verify/sampling/findLongest", LONGEST_PERIOD_UNITS);
            }
        }
        if (present(verify.get("inputDelay"))) {
            parts.put("/verify/inputDelay", DELAY_UNITS);
        }
        long points = count(verify.get("frequencyPoints"), VerifyLimits.MAX_FREQUENCY_POINTS)
                + count(verify.get("timeSeriesPoints"), VerifyLimits.MAX_TIME_SERIES_POINTS);
        if (points > 0) {
            parts.put("/verify/frequencyPoints", (points + POINTS_PER_UNIT - 1) / POINTS_PER_UNIT);
        }
        return parts;
    }

    /**
     * The estimated work of a design-space map of {@code cells} cells whose feasible cells are judged on
     * {@code boxCases} parameter sets (corners plus samples; 0 without a box). The caps (64 x 64 cells, 16 corners
     * plus 64 samples) keep the largest map at 13,435 units, within {@link #MAX_REQUEST_WORK_UNITS}.
     */
    public static long designSpaceUnits(long cells, long boxCases) {
        long evaluations = cells * (2 + boxCases);
        return (evaluations + DESIGN_SPACE_EVALUATIONS_PER_UNIT - 1) / DESIGN_SPACE_EVALUATIONS_PER_UNIT;
    }

    /** The estimated work of one design request. */
    public long designUnits(JsonNode request) {
        return designParts(request).values().stream().mapToLong(Long::longValue).sum();
    }

    /**
     * The 422 cap-exceeded problem when a batch's estimated work exceeds the cap, else null. The problem names
     * the fields that drive the cost, largest first: each with the first item that asks for it and its share of
     * the total over all items.
     */
    public Problem refuseBatch(JsonNode items) {
        return refuseBatch(items.size(), items::get);
    }

    /**
     * As {@link #refuseBatch(JsonNode)} for items read one at a time (a streamed envelope builds each item's tree
     * only while it is estimated).
     */
    public Problem refuseBatch(int count, IntFunction<JsonNode> item) {
        return refuseBatch(count, item, new long[count]);
    }

    /**
     * As {@link #refuseBatch(int, IntFunction)}, also giving each item's estimate in {@code itemUnits} (at least
     * {@code count} long), whether or not the batch is refused.
     */
    public Problem refuseBatch(int count, IntFunction<JsonNode> item, long[] itemUnits) {
        Map<String, Long> byField = new LinkedHashMap<>();
        Map<String, Integer> firstItem = new LinkedHashMap<>();
        Map<String, Integer> itemsAsking = new LinkedHashMap<>();
        long total = 0;
        for (int i = 0; i < count; i++) {
            long units = 0;
            for (Map.Entry<String, Long> part : designParts(item.apply(i)).entrySet()) {
                byField.merge(part.getKey(), part.getValue(), Long::sum);
                firstItem.putIfAbsent(part.getKey(), i);
                itemsAsking.merge(part.getKey(), 1, Integer::sum);
                units += part.getValue();
            }
            itemUnits[i] = units;
            total += units;
        }
        if (total <= MAX_REQUEST_WORK_UNITS) {
            return null;
        }
        String summary = "the batch's " + count + " items are estimated at " + total + " work units, more"
                + " than the cap of " + MAX_REQUEST_WORK_UNITS + " per request (one unit is about 0.1 ms of CPU);"
                + " send fewer items or fewer checks per item (see the cost model in docs/limits-and-budgets.md)";
        long estimated = total;
        List<FieldError> errors = new ArrayList<>();
        errors.add(new FieldError(
                "/items",
                count + " items, " + estimated + " work units estimated; the cap is " + MAX_REQUEST_WORK_UNITS));
        byField.entrySet().stream()
                .sorted(Map.Entry.<String, Long>comparingByValue().reversed())
                .limit(MAX_DRIVERS)
                .forEach(part -> errors.add(new FieldError(
                        "/items/" + firstItem.get(part.getKey()) + part.getKey(),
                        (part.getKey().isEmpty() ? "the designs themselves" : "this check")
                                + " in " + itemsAsking.get(part.getKey()) + " items costs " + part.getValue()
                                + " of the " + estimated + " work units")));
        return ProblemType.CAP_EXCEEDED.problem(summary, errors, List.of());
    }

    private static boolean present(JsonNode value) {
        return value != null && !value.isNull();
    }

    /** A count field, clamped to [0, cap] (the validator refuses values outside; the estimate stays bounded). */
    private static long count(JsonNode value, int cap) {
        if (value == null || !value.isNumber()) {
            return 0;
        }
        double number = value.asDouble();
        return number > 0 ? (long) Math.min(number, cap) : 0;
    }
}
