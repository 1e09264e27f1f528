package com.loopwright.solver.design;

/** How gamma is picked above its lower bound gamma_min. */
public sealed interface GammaChoice permits GammaChoice.Fixed, GammaChoice.MarginOverMinimum {

    /** The caller's gamma; must exceed gamma_min. */
    record Fixed(double gamma) implements GammaChoice {
        public Fixed {
            if (!(gamma > 0) || !Double.isFinite(gamma)) {
                throw new IllegalArgumentException("gamma must be positive and finite");
            }
        }
    }

    /** gamma = factor x gamma_min, factor &gt; 1. */
    record MarginOverMinimum(double factor) implements GammaChoice {
        public static final double DEFAULT_FACTOR = 1.2;

        public MarginOverMinimum {
            if (!(factor > 1) || !Double.isFinite(factor)) {
                throw new IllegalArgumentException("gamma margin must exceed 1");
            }
        }
    }
}
