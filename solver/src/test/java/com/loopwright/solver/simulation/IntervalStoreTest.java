package com.loopwright.solver.simulation;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.Arrays;
import java.util.Random;
import org.junit.jupiter.api.Test;

class IntervalStoreTest {

    @Test
    void orderIsTheStableSortOfTheBoxedComparator() {
        // source: java.util.Arrays.sort(T[], Comparator) (a stable sort, per its specification)
        // with the comparator the previous implementation used, (p, q) -> Double.compare(key q,
        // key p), on 500 random key sets of 0 .. 300 entries with many ties, signed zeros and
        // infinities; the merge sort on entry numbers must give the same permutation.
        Random random = new Random(2027L);
        double[] pool = {
            0.0, -0.0, 1.0, 1.0, 2.5, -3.0, Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY, 1e-300, -1e-300
        };
        for (int c = 0; c < 500; c++) {
            int count = random.nextInt(301);
            IntervalStore store = new IntervalStore(2);
            double[] keys = new double[count];
            for (int i = 0; i < count; i++) {
                keys[i] = random.nextBoolean() ? pool[random.nextInt(pool.length)] : random.nextGaussian();
                store.add(10 * i, new double[] {i, -i}, i, 1, i + 1, -1, keys[i]);
            }
            Integer[] expected = new Integer[count];
            for (int i = 0; i < count; i++) {
                expected[i] = i;
            }
            Arrays.sort(expected, (p, q) -> Double.compare(keys[q], keys[p]));
            int[] actual = store.orderByKeyDescending();
            assertArrayEquals(
                    Arrays.stream(expected).mapToInt(Integer::intValue).toArray(), actual, "key set " + c);
        }
    }

    @Test
    void keepsEntriesAndTheirStatesThroughGrowthAndFiltering() {
        // source: from memory (the store's contract): entries keep index, x_k and end samples
        // through doubling, clearing and dropping keys not above a threshold, in insertion order.
        IntervalStore store = new IntervalStore(3);
        for (int i = 0; i < 5; i++) {
            store.add(i, new double[] {i, 0, 0}, 0, 0, 0, 0, i);
        }
        store.clear();
        assertEquals(0, store.size());
        for (int i = 0; i < 100; i++) {
            store.add(7 * i, new double[] {i, 2 * i, 3 * i}, i + 0.5, -i, i + 1.5, i, i % 10);
        }
        store.keepKeysAbove(6.0);
        assertEquals(30, store.size());
        for (int e = 0; e < store.size(); e++) {
            int i = store.sampleIndex(e) / 7;
            assertEquals(7 + (e % 3), i % 10);
            double[] states = store.states();
            int from = store.stateOffset(e);
            assertArrayEquals(new double[] {i, 2 * i, 3 * i}, Arrays.copyOfRange(states, from, from + 3));
            assertEquals(i + 0.5, store.valueAtStart(e));
            assertEquals(-i, store.rateAtStart(e));
            assertEquals(i + 1.5, store.valueAtEnd(e));
            assertEquals(i, store.rateAtEnd(e));
            assertEquals(i % 10, store.key(e));
        }
    }
}
