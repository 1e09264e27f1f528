package com.loopwright.api;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertThrows;

import com.loopwright.api.design.DesignRequest;
import com.loopwright.api.design.DesignRequestValidator;
import com.loopwright.api.design.ValidatedDesign;
import com.loopwright.api.plant.CanonicalPlantInput;
import com.loopwright.api.validation.FieldLimits;
import com.loopwright.api.validation.InvalidRequestException;
import com.loopwright.api.validation.SpecInput;
import com.loopwright.solver.design.GammaChoice;
import com.loopwright.solver.spec.TimeSpec;
import org.junit.jupiter.api.Test;

/** Validation at the documented range edges (common practice: test both sides of every bound). */
class DesignRequestValidatorTest {

    private final DesignRequestValidator validator = new DesignRequestValidator();
    private static final CanonicalPlantInput AXIS = new CanonicalPlantInput(0.0, 0.48, 400.0, 400.0);

    private static SpecInput spec(Double settling, Double overshoot) {
        return new SpecInput(settling, overshoot, null, null, null, null, null);
    }

    @Test
    void appliesDefaults() {
        ValidatedDesign design = validator.validate(new DesignRequest(AXIS, spec(0.15, 1.5)));
        assertEquals(0.015, design.spec().overshootFraction(), 1e-15);
        TimeSpec.SettlingTime settling =
                assertInstanceOf(TimeSpec.SettlingTime.class, design.spec().timeSpec());
        assertEquals(FieldLimits.DEFAULT_BAND_PERCENT / 100, settling.bandFraction(), 0);
        assertEquals(
                FieldLimits.DEFAULT_GAMMA_MARGIN,
                assertInstanceOf(GammaChoice.MarginOverMinimum.class, design.gammaChoice())
                        .factor(),
                0);
        assertEquals(FieldLimits.DEFAULT_STEP, design.stepSize(), 0);
        assertEquals("/spec/settlingTime", design.timeSpecPointer());
    }

    @Test
    void acceptsEveryBoundItselfAndRejectsJustBeyond() {
        validator.validate(
                new DesignRequest(AXIS, spec(FieldLimits.MIN_TIME_SECONDS, FieldLimits.MIN_OVERSHOOT_PERCENT)));
        validator.validate(
                new DesignRequest(AXIS, spec(FieldLimits.MAX_TIME_SECONDS, FieldLimits.MAX_OVERSHOOT_PERCENT)));
        assertPointer(
                "/spec/settlingTime", new DesignRequest(AXIS, spec(Math.nextDown(FieldLimits.MIN_TIME_SECONDS), 1.0)));
        assertPointer(
                "/spec/overshootPercent",
                new DesignRequest(AXIS, spec(1.0, Math.nextUp(FieldLimits.MAX_OVERSHOOT_PERCENT))));
        assertPointer(
                "/plant/b",
                new DesignRequest(new CanonicalPlantInput(0.0, 0.0, FieldLimits.MIN_ABS_B / 2, 1.0), spec(1.0, 1.0)));
        assertPointer(
                "/plant/a0",
                new DesignRequest(new CanonicalPlantInput(-2 * FieldLimits.MAX_ABS_A0, 0.0, 1.0, 1.0), spec(1.0, 1.0)));
        validator.validate(
                new DesignRequest(new CanonicalPlantInput(0.0, 0.0, -FieldLimits.MIN_ABS_B, 0.0), spec(1.0, 1.0)));
    }

    @Test
    void rejectsNonFiniteValues() {
        assertPointer(
                "/plant/d",
                new DesignRequest(new CanonicalPlantInput(0.0, 0.0, 1.0, Double.POSITIVE_INFINITY), spec(1.0, 1.0)));
        assertPointer("/spec/settlingTime", new DesignRequest(AXIS, spec(Double.NaN, 1.0)));
    }

    @Test
    void fixedGammaIsPassedThrough() {
        ValidatedDesign design =
                validator.validate(new DesignRequest(AXIS, new SpecInput(null, 1.0, 5.0, 0.1, 3.0, null, -2.0)));
        assertEquals(
                3.0,
                assertInstanceOf(GammaChoice.Fixed.class, design.gammaChoice()).gamma(),
                0);
        assertEquals("/spec/riseTime", design.timeSpecPointer());
        assertEquals(0.05, design.bandFraction(), 1e-15);
        assertEquals(-2.0, design.stepSize(), 0);
    }

    private void assertPointer(String pointer, DesignRequest request) {
        InvalidRequestException e = assertThrows(InvalidRequestException.class, () -> validator.validate(request));
        assertEquals(pointer, e.errors().get(0).pointer(), e.errors().toString());
    }
}
