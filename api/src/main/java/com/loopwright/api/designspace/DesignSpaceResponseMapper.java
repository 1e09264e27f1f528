package com.loopwright.api.designspace;

import com.loopwright.api.design.Cautions;
import com.loopwright.api.designspace.DesignSpaceResponse.BoxResponse;
import com.loopwright.api.designspace.DesignSpaceResponse.ConditionCount;
import com.loopwright.api.designspace.DesignSpaceResponse.DesignSpaceCellResponse;
import com.loopwright.api.designspace.DesignSpaceResponse.FastestTime;
import com.loopwright.solver.design.DesignSpaceBox;
import com.loopwright.solver.design.DesignSpaceCell;
import com.loopwright.solver.design.DesignSpaceMap;
import com.loopwright.solver.design.DesignSpaceRow;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/** Formats a map as its wire response; computes nothing. */
final class DesignSpaceResponseMapper {

    DesignSpaceResponse toResponse(DesignSpaceMap map, DesignSpaceCell spec) {
        boolean settling = map.grid().settlingAxis();
        List<DesignSpaceCellResponse> cells = new ArrayList<>(map.cells().size());
        Map<String, ConditionCount> counts = new LinkedHashMap<>();
        for (DesignSpaceCell cell : map.cells()) {
            cells.add(cell(cell, settling));
            if (!cell.feasible()) {
                String name = DesignSpaceConditions.wireName(cell.limit(), cell.condition());
                Integer state = DesignSpaceConditions.state(cell.limit(), cell.condition());
                String key = name + "/" + state;
                ConditionCount seen = counts.get(key);
                counts.put(
                        key,
                        new ConditionCount(
                                name,
                                state,
                                DesignSpaceConditions.meaning(cell.limit(), cell.condition()),
                                seen == null ? 1 : seen.cells() + 1));
            }
        }
        List<FastestTime> fastest = new ArrayList<>(map.rows().size());
        for (DesignSpaceRow row : map.rows()) {
            fastest.add(new FastestTime(
                    row.overshootPercent(),
                    settling ? row.fastestSeconds() : null,
                    settling ? null : row.fastestSeconds(),
                    DesignSpaceConditions.wireName(row.limitedBy(), row.condition()),
                    DesignSpaceConditions.state(row.limitedBy(), row.condition())));
        }
        return new DesignSpaceResponse(
                settling ? "settlingTime" : "riseTime",
                100 * map.grid().bandFraction(),
                map.grid().timeCount(),
                map.grid().overshootCount(),
                map.boxCases(),
                cells,
                fastest,
                List.copyOf(counts.values()),
                spec == null ? null : cell(spec, settling),
                Cautions.ALL);
    }

    private static DesignSpaceCellResponse cell(DesignSpaceCell cell, boolean settling) {
        return new DesignSpaceCellResponse(
                settling ? cell.timeSeconds() : null,
                settling ? null : cell.timeSeconds(),
                cell.overshootPercent(),
                cell.feasible(),
                cell.feasible() ? null : DesignSpaceConditions.wireName(cell.limit(), cell.condition()),
                cell.feasible() ? null : DesignSpaceConditions.state(cell.limit(), cell.condition()),
                cell.gammaMin(),
                cell.peakControl(),
                box(cell.box(), settling));
    }

    private static BoxResponse box(DesignSpaceBox box, boolean settling) {
        if (box == null) {
            return null;
        }
        return new BoxResponse(
                box.cases(),
                box.unstableCases(),
                settling ? box.worstTimeSeconds() : null,
                settling ? null : box.worstTimeSeconds(),
                box.worstOvershootPercent(),
                box.worstPeakControl(),
                box.meetingFraction());
    }
}
