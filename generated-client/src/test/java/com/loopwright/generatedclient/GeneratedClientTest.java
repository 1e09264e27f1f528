package com.loopwright.generatedclient;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.client.ApiClient;
import com.loopwright.client.ApiException;
import com.loopwright.client.api.ControllersApi;
import com.loopwright.client.api.DesignsApi;
import com.loopwright.client.api.ModelsApi;
import com.loopwright.client.model.BatchRequest;
import com.loopwright.client.model.BatchStreamLine;
import com.loopwright.client.model.ControllerParameters;
import com.loopwright.client.model.ControllerRequest;
import com.loopwright.client.model.DesignRequest;
import com.loopwright.client.model.DesignResponse;
import com.loopwright.client.model.FitRequest;
import com.loopwright.client.model.FitResponse;
import com.loopwright.client.model.PlantDescription;
import com.loopwright.client.model.PlantInput;
import com.loopwright.client.model.Problem;
import com.loopwright.client.model.RotaryAxisPlant;
import com.loopwright.client.model.SpecInput;
import com.loopwright.client.model.StepTestSamples;
import com.loopwright.service.LoopwrightApp;
import com.loopwright.service.ServiceConfig;
import io.javalin.Javalin;
import java.io.IOException;
import java.net.URI;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.file.Files;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * The client generated from openapi.yaml (target/generated-sources, package com.loopwright.client) against the real
 * service started in-process on a free loopback port: a design, a batch, a fit, a controller export and a problem,
 * each through the generated API and model classes only.
 *
 * <p>Every wire name and problem type this test depends on is in {@link Wire} (field renames: edit there); the
 * generated getters follow the contract's names, so a rename in openapi.yaml shows up here as a compile error.
 */
class GeneratedClientTest {

    /** The contract names and values this test leans on, in one place. */
    private static final class Wire {
        /** Packaging-line indexing axis, the README's example: x2' = -0.48 x2 + 400 u + 400 w. */
        static PlantInput indexingAxis() {
            return new PlantInput()
                    .form(PlantInput.FormEnum.CANONICAL)
                    .a0(num(0))
                    .a1(num(0.48))
                    .b(num(400))
                    .d(num(400));
        }

        static final double SETTLING_TIME_SECONDS = 0.15;
        static final double OVERSHOOT_PERCENT = 1.5;

        static SpecInput spec(double overshootPercent) {
            return new SpecInput().settlingTime(num(SETTLING_TIME_SECONDS)).overshootPercent(num(overshootPercent));
        }

        static final String INVALID_FIELD = "tag:loopwright.dev,2026:problem/invalid-field";
        static final String OVERSHOOT_POINTER = "/spec/overshootPercent";
        static final String BATCH_MEDIA_TYPE = "application/x-ndjson";
        static final String BATCH_PATH = "/v1/designs/batch";
    }

    /** Relative tolerance of a number the service computed against the same number computed here. */
    private static final double RELATIVE_TOLERANCE = 1e-9;
    /** Samples of the synthetic step test (the fit takes 8 to 20000). */
    private static final int FIT_SAMPLE_COUNT = 400;

    /** The generated models carry JSON numbers (`type: number, format: double`) as Double. */
    private static Double num(double value) {
        return value;
    }

    private static double value(Double number) {
        return number;
    }

    private static Javalin service;
    private static ApiClient client;

    @BeforeAll
    static void startService() {
        service = LoopwrightApp.create(ServiceConfig.fromEnvironment(Map.of("LOOPWRIGHT_PORT", "0")))
                .start("127.0.0.1", 0);
        client = new ApiClient();
        client.updateBaseUri("http://127.0.0.1:" + service.port());
        client.setReadTimeout(Duration.ofSeconds(30));
    }

    @AfterAll
    static void stopService() {
        if (service != null) {
            service.stop();
        }
    }

    private static DesignRequest indexingAxisDesign() {
        return new DesignRequest()
                .plant(new PlantDescription(Wire.indexingAxis()))
                .spec(Wire.spec(Wire.OVERSHOOT_PERCENT));
    }

    @Test
    void designGivesCertifiedGainsThatPlaceThePolesTheSpecsDemand() throws ApiException {
        DesignResponse design = new DesignsApi(client).createDesign(indexingAxisDesign());

        // Textbook: overshoot OS = exp(-pi zeta / sqrt(1 - zeta^2)), so zeta = -ln(OS) / sqrt(pi^2 + ln(OS)^2).
        double logOvershoot = Math.log(Wire.OVERSHOOT_PERCENT / 100);
        double zeta = -logOvershoot / Math.sqrt(Math.PI * Math.PI + logOvershoot * logOvershoot);
        assertEquals(zeta, value(design.getTarget().getDampingRatio()), 1e-9, "damping ratio from the overshoot");

        // Pole placement (textbook): s^2 + (a1 + b k2) s + (a0 + b k1) = s^2 + 2 zeta wn s + wn^2.
        double wn = value(design.getTarget().getNaturalFrequency());
        PlantInput plant = Wire.indexingAxis();
        double k1 = (wn * wn - value(plant.getA0())) / value(plant.getB());
        double k2 = (2 * zeta * wn - value(plant.getA1())) / value(plant.getB());
        assertEquals(k1, value(design.getGain().getK().get(0)), Math.abs(k1) * 1e-6, "k1");
        assertEquals(k2, value(design.getGain().getK().get(1)), Math.abs(k2) * 1e-6, "k2");
        // kr = wn^2 / b: unit DC gain from r to x1 (final-value theorem on the closed loop).
        double referenceGain = wn * wn / value(plant.getB());
        assertEquals(referenceGain, value(design.getGain().getReferenceGain()), referenceGain * 1e-9, "kr");

        // The simulated step meets the specs, and the H-infinity certificate holds.
        assertEquals(
                Wire.SETTLING_TIME_SECONDS,
                value(design.getSimulated().getSettlingTime()),
                0.01 * Wire.SETTLING_TIME_SECONDS);
        assertEquals(Wire.OVERSHOOT_PERCENT, value(design.getSimulated().getOvershootPercent()), 0.01);
        assertTrue(design.getVerification().getCertified(), "certified");
        assertTrue(
                design.getVerification().getPeakDisturbanceGain().compareTo(design.getGamma()) <= 0,
                design.getVerification().getPeakDisturbanceGain() + " <= " + design.getGamma());
    }

    /**
     * The generated createDesignBatch reads the body as ONE JSON value, so it cannot read an NDJSON stream of
     * several lines. The request therefore goes through the generated ApiClient's HttpClient, base URI, request
     * interceptor and ObjectMapper, and each line is read into the generated BatchStreamLine model (one class for every line of the stream).
     */
    @Test
    void batchStreamsOneTypedLinePerItemInOrder() throws Exception {
        BatchRequest batch = new BatchRequest()
                .addItemsItem(indexingAxisDesign())
                .addItemsItem(new DesignRequest()
                        .plant(new PlantDescription(Wire.indexingAxis()))
                        .spec(Wire.spec(0.0)));
        HttpRequest.Builder request = HttpRequest.newBuilder(URI.create(client.getBaseUri() + Wire.BATCH_PATH))
                .timeout(Duration.ofSeconds(30))
                .header("Content-Type", "application/json")
                .header("Accept", Wire.BATCH_MEDIA_TYPE)
                .POST(HttpRequest.BodyPublishers.ofByteArray(
                        client.getObjectMapper().writeValueAsBytes(batch)));
        if (client.getRequestInterceptor() != null) {
            client.getRequestInterceptor().accept(request);
        }
        HttpResponse<String> response =
                client.getHttpClient().send(request.build(), HttpResponse.BodyHandlers.ofString());
        assertEquals(200, response.statusCode());
        assertEquals(
                Wire.BATCH_MEDIA_TYPE,
                response.headers()
                        .firstValue("Content-Type")
                        .orElse("")
                        .split(";")[0]
                        .trim());

        List<BatchStreamLine> lines = new ArrayList<>();
        for (String line : response.body().split("\n")) {
            lines.add(client.getObjectMapper().readValue(line, BatchStreamLine.class));
        }
        assertEquals(2, lines.size(), response.body());

        BatchStreamLine designed = lines.get(0);
        assertEquals(0, designed.getIndex());
        assertNull(designed.getResumeFromIndex(), "an item's line is no cut");
        assertEquals(200, designed.getStatus());
        assertNull(designed.getProblem());
        // An item is computed exactly as POST /v1/designs computes it: same gains to the last bit.
        DesignResponse single = new DesignsApi(client).createDesign(indexingAxisDesign());
        assertEquals(
                single.getGain().getK().get(0),
                designed.getDesign().getGain().getK().get(0));
        assertEquals(
                single.getGain().getK().get(1),
                designed.getDesign().getGain().getK().get(1));
        assertTrue(designed.getDesign().getVerification().getCertified());

        BatchStreamLine refused = lines.get(1);
        assertEquals(1, refused.getIndex());
        assertEquals(400, refused.getStatus());
        assertNull(refused.getDesign());
        assertEquals(Wire.INVALID_FIELD, refused.getProblem().getType());
        assertEquals(400, refused.getProblem().getStatus());
        assertTrue(
                refused.getProblem().getErrors().stream()
                        .anyMatch(e -> e.getPointer().endsWith(Wire.OVERSHOOT_POINTER)),
                refused.getProblem().toString());
    }

    @Test
    void fitRecoversTheSecondOrderModelOfANoiseFreeStepTest() throws ApiException {
        double gain = 2.0;
        double wn = 5.0; // rad/s
        double zeta = 0.4;
        double stepTime = 0.5; // s
        double duration = 4.0; // s
        StepTestSamples samples = new StepTestSamples();
        for (int i = 0; i < FIT_SAMPLE_COUNT; i++) {
            double t = duration * i / (FIT_SAMPLE_COUNT - 1);
            samples.addTimeItem(num(t));
            samples.addOutputItem(num(gain * unitStep(wn, zeta, t - stepTime)));
        }
        FitResponse fit = new ModelsApi(client)
                .fitStepTestModel(new FitRequest().samples(samples).stepTime(num(stepTime)));

        assertEquals(gain, value(fit.getPlant().getGain()), gain * 1e-6, "gain");
        assertEquals(wn, value(fit.getPlant().getNaturalFrequency()), wn * 1e-6, "natural frequency");
        assertEquals(zeta, value(fit.getPlant().getDampingRatio()), zeta * 1e-6, "damping ratio");
        assertTrue(value(fit.getQuality().getrSquared()) > 1 - 1e-9, "R^2 of a noise-free record");
    }

    /**
     * Unit step response of wn^2 / (s^2 + 2 zeta wn s + wn^2), 0 <= zeta < 1 (textbook):
     * 1 - exp(-zeta wn t) (cos(wd t) + zeta / sqrt(1 - zeta^2) sin(wd t)), wd = wn sqrt(1 - zeta^2); 0 before t = 0.
     */
    private static double unitStep(double wn, double zeta, double t) {
        if (t <= 0) {
            return 0;
        }
        double root = Math.sqrt(1 - zeta * zeta);
        double wd = wn * root;
        return 1 - Math.exp(-zeta * wn * t) * (Math.cos(wd * t) + zeta / root * Math.sin(wd * t));
    }

    @Test
    void controllerExportsCarryTheDesignGains() throws ApiException, IOException {
        DesignResponse design = new DesignsApi(client).createDesign(indexingAxisDesign());
        double samplePeriodSeconds = 0.001;
        double commandLimit = 3.0;
        ControllerRequest request = new ControllerRequest()
                .design(indexingAxisDesign())
                .samplePeriod(num(samplePeriodSeconds))
                .actuatorLimit(num(commandLimit))
                .prefix("Axis1");
        ControllersApi controllers = new ControllersApi(client);

        ControllerParameters parameters = controllers.exportControllerParameters(request);
        assertEquals(value(design.getGain().getK().get(0)), value(parameters.getPositionGain()), 0.0);
        assertEquals(value(design.getGain().getK().get(1)), value(parameters.getVelocityGain()), 0.0);
        assertEquals(value(design.getGain().getReferenceGain()), value(parameters.getReferenceGain()), 0.0);
        assertEquals(samplePeriodSeconds, value(parameters.getSamplePeriod()), 0.0);
        assertEquals(-commandLimit, value(parameters.getActuatorRange().getLowest()), 0.0);
        assertEquals(commandLimit, value(parameters.getActuatorRange().getHighest()), 0.0);
        // Emulation of a loop with wn T well below 0.5: the sampled loop is stable.
        assertTrue(value(parameters.getSampledSpectralRadius()) < 1, "sampled spectral radius");
        assertEquals(
                value(design.getTarget().getNaturalFrequency()) * samplePeriodSeconds,
                value(parameters.getPeriodPerTimeConstant()),
                RELATIVE_TOLERANCE);

        String structuredText = controllers.exportStructuredText(request);
        assertTrue(structuredText.contains("FUNCTION_BLOCK Axis1_Controller"), structuredText);
        assertTrue(structuredText.contains("END_FUNCTION_BLOCK"), structuredText);
        // The C pair and the PLCopen project are files to the generated client (type string, format binary).
        String header = Files.readString(controllers.exportCHeader(request).toPath());
        assertTrue(header.contains("double Axis1_step(Axis1_state *s,"), header);
        String source = Files.readString(controllers.exportCSource(request).toPath());
        assertTrue(source.contains("#include \"Axis1.h\""), source);
        String project = Files.readString(controllers.exportPlcOpenXml(request).toPath());
        assertTrue(project.contains("<pou name=\"Axis1_Controller\" pouType=\"functionBlock\">"), project);
    }

    /**
     * The plant's `form` is the discriminator of PlantDescription: the generated client sends it and reads a plant
     * back into the class its form names. Scenario: the README's pick-and-place wrist, J = 0.004 kg m^2,
     * c = 0.002 N m s/rad, kt = 0.12 N m/A, N = 10; J q'' + c q' = N kt i + w divided by J (Newton's second law for
     * rotation, textbook) gives a1 = c/J and b = N kt/J.
     */
    @Test
    void thePlantFormSelectsTheGeneratedPlantClass() throws Exception {
        RotaryAxisPlant wrist = new RotaryAxisPlant()
                .form(RotaryAxisPlant.FormEnum.ROTARY_AXIS)
                .inertia(0.004)
                .viscousFriction(0.002)
                .torqueConstant(0.12)
                .gearRatio(10.0);
        DesignResponse design = new DesignsApi(client)
                .createDesign(
                        new DesignRequest().plant(new PlantDescription(wrist)).spec(Wire.spec(1.0)));
        assertEquals("rotaryAxis", design.getModel().getForm().getValue());
        assertEquals(0.002 / 0.004, value(design.getPlant().getA1()), 1e-12);
        assertEquals(10 * 0.12 / 0.004, value(design.getPlant().getB()), 1e-9);

        PlantDescription read = client.getObjectMapper()
                .readValue(
                        client.getObjectMapper().writeValueAsString(new PlantDescription(wrist)),
                        PlantDescription.class);
        assertEquals(wrist, read.getActualInstance());
    }

    @Test
    void aRefusedFieldIsATypedProblemWithItsPointer() throws IOException {
        DesignRequest request = new DesignRequest()
                .plant(new PlantDescription(Wire.indexingAxis()))
                .spec(Wire.spec(0.0));
        ApiException refused = assertThrows(ApiException.class, () -> new DesignsApi(client).createDesign(request));
        assertEquals(400, refused.getCode());
        assertEquals(
                "application/problem+json",
                refused.getResponseHeaders()
                        .firstValue("Content-Type")
                        .orElse("")
                        .split(";")[0]
                        .trim());

        Problem problem = client.getObjectMapper().readValue(refused.getResponseBody(), Problem.class);
        assertEquals(Wire.INVALID_FIELD, problem.getType());
        assertEquals(400, problem.getStatus());
        assertNotNull(problem.getTitle());
        assertNotNull(problem.getErrors());
        assertEquals(Wire.OVERSHOOT_POINTER, problem.getErrors().get(0).getPointer(), problem.toString());
    }
}
