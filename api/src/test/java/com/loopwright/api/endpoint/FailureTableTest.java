package com.loopwright.api.endpoint;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import com.loopwright.api.problem.FieldError;
import com.loopwright.api.problem.Problem;
import com.loopwright.api.problem.ProblemType;
import com.loopwright.api.problem.Proposal;
import com.loopwright.api.validation.InvalidRequestException;
import com.loopwright.solver.design.Infeasibility;
import com.loopwright.solver.design.SpecProposal;
import com.loopwright.solver.design.SpecQuantity;
import com.loopwright.solver.pipeline.SolverFailure;
import com.loopwright.solver.plant.PlantParameterException;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * The one failure table against the problems the endpoints gave before it existed (the wording and pointers the
 * golden corpus recorded, service/src/test/resources/golden): each kind in the context of a top-level request and
 * of a design nested under "design".
 */
class FailureTableTest {

    private static final FailureContext NESTED =
            new FailureContext("/design", "/spec/riseTime", "/design/verify", "/design/verify/uncertainty");

    @Test
    void infeasibleSpecsPointAtTheTimeSpecGivenAndPrefixNestedPointers() {
        Infeasibility infeasibility = new Infeasibility(
                SpecQuantity.TIME_SPEC,
                "too fast",
                List.of(new SpecProposal(SpecQuantity.OVERSHOOT_PERCENT, 4.5, "more overshoot")));
        Problem top = FailureTable.toProblem(
                SolverFailure.infeasible(infeasibility, null), FailureContext.ROOT.withTimeSpec("/spec/riseTime"));
        assertEquals(ProblemType.INFEASIBLE_SPEC.uri(), top.type());
        assertEquals("too fast", top.detail());
        assertEquals(List.of(new FieldError("/spec/riseTime", "too fast")), top.errors());
        assertEquals(List.of(new Proposal("/spec/overshootPercent", 4.5, "more overshoot")), top.proposals());
        Problem nested = FailureTable.toProblem(SolverFailure.infeasible(infeasibility, null), NESTED);
        assertEquals(List.of(new FieldError("/design/spec/riseTime", "too fast")), nested.errors());
        assertEquals("/design/spec/overshootPercent", nested.proposals().get(0).pointer());
    }

    @Test
    void anUnusablePlantNamesTheParameterUnprefixedInTheDetailAndPrefixedInTheError() {
        Problem nested = FailureTable.toProblem(new PlantParameterException("a0", "not physical"), NESTED);
        assertEquals(ProblemType.PLANT_MODEL_UNUSABLE.uri(), nested.type());
        assertEquals("/plant/a0: not physical", nested.detail());
        assertEquals(List.of(new FieldError("/design/plant/a0", "not physical")), nested.errors());
        Problem whole = FailureTable.toProblem(new PlantParameterException("", "no plant"), FailureContext.ROOT);
        assertEquals("/plant: no plant", whole.detail());
    }

    @Test
    void cappedChecksPointInsideTheVerifyObject() {
        assertEquals(
                "/verify/disturbances/2",
                FailureTable.toProblem(
                                SolverFailure.about(
                                        SolverFailure.Kind.CAP_EXCEEDED, "DISTURBANCE_TIMING", 2, "too late", null),
                                FailureContext.ROOT)
                        .errors()
                        .get(0)
                        .pointer());
        assertEquals(
                "/design/verify/sampling/samplePeriod",
                FailureTable.toProblem(
                                SolverFailure.about(
                                        SolverFailure.Kind.CAP_EXCEEDED, "SAMPLE_PERIOD", -1, "too short", null),
                                NESTED)
                        .errors()
                        .get(0)
                        .pointer());
        assertEquals(
                "/verify/inputDelay",
                FailureTable.toProblem(
                                SolverFailure.about(
                                        SolverFailure.Kind.CAP_EXCEEDED, "INPUT_DELAY", -1, "too long", null),
                                FailureContext.ROOT)
                        .errors()
                        .get(0)
                        .pointer());
    }

    @Test
    void eachKindKeepsItsProblemTypeAndWording() {
        assertEquals(
                "/gain",
                problem(SolverFailure.Kind.UNSTABLE_LOOP, FailureContext.ROOT)
                        .errors()
                        .get(0)
                        .pointer());
        assertEquals(
                "/design/verify/uncertainty",
                problem(SolverFailure.Kind.UNSTABLE_LOOP, NESTED)
                        .errors()
                        .get(0)
                        .pointer());
        assertEquals(
                List.of(new FieldError("/samples/output", "m")),
                problem(SolverFailure.Kind.FIT_FAILED, FailureContext.ROOT).errors());
        assertEquals(
                "/plant/stateSpace/b2",
                problem(SolverFailure.Kind.UNCONTROLLABLE, FailureContext.ROOT)
                        .errors()
                        .get(0)
                        .pointer());
        assertEquals(
                "/plant/stateSpace/output",
                problem(SolverFailure.Kind.NO_DC_GAIN, FailureContext.ROOT)
                        .errors()
                        .get(0)
                        .pointer());
        String rescale = ". Rescale the plant units (for example millimetres instead of metres) so that the"
                + " coefficients are nearer 1.";
        assertEquals(
                "m" + rescale,
                problem(SolverFailure.Kind.UNVERIFIABLE, FailureContext.ROOT).detail());
        assertEquals(
                "the closed loop could not be simulated or checked: m" + rescale,
                problem(SolverFailure.Kind.LOOP_NOT_SIMULABLE, FailureContext.ROOT)
                        .detail());
        assertEquals(
                "the figure could not be drawn: m" + rescale,
                problem(SolverFailure.Kind.FIGURE_NOT_COMPUTABLE, NESTED).detail());
        Problem check = problem(SolverFailure.Kind.CHECK_NOT_COMPUTABLE, FailureContext.ROOT);
        assertEquals("a robustness check could not be computed in double precision: m", check.detail());
        assertEquals(List.of(), check.errors());
        assertEquals(
                "/samplePeriod",
                FailureTable.toProblem(
                                SolverFailure.about(
                                        SolverFailure.Kind.SAMPLED_LAW_INFEASIBLE,
                                        SolverFailure.SAMPLE_PERIOD,
                                        -1,
                                        "m",
                                        null),
                                NESTED)
                        .errors()
                        .get(0)
                        .pointer());
        assertEquals(
                "/actuatorLimit",
                FailureTable.toProblem(
                                SolverFailure.about(
                                        SolverFailure.Kind.SAMPLED_LAW_INFEASIBLE,
                                        SolverFailure.ACTUATOR_LIMIT,
                                        -1,
                                        "m",
                                        null),
                                NESTED)
                        .errors()
                        .get(0)
                        .pointer());
    }

    @Test
    void fieldErrorsAreAllReportedAndOneIsNamedInTheDetail() {
        FieldError one = new FieldError("/spec/gamma", "must be positive");
        assertEquals(
                "/spec/gamma: must be positive",
                FailureTable.toProblem(new InvalidRequestException(List.of(one)), FailureContext.ROOT)
                        .detail());
        Problem two = FailureTable.toProblem(new InvalidRequestException(List.of(one, one)), FailureContext.ROOT);
        assertEquals("2 fields are invalid; see errors", two.detail());
        assertEquals(2, two.errors().size());
        assertThrows(
                IllegalArgumentException.class,
                () -> FailureTable.toProblem(new IllegalStateException("a defect"), FailureContext.ROOT));
    }

    private static Problem problem(SolverFailure.Kind kind, FailureContext context) {
        return FailureTable.toProblem(SolverFailure.of(kind, "m", null), context);
    }
}
