package com.loopwright.api.result;

import com.fasterxml.jackson.annotation.JsonInclude;
import java.util.List;

/**
 * The Riccati solution P of the design (row by row; order 2: [[p11, p12], [p12, p22]]) and the independent
 * numeric solution beside it.
 *
 * @param p                   P, rows
 * @param residualNorm        relative residual of P in the Riccati equation
 * @param numeric             the independent numeric solution of the same equation
 * @param reciprocalCondition order n only: sigma_min/sigma_max of the column-scaled pole-matching system
 * @param newtonSteps         order n only: Newton steps of the pole-matched solve
 * @param bisectionSteps      order n only: Newton solves spent on the feasible gamma set
 */
@JsonInclude(JsonInclude.Include.NON_NULL)
public record Riccati(
        List<List<Double>> p,
        double residualNorm,
        NumericRiccati numeric,
        Double reciprocalCondition,
        Integer newtonSteps,
        Integer bisectionSteps) {
    public Riccati {
        p = Matrices.copy(p);
    }
}
