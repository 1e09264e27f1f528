package com.loopwright.solver.export;

import com.loopwright.solver.design.SampledLaw;

/**
 * The sampled law as an IEC 61131-3 Structured Text function block: setpoint and measured position and
 * velocity in, clamped command and a saturation flag out; gains as constants. Call it once per sample period
 * from a cyclic task with that period.
 */
public final class StructuredTextWriter {

    /** Name of the generated function block. */
    public static final String BLOCK_NAME = "LW_StateFeedback";

    public String write(ExportHeader header, SampledLaw law) {
        StringBuilder st = new StringBuilder();
        for (String line : Literals.header(header, law)) {
            st.append("(* ").append(line).append(" *)\n");
        }
        st.append("FUNCTION_BLOCK ").append(BLOCK_NAME).append('\n');
        st.append("VAR_INPUT\n");
        st.append("    Enable : BOOL; (* FALSE holds the command at 0 *)\n");
        st.append("    Setpoint : LREAL; (* r, x1 units *)\n");
        st.append("    Position : LREAL; (* x1, measured *)\n");
        st.append("    Velocity : LREAL; (* x2 = dx1/dt, measured or observed *)\n");
        st.append("END_VAR\n");
        st.append("VAR_OUTPUT\n");
        st.append("    Command : LREAL; (* u, clamped to the actuator limit *)\n");
        st.append("    Saturated : BOOL; (* TRUE while the clamp is active *)\n");
        st.append("END_VAR\n");
        st.append("VAR CONSTANT\n");
        st.append("    K_POSITION : LREAL := ")
                .append(Literals.real(law.positionGain()))
                .append(";\n");
        st.append("    K_VELOCITY : LREAL := ")
                .append(Literals.real(law.velocityGain()))
                .append(";\n");
        st.append("    K_REFERENCE : LREAL := ")
                .append(Literals.real(law.referenceGain()))
                .append(";\n");
        st.append("    ACTUATOR_LIMIT : LREAL := ")
                .append(Literals.real(law.actuatorLimit()))
                .append(";\n");
        st.append("    SAMPLE_PERIOD_S : LREAL := ")
                .append(Literals.real(law.samplePeriod()))
                .append("; (* the task period this block was designed for *)\n");
        st.append("END_VAR\n");
        st.append("VAR\n");
        st.append("    Unclamped : LREAL;\n");
        st.append("END_VAR\n");
        st.append("IF Enable THEN\n");
        st.append("    Unclamped := K_REFERENCE * Setpoint - (K_POSITION * Position + K_VELOCITY * Velocity);\n");
        st.append("ELSE\n");
        st.append("    Unclamped := 0.0;\n");
        st.append("END_IF;\n");
        st.append("IF Unclamped > ACTUATOR_LIMIT THEN\n");
        st.append("    Command := ACTUATOR_LIMIT;\n");
        st.append("    Saturated := TRUE;\n");
        st.append("ELSIF Unclamped < -ACTUATOR_LIMIT THEN\n");
        st.append("    Command := -ACTUATOR_LIMIT;\n");
        st.append("    Saturated := TRUE;\n");
        st.append("ELSE\n");
        st.append("    Command := Unclamped;\n");
        st.append("    Saturated := FALSE;\n");
        st.append("END_IF;\n");
        st.append("END_FUNCTION_BLOCK\n");
        return st.toString();
    }
}
