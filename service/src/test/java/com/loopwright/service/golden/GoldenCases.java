package com.loopwright.service.golden;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.SplittableRandom;

/**
 * The requests of the golden corpus: every endpoint, every plant form, every problem type a request can
 * provoke deterministically, and batches. The list is generated once from a fixed seed and committed as
 * {@code golden/cases.jsonl}; the replay reads that file, never this class, so editing this class changes
 * nothing until the corpus is recorded again.
 */
final class GoldenCases {

    /** Seed of every random choice below (any fixed value; only reproducibility matters). */
    private static final long SEED = 20261203L;

    private final List<GoldenCase> cases = new ArrayList<>();
    private final SplittableRandom random = new SplittableRandom(SEED);

    static List<GoldenCase> all() {
        GoldenCases g = new GoldenCases();
        g.canonicalDesigns();
        g.designOptions();
        g.plantForms();
        g.verifyOptions();
        g.malformedAndInvalid();
        g.batches();
        g.highOrder();
        g.verifications();
        g.fits();
        g.plots();
        g.controllers();
        g.plainResources();
        g.keyed();
        g.extremes();
        g.designSpaces();
        g.robustDesigns();
        g.stateSpaceLoops();
        g.highOrderRobustDesigns();
        return List.copyOf(g.cases);
    }

    private static final String AXIS_PLANT = "{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":400,\"d\":400}";
    private static final String AXIS_SPEC = "{\"settlingTime\":0.15,\"overshootPercent\":1.5}";
    private static final String AXIS = "{\"plant\":" + AXIS_PLANT + ",\"spec\":" + AXIS_SPEC + "}";

    private void post(String id, String path, String body) {
        cases.add(new GoldenCase(id, GoldenCase.OPEN, "POST", path, "application/json", body, Map.of()));
    }

    private void design(String id, String body) {
        post("design-" + id, "/v1/designs", body);
    }

    private static String num(double value) {
        // Shortest round-trip form, as Java prints doubles; the corpus stores the exact text sent.
        return Double.toString(value);
    }

    private double pick(double... values) {
        return values[random.nextInt(values.length)];
    }

    /** Canonical plants over a seeded spread of stiffness, damping, gains and specs (feasible and not). */
    private void canonicalDesigns() {
        for (int i = 0; i < 70; i++) {
            double a0 = pick(0, 0, 10, 150, -20, 2500, 0.5);
            double a1 = pick(0, 0.48, 2, -1, 12, 0.05);
            double b = pick(400, 1, -5, 65, 0.02, 3000);
            double d = pick(0, 400, 6, 1, -2, 0.5);
            double overshoot = pick(0.2, 0.5, 1.5, 2.66, 4, 10, 20, 0.01);
            boolean rise = random.nextInt(4) == 0;
            double time = pick(0.05, 0.15, 0.37, 1.35, 3, 12, 0.5);
            String spec = "{\"" + (rise ? "riseTime" : "settlingTime") + "\":" + num(time) + ",\"overshootPercent\":"
                    + num(overshoot) + "}";
            design(
                    String.format(Locale.ROOT, "canonical-%02d", i),
                    "{\"plant\":{\"form\":\"canonical\",\"a0\":" + num(a0) + ",\"a1\":" + num(a1) + ",\"b\":" + num(b)
                            + ",\"d\":" + num(d) + "},\"spec\":" + spec + "}");
        }
    }

    /** The optional spec fields one at a time and together, on the indexing axis. */
    private void designOptions() {
        String[] specs = {
            "{\"settlingTime\":0.15,\"overshootPercent\":1.5,\"settlingBandPercent\":5}",
            "{\"settlingTime\":0.15,\"overshootPercent\":1.5,\"settlingBandPercent\":0.5}",
            "{\"settlingTime\":0.15,\"overshootPercent\":1.5,\"gamma\":3}",
            "{\"settlingTime\":0.15,\"overshootPercent\":1.5,\"gamma\":1000}",
            "{\"settlingTime\":0.15,\"overshootPercent\":1.5,\"gamma\":1.5}",
            "{\"settlingTime\":0.15,\"overshootPercent\":1.5,\"gammaMargin\":2}",
            "{\"settlingTime\":0.15,\"overshootPercent\":1.5,\"gammaMargin\":1.0001}",
            "{\"settlingTime\":0.15,\"overshootPercent\":1.5,\"stepSize\":0.25}",
            "{\"settlingTime\":0.15,\"overshootPercent\":1.5,\"stepSize\":-3}",
            "{\"riseTime\":0.05,\"overshootPercent\":2}",
            "{\"riseTime\":0.2,\"overshootPercent\":0.5,\"settlingBandPercent\":1}",
            "{\"settlingTime\":0.15,\"overshootPercent\":4.3}",
            "{\"settlingTime\":0.15,\"overshootPercent\":4.4}",
            "{\"settlingTime\":0.15,\"overshootPercent\":0.001}",
            "{\"settlingTime\":10000,\"overshootPercent\":1}",
            "{\"settlingTime\":0.0001,\"overshootPercent\":1}",
        };
        for (int i = 0; i < specs.length; i++) {
            design(
                    String.format(Locale.ROOT, "option-%02d", i),
                    "{\"plant\":" + AXIS_PLANT + ",\"spec\":" + specs[i] + "}");
        }
    }

    /** Every plant form, valid and unusable, and fields of another form. */
    private void plantForms() {
        String spec = ",\"spec\":{\"settlingTime\":0.25,\"overshootPercent\":1}}";
        String[] plants = {
            "{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":400,\"d\":400}",
            "{\"form\":\"rotaryAxis\",\"inertia\":0.004,\"viscousFriction\":0.002,\"torqueConstant\":0.12,\"gearRatio\":10}",
            "{\"form\":\"rotaryAxis\",\"inertia\":0.0025,\"viscousFriction\":0.0012,\"torqueConstant\":1}",
            "{\"form\":\"rotaryAxis\",\"inertia\":2.5,\"viscousFriction\":0,\"torqueConstant\":0.8,\"gearRatio\":50}",
            "{\"form\":\"rotaryAxis\",\"inertia\":-0.004,\"viscousFriction\":0.002,\"torqueConstant\":0.12}",
            "{\"form\":\"rotaryAxis\",\"inertia\":0.004,\"viscousFriction\":0.002,\"torqueConstant\":0}",
            "{\"form\":\"rotaryAxis\",\"inertia\":0.004,\"viscousFriction\":-0.5,\"torqueConstant\":0.12}",
            "{\"form\":\"massSpringDamper\",\"mass\":12,\"damping\":40,\"stiffness\":3000}",
            "{\"form\":\"massSpringDamper\",\"mass\":0.5,\"damping\":0,\"stiffness\":0}",
            "{\"form\":\"massSpringDamper\",\"mass\":80,\"damping\":900,\"stiffness\":2.0e5}",
            "{\"form\":\"massSpringDamper\",\"mass\":-1,\"damping\":1,\"stiffness\":1}",
            "{\"form\":\"massSpringDamper\",\"mass\":1,\"damping\":1,\"stiffness\":-5}",
            "{\"form\":\"secondOrderTransferFunction\",\"gain\":2,\"naturalFrequency\":3,\"dampingRatio\":0.4}",
            "{\"form\":\"secondOrderTransferFunction\",\"gain\":0.8,\"naturalFrequency\":0.05,\"dampingRatio\":1.5}",
            "{\"form\":\"secondOrderTransferFunction\",\"gain\":-1,\"naturalFrequency\":12,\"dampingRatio\":0}",
            "{\"form\":\"secondOrderTransferFunction\",\"gain\":2,\"naturalFrequency\":3,\"dampingRatio\":0.4,\"disturbanceNumerator\":5}",
            "{\"form\":\"secondOrderTransferFunction\",\"numerator\":[4],\"denominator\":[1,0.6,9]}",
            "{\"form\":\"secondOrderTransferFunction\",\"numerator\":[0,0,4],\"denominator\":[2,1,0]}",
            "{\"form\":\"secondOrderTransferFunction\",\"numerator\":[1,4],\"denominator\":[1,0.6,9]}",
            "{\"form\":\"secondOrderTransferFunction\",\"numerator\":[4],\"denominator\":[0,1,9]}",
            "{\"form\":\"secondOrderTransferFunction\",\"gain\":2,\"numerator\":[4],\"denominator\":[1,0.6,9]}",
            "{\"form\":\"stateSpace\",\"a\":[[0,1],[-4,-0.4]],\"b2\":[0,2],\"b1\":[0,1]}",
            "{\"form\":\"stateSpace\",\"a\":[[-1,0.5],[0,-2]],\"b2\":[1,1]}",
            "{\"form\":\"stateSpace\",\"a\":[[0,1],[0,0]],\"b2\":[0,1],\"b1\":[0,3]}",
            "{\"form\":\"stateSpace\",\"a\":[[-1,0],[0,-2]],\"b2\":[1,0]}",
            "{\"form\":\"stateSpace\",\"a\":[[0,1],[-4,-0.4]],\"b2\":[0,2],\"b1\":[1,0]}",
            "{\"form\":\"stateSpace\",\"a\":[[0,1],[-4,-0.4]],\"b2\":[0,2],\"mass\":3}",
            "{\"form\":\"rotaryAxis\",\"inertia\":0.004,\"viscousFriction\":0.002,\"torqueConstant\":0.12,\"mass\":1}",
            "{\"form\":\"pendulum\",\"length\":1}",
            "{\"form\":\"massSpringDamper\",\"mass\":4.9e-324,\"damping\":1,\"stiffness\":1}",
        };
        for (int i = 0; i < plants.length; i++) {
            design(String.format(Locale.ROOT, "form-%02d", i), "{\"plant\":" + plants[i] + spec);
        }
    }

    /** The verify section: every check alone, then several together. */
    private void verifyOptions() {
        String[] verify = {
            "{\"uncertainty\":{\"a1\":{\"spreadPercent\":20}}}",
            "{\"uncertainty\":{\"a1\":{\"spreadPercent\":20},\"b\":{\"lowest\":266.7,\"highest\":500},\"d\":{\"lowest\":266.7,\"highest\":500},\"monteCarloSamples\":40,\"seed\":7}}",
            "{\"uncertainty\":{\"a0\":{\"lowest\":-5,\"highest\":5},\"monteCarloSamples\":10}}",
            "{\"uncertainty\":{\"b\":{\"lowest\":-10,\"highest\":10}}}",
            "{\"disturbances\":[{\"shape\":\"step\",\"amplitude\":0.01}]}",
            "{\"disturbances\":[{\"shape\":\"pulse\",\"amplitude\":0.05,\"start\":0.1,\"duration\":0.02}]}",
            "{\"disturbances\":[{\"shape\":\"sinusoid\",\"amplitude\":0.01,\"frequency\":30}]}",
            "{\"disturbances\":[{\"shape\":\"randomBounded\",\"amplitude\":0.01,\"holdTime\":0.01,\"seed\":3}]}",
            "{\"disturbances\":[{\"shape\":\"pulse\",\"amplitude\":0.05}]}",
            "{\"actuatorLimit\":3}",
            "{\"actuatorLimit\":0.5}",
            "{\"sampling\":{\"samplePeriod\":0.001}}",
            "{\"sampling\":{\"samplePeriod\":0.01,\"findLongest\":true}}",
            "{\"sampling\":{\"samplePeriod\":0.2}}",
            "{\"inputDelay\":0.002}",
            "{\"inputDelay\":0.02,\"sampling\":{\"samplePeriod\":0.001}}",
            "{\"frequencyPoints\":25}",
            "{\"timeSeriesPoints\":12}",
            "{\"tolerancePercent\":0}",
            "{\"tolerancePercent\":50,\"actuatorLimit\":2,\"frequencyPoints\":5}",
            "{\"uncertainty\":{\"a1\":{\"spreadPercent\":10}},\"disturbances\":[{\"shape\":\"step\",\"amplitude\":0.01}],\"actuatorLimit\":3,\"sampling\":{\"samplePeriod\":0.001},\"inputDelay\":0.001,\"timeSeriesPoints\":5}",
            "{\"frequencyPoints\":501}",
            "{\"uncertainty\":{\"monteCarloSamples\":2001}}",
            "{\"uncertainty\":{\"a1\":{\"spreadPercent\":20,\"lowest\":0,\"highest\":1}}}",
            "{\"disturbances\":[{\"shape\":\"chirp\",\"amplitude\":1}]}",
            "{\"timeSeriesPoints\":10.7}",
            "{\"uncertainty\":{\"monteCarloSamples\":2.9}}",
            "{\"inputDelay\":50}",
            "{\"sampling\":{\"samplePeriod\":1.0e-7}}",
        };
        for (int i = 0; i < verify.length; i++) {
            design(
                    String.format(Locale.ROOT, "verify-%02d", i),
                    "{\"plant\":" + AXIS_PLANT + ",\"spec\":" + AXIS_SPEC + ",\"verify\":" + verify[i] + "}");
        }
        design(
                "verify-tank-level",
                "{\"plant\":{\"form\":\"canonical\",\"a0\":0.02,\"a1\":0.3,\"b\":0.05,\"d\":0.05},\"spec\":{\"settlingTime\":"
                        + "60,\"overshootPercent\":2},\"verify\":{\"uncertainty\":{\"a0\":{\"spreadPercent\":30},"
                        + "\"monteCarloSamples\":20},\"actuatorLimit\":100,\"sampling\":{\"samplePeriod\":0.5}}}");
    }

    /** Bodies that are not the JSON an endpoint takes, and fields out of range, missing or of another type. */
    private void malformedAndInvalid() {
        String[] bodies = {
            "",
            "{",
            "[]",
            "null",
            "42",
            "\"text\"",
            "{\"plant\":}",
            "{\"plant\":" + AXIS_PLANT + ",}",
            "{\"plant\":" + AXIS_PLANT + ",\"spec\":" + AXIS_SPEC + "} trailing",
            "{\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a0\":1,\"a1\":0.48,\"b\":400,\"d\":400},\"spec\":"
                    + AXIS_SPEC + "}",
            "{\"plant\":{\"form\":\"canonical\",\"a0\":NaN,\"a1\":0.48,\"b\":400,\"d\":400},\"spec\":" + AXIS_SPEC
                    + "}",
            "{\"plant\":{\"form\":\"canonical\",\"a0\":Infinity,\"a1\":0.48,\"b\":400,\"d\":400},\"spec\":" + AXIS_SPEC
                    + "}",
            "{\"plant\":{\"form\":\"canonical\",\"a0\":1e400,\"a1\":0.48,\"b\":400,\"d\":400},\"spec\":" + AXIS_SPEC
                    + "}",
            "{\"plant\":{\"form\":\"canonical\",\"a0\":\"0\",\"a1\":0.48,\"b\":400,\"d\":400},\"spec\":" + AXIS_SPEC
                    + "}",
            "{\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":400,\"d\":400},\"spec\":" + AXIS_SPEC
                    + ",\"colour\":\"red\"}",
            "{\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":400,\"d\":400,\"e\":1},\"spec\":" + AXIS_SPEC
                    + "}",
            "{\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":400},\"spec\":" + AXIS_SPEC + "}",
            "{\"spec\":" + AXIS_SPEC + "}",
            "{\"plant\":" + AXIS_PLANT + "}",
            "{\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":0,\"d\":400},\"spec\":" + AXIS_SPEC + "}",
            "{\"plant\":{\"form\":\"canonical\",\"a0\":2e8,\"a1\":0.48,\"b\":400,\"d\":400},\"spec\":" + AXIS_SPEC
                    + "}",
            "{\"plant\":" + AXIS_PLANT + ",\"spec\":{\"settlingTime\":0.15}}",
            "{\"plant\":" + AXIS_PLANT + ",\"spec\":{\"overshootPercent\":1.5}}",
            "{\"plant\":" + AXIS_PLANT
                    + ",\"spec\":{\"settlingTime\":0.15,\"riseTime\":0.05,\"overshootPercent\":1.5}}",
            "{\"plant\":" + AXIS_PLANT + ",\"spec\":{\"settlingTime\":0.15,\"overshootPercent\":0}}",
            "{\"plant\":" + AXIS_PLANT + ",\"spec\":{\"settlingTime\":0.15,\"overshootPercent\":96}}",
            "{\"plant\":" + AXIS_PLANT + ",\"spec\":{\"settlingTime\":-1,\"overshootPercent\":1.5}}",
            "{\"plant\":" + AXIS_PLANT
                    + ",\"spec\":{\"settlingTime\":0.15,\"overshootPercent\":1.5,\"gamma\":3,\"gammaMargin\":2}}",
            "{\"plant\":" + AXIS_PLANT
                    + ",\"spec\":{\"settlingTime\":0.15,\"overshootPercent\":1.5,\"gammaMargin\":1}}",
            "{\"plant\":" + AXIS_PLANT + ",\"spec\":{\"settlingTime\":0.15,\"overshootPercent\":1.5,\"stepSize\":0}}",
            "{\"plant\":" + AXIS_PLANT
                    + ",\"spec\":{\"settlingTime\":0.15,\"overshootPercent\":1.5,\"settlingBandPercent\":30}}",
            "{\"plant\":[1,2],\"spec\":" + AXIS_SPEC + "}",
            "{\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":400,\"d\":400},\"spec\":{\"settlingTime\":true,\"overshootPercent\":1.5}}",
            "{\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":-1e4,\"b\":1e-6,\"d\":1e8},\"spec\":{\"settlingTime\":1e4,\"overshootPercent\":95}}",
            // a plant without form: 400 at /plant/form naming the five forms (issue 15)
            "{\"plant\":{\"a0\":0,\"a1\":0.48,\"b\":400,\"d\":400},\"spec\":" + AXIS_SPEC + "}",
        };
        for (int i = 0; i < bodies.length; i++) {
            design(String.format(Locale.ROOT, "invalid-%02d", i), bodies[i]);
        }
        cases.add(new GoldenCase(
                "design-media-type-text", GoldenCase.OPEN, "POST", "/v1/designs", "text/plain", AXIS, Map.of()));
        cases.add(
                new GoldenCase("design-media-type-none", GoldenCase.OPEN, "POST", "/v1/designs", null, AXIS, Map.of()));
        cases.add(new GoldenCase(
                "design-media-type-charset",
                GoldenCase.OPEN,
                "POST",
                "/v1/designs",
                "application/json; charset=utf-8",
                AXIS,
                Map.of()));
    }

    private void batches() {
        post("batch-two", "/v1/designs/batch", "{\"items\":[" + AXIS + ",{}]}");
        post("batch-empty", "/v1/designs/batch", "{\"items\":[]}");
        post("batch-not-object", "/v1/designs/batch", "{\"items\":[1.5,\"x\",null,[]]}");
        post("batch-no-items", "/v1/designs/batch", "{}");
        post("batch-unknown-field", "/v1/designs/batch", "{\"items\":[" + AXIS + "],\"mode\":\"fast\"}");
        post("batch-malformed", "/v1/designs/batch", "{\"items\":[" + AXIS);
        // an item whose plant has no form: 400 at /items/1/plant/form, the other item designed
        post(
                "batch-no-form",
                "/v1/designs/batch",
                "{\"items\":[" + AXIS + ",{\"plant\":{\"a0\":0,\"a1\":0.48,\"b\":400,\"d\":400},\"spec\":" + AXIS_SPEC
                        + "}]}");
        StringBuilder mixed = new StringBuilder("{\"items\":[");
        for (int i = 0; i < 24; i++) {
            double overshoot = 0.5 + i * 0.4;
            mixed.append(i == 0 ? "" : ",")
                    .append("{\"plant\":")
                    .append(AXIS_PLANT)
                    .append(",\"spec\":{\"settlingTime\":")
                    .append(num(0.1 + 0.02 * i))
                    .append(",\"overshootPercent\":")
                    .append(num(overshoot))
                    .append("}}");
        }
        post("batch-mixed", "/v1/designs/batch", mixed.append("]}").toString());
        post(
                "batch-forms",
                "/v1/designs/batch",
                "{\"items\":[{\"plant\":{\"form\":\"rotaryAxis\",\"inertia\":0.004,"
                        + "\"viscousFriction\":0.002,\"torqueConstant\":0.12,\"gearRatio\":10},\"spec\":{\"settlingTime\":0.25,"
                        + "\"overshootPercent\":1}},{\"plant\":{\"form\":\"massSpringDamper\",\"mass\":-1,\"damping\":1,"
                        + "\"stiffness\":1},\"spec\":{\"settlingTime\":1,\"overshootPercent\":1}},{\"plant\":"
                        + AXIS_PLANT
                        + ",\"spec\":" + AXIS_SPEC + ",\"verify\":{\"actuatorLimit\":3}}]}");
        post(
                "batch-with-infeasible",
                "/v1/designs/batch",
                "{\"items\":[{\"plant\":" + AXIS_PLANT + ",\"spec\":{\"settlingTime\":0.15,\"overshootPercent\":10}},"
                        + AXIS + "]}");
        post("batch-items-not-array", "/v1/designs/batch", "{\"items\":{}}");
    }

    /** Orders 3 to 8, with and without zeros, matched and unmatched disturbances, spec matching. */
    private void highOrder() {
        for (int i = 0; i < 36; i++) {
            int order = 3 + i % 6;
            double[] roots = new double[order];
            for (int k = 0; k < order; k++) {
                roots[k] = -pick(0.5, 1, 2, 4, 8, 0.2) * (1 + 0.1 * k);
            }
            if (i % 7 == 3) {
                roots[0] = 0;
            }
            double[] denominator = fromRoots(roots);
            // highest power first, right-aligned: c_1 s + c_0 or just c_0 = 1
            double[] numerator = i % 3 == 1 ? new double[] {pick(0.25, -0.1, 0.5), 1} : new double[] {1};
            double[] disturbance = new double[order];
            if (i % 4 == 2) {
                for (int k = 0; k < order; k++) {
                    disturbance[k] = pick(0.1, -0.05, 0.2, 0);
                }
                disturbance[order - 1] = 0.3;
            } else {
                disturbance[order - 1] = pick(1, 5, 0.5);
            }
            double settling = pick(2, 4, 8, 15, 1);
            double overshoot = pick(1, 2, 5, 0.5);
            String extra = switch (i % 5) {
                case 1 -> ",\"matchSpecs\":true";
                case 2 -> ",\"auxiliaryPoles\":{\"realPartMultiple\":6}";
                default -> "";
            };
            String spec = "{\"settlingTime\":" + num(settling) + ",\"overshootPercent\":" + num(overshoot)
                    + (i % 6 == 5 ? ",\"settlingBandPercent\":5" : "") + (i % 8 == 7 ? ",\"gammaMargin\":2" : "") + "}";
            post(
                    String.format(Locale.ROOT, "high-order-%02d", i),
                    "/v1/designs/high-order",
                    "{\"plant\":{\"denominator\":"
                            + array(denominator) + ",\"b\":" + num(pick(1, 2, 0.5, 10)) + ",\"numerator\":"
                            + array(numerator)
                            + ",\"disturbance\":" + array(disturbance) + "},\"spec\":" + spec + extra + "}");
        }
        String[] special = {
            "{\"plant\":{\"denominator\":[1,6,11,6],\"b\":1,\"disturbance\":[0,0,1]},\"spec\":{\"settlingTime\":3,\"overshootPercent\":2},\"auxiliaryPoles\":{\"poles\":[{\"re\":-8,\"im\":0}]}}",
            "{\"plant\":{\"denominator\":[1,10,35,50,24],\"b\":2,\"disturbance\":[0,0,0,1]},\"spec\":{\"settlingTime\":3,\"overshootPercent\":2},\"auxiliaryPoles\":{\"poles\":[{\"re\":-6,\"im\":2},{\"re\":-6,\"im\":-2}]}}",
            "{\"plant\":{\"stateSpace\":{\"a\":[[0,1,0],[0,0,1],[-6,-11,-6]],\"b2\":[0,0,1],\"b1\":[0,0,1]}},\"spec\":{\"settlingTime\":3,\"overshootPercent\":2}}",
            "{\"plant\":{\"stateSpace\":{\"a\":[[-1,0,0],[1,-2,0],[0,1,-3]],\"b2\":[1,0,0],\"b1\":[1,0,0],\"output\":[0,0,1]}},\"spec\":{\"settlingTime\":4,\"overshootPercent\":1}}",
            "{\"plant\":{\"stateSpace\":{\"a\":[[-1,0,0],[0,-2,0],[0,0,-3]],\"b2\":[1,0,0],\"b1\":[1,0,0]}},\"spec\":{\"settlingTime\":4,\"overshootPercent\":1}}",
            "{\"plant\":{\"denominator\":[1,6,11,6],\"b\":1,\"disturbance\":[0,0,1]},\"spec\":{\"settlingTime\":3,\"overshootPercent\":20}}",
            "{\"plant\":{\"denominator\":[1,6,11,6],\"b\":1,\"disturbance\":[0,0,1]},\"spec\":{\"settlingTime\":3,\"overshootPercent\":2,\"gamma\":0.001}}",
            "{\"plant\":{\"denominator\":[1,6,11,6],\"b\":0,\"disturbance\":[0,0,1]},\"spec\":{\"settlingTime\":3,\"overshootPercent\":2}}",
            "{\"plant\":{\"denominator\":[1,6,11,6],\"b\":1,\"disturbance\":[0,0]},\"spec\":{\"settlingTime\":3,\"overshootPercent\":2}}",
            "{\"plant\":{\"denominator\":[1,9,8,7,6,5,4,3,2,1],\"b\":1,\"disturbance\":[0,0,0,0,0,0,0,0,1]},\"spec\":{\"settlingTime\":3,\"overshootPercent\":2}}",
            "{\"plant\":{\"denominator\":[1,6,11,6],\"b\":1,\"disturbance\":[0,0,1]},\"spec\":{\"riseTime\":1,\"overshootPercent\":2}}",
            "{\"plant\":{\"denominator\":[1,6,11,6],\"b\":1,\"disturbance\":[0,0,1]},\"spec\":{\"settlingTime\":3,\"overshootPercent\":2},\"auxiliaryPoles\":{\"realPartMultiple\":4,\"poles\":[{\"re\":-8,\"im\":0}]}}",
            "{\"plant\":{\"denominator\":[1,6,11,6],\"b\":1,\"disturbance\":[0,0,1],\"stateSpace\":{\"a\":[[0]],\"b2\":[1],\"b1\":[1]}},\"spec\":{\"settlingTime\":3,\"overshootPercent\":2}}",
            "{\"plant\":{\"denominator\":[1,6,11,6],\"b\":1,\"numerator\":[1,0],\"disturbance\":[0,0,1]},\"spec\":{\"settlingTime\":3,\"overshootPercent\":2}}",
        };
        for (int i = 0; i < special.length; i++) {
            post(String.format(Locale.ROOT, "high-order-special-%02d", i), "/v1/designs/high-order", special[i]);
        }
    }

    /** Coefficients a_0 .. a_{n-1} of prod (s - root), the monic term dropped (lowest power first). */
    private static double[] fromRoots(double[] roots) {
        double[] poly = {1};
        for (double root : roots) {
            double[] next = new double[poly.length + 1];
            for (int k = 0; k < poly.length; k++) {
                next[k + 1] += poly[k];
                next[k] -= root * poly[k];
            }
            poly = next;
        }
        // highest power first with the leading 1, as the request takes it
        double[] highestFirst = new double[poly.length];
        for (int k = 0; k < poly.length; k++) {
            highestFirst[k] = poly[poly.length - 1 - k];
        }
        return highestFirst;
    }

    private static String array(double[] values) {
        StringBuilder out = new StringBuilder("[");
        for (int i = 0; i < values.length; i++) {
            out.append(i == 0 ? "" : ",").append(num(values[i] == 0 ? 0.0 : values[i]));
        }
        return out.append(']').toString();
    }

    /** Design-space maps: small grids (the answer lists every cell), good, capped and invalid. */
    private void designSpaces() {
        String plant = "\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":400,\"d\":400}";
        String grid = "\"settlingTime\":{\"lowest\":0.05,\"highest\":0.2,\"count\":4},"
                + "\"overshootPercent\":{\"lowest\":1.5,\"highest\":10,\"count\":3}";
        String[] bodies = {
            "{" + plant + "," + grid + ",\"spec\":" + AXIS_SPEC + "}",
            "{" + plant + "," + grid + ",\"actuatorLimit\":3,\"samplePeriod\":0.004,"
                    + "\"uncertainty\":{\"b\":{\"spreadPercent\":10},\"monteCarloSamples\":5,\"seed\":2}}",
            "{\"plant\":{\"form\":\"massSpringDamper\",\"mass\":2.5,\"damping\":4,\"stiffness\":150},"
                    + "\"riseTime\":{\"lowest\":0.05,\"highest\":1,\"count\":3},"
                    + "\"overshootPercent\":{\"lowest\":1,\"highest\":20,\"count\":2}}",
            "{" + plant + ",\"settlingTime\":{\"lowest\":0.05,\"highest\":0.2,\"count\":65},"
                    + "\"overshootPercent\":{\"lowest\":1.5,\"highest\":10,\"count\":3}}",
            "{" + plant + "," + grid + ",\"riseTime\":{\"lowest\":0.05,\"highest\":0.2,\"count\":2}}",
        };
        for (int i = 0; i < bodies.length; i++) {
            post(String.format(Locale.ROOT, "design-space-%02d", i), "/v1/design-spaces", bodies[i]);
        }
        post("design-space-figure-00", "/v1/design-spaces/figure", bodies[0]);
    }

    /**
     * Robust designs: the two-state search (settling and rise time, an actuator limit, a box no target meets) and
     * the loop judged by simulation (integral action; integral action with a pole-multiple observer), and the same
     * judged sampled at robust.samplePeriod (the full-state law, settling and rise time; the loops; a period too
     * long, one the box cannot meet the spec at, one out of range).
     */
    private void robustDesigns() {
        String box = "{\"a1\":{\"spreadPercent\":20},\"b\":{\"lowest\":266.7,\"highest\":500},"
                + "\"d\":{\"lowest\":266.7,\"highest\":500},\"monteCarloSamples\":20,\"seed\":7}";
        String riseSpec = "{\"riseTime\":0.05,\"overshootPercent\":4}";
        String[] bodies = {
            "{\"plant\":" + AXIS_PLANT + ",\"spec\":" + AXIS_SPEC + ",\"robust\":{\"uncertainty\":" + box + "}}",
            "{\"plant\":" + AXIS_PLANT + ",\"spec\":" + riseSpec + ",\"robust\":{\"uncertainty\":" + box
                    + ",\"actuatorLimit\":3}}",
            "{\"plant\":" + AXIS_PLANT + ",\"spec\":" + AXIS_SPEC + ",\"robust\":{\"uncertainty\":" + box
                    + ",\"actuatorLimit\":0.01}}",
            "{\"plant\":" + AXIS_PLANT + ",\"spec\":" + AXIS_SPEC + ",\"integralAction\":true,"
                    + "\"robust\":{\"uncertainty\":" + box + "}}",
            "{\"plant\":" + AXIS_PLANT + ",\"spec\":" + AXIS_SPEC + ",\"integralAction\":true,"
                    + "\"measurement\":\"position\",\"observer\":{\"method\":\"poleMultiple\",\"multiple\":5},"
                    + "\"robust\":{\"uncertainty\":" + box + "}}",
            // judged sampled: the exported law (settling, rise time), the discrete controllers of the loops
            "{\"plant\":" + AXIS_PLANT + ",\"spec\":" + AXIS_SPEC + ",\"robust\":{\"uncertainty\":" + box
                    + ",\"samplePeriod\":0.004}}",
            "{\"plant\":" + AXIS_PLANT + ",\"spec\":{\"riseTime\":0.08,\"overshootPercent\":1.5},"
                    + "\"robust\":{\"uncertainty\":" + box + ",\"samplePeriod\":0.004}}",
            "{\"plant\":" + AXIS_PLANT + ",\"spec\":" + AXIS_SPEC + ",\"integralAction\":true,"
                    + "\"robust\":{\"uncertainty\":" + box + ",\"samplePeriod\":0.002}}",
            "{\"plant\":" + AXIS_PLANT + ",\"spec\":" + AXIS_SPEC + ",\"integralAction\":true,"
                    + "\"measurement\":\"position\",\"observer\":{\"method\":\"poleMultiple\",\"multiple\":5},"
                    + "\"robust\":{\"uncertainty\":" + box + ",\"samplePeriod\":0.002}}",
            // a period too long for the spec (422 at /robust/samplePeriod), one the box cannot meet the spec at
            // (422 with the best spec at that period), and a period out of range (400)
            "{\"plant\":" + AXIS_PLANT + ",\"spec\":" + AXIS_SPEC + ",\"robust\":{\"uncertainty\":" + box
                    + ",\"samplePeriod\":5}}",
            "{\"plant\":" + AXIS_PLANT + ",\"spec\":" + AXIS_SPEC + ",\"robust\":{\"uncertainty\":" + box
                    + ",\"samplePeriod\":0.014}}",
            "{\"plant\":" + AXIS_PLANT + ",\"spec\":" + AXIS_SPEC + ",\"robust\":{\"uncertainty\":" + box
                    + ",\"samplePeriod\":0}}",
        };
        for (int i = 0; i < bodies.length; i++) {
            design(String.format(Locale.ROOT, "robust-%02d", i), bodies[i]);
        }
    }

    /**
     * Order-n robust designs (issue 18): a tank-level loop (tank, valve lag 5 s, sensor lag 2 s) over a box on
     * the valve lag and gain, with samples; with an actuator limit no pair meets (422 with a proposal); the camera
     * gimbal whose nominal pair has no design, and with an actuator limit it cannot keep at the spec (the proposal
     * measured above the slowest pair with a design); a b range through 0 and a state space (400 at their pointers).
     */
    private void highOrderRobustDesigns() {
        String tank = "\"plant\":{\"denominator\":[1,0.7,0.1,0],\"b\":0.05,\"disturbance\":[0,0,1]},"
                + "\"spec\":{\"settlingTime\":1,\"overshootPercent\":2}";
        String box = "{\"denominator\":[null,{\"spreadPercent\":10},null,null],\"b\":{\"spreadPercent\":20},"
                + "\"monteCarloSamples\":20,\"seed\":5}";
        String gimbal = "\"plant\":{\"denominator\":[1,52,100,0],\"b\":500,\"disturbance\":[0,0,1]},"
                + "\"spec\":{\"settlingTime\":0.6,\"overshootPercent\":2}";
        String gimbalBox = "{\"denominator\":[null,{\"spreadPercent\":10},{\"spreadPercent\":30},null],"
                + "\"b\":{\"lowest\":400,\"highest\":600},\"monteCarloSamples\":10,\"seed\":11}";
        String[] bodies = {
            "{" + tank + ",\"robust\":{\"uncertainty\":" + box + "}}",
            "{" + tank + ",\"robust\":{\"uncertainty\":" + box + ",\"actuatorLimit\":2}}",
            "{\"plant\":{\"denominator\":[1,52,100,0],\"b\":500,\"disturbance\":[0,0,1]},"
                    + "\"spec\":{\"settlingTime\":0.4,\"overshootPercent\":2},\"robust\":{\"uncertainty\":"
                    + "{\"denominator\":[null,{\"spreadPercent\":10},{\"spreadPercent\":30},null],"
                    + "\"b\":{\"lowest\":350,\"highest\":550}}}}",
            "{\"plant\":{\"denominator\":[1,52,100,0],\"b\":500,\"disturbance\":[0,0,1]},"
                    + "\"spec\":{\"settlingTime\":0.4,\"overshootPercent\":2},\"robust\":{\"uncertainty\":"
                    + "{\"b\":{\"lowest\":350,\"highest\":550}},\"actuatorLimit\":20}}",
            "{" + tank + ",\"robust\":{\"uncertainty\":{\"b\":{\"lowest\":-1,\"highest\":1}}}}",
            "{\"plant\":{\"stateSpace\":{\"a\":[[0,1],[0,-2]],\"b2\":[0,3],\"b1\":[0,1]}},"
                    + "\"spec\":{\"settlingTime\":2,\"overshootPercent\":5},"
                    + "\"robust\":{\"uncertainty\":{\"b\":{\"spreadPercent\":5}}}}",
            // the loop that runs judged over the box: integral action, encoder only, both, and a box too wide
            "{" + gimbal + ",\"integralAction\":true,\"measurement\":\"position\","
                    + "\"observer\":{\"method\":\"poleMultiple\",\"multiple\":4},\"robust\":{\"uncertainty\":"
                    + gimbalBox + "}}",
            "{" + gimbal + ",\"integralAction\":true,\"robust\":{\"uncertainty\":" + gimbalBox + "}}",
            "{" + gimbal + ",\"measurement\":\"position\",\"robust\":{\"uncertainty\":" + gimbalBox
                    + ",\"actuatorLimit\":40}}",
            "{" + gimbal + ",\"integralAction\":true,\"robust\":{\"uncertainty\":{\"b\":{\"lowest\":5,"
                    + "\"highest\":5000}}}}",
        };
        for (int i = 0; i < bodies.length; i++) {
            post(String.format(Locale.ROOT, "high-order-robust-%02d", i), "/v1/designs/high-order", bodies[i]);
        }
    }

    /** A state-space plant with integral action, with and without position-only sensing (model.stateSpace.loopLaw). */
    private void stateSpaceLoops() {
        String plant = "{\"form\":\"stateSpace\",\"a\":[[0,50],[0,-2]],\"b2\":[0,3],\"b1\":[0,1]}";
        String spec = "{\"settlingTime\":0.3,\"overshootPercent\":1}";
        design("state-space-loop-00", "{\"plant\":" + plant + ",\"spec\":" + spec + ",\"integralAction\":true}");
        design(
                "state-space-loop-01",
                "{\"plant\":" + plant + ",\"spec\":" + spec + ",\"integralAction\":true,\"measurement\":\"position\"}");
    }

    private void verifications() {
        String gains = "\"gain\":{\"k1\":1.5723,\"k2\":0.0992069,\"referenceGain\":1.5723}";
        String[] bodies = {
            "{\"plant\":" + AXIS_PLANT + "," + gains + "}",
            "{\"plant\":" + AXIS_PLANT + "," + gains + ",\"spec\":" + AXIS_SPEC + "}",
            "{\"plant\":" + AXIS_PLANT + "," + gains + ",\"spec\":{\"riseTime\":0.1,\"overshootPercent\":2}}",
            "{\"plant\":" + AXIS_PLANT + "," + gains
                    + ",\"performance\":{\"rho1\":1.444,\"rho2\":0.0260367,\"gamma\":2.5274}}",
            "{\"plant\":" + AXIS_PLANT + "," + gains + ",\"performance\":{\"rho1\":1.444,\"rho2\":0.0260367}}",
            "{\"plant\":" + AXIS_PLANT + "," + gains
                    + ",\"verify\":{\"uncertainty\":{\"a1\":{\"spreadPercent\":20},\"monteCarloSamples\":15,\"seed\":3}}}",
            "{\"plant\":" + AXIS_PLANT + "," + gains
                    + ",\"verify\":{\"actuatorLimit\":3,\"sampling\":{\"samplePeriod\":0.001}}}",
            "{\"plant\":" + AXIS_PLANT + "," + gains + ",\"verify\":{\"inputDelay\":0.003,\"frequencyPoints\":10}}",
            "{\"plant\":" + AXIS_PLANT + "," + gains
                    + ",\"verify\":{\"disturbances\":[{\"shape\":\"step\",\"amplitude\":0.01}]}}",
            "{\"plant\":" + AXIS_PLANT + ",\"gain\":{\"k1\":-1,\"k2\":0.1,\"referenceGain\":1}}",
            "{\"plant\":" + AXIS_PLANT + ",\"gain\":{\"k1\":1,\"k2\":0.1}}",
            "{\"plant\":" + AXIS_PLANT + "," + gains + ",\"spec\":{\"gamma\":3}}",
            "{\"plant\":{\"form\":\"canonical\",\"a0\":10,\"a1\":2,\"b\":75,\"d\":6},\"gain\":{\"k1\":0.5,\"k2\":0.08,\"referenceGain\":0.63}}",
            "{\"plant\":{\"form\":\"canonical\",\"a0\":150,\"a1\":-1,\"b\":65,\"d\":6},\"gain\":{\"k1\":4,\"k2\":0.3,\"referenceGain\":6.3},\"verify\":{\"frequencyPoints\":8}}",
            "{\"plant\":{\"form\":\"canonical\",\"a0\":-20,\"a1\":0,\"b\":5,\"d\":1},\"gain\":{\"k1\":20,\"k2\":2,\"referenceGain\":16},\"spec\":{\"settlingTime\":2,\"overshootPercent\":5}}",
            "{\"plant\":{\"form\":\"canonical\",\"a0\":0.02,\"a1\":0.3,\"b\":0.05,\"d\":0.05},\"gain\":{\"k1\":2,\"k2\":3,\"referenceGain\":2.4},\"verify\":{\"uncertainty\":{\"b\":{\"spreadPercent\":25}}}}",
            "{\"plant\":" + AXIS_PLANT + "," + gains + ",\"verify\":{\"timeSeriesPoints\":6}}",
            "{\"plant\":" + AXIS_PLANT + "}",
            "{\"plant\":{\"form\":\"rotaryAxis\",\"inertia\":1,\"viscousFriction\":0,\"torqueConstant\":1}," + gains
                    + "}",
            "{\"plant\":" + AXIS_PLANT + "," + gains
                    + ",\"verify\":{\"sampling\":{\"samplePeriod\":0.004,\"findLongest\":true}}}",
            // a finite gain margin (3, by hand: L(2j) = -1/3): velocity fed back with the wrong sign
            "{\"plant\":{\"form\":\"canonical\",\"a0\":1,\"a1\":3,\"b\":1,\"d\":1},\"gain\":{\"k1\":1,\"k2\":-1,\"referenceGain\":2}}",
            // a plant without form: 400 at /plant/form (verifications take the canonical form, named)
            "{\"plant\":{\"a0\":0,\"a1\":0.48,\"b\":400,\"d\":400}," + gains + "}",
        };
        for (int i = 0; i < bodies.length; i++) {
            post(String.format(Locale.ROOT, "verification-%02d", i), "/v1/verifications", bodies[i]);
        }
    }

    /**
     * Step tests computed from the textbook second-order step response (no measured data), with seeded
     * Gaussian noise where a case says so.
     */
    private void fits() {
        double[][] truths = { // gain, wn, zeta, delay, offset, noise, samples, inputStep
            {1, 2, 0.5, 0, 0, 0, 60, 1},
            {2.5, 8, 0.3, 0, 1, 0.01, 120, 1},
            {1, 2, 1.3, 0.1, 0.5, 0.01, 41, 1},
            {0.4, 0.5, 0.9, 0.5, -2, 0.002, 200, 2},
            {3, 20, 0.15, 0.01, 0, 0.02, 300, 0.5},
            {1, 1, 2.5, 0, 0, 0.001, 80, 1},
            {-1.5, 4, 0.7, 0.05, 0.2, 0.005, 100, 1},
        };
        for (int i = 0; i < truths.length; i++) {
            double[] t = truths[i];
            boolean withInput = i % 2 == 1;
            boolean deadTime = t[3] > 0;
            post(
                    String.format(Locale.ROOT, "fit-%02d", i),
                    "/v1/models/fit",
                    stepTest(t[0], t[1], t[2], t[3], t[4], t[5], (int) t[6], t[7], withInput, deadTime));
        }
        post("fit-too-few", "/v1/models/fit", "{\"samples\":{\"time\":[0,1,2],\"output\":[0,1,2]}}");
        post(
                "fit-unequal",
                "/v1/models/fit",
                "{\"samples\":{\"time\":[0,1,2,3,4,5,6,7,8],\"output\":[0,1,2,3,4,5,6,7]}}");
        post(
                "fit-not-increasing",
                "/v1/models/fit",
                "{\"samples\":{\"time\":[0,1,2,3,3,5,6,7],\"output\":[0,1,2,3,4,5,6,7]}}");
        post("fit-flat", "/v1/models/fit", "{\"samples\":{\"time\":[0,1,2,3,4,5,6,7],\"output\":[1,1,1,1,1,1,1,1]}}");
        post(
                "fit-both-step-sources",
                "/v1/models/fit",
                "{\"samples\":{\"time\":[0,1,2,3,4,5,6,7],\"output\":[0,1,2,3,4,5,6,7],"
                        + "\"input\":[0,1,1,1,1,1,1,1]},\"stepAmplitude\":2}");
        post(
                "fit-zero-amplitude",
                "/v1/models/fit",
                "{\"samples\":{\"time\":[0,1,2,3,4,5,6,7],\"output\":[0,1,2,3,4,5,6,7]}," + "\"stepAmplitude\":0}");
        post("fit-no-samples", "/v1/models/fit", "{\"stepAmplitude\":1}");
    }

    /** y(t) = offset + K u (1 - step shape) after the delay, the textbook step response of K wn^2/(s^2+2 zeta wn s+wn^2). */
    private String stepTest(
            double gain,
            double wn,
            double zeta,
            double delay,
            double offset,
            double noise,
            int samples,
            double inputStep,
            boolean withInput,
            boolean deadTime) {
        double horizon = 10 / (Math.min(zeta, 1) * wn) + delay;
        StringBuilder time = new StringBuilder();
        StringBuilder output = new StringBuilder();
        StringBuilder input = new StringBuilder();
        for (int k = 0; k < samples; k++) {
            double t = horizon * k / (samples - 1);
            double shifted = t - delay;
            double y = offset + (shifted <= 0 ? 0 : gain * inputStep * unitStep(shifted, wn, zeta));
            y += noise * gaussian();
            String sep = k == 0 ? "" : ",";
            time.append(sep).append(round(t));
            output.append(sep).append(round(y));
            input.append(sep).append(k == 0 ? "0" : num(inputStep));
        }
        String inputPart = withInput ? ",\"input\":[" + input + "]" : "";
        String amplitude = withInput || inputStep == 1 ? "" : ",\"stepAmplitude\":" + num(inputStep);
        return "{\"samples\":{\"time\":[" + time + "],\"output\":[" + output + "]" + inputPart + "}" + amplitude
                + (deadTime ? ",\"estimateDeadTime\":true" : "") + "}";
    }

    private static String round(double value) {
        return String.format(Locale.ROOT, "%.6g", value);
    }

    private double gaussian() {
        // Box-Muller from the seeded generator (common practice).
        double u1 = 1 - random.nextDouble();
        double u2 = random.nextDouble();
        return Math.sqrt(-2 * Math.log(u1)) * Math.cos(2 * Math.PI * u2);
    }

    /** Unit step response of wn^2/(s^2 + 2 zeta wn s + wn^2) (any control textbook). */
    private static double unitStep(double t, double wn, double zeta) {
        if (zeta < 1) {
            double wd = wn * Math.sqrt(1 - zeta * zeta);
            return 1 - Math.exp(-zeta * wn * t) * (Math.cos(wd * t) + zeta * wn / wd * Math.sin(wd * t));
        }
        if (zeta == 1) {
            return 1 - Math.exp(-wn * t) * (1 + wn * t);
        }
        double root = Math.sqrt(zeta * zeta - 1);
        double s1 = -wn * (zeta - root);
        double s2 = -wn * (zeta + root);
        return 1 + (s2 * Math.exp(s1 * t) - s1 * Math.exp(s2 * t)) / (s1 - s2);
    }

    private void plots() {
        String[] figures = {"step-response", "control-effort", "bode", "uncertainty-band"};
        String[] designs = {
            AXIS,
            "{\"plant\":{\"form\":\"massSpringDamper\",\"mass\":12,\"damping\":40,\"stiffness\":3000},\"spec\":{\"settlingTime\":0.5,\"overshootPercent\":2}}",
            "{\"plant\":{\"form\":\"canonical\",\"a0\":0.02,\"a1\":0.3,\"b\":0.05,\"d\":0.05},\"spec\":{\"riseTime\":20,\"overshootPercent\":1},\"verify\":{\"uncertainty\":{\"a0\":{\"spreadPercent\":30},\"monteCarloSamples\":12,\"seed\":5}}}",
        };
        for (String figure : figures) {
            for (int i = 0; i < designs.length; i++) {
                String limit = i == 0 ? ",\"actuatorLimit\":3" : "";
                post(
                        "plot-" + figure + "-" + i,
                        "/v1/designs/plots/" + figure,
                        "{\"design\":" + designs[i] + limit + "}");
            }
        }
        post("plot-unknown-figure", "/v1/designs/plots/nyquist", "{\"design\":" + AXIS + "}");
        post(
                "plot-infeasible",
                "/v1/designs/plots/step-response",
                "{\"design\":{\"plant\":" + AXIS_PLANT + ",\"spec\":{\"settlingTime\":0.15,\"overshootPercent\":10}}}");
        post("plot-missing-design", "/v1/designs/plots/bode", "{\"actuatorLimit\":3}");
        post("plot-band-without-box", "/v1/designs/plots/uncertainty-band", "{\"design\":" + AXIS + "}");
    }

    private void controllers() {
        String[] formats = {"structured-text", "c-header", "c-source", "plcopen-xml", "parameters"};
        String[] bodies = {
            "{\"design\":" + AXIS + ",\"samplePeriod\":0.001,\"actuatorLimit\":3}",
            "{\"design\":{\"plant\":{\"form\":\"rotaryAxis\",\"inertia\":0.004,\"viscousFriction\":0.002,\"torqueConstant\":0.12,\"gearRatio\":10},\"spec\":{\"settlingTime\":0.25,\"overshootPercent\":1}},\"samplePeriod\":0.0005,\"actuatorLimit\":8}",
            "{\"design\":{\"plant\":{\"form\":\"canonical\",\"a0\":0.02,\"a1\":0.3,\"b\":0.05,\"d\":0.05},\"spec\":{\"settlingTime\":60,\"overshootPercent\":2}},\"samplePeriod\":0.5,\"actuatorLimit\":100}",
        };
        for (String format : formats) {
            for (int i = 0; i < bodies.length; i++) {
                post("controller-" + format + "-" + i, "/v1/designs/controllers/" + format, bodies[i]);
            }
        }
        String options = "{\"design\":{\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":400,\"d\":400},"
                + "\"spec\":{\"settlingTime\":0.15,\"overshootPercent\":1.5}},\"samplePeriod\":0.001,"
                + "\"actuatorRange\":{\"lowest\":4,\"highest\":20},\"operatingPoint\":{\"output\":0.25,\"command\":12},"
                + "\"prefix\":\"Valve7\",\"precision\":\"single\",\"periodTolerancePercent\":5}";
        for (String format : formats) {
            post("controller-options-" + format, "/v1/designs/controllers/" + format, options);
        }
        post("controller-bad-prefix", "/v1/designs/controllers/c-header", options.replace("\"Valve7\"", "\"7Valve\""));
        post(
                "controller-limit-and-range",
                "/v1/designs/controllers/parameters",
                options.replace("\"samplePeriod\":0.001,", "\"samplePeriod\":0.001,\"actuatorLimit\":3,"));
        // issue 17 part 2: the vertical axis with integral action and position-only sensing, exported as its loop
        String lift = "{\"design\":{\"plant\":{\"form\":\"massSpringDamper\",\"mass\":18,\"damping\":60,"
                + "\"stiffness\":0},\"spec\":{\"settlingTime\":0.3,\"overshootPercent\":2},\"integralAction\":true,"
                + "\"measurement\":\"position\",\"observer\":{\"method\":\"poleMultiple\",\"multiple\":5}},"
                + "\"samplePeriod\":0.001,\"actuatorRange\":{\"lowest\":-400,\"highest\":800},\"prefix\":\"Lift\"}";
        for (String format : formats) {
            post("controller-loop-" + format, "/v1/designs/controllers/" + format, lift);
        }
        post(
                "controller-loop-observer-too-fast",
                "/v1/designs/controllers/c-source",
                lift.replace(
                        "{\"method\":\"poleMultiple\",\"multiple\":5}",
                        "{\"method\":\"kalman\",\"processNoise\":25,\"sensorResolution\":1e-6,\"samplePeriod\":1e-3}"));
        post(
                "controller-retired-c-format",
                "/v1/designs/controllers/c",
                "{\"design\":" + AXIS + ",\"samplePeriod\":0.001,\"actuatorLimit\":3}");
        post(
                "controller-period-too-long",
                "/v1/designs/controllers/c-source",
                "{\"design\":" + AXIS + ",\"samplePeriod\":0.05,\"actuatorLimit\":3}");
        post(
                "controller-unknown-format",
                "/v1/designs/controllers/ladder",
                "{\"design\":" + AXIS + ",\"samplePeriod\":0.001,\"actuatorLimit\":3}");
        post(
                "controller-missing-limit",
                "/v1/designs/controllers/structured-text",
                "{\"design\":" + AXIS + ",\"samplePeriod\":0.001}");
    }

    private void plainResources() {
        get("get-dashboard", "/");
        get("get-contract", "/openapi.yaml");
        get("get-health", "/health");
        get("get-health-live", "/health/live");
        get("get-health-ready", "/health/ready");
        get("get-unknown-path", "/v1/nothing-here");
        get("get-design-method", "/v1/designs");
        cases.add(new GoldenCase(
                "put-design-method", GoldenCase.OPEN, "PUT", "/v1/designs", "application/json", AXIS, Map.of()));
        cases.add(new GoldenCase("delete-health", GoldenCase.OPEN, "DELETE", "/health", null, null, Map.of()));
    }

    /** Coefficients at the ends of their ranges, where double precision runs out. */
    private void extremes() {
        design(
                "extreme-00",
                "{\"plant\":{\"form\":\"canonical\",\"a0\":1e8,\"a1\":1e4,\"b\":1e-6,\"d\":1e8},\"spec\":{\"settlingTime\":1e-4,\"overshootPercent\":0.001}}");
        design(
                "extreme-01",
                "{\"plant\":{\"form\":\"canonical\",\"a0\":-1e8,\"a1\":-1e4,\"b\":1e-6,\"d\":1e8},\"spec\":{\"settlingTime\":1e-4,\"overshootPercent\":1}}");
        design(
                "extreme-02",
                "{\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":0,\"b\":1e-6,\"d\":1e8},\"spec\":{\"settlingTime\":1e-4,\"overshootPercent\":0.001}}");
        design(
                "extreme-03",
                "{\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":0,\"b\":1e8,\"d\":1e-8},\"spec\":{\"settlingTime\":1e4,\"overshootPercent\":0.001}}");
        post(
                "verification-extreme-00",
                "/v1/verifications",
                "{\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":0,\"b\":1e8,\"d\":1e8},"
                        + "\"gain\":{\"k1\":1e12,\"k2\":1e12,\"referenceGain\":1e12}}");
        post(
                "verification-extreme-01",
                "/v1/verifications",
                "{\"plant\":{\"form\":\"canonical\",\"a0\":1e8,\"a1\":1e4,\"b\":1e-6,\"d\":1e8},"
                        + "\"gain\":{\"k1\":1e-12,\"k2\":1e-12,\"referenceGain\":1e12}}");
        post(
                "high-order-extreme-00",
                "/v1/designs/high-order",
                "{\"plant\":{\"denominator\":[1,1e8,1e8,1e8,1e8,1e8,1e8,1e8,1e8],"
                        + "\"b\":1e-6,\"disturbance\":[1e8,0,0,0,0,0,0,1e8]},\"spec\":{\"settlingTime\":1e-4,\"overshootPercent\":0.001}}");
    }

    private void get(String id, String path) {
        cases.add(new GoldenCase(id, GoldenCase.OPEN, "GET", path, null, null, Map.of()));
    }

    /** A server with API keys: no credential, a wrong one, a right one in either header. */
    private void keyed() {
        String right = GoldenCase.KEY;
        cases.add(new GoldenCase(
                "keyed-none", GoldenCase.KEYED, "POST", "/v1/designs", "application/json", AXIS, Map.of()));
        cases.add(new GoldenCase(
                "keyed-wrong",
                GoldenCase.KEYED,
                "POST",
                "/v1/designs",
                "application/json",
                AXIS,
                Map.of("X-Api-Key", "not-the-key")));
        cases.add(new GoldenCase(
                "keyed-header",
                GoldenCase.KEYED,
                "POST",
                "/v1/designs",
                "application/json",
                AXIS,
                Map.of("X-Api-Key", right)));
        cases.add(new GoldenCase(
                "keyed-bearer",
                GoldenCase.KEYED,
                "POST",
                "/v1/designs/batch",
                "application/json",
                "{\"items\":[" + AXIS + "]}",
                Map.of("Authorization", "Bearer " + right)));
        cases.add(new GoldenCase("keyed-health", GoldenCase.KEYED, "GET", "/health", null, null, Map.of()));
    }
}
