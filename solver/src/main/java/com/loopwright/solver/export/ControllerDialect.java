package com.loopwright.solver.export;

/** The spelling of the controller's statements in one language (the statements and their order are shared). */
interface ControllerDialect {

    /** A design constant, by its neutral name (e.g. KQ_1). */
    String constant(String name);

    /** An input (Enable, Setpoint, Y1.., GainScale, MeasuredPeriod). */
    String input(String name);

    /** A persistent state (Q1.., WasEnabled), an output (Command, Saturated, ...) or a per-call local. */
    String variable(String name);

    /** A number literal written in the code (0.0, 1.0). */
    String literal(String text);

    String assign(String target, String expression);

    String ifOpen(String condition);

    String elsif(String condition);

    String otherwise();

    String endIf();

    String and();

    String or();

    String not();

    String trueValue();

    String falseValue();
}
