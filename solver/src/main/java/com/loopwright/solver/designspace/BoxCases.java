package com.loopwright.solver.designspace;

import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.robustness.ParameterBox;
import com.loopwright.solver.robustness.ParameterSampler;
import java.util.ArrayList;
import java.util.List;

/**
 * The parameter sets a map judges each cell on: every corner of the box (the parameters whose range is not a
 * point; at most 2^4) and then the seeded samples of {@link ParameterSampler}, the same sets the robustness
 * report of a design draws for this box and seed.
 */
public final class BoxCases {

    private BoxCases() {}

    public static List<CanonicalPlant> of(ParameterBox box, int samples, long seed) {
        double[] lows = {box.a0Min(), box.a1Min(), box.bMin(), box.dMin()};
        double[] highs = {box.a0Max(), box.a1Max(), box.bMax(), box.dMax()};
        List<Integer> varying = new ArrayList<>(4);
        for (int i = 0; i < 4; i++) {
            if (lows[i] < highs[i]) {
                varying.add(i);
            }
        }
        List<CanonicalPlant> cases = new ArrayList<>((1 << varying.size()) + samples);
        for (int mask = 0; mask < (1 << varying.size()); mask++) {
            double[] p = lows.clone();
            for (int bit = 0; bit < varying.size(); bit++) {
                int index = varying.get(bit);
                p[index] = (mask >> bit & 1) == 1 ? highs[index] : lows[index];
            }
            cases.add(new CanonicalPlant(p[0], p[1], p[2], p[3]));
        }
        ParameterSampler sampler = new ParameterSampler(box, seed);
        for (int s = 0; s < samples; s++) {
            double[] p = sampler.next();
            cases.add(new CanonicalPlant(p[0], p[1], p[2], p[3]));
        }
        return cases;
    }
}
