package com.loopwright.api.loop;

import static org.junit.jupiter.api.Assertions.*;

import com.loopwright.api.design.DesignRequest;
import com.loopwright.api.design.DesignRequestValidator;
import com.loopwright.api.design.ValidatedDesign;
import com.loopwright.api.plant.CanonicalPlantInput;
import com.loopwright.api.problem.FieldError;
import com.loopwright.api.validation.InvalidRequestException;
import com.loopwright.api.validation.SpecInput;
import com.loopwright.solver.pipeline.LoopStructure;
import com.loopwright.solver.pipeline.ObserverChoice;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * The loop-structure fields: defaults, exclusive choices, fields of a choice not made, ranges at both edges (common
 * practice: test both sides of every bound), each error at its pointer.
 */
class LoopInputValidatorTest {

    private final LoopInputValidator validator = new LoopInputValidator();

    private static LoopInput loop(Boolean integral, Double multiple, String measurement, ObserverInput observer) {
        return new LoopInput(integral, multiple, measurement, observer, null);
    }

    private List<FieldError> errorsOf(LoopInput input) {
        List<FieldError> errors = new ArrayList<>();
        assertNull(validator.validate(input, errors));
        return errors;
    }

    private List<String> pointersOf(LoopInput input) {
        return errorsOf(input).stream().map(FieldError::pointer).toList();
    }

    @Test
    void absentFieldsMeanThePlainLoop() {
        List<FieldError> errors = new ArrayList<>();
        assertNull(validator.validate(new LoopInput(null, null, null, null, null), errors));
        assertTrue(errors.isEmpty());
    }

    @Test
    void integralActionTakesTheDefaults() {
        List<FieldError> errors = new ArrayList<>();
        ValidatedLoop v = validator.validate(loop(true, null, null, null), errors);
        assertTrue(errors.isEmpty(), errors.toString());
        assertTrue(v.structure().integralAction());
        assertEquals(LoopLimits.DEFAULT_INTEGRAL_POLE_MULTIPLE, v.structure().integralPoleMultiple(), 0);
        assertEquals(LoopStructure.Measurement.FULL_STATE, v.structure().measurement());
        assertNull(v.structure().observer());
        assertEquals(LoopLimits.DEFAULT_LOAD_STEP, v.loadStepSize(), 0);
    }

    @Test
    void positionWithoutObserverUsesPolesAtTheDefaultMultiple() {
        List<FieldError> errors = new ArrayList<>();
        ValidatedLoop v = validator.validate(loop(null, null, "position", null), errors);
        assertFalse(v.structure().integralAction());
        assertEquals(
                LoopLimits.DEFAULT_OBSERVER_MULTIPLE,
                assertInstanceOf(
                                ObserverChoice.PoleMultiple.class, v.structure().observer())
                        .multiple(),
                0);
    }

    /** Quantization noise: uniform rounding error of variance Delta^2/12 held for T (common practice). */
    @Test
    void sensorResolutionGivesTheQuantizationIntensity() {
        List<FieldError> errors = new ArrayList<>();
        ValidatedLoop v = validator.validate(
                loop(null, null, "position", new ObserverInput("kalman", 2.0, null, 1e-3, 1e-3, null)), errors);
        ObserverChoice.Kalman k =
                assertInstanceOf(ObserverChoice.Kalman.class, v.structure().observer());
        assertEquals(2.0, k.processIntensity(), 0);
        assertEquals(1e-6 / 12 * 1e-3, k.measurementIntensity(), 1e-24);
    }

    @Test
    void measurementNoiseIsTakenAsGiven() {
        List<FieldError> errors = new ArrayList<>();
        ValidatedLoop v = validator.validate(
                loop(true, 6.0, "position", new ObserverInput("kalman", 2.0, 3e-9, null, null, null)), errors);
        ObserverChoice.Kalman k =
                assertInstanceOf(ObserverChoice.Kalman.class, v.structure().observer());
        assertEquals(3e-9, k.measurementIntensity(), 0);
        assertEquals(6.0, v.structure().integralPoleMultiple(), 0);
    }

    @Test
    void integralPoleMultipleEdges() {
        List<FieldError> errors = new ArrayList<>();
        assertNotNull(validator.validate(loop(true, LoopLimits.MIN_INTEGRAL_POLE_MULTIPLE, null, null), errors));
        assertNotNull(validator.validate(loop(true, LoopLimits.MAX_INTEGRAL_POLE_MULTIPLE, null, null), errors));
        assertTrue(errors.isEmpty());
        assertEquals(
                List.of("/integralPoleMultiple"),
                pointersOf(loop(true, Math.nextDown(LoopLimits.MIN_INTEGRAL_POLE_MULTIPLE), null, null)));
        assertEquals(
                List.of("/integralPoleMultiple"),
                pointersOf(loop(true, Math.nextUp(LoopLimits.MAX_INTEGRAL_POLE_MULTIPLE), null, null)));
        assertEquals(List.of("/integralPoleMultiple"), pointersOf(loop(true, Double.NaN, null, null)));
    }

    @Test
    void fieldsOfAChoiceNotMadeAreNamed() {
        assertTrue(pointersOf(loop(false, 4.0, "position", null)).contains("/integralPoleMultiple"));
        assertTrue(pointersOf(
                        loop(true, null, "fullState", new ObserverInput("poleMultiple", null, null, null, null, 5.0)))
                .contains("/observer"));
        assertEquals(
                List.of("/observer/multiple"),
                pointersOf(loop(null, null, "position", new ObserverInput("kalman", 1.0, 1.0, null, null, 5.0))));
        assertEquals(
                List.of("/observer/processNoise"),
                pointersOf(
                        loop(null, null, "position", new ObserverInput("poleMultiple", 1.0, null, null, null, 5.0))));
        assertEquals(List.of("/loadStepSize"), pointersOf(new LoopInput(false, null, null, null, 2.0)));
        assertEquals(List.of("/integralAction"), pointersOf(new LoopInput(false, null, null, null, null)));
    }

    @Test
    void kalmanNeedsItsNoisesAndOneMeasurementNoise() {
        assertEquals(
                List.of("/observer/processNoise", "/observer/measurementNoise"),
                pointersOf(loop(null, null, "position", new ObserverInput("kalman", null, null, null, null, null))));
        assertEquals(
                List.of("/observer/measurementNoise"),
                pointersOf(loop(null, null, "position", new ObserverInput("kalman", 1.0, 1.0, 1e-3, 1e-3, null))));
        assertEquals(
                List.of("/observer/samplePeriod"),
                pointersOf(loop(null, null, "position", new ObserverInput("kalman", 1.0, null, 1e-3, null, null))));
        assertEquals(
                List.of("/observer/processNoise"),
                pointersOf(loop(null, null, "position", new ObserverInput("kalman", 0.0, 1.0, null, null, null))));
        assertEquals(
                List.of("/observer/samplePeriod"),
                pointersOf(loop(
                        null,
                        null,
                        "position",
                        new ObserverInput(
                                "kalman", 1.0, null, 1e-3, Math.nextUp(LoopLimits.MAX_SAMPLE_PERIOD), null))));
    }

    @Test
    void unknownWordsAreNamed() {
        assertEquals(List.of("/measurement"), pointersOf(loop(true, null, "velocity", null)));
        assertEquals(
                List.of("/observer/method"),
                pointersOf(loop(null, null, "position", new ObserverInput("luenberger", null, null, null, null, 5.0))));
        assertEquals(
                List.of("/observer/method"),
                pointersOf(loop(null, null, "position", new ObserverInput(null, null, null, null, null, null))));
        assertEquals(
                List.of("/observer/multiple"),
                pointersOf(loop(
                        null,
                        null,
                        "position",
                        new ObserverInput(
                                "poleMultiple",
                                null,
                                null,
                                null,
                                null,
                                Math.nextUp(LoopLimits.MAX_OBSERVER_MULTIPLE)))));
        assertEquals(List.of("/loadStepSize"), pointersOf(new LoopInput(true, null, null, null, 0.0)));
    }

    /** The order-2 request carries the fields, and the loop needs a settling-time spec. */
    @Test
    void designRequestCarriesTheLoopAndRefusesRiseTime() {
        CanonicalPlantInput axis = new CanonicalPlantInput(0.0, 0.48, 400.0, 400.0);
        DesignRequestValidator designs = new DesignRequestValidator();
        ValidatedDesign plain =
                designs.validate(new DesignRequest(axis, new SpecInput(0.15, 1.5, null, null, null, null, null)));
        assertNull(plain.loop());
        ValidatedDesign integral = designs.validate(new DesignRequest(
                axis, new SpecInput(0.15, 1.5, null, null, null, null, null), null, true, null, null, null, -3.0));
        assertTrue(integral.loop().structure().integralAction());
        assertEquals(-3.0, integral.loop().loadStepSize(), 0);
        InvalidRequestException e = assertThrows(
                InvalidRequestException.class,
                () -> designs.validate(new DesignRequest(
                        axis,
                        new SpecInput(null, 1.5, null, 0.1, null, null, null),
                        null,
                        true,
                        null,
                        null,
                        null,
                        null)));
        assertEquals(
                List.of("/spec/riseTime"),
                e.errors().stream().map(FieldError::pointer).toList());
    }
}
