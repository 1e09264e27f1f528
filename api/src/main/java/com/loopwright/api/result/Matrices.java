package com.loopwright.api.result;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.ejml.data.DMatrixRMaj;

/** Matrices and vectors to their wire lists (rows of numbers). */
public final class Matrices {

    private Matrices() {}

    /** An immutable deep copy of a list of rows. */
    static List<List<Double>> copy(List<List<Double>> rows) {
        return rows.stream().map(List::copyOf).toList();
    }

    /** The rows of m. */
    public static List<List<Double>> rows(DMatrixRMaj m) {
        List<List<Double>> rows = new ArrayList<>(m.numRows);
        for (int i = 0; i < m.numRows; i++) {
            List<Double> row = new ArrayList<>(m.numCols);
            for (int j = 0; j < m.numCols; j++) {
                row.add(m.get(i, j));
            }
            rows.add(row);
        }
        return rows;
    }

    /** The symmetric 2 x 2 matrix [[p11, p12], [p12, p22]]. */
    public static List<List<Double>> symmetric2(double p11, double p12, double p22) {
        return List.of(List.of(p11, p12), List.of(p12, p22));
    }

    public static List<Double> boxed(double[] values) {
        return Arrays.stream(values).boxed().toList();
    }
}
