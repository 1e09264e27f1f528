package com.loopwright.api.loop;

import com.fasterxml.jackson.annotation.JsonInclude;
import com.loopwright.api.result.Pole;
import java.util.List;

/**
 * The observer of the plant state from the measured position y_m = C_m x: x_hat' = A x_hat + B2 u + L (y_m - C_m
 * x_hat), with the reference applied to plant and observer alike.
 *
 * @param method           "kalman": L = Y C_m' / v with Y from A Y + Y A' - Y C_m' C_m Y / v + q B1 B1' = 0;
 *                         "poleMultiple": the poles of A - L C_m at a multiple of the controller poles
 * @param gain             L, one entry per plant state (the coordinates of the law)
 * @param poles            the estimation-error poles, eigenvalues of A - L C_m
 * @param processNoise     q (kalman)
 * @param measurementNoise v (kalman; from the sensor resolution Delta and sample period T: Delta^2 / 12 T)
 * @param riccatiResidual  relative residual of Y in its Riccati equation (kalman)
 * @param multiple         the pole multiple (poleMultiple)
 */
@JsonInclude(JsonInclude.Include.NON_NULL)
public record Observer(
        String method,
        List<Double> gain,
        List<Pole> poles,
        Double processNoise,
        Double measurementNoise,
        Double riccatiResidual,
        Double multiple) {

    public Observer {
        gain = List.copyOf(gain);
        poles = List.copyOf(poles);
    }
}
