package com.loopwright.api.json;

import com.fasterxml.jackson.databind.JsonNode;
import java.util.ArrayDeque;
import java.util.Deque;

/**
 * Test oracle: the first non-finite number in a JSON tree, found by walking the tree (an independent route to
 * the pointer FiniteNumbersModule reports while writing; the production tree walk it replaced).
 */
public final class FiniteNumbers {

    /** Response trees are a few hundred nodes; the cap only guards against a runaway structure. */
    private static final int MAX_NODES = 100_000;

    private FiniteNumbers() {}

    /** JSON pointer of the first NaN/Infinity, or null when every number is finite. */
    public static String firstNonFinite(JsonNode root) {
        Deque<Visit> pending = new ArrayDeque<>();
        pending.push(new Visit(root, ""));
        int visited = 0;
        while (!pending.isEmpty()) {
            if (++visited > MAX_NODES) {
                return "";
            }
            Visit visit = pending.pop();
            JsonNode node = visit.node();
            String pointer = visit.pointer();
            if (node.isNumber() && !Double.isFinite(node.doubleValue())) {
                return pointer;
            }
            if (node.isObject()) {
                node.fields().forEachRemaining(f -> pending.push(new Visit(f.getValue(), pointer + "/" + f.getKey())));
            } else if (node.isArray()) {
                for (int i = 0; i < node.size(); i++) {
                    pending.push(new Visit(node.get(i), pointer + "/" + i));
                }
            }
        }
        return null;
    }

    private record Visit(JsonNode node, String pointer) {}
}
