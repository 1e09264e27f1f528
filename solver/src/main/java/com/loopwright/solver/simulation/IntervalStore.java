package com.loopwright.solver.simulation;

import java.util.Arrays;

/**
 * The sample intervals a streaming scan may refine after the pass: for each, its index k, the
 * state x_k it is propagated from, the signal's values and rates at both ends and a sort key.
 * Primitive arrays that start small and double when full; their length is bounded by the sample
 * count, which is capped, and is proportional to the number of events, not of samples.
 */
final class IntervalStore {

    private static final int INITIAL_CAPACITY = 8;

    private final int n;
    private int count;
    private int[] index;
    /** x_k of entry i at [i n, i n + n). */
    private double[] states;
    /** s_k, s'_k, s_(k+1), s'_(k+1) of entry i at [4 i, 4 i + 4). */
    private double[] ends;

    private double[] keys;

    IntervalStore(int stateDimension) {
        this.n = stateDimension;
    }

    int size() {
        return count;
    }

    /** Forgets every entry (keeps the room). */
    void clear() {
        count = 0;
    }

    /** Appends interval k with x_k = state[0 .. n). */
    void add(
            int k,
            double[] state,
            double valueAtStart,
            double rateAtStart,
            double valueAtEnd,
            double rateAtEnd,
            double key) {
        if (index == null) {
            index = new int[INITIAL_CAPACITY];
            states = new double[INITIAL_CAPACITY * n];
            ends = new double[INITIAL_CAPACITY * 4];
            keys = new double[INITIAL_CAPACITY];
        } else if (count == index.length) {
            int capacity = 2 * count;
            index = Arrays.copyOf(index, capacity);
            states = Arrays.copyOf(states, capacity * n);
            ends = Arrays.copyOf(ends, capacity * 4);
            keys = Arrays.copyOf(keys, capacity);
        }
        index[count] = k;
        System.arraycopy(state, 0, states, count * n, n);
        int at = 4 * count;
        ends[at] = valueAtStart;
        ends[at + 1] = rateAtStart;
        ends[at + 2] = valueAtEnd;
        ends[at + 3] = rateAtEnd;
        keys[count] = key;
        count++;
    }

    int sampleIndex(int entry) {
        return index[entry];
    }

    /** The array holding x_k of every entry; entry i's state starts at {@link #stateOffset}. */
    double[] states() {
        return states;
    }

    int stateOffset(int entry) {
        return entry * n;
    }

    double valueAtStart(int entry) {
        return ends[4 * entry];
    }

    double rateAtStart(int entry) {
        return ends[4 * entry + 1];
    }

    double valueAtEnd(int entry) {
        return ends[4 * entry + 2];
    }

    double rateAtEnd(int entry) {
        return ends[4 * entry + 3];
    }

    double key(int entry) {
        return keys[entry];
    }

    /** Drops the entries whose key is not above the threshold, keeping the order of the rest. */
    void keepKeysAbove(double threshold) {
        int kept = 0;
        for (int i = 0; i < count; i++) {
            if (keys[i] > threshold) {
                if (kept != i) {
                    index[kept] = index[i];
                    System.arraycopy(states, i * n, states, kept * n, n);
                    System.arraycopy(ends, 4 * i, ends, 4 * kept, 4);
                    keys[kept] = keys[i];
                }
                kept++;
            }
        }
        count = kept;
    }

    /**
     * The entries ordered by key, largest first under {@link Double#compare}, equal keys in
     * insertion order: the order of a stable sort with that comparator (a stable order by a total
     * order is unique), here a merge sort on entry numbers.
     */
    int[] orderByKeyDescending() {
        int[] order = new int[count];
        for (int i = 0; i < count; i++) {
            order[i] = i;
        }
        if (count > 1) {
            mergeSort(order, new int[count], 0, count);
        }
        return order;
    }

    /** Sorts order[from, to) stably, largest key first; scratch has the same length. */
    private void mergeSort(int[] order, int[] scratch, int from, int to) {
        if (to - from < 2) {
            return;
        }
        int middle = (from + to) >>> 1;
        mergeSort(order, scratch, from, middle);
        mergeSort(order, scratch, middle, to);
        System.arraycopy(order, from, scratch, from, to - from);
        int left = from;
        int right = middle;
        for (int out = from; out < to; out++) {
            // Take from the left run unless the right one's key is strictly larger: stable.
            if (right >= to || (left < middle && Double.compare(keys[scratch[right]], keys[scratch[left]]) <= 0)) {
                order[out] = scratch[left++];
            } else {
                order[out] = scratch[right++];
            }
        }
    }
}
