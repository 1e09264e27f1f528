package com.loopwright.api.mapping;

import com.loopwright.api.problem.FieldError;
import com.loopwright.api.problem.Problem;
import com.loopwright.api.problem.ProblemType;
import com.loopwright.api.problem.Proposal;
import com.loopwright.api.request.InvalidRequestException;
import com.loopwright.solver.design.Infeasibility;
import com.loopwright.solver.design.SpecQuantity;
import com.loopwright.solver.plant.PlantParameterException;
import java.util.List;

/** Solver and validation failures to RFC 9457 problems that name the offending field. */
public final class ProblemMapper {

    public Problem invalid(InvalidRequestException e) {
        List<FieldError> errors = e.errors();
        String detail = errors.size() == 1
                ? errors.get(0).pointer() + ": " + errors.get(0).detail()
                : errors.size() + " fields are invalid; see errors";
        return ProblemType.INVALID_FIELD.problem(detail, errors, List.of());
    }

    /**
     * @param timeSpecPointer pointer of the time spec the caller gave
     */
    public Problem infeasible(Infeasibility infeasibility, String timeSpecPointer) {
        String pointer = pointerOf(infeasibility.quantity(), timeSpecPointer);
        List<Proposal> proposals = infeasibility.proposals().stream()
                .map(p -> new Proposal(pointerOf(p.quantity(), timeSpecPointer), p.value(), p.note()))
                .toList();
        return ProblemType.INFEASIBLE_SPEC.problem(infeasibility.reason(),
                List.of(new FieldError(pointer, infeasibility.reason())), proposals);
    }

    /** A plant description that is well-formed but not physical or not usable (422). */
    public Problem plantModel(PlantParameterException e) {
        String pointer = e.parameter().isEmpty() ? "/plant" : "/plant/" + e.parameter();
        return ProblemType.PLANT_MODEL_UNUSABLE.problem(pointer + ": " + e.getMessage(),
                List.of(new FieldError(pointer, e.getMessage())), List.of());
    }

    public Problem unverifiable(String detail) {
        return ProblemType.UNVERIFIABLE_DESIGN.problem(detail + ". Rescale the plant units (for example"
                + " millimetres instead of metres) so that the coefficients are nearer 1.", List.of(), List.of());
    }

    private static String pointerOf(SpecQuantity quantity, String timeSpecPointer) {
        return switch (quantity) {
            case OVERSHOOT_PERCENT -> "/spec/overshootPercent";
            case TIME_SPEC -> timeSpecPointer;
            case GAMMA -> "/spec/gamma";
        };
    }
}
