package com.loopwright.api.design;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ObjectNode;
import com.loopwright.api.endpoint.Answer;
import com.loopwright.api.json.StrictJson;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * Plain-language advice for the commonest spec mistakes (issue 15), the sanity notes with their codes, and the
 * ready-to-send spec of each proposal. Each test is the reproduction of its case.
 */
class DesignAdviceTest {

    private final ObjectMapper mapper = StrictJson.newMapper();

    private ObjectNode request(double a0, double a1, double overshootPercent, double settlingTime) {
        ObjectNode root = mapper.createObjectNode();
        ObjectNode plant = root.putObject("plant");
        plant.put("form", "canonical");
        plant.put("a0", a0);
        plant.put("a1", a1);
        plant.put("b", 1.0);
        plant.put("d", 1.0);
        ObjectNode spec = root.putObject("spec");
        spec.put("overshootPercent", overshootPercent);
        spec.put("settlingTime", settlingTime);
        return root;
    }

    private static String errorDetail(Answer answer, String pointer) {
        for (JsonNode error : answer.body().get("errors")) {
            if (error.get("pointer").asText().equals(pointer)) {
                return error.get("detail").asText();
            }
        }
        throw new AssertionError("no error at " + pointer + ": " + answer.text());
    }

    private static List<String> codes(Answer answer) {
        List<String> codes = new ArrayList<>();
        answer.body().get("noteCodes").forEach(c -> codes.add(c.asText()));
        assertEquals(answer.body().get("notes").size(), codes.size(), "one code per note");
        return codes;
    }

    private static String note(Answer answer, String code) {
        int index = codes(answer).indexOf(code);
        assertTrue(index >= 0, code + " missing: " + answer.body().get("noteCodes"));
        return answer.body().get("notes").get(index).asText();
    }

    @Test
    void zeroOvershootIsRefusedWithTheMinimumAndWhy() {
        Answer answer = Answer.design(request(0, 1, 0, 1));
        assertEquals(400, answer.status(), answer.text());
        String detail = errorDetail(answer, "/spec/overshootPercent");
        assertTrue(detail.startsWith("must be a finite number from 0.001 to 95"), detail);
        assertTrue(detail.contains("critically damped") && detail.contains("zeta < 1"), detail);
        // source: textbook overshoot-damping formula zeta = -ln(OS)/sqrt(pi^2 + ln^2 OS), recomputed here:
        // 0.001 % -> 0.965, 0.1 % -> 0.910 (method notes, section 5: 0.1 % needs zeta ~ 0.91)
        double lnMin = Math.log(1e-5);
        double lnTenth = Math.log(1e-3);
        String zetaMin =
                String.format(java.util.Locale.US, "%.3g", -lnMin / Math.sqrt(Math.PI * Math.PI + lnMin * lnMin));
        String zetaTenth =
                String.format(java.util.Locale.US, "%.3g", -lnTenth / Math.sqrt(Math.PI * Math.PI + lnTenth * lnTenth));
        assertEquals("0.965", zetaMin);
        assertEquals("0.910", zetaTenth);
        assertTrue(detail.contains("damping ratio " + zetaMin) && detail.contains("means " + zetaTenth), detail);
    }

    @Test
    void anOvershootBelowTheRangeReadsAsAFractionTypedAsAPercentage() {
        Answer answer = Answer.design(request(0, 1, 0.0005, 1));
        assertEquals(400, answer.status(), answer.text());
        String detail = errorDetail(answer, "/spec/overshootPercent");
        assertTrue(detail.contains("fraction typed as a percentage") && detail.contains("0.05 %"), detail);
    }

    @Test
    void anAcceptedOvershootBelowATenthIsDesignedAsGivenWithANote() {
        // 0.05 probably meant 5 %: today's range accepts it, so it stays accepted, with the note
        Answer answer = Answer.design(request(0, 1, 0.05, 1));
        assertEquals(200, answer.status(), answer.text());
        String note = note(answer, DesignNotes.OVERSHOOT_LOOKS_LIKE_FRACTION);
        assertTrue(note.contains("meets 0.05 %") && note.contains("overshootPercent = 5."), note);
        // 0.1 itself and 5 get no such note
        assertFalse(codes(Answer.design(request(0, 1, 0.1, 1))).contains(DesignNotes.OVERSHOOT_LOOKS_LIKE_FRACTION));
        assertFalse(codes(Answer.design(request(0, 1, 4, 1))).contains(DesignNotes.OVERSHOOT_LOOKS_LIKE_FRACTION));
    }

    @Test
    void aPeakCommandFarAboveTheActuatorLimitIsNoted() {
        ObjectNode request = request(0, 1, 4, 1);
        Answer free = Answer.design(request);
        assertEquals(200, free.status(), free.text());
        double peak = free.body().get("simulated").get("peakControl").asDouble();
        // source: pole matching (method notes, section 2): u(0+) = kr r = wn^2 r/b, and the peak is at least that
        double wn = free.body().get("target").get("naturalFrequency").asDouble();
        assertTrue(peak >= wn * wn * (1 - 1e-9), peak + " vs " + wn * wn);
        request.putObject("verify").put("actuatorLimit", peak / 20);
        Answer limited = Answer.design(request);
        assertEquals(200, limited.status(), limited.text());
        assertTrue(note(limited, DesignNotes.PEAK_COMMAND_ABOVE_ACTUATOR_LIMIT).contains("20.0 times"));
        request.putObject("verify").put("actuatorLimit", peak / 5);
        assertFalse(codes(Answer.design(request)).contains(DesignNotes.PEAK_COMMAND_ABOVE_ACTUATOR_LIMIT));
    }

    @Test
    void aSpecFarFasterThanThePlantIsNotedAgainstThePlantsOwnScale() {
        // a soft spring, a0 = 0.01 1/s^2 (wp = 0.1 rad/s), asked to settle in 0.1 s: wn about 58 rad/s
        Answer fast = Answer.design(request(0.01, 0, 4, 0.1));
        assertEquals(200, fast.status(), fast.text());
        double peak = fast.body().get("simulated").get("peakControl").asDouble();
        // own scale: (|a0| + |a1| wp + wp^2)/|b| = (0.01 + 0 + 0.01)/1 = 0.02 per unit step (hand computed)
        double scale = 0.02;
        assertEquals(
                scale,
                DesignNotes.plantCommandScale(new com.loopwright.solver.plant.CanonicalPlant(0.01, 0, 1, 1)),
                1e-15);
        assertTrue(peak > 1e3 * scale);
        assertTrue(note(fast, DesignNotes.PEAK_COMMAND_ABOVE_PLANT_SCALE).contains("times the plant's own"));
        // a plant with a pace near the spec's (a0 = 1, a1 = 1; peak about wn^2 = 34, scale 3): no note
        assertFalse(codes(Answer.design(request(1, 1, 4, 1))).contains(DesignNotes.PEAK_COMMAND_ABOVE_PLANT_SCALE));
        // no stiffness (a0 = 0): no pace of its own, no scale, no note, however fast the spec
        assertFalse(
                codes(Answer.design(request(0, 0.01, 4, 0.1))).contains(DesignNotes.PEAK_COMMAND_ABOVE_PLANT_SCALE));
    }

    @Test
    void aSettlingTimeWithinFewSamplePeriodsIsNoted() {
        ObjectNode request = request(0, 1, 4, 1);
        request.putObject("verify").putObject("sampling").put("samplePeriod", 0.2);
        Answer coarse = Answer.design(request);
        assertEquals(200, coarse.status(), coarse.text());
        double settling = coarse.body().get("simulated").get("settlingTime").asDouble();
        assertTrue(settling < 10 * 0.2);
        assertTrue(note(coarse, DesignNotes.SETTLING_WITHIN_FEW_SAMPLES).contains("fewer than 10"));
        request.putObject("verify").putObject("sampling").put("samplePeriod", 0.001);
        assertFalse(codes(Answer.design(request)).contains(DesignNotes.SETTLING_WITHIN_FEW_SAMPLES));
    }

    @Test
    void aDampingLimitIsExplainedAsTheMethodsAndEachProposalIsAReadyToSendSpec() {
        // a pure inertia (a0 = 0) asked for 10 % overshoot: damping ratio 0.591, below 1/sqrt(2)
        ObjectNode request = request(0, 1, 10, 1);
        request.with("spec").put("gammaMargin", 1.5);
        Answer answer = Answer.design(request);
        assertEquals(422, answer.status(), answer.text());
        String detail = answer.body().get("detail").asText();
        assertTrue(detail.contains("limit of the certified method, not a fault of the plant"), detail);
        JsonNode proposals = answer.body().get("proposals");
        assertTrue(proposals.size() >= 1, answer.text());
        for (JsonNode proposal : proposals) {
            JsonNode spec = proposal.get("spec");
            String field = proposal.get("pointer").asText().substring("/spec/".length());
            assertEquals(proposal.get("value").asDouble(), spec.get(field).asDouble(), 0.0);
            assertEquals(1.5, spec.get("gammaMargin").asDouble(), 0.0, "the rest of the spec is kept");
            ObjectNode retry = request.deepCopy();
            retry.set("spec", spec);
            Answer accepted = Answer.design(retry);
            assertEquals(200, accepted.status(), accepted.text());
        }
    }
}
