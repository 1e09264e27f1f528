package com.loopwright.solver.pipeline;

import com.loopwright.solver.design.Infeasibility;
import java.util.Objects;

/**
 * The one failure the solver's front door ({@code solver.pipeline}) reports: a {@link Kind} per cause, the solver's
 * own message, and the few details a caller needs to name the offending input. Internal exceptions of the solver
 * are translated into it at the front door, with the original as the cause.
 */
public final class SolverFailure extends RuntimeException {

    private static final long serialVersionUID = 1L;

    /** Why the solver could not answer. */
    public enum Kind {
        /** The plant description is well-formed but not physical or not usable; the subject names the parameter. */
        PLANT_MODEL,
        /** The spec cannot be met by this plant; {@link #infeasibility()} says which spec and proposes values. */
        INFEASIBLE_SPEC,
        /** The state-space input vector does not make the plant controllable. */
        UNCONTROLLABLE,
        /** The tracked output has a zero at s = 0: the reference cannot be scaled to it. */
        NO_DC_GAIN,
        /** A verification step (numeric Riccati, norm, simulation) could not be computed. */
        UNVERIFIABLE,
        /** The high-order closed loop could not be simulated or its eigenvalues checked. */
        LOOP_NOT_SIMULABLE,
        /** A robustness check could not be computed in double precision. */
        CHECK_NOT_COMPUTABLE,
        /** A robustness check would exceed its interval cap; the subject names the option, index the entry. */
        CAP_EXCEEDED,
        /** The loop to check or to sweep is unstable. */
        UNSTABLE_LOOP,
        /** The step-response fit did not converge to a usable model. */
        FIT_FAILED,
        /** The sampled control law cannot be built; the subject names the offending input. */
        SAMPLED_LAW_INFEASIBLE,
        /** The data of a figure (a series, a frequency response) could not be computed. */
        FIGURE_NOT_COMPUTABLE
    }

    /** Subjects of {@link Kind#SAMPLED_LAW_INFEASIBLE}. */
    public static final String SAMPLE_PERIOD = "samplePeriod";

    public static final String ACTUATOR_LIMIT = "actuatorLimit";
    /** The sample period of a robust design (the request's robust.samplePeriod). */
    public static final String ROBUST_SAMPLE_PERIOD = "robustSamplePeriod";
    /** Subject of a CAP_EXCEEDED failure of the robust design's target search (its evaluation caps). */
    public static final String ROBUST_SEARCH = "ROBUST_SEARCH";

    private final Kind kind;
    private final String subject;
    private final int index;
    private final transient Infeasibility infeasibility;

    private SolverFailure(
            Kind kind, String message, String subject, int index, Infeasibility infeasibility, Throwable cause) {
        super(message, cause);
        this.kind = Objects.requireNonNull(kind, "kind");
        this.subject = subject == null ? "" : subject;
        this.index = index;
        this.infeasibility = infeasibility;
    }

    /** A failure without details beyond its message. */
    public static SolverFailure of(Kind kind, String message, Throwable cause) {
        return new SolverFailure(kind, message, "", -1, null, cause);
    }

    /** A failure about one named input (a plant parameter, a check option, ...) and, for a list, its index. */
    public static SolverFailure about(Kind kind, String subject, int index, String message, Throwable cause) {
        return new SolverFailure(kind, message, subject, index, null, cause);
    }

    /** An infeasible spec, with the spec to blame and the computed proposals. */
    public static SolverFailure infeasible(Infeasibility infeasibility, Throwable cause) {
        return new SolverFailure(Kind.INFEASIBLE_SPEC, infeasibility.reason(), "", -1, infeasibility, cause);
    }

    public Kind kind() {
        return kind;
    }

    /** The offending input named by the solver ("" when none): a plant parameter, a check option, ... */
    public String subject() {
        return subject;
    }

    /** Index of the offending entry of a list input, or -1. */
    public int index() {
        return index;
    }

    /** For {@link Kind#INFEASIBLE_SPEC}: the spec to blame and the proposals; else null. */
    public Infeasibility infeasibility() {
        return infeasibility;
    }
}
