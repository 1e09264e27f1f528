package com.loopwright.solver.design;

import java.util.List;

/**
 * A design-space map of one plant: every cell of the grid, row by row (overshoot rows, time columns), and the
 * fastest feasible time at each overshoot.
 *
 * @param grid      the grid
 * @param cells     grid.overshootCount() x grid.timeCount() cells, row-major (cell (row, column) at
 *                  row x timeCount + column)
 * @param rows      one entry per overshoot row
 * @param boxCases  parameter sets each feasible cell was judged on (0 without a box)
 */
public record DesignSpaceMap(
        DesignSpaceGrid grid, List<DesignSpaceCell> cells, List<DesignSpaceRow> rows, int boxCases) {

    public DesignSpaceMap {
        cells = List.copyOf(cells);
        rows = List.copyOf(rows);
        if (cells.size() != grid.cellCount() || rows.size() != grid.overshootCount()) {
            throw new IllegalArgumentException("the cells and rows must fill the grid");
        }
    }

    public DesignSpaceCell cell(int row, int column) {
        return cells.get(row * grid.timeCount() + column);
    }
}
