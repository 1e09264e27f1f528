package com.loopwright.solver.export;

import com.loopwright.solver.design.SampledLaw;

/**
 * The sampled law as one C99 function with the gains as constants: call it once per sample period.
 * Compiles warning-free with {@code -std=c99 -Wall -Wextra}; needs no library.
 */
public final class CSourceWriter {

    /** Name of the generated function. */
    public static final String FUNCTION_NAME = "lw_state_feedback_command";

    public String write(ExportHeader header, SampledLaw law) {
        StringBuilder c = new StringBuilder();
        c.append("/*\n");
        for (String line : Literals.header(header, law)) {
            c.append(" * ").append(line).append('\n');
        }
        c.append(" */\n");
        c.append("#define LW_K_POSITION (")
                .append(Literals.real(law.positionGain()))
                .append(")\n");
        c.append("#define LW_K_VELOCITY (")
                .append(Literals.real(law.velocityGain()))
                .append(")\n");
        c.append("#define LW_K_REFERENCE (")
                .append(Literals.real(law.referenceGain()))
                .append(")\n");
        c.append("#define LW_ACTUATOR_LIMIT (")
                .append(Literals.real(law.actuatorLimit()))
                .append(")\n");
        c.append("#define LW_SAMPLE_PERIOD_S (")
                .append(Literals.real(law.samplePeriod()))
                .append(")\n\n");
        c.append("/* Returns u for one sample; *saturated (if not NULL) is set to 1 while the clamp is active. */\n");
        c.append("double ")
                .append(FUNCTION_NAME)
                .append("(double setpoint, double position, double velocity, int *saturated)\n");
        c.append("{\n");
        c.append("    double u = LW_K_REFERENCE * setpoint - (LW_K_POSITION * position + LW_K_VELOCITY * velocity);\n");
        c.append("    int clamped = 0;\n");
        c.append("    if (u > LW_ACTUATOR_LIMIT) {\n");
        c.append("        u = LW_ACTUATOR_LIMIT;\n");
        c.append("        clamped = 1;\n");
        c.append("    } else if (u < -LW_ACTUATOR_LIMIT) {\n");
        c.append("        u = -LW_ACTUATOR_LIMIT;\n");
        c.append("        clamped = 1;\n");
        c.append("    }\n");
        c.append("    if (saturated) {\n");
        c.append("        *saturated = clamped;\n");
        c.append("    }\n");
        c.append("    return u;\n");
        c.append("}\n");
        return c.toString();
    }
}
