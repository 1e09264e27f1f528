package com.loopwright.service;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * A strict reader of the Prometheus text exposition format 0.0.4 (source: the format's published
 * specification, "Exposition formats", from memory): every sample line is name{labels} value, every metric
 * family is introduced by # HELP and # TYPE, histogram buckets are cumulative and the +Inf bucket equals _count.
 */
final class PrometheusText {

    private static final Pattern SAMPLE = Pattern.compile(
            "([a-zA-Z_:][a-zA-Z0-9_:]*)(\\{((?:[a-zA-Z_][a-zA-Z0-9_]*=\"(?:[^\"\\\\\\n]|\\\\.)*\",?)*)})? (\\S+)");
    private static final Pattern LABEL = Pattern.compile("([a-zA-Z_][a-zA-Z0-9_]*)=\"((?:[^\"\\\\\\n]|\\\\.)*)\"");

    /** Samples by name{labels} as written. */
    final Map<String, Double> samples = new LinkedHashMap<>();

    final Map<String, String> types = new HashMap<>();

    static PrometheusText parse(String text) {
        PrometheusText parsed = new PrometheusText();
        String family = null;
        for (String line : text.split("\n")) {
            if (line.startsWith("# HELP ")) {
                family = line.split(" ")[2];
                continue;
            }
            if (line.startsWith("# TYPE ")) {
                String[] parts = line.split(" ");
                assertEquals(family, parts[2], "TYPE follows its HELP: " + line);
                assertTrue(parts[3].matches("counter|gauge|histogram|summary|untyped"), line);
                parsed.types.put(parts[2], parts[3]);
                continue;
            }
            Matcher sample = SAMPLE.matcher(line);
            assertTrue(sample.matches(), "not a sample line: " + line);
            String name = sample.group(1);
            assertTrue(
                    family != null && (name.equals(family) || name.startsWith(family + "_")),
                    "sample " + name + " outside its family " + family);
            double value = parseValue(sample.group(4));
            assertTrue(
                    parsed.samples.put(name + (sample.group(2) == null ? "" : sample.group(2)), value) == null,
                    "duplicate series " + line);
        }
        parsed.checkHistograms();
        return parsed;
    }

    private static double parseValue(String text) {
        return switch (text) {
            case "+Inf" -> Double.POSITIVE_INFINITY;
            case "-Inf" -> Double.NEGATIVE_INFINITY;
            case "NaN" -> Double.NaN;
            default -> Double.parseDouble(text);
        };
    }

    static Map<String, String> labels(String series) {
        Map<String, String> labels = new LinkedHashMap<>();
        int brace = series.indexOf('{');
        if (brace >= 0) {
            Matcher label = LABEL.matcher(series.substring(brace));
            while (label.find()) {
                labels.put(label.group(1), label.group(2));
            }
        }
        return labels;
    }

    /** Sum of all samples of a name whose labels include the given ones. */
    double sum(String name, Map<String, String> having) {
        double total = 0;
        for (Map.Entry<String, Double> sample : samples.entrySet()) {
            String series = sample.getKey();
            int brace = series.indexOf('{');
            String sampleName = brace < 0 ? series : series.substring(0, brace);
            if (sampleName.equals(name) && labels(series).entrySet().containsAll(having.entrySet())) {
                total += sample.getValue();
            }
        }
        return total;
    }

    private void checkHistograms() {
        types.forEach((family, type) -> {
            if (!type.equals("histogram")) {
                return;
            }
            Map<String, Double> previous = new HashMap<>();
            for (Map.Entry<String, Double> sample : samples.entrySet()) {
                if (!sample.getKey().startsWith(family + "_bucket{")) {
                    continue;
                }
                Map<String, String> labels = labels(sample.getKey());
                String le = labels.remove("le");
                String key = labels.toString();
                double before = previous.getOrDefault(key, 0.0);
                assertTrue(sample.getValue() >= before, "buckets are cumulative: " + sample.getKey());
                previous.put(key, sample.getValue());
                if (le.equals("+Inf")) {
                    String count = family + "_count{"
                            + sample.getKey()
                                    .substring(sample.getKey().indexOf('{') + 1)
                                    .replaceAll(",?le=\"\\+Inf\"", "");
                    count = count.endsWith("{}") ? count.substring(0, count.length() - 2) : count; // no labels
                    assertEquals(samples.get(count), sample.getValue(), "+Inf bucket equals _count: " + count);
                }
            }
        });
    }
}
