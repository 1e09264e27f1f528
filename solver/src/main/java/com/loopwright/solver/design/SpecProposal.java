package com.loopwright.solver.design;

/**
 * A computed nearby spec that the plant can meet.
 *
 * @param quantity what to change
 * @param value    the proposed value, in the spec's own units (percent, seconds, or gamma)
 * @param note     what is kept and why the value is where it is
 */
public record SpecProposal(SpecQuantity quantity, double value, String note) {}
