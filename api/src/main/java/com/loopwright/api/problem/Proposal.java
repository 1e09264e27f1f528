package com.loopwright.api.problem;

/**
 * A nearby value the plant can meet.
 *
 * @param pointer the field to change
 * @param value   the proposed value, in that field's units
 * @param note    what is kept and why
 */
public record Proposal(String pointer, double value, String note) {}
