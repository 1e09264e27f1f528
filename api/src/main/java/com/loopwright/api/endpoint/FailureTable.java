package com.loopwright.api.endpoint;

import com.loopwright.api.problem.FieldError;
import com.loopwright.api.problem.Problem;
import com.loopwright.api.problem.ProblemType;
import com.loopwright.api.problem.Proposal;
import com.loopwright.api.validation.InvalidRequestException;
import com.loopwright.api.validation.SpecInput;
import com.loopwright.solver.design.Infeasibility;
import com.loopwright.solver.design.SpecProposal;
import com.loopwright.solver.design.SpecQuantity;
import com.loopwright.solver.pipeline.DesignSpacePipeline;
import com.loopwright.solver.pipeline.SolverFailure;
import com.loopwright.solver.plant.PlantParameterException;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;

/**
 * The one place failures become RFC 9457 problems: field errors of validation, unusable plant parameters, and
 * each {@link SolverFailure.Kind}; the endpoint supplies only the pointers ({@link FailureContext}).
 */
public final class FailureTable {

    private static final String UNCONTROLLABLE_POINTER = "/plant/stateSpace/b2";
    private static final String NO_DC_GAIN_POINTER = "/plant/stateSpace/output";
    private static final String FIT_POINTER = "/samples/output";
    private static final String SAMPLE_PERIOD_POINTER = "/samplePeriod";
    private static final String ROBUST_SAMPLE_PERIOD_POINTER = "/robust/samplePeriod";
    private static final String ACTUATOR_LIMIT_POINTER = "/actuatorLimit";
    private static final String SPEC_PREFIX = "/spec/";

    private FailureTable() {}

    /**
     * The problem of a failure an endpoint step raised: an InvalidRequestException, a PlantParameterException
     * or a SolverFailure.
     */
    public static Problem toProblem(RuntimeException failure, FailureContext context) {
        if (failure instanceof InvalidRequestException invalid) {
            return invalid(invalid.errors());
        }
        if (failure instanceof PlantParameterException plant) {
            return plantModel(plant.parameter(), plant.getMessage(), context);
        }
        if (failure instanceof SolverFailure solver) {
            return solverProblem(solver, context);
        }
        throw new IllegalArgumentException("not a request or solver failure", failure);
    }

    /** 422 invalid-field with every field error; the detail names the field when there is one. */
    public static Problem invalid(List<FieldError> errors) {
        String detail = errors.size() == 1
                ? errors.get(0).pointer() + ": " + errors.get(0).detail()
                : errors.size() + " fields are invalid; see errors";
        return ProblemType.INVALID_FIELD.problem(detail, errors, List.of());
    }

    /** A result that cannot be computed or written in double precision, with the advice to rescale. */
    public static Problem unverifiable(String detail) {
        return ProblemType.UNVERIFIABLE_DESIGN.problem(
                detail + ". Rescale the plant units (for example"
                        + " millimetres instead of metres) so that the coefficients are nearer 1.",
                List.of(),
                List.of());
    }

    private static Problem solverProblem(SolverFailure failure, FailureContext context) {
        String message = failure.getMessage();
        return switch (failure.kind()) {
            case PLANT_MODEL -> plantModel(failure.subject(), message, context);
            case INFEASIBLE_SPEC -> infeasible(failure.infeasibility(), context);
            case UNCONTROLLABLE -> at(ProblemType.INFEASIBLE_SPEC, context.prefix() + UNCONTROLLABLE_POINTER, message);
            case NO_DC_GAIN -> at(ProblemType.INFEASIBLE_SPEC, context.prefix() + NO_DC_GAIN_POINTER, message);
            case UNVERIFIABLE -> unverifiable(message);
            case LOOP_NOT_SIMULABLE -> unverifiable("the closed loop could not be simulated or checked: " + message);
            case FIGURE_NOT_COMPUTABLE -> unverifiable("the figure could not be drawn: " + message);
            case CHECK_NOT_COMPUTABLE ->
                ProblemType.UNVERIFIABLE_DESIGN.problem(
                        "a robustness check could not be" + " computed in double precision: " + message,
                        List.of(),
                        List.of());
            case CAP_EXCEEDED -> at(ProblemType.CAP_EXCEEDED, capPointer(failure, context), message);
            case UNSTABLE_LOOP -> at(ProblemType.UNSTABLE_LOOP, context.unstableLoopPointer(), message);
            case FIT_FAILED -> at(ProblemType.FIT_FAILED, FIT_POINTER, message);
            case SAMPLED_LAW_INFEASIBLE ->
                at(ProblemType.INFEASIBLE_SPEC, sampledLawPointer(failure, context), message);
        };
    }

    /** The input a sampled law cannot be built for: the export's period or limit, or a robust design's period. */
    private static String sampledLawPointer(SolverFailure failure, FailureContext context) {
        return switch (failure.subject()) {
            case SolverFailure.SAMPLE_PERIOD -> SAMPLE_PERIOD_POINTER;
            case SolverFailure.ROBUST_SAMPLE_PERIOD -> context.prefix() + ROBUST_SAMPLE_PERIOD_POINTER;
            default -> ACTUATOR_LIMIT_POINTER;
        };
    }

    /** The problem with the message as detail and as the one field error at {@code pointer}. */
    private static Problem at(ProblemType type, String pointer, String message) {
        return type.problem(message, List.of(new FieldError(pointer, message)), List.of());
    }

    /** The option of a capped check, inside the verify object. */
    private static String capPointer(SolverFailure failure, FailureContext context) {
        String verify = context.verifyPointer();
        return switch (failure.subject()) {
            case "SAMPLE_PERIOD" -> verify + "/sampling/samplePeriod";
            case "INPUT_DELAY" -> verify + "/inputDelay";
            case "DISTURBANCE_TIMING" -> verify + "/disturbances/" + failure.index();
            case SolverFailure.ROBUST_SEARCH -> context.prefix() + "/robust";
            case DesignSpacePipeline.TIME_AXIS -> context.timeSpecPointer() + "/count";
            case DesignSpacePipeline.OVERSHOOT_AXIS -> "/overshootPercent/count";
            case DesignSpacePipeline.BOX_SAMPLES -> "/uncertainty/monteCarloSamples";
            default -> verify;
        };
    }

    /** A plant description that is well-formed but not physical or not usable (422). */
    private static Problem plantModel(String parameter, String message, FailureContext context) {
        String pointer = parameter.isEmpty() ? "/plant" : "/plant/" + parameter;
        return ProblemType.PLANT_MODEL_UNUSABLE.problem(
                pointer + ": " + message, List.of(new FieldError(context.prefix() + pointer, message)), List.of());
    }

    private static Problem infeasible(Infeasibility infeasibility, FailureContext context) {
        String prefix = context.prefix();
        String pointer = pointerOf(infeasibility.quantity(), context.timeSpecPointer());
        List<Proposal> proposals = infeasibility.proposals().stream()
                .map(p -> {
                    String field = pointerOf(p.quantity(), context.timeSpecPointer());
                    return new Proposal(prefix + field, p.value(), p.note(), readyToSend(context.sentSpec(), field, p));
                })
                .toList();
        return ProblemType.INFEASIBLE_SPEC.problem(
                infeasibility.reason(), List.of(new FieldError(prefix + pointer, infeasibility.reason())), proposals);
    }

    /**
     * The sent spec with the proposed value in place of the field it replaces (null without a sent spec). A
     * proposed gamma replaces a gammaMargin too, since the request takes one of the two.
     */
    private static Map<String, Double> readyToSend(SpecInput sent, String field, SpecProposal proposal) {
        if (sent == null) {
            return null;
        }
        Map<String, Double> spec = new LinkedHashMap<>();
        spec.put("settlingTime", sent.settlingTime());
        spec.put("riseTime", sent.riseTime());
        spec.put("overshootPercent", sent.overshootPercent());
        spec.put("settlingBandPercent", sent.settlingBandPercent());
        spec.put("gamma", sent.gamma());
        spec.put("gammaMargin", sent.gammaMargin());
        spec.put("stepSize", sent.stepSize());
        if (proposal.quantity() == SpecQuantity.GAMMA) {
            spec.put("gammaMargin", null);
        }
        spec.put(field.substring(SPEC_PREFIX.length()), proposal.value());
        spec.values().removeIf(Objects::isNull);
        return spec;
    }

    private static String pointerOf(SpecQuantity quantity, String timeSpecPointer) {
        return switch (quantity) {
            case OVERSHOOT_PERCENT -> "/spec/overshootPercent";
            case TIME_SPEC -> timeSpecPointer;
            case GAMMA -> "/spec/gamma";
        };
    }
}
