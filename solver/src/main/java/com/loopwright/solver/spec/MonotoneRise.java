package com.loopwright.solver.spec;

import com.loopwright.solver.numeric.BracketedRoot;

/** First crossing of a level in (0, 1) by the normalized step response, where the response is still rising. */
final class MonotoneRise {

    /** Doublings of the search bracket for non-oscillating responses: 2^200 is beyond any finite time. */
    private static final int MAX_DOUBLINGS = 200;

    private MonotoneRise() {}

    /**
     * y rises monotonically from 0 up to its first peak (zeta &lt; 1) or to 1 (zeta &gt;= 1), so the first
     * crossing of a level in (0, 1) is the only one on that stretch.
     */
    static double crossing(NormalizedStepResponse response, double level) {
        if (!(level > 0 && level < 1)) {
            throw new IllegalArgumentException("level must lie in (0, 1): " + level);
        }
        if (response.underdamped()) {
            return BracketedRoot.bisection(t -> response.at(t) - level, 0, response.extremumTime(1));
        }
        double hi = 1;
        for (int i = 0; response.at(hi) < level; i++) {
            if (i == MAX_DOUBLINGS) {
                throw new IllegalArgumentException("response never reaches " + level);
            }
            hi *= 2;
        }
        return BracketedRoot.bisection(t -> response.at(t) - level, 0, hi);
    }
}
