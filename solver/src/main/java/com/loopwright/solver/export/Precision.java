package com.loopwright.solver.export;

/** The floating-point type of an export: IEC LREAL / C double, or IEC REAL / C float. */
public enum Precision {
    /** 64-bit: LREAL, double. */
    DOUBLE("LREAL", "double"),
    /** 32-bit: REAL, float (constants rounded to the nearest float). */
    SINGLE("REAL", "float");

    private final String iecType;
    private final String cType;

    Precision(String iecType, String cType) {
        this.iecType = iecType;
        this.cType = cType;
    }

    public String iecType() {
        return iecType;
    }

    public String cType() {
        return cType;
    }

    /** The constant in IEC syntax: shortest round-trip decimal of the double, or of the nearest float. */
    String iecLiteral(double value) {
        return this == DOUBLE ? Literals.real(value) : Float.toString(toFloat(value));
    }

    /** The constant in C syntax (a float literal carries the 'f' suffix). */
    String cLiteral(double value) {
        return this == DOUBLE ? Literals.real(value) : Float.toString(toFloat(value)) + "f";
    }

    private static float toFloat(double value) {
        float f = (float) Literals.realValue(value);
        if (!Float.isFinite(f)) {
            throw new IllegalArgumentException("the constant " + value + " does not fit a 32-bit REAL");
        }
        return f;
    }
}
