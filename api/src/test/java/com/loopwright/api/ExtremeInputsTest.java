package com.loopwright.api;

import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.api.endpoint.Answer;
import com.loopwright.api.validation.FieldLimits;
import java.nio.charset.StandardCharsets;
import java.util.Map;
import java.util.TreeMap;
import org.junit.jupiter.api.Test;

/**
 * Every combination of documented range edges (and a few interior values) gives a design or a 4xx problem:
 * never an exception, never a non-finite number, never an uncertified design (common practice: test the
 * corners of the input box).
 */
class ExtremeInputsTest {

    @Test
    void rangeCornersGiveADesignOrAProblem() {
        double[] a0 = {-FieldLimits.MAX_ABS_A0, -1, 0, 1, FieldLimits.MAX_ABS_A0};
        double[] a1 = {-FieldLimits.MAX_ABS_A1, 0, 0.5, FieldLimits.MAX_ABS_A1};
        double[] b = {-FieldLimits.MAX_ABS_B, FieldLimits.MIN_ABS_B, 1, FieldLimits.MAX_ABS_B};
        double[] d = {0, 1, FieldLimits.MAX_ABS_D};
        double[] time = {FieldLimits.MIN_TIME_SECONDS, 1, FieldLimits.MAX_TIME_SECONDS};
        double[] overshoot = {FieldLimits.MIN_OVERSHOOT_PERCENT, 1, FieldLimits.MAX_OVERSHOOT_PERCENT};
        Map<Integer, Integer> statuses = new TreeMap<>();
        for (double x0 : a0) {
            for (double x1 : a1) {
                for (double xb : b) {
                    for (double xd : d) {
                        for (double t : time) {
                            for (double os : overshoot) {
                                String body = String.format(
                                        java.util.Locale.ROOT,
                                        "{\"plant\":{\"form\":\"canonical\",\"a0\":%s,\"a1\":%s,\"b\":%s,\"d\":%s},"
                                                + "\"spec\":{\"settlingTime\":%s,\"overshootPercent\":%s}}",
                                        x0,
                                        x1,
                                        xb,
                                        xd,
                                        t,
                                        os);
                                Answer outcome = Answer.design(body.getBytes(StandardCharsets.UTF_8));
                                statuses.merge(outcome.status(), 1, Integer::sum);
                                assertTrue(
                                        outcome.status() == 200 || outcome.status() == 422,
                                        body + " -> " + outcome.status() + " " + outcome.body());
                                // A design that comes back is certified and meets its specs in simulation.
                                if (outcome.status() == 200) {
                                    assertTrue(
                                            outcome.body()
                                                            .at("/verification/certified")
                                                            .asBoolean()
                                                    && outcome.body()
                                                            .at("/verification/specsMet")
                                                            .asBoolean(),
                                            body);
                                }
                                assertTrue(
                                        !outcome.body().toString().contains("NaN")
                                                && !outcome.body().toString().contains("Infinity"),
                                        body);
                            }
                        }
                    }
                }
            }
        }
        System.out.println("range corners: " + statuses);
        assertTrue(statuses.getOrDefault(200, 0) > 0 && statuses.getOrDefault(422, 0) > 0, statuses.toString());
    }
}
