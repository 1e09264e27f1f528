package com.loopwright.solver.design;

import java.util.List;

/**
 * Why a spec cannot be met, in engineering words.
 *
 * @param quantity  the spec quantity to change
 * @param reason    the failing condition and its numbers
 * @param proposals nearest specs the plant can meet, computed (may be empty)
 */
public record Infeasibility(SpecQuantity quantity, String reason, List<SpecProposal> proposals) {

    public Infeasibility {
        proposals = List.copyOf(proposals);
    }

    public Infeasibility withProposals(List<SpecProposal> more) {
        return new Infeasibility(quantity, reason, more);
    }
}
