package com.loopwright.solver.observer;

import com.loopwright.solver.design.TrackingLaw;
import com.loopwright.solver.plant.CompanionPlant;
import org.ejml.data.DMatrixRMaj;

/**
 * Assembles the closed loop of a companion plant x' = A x + B2 u + B1 w, y = c x, measured y_m = C_m x + v, under
 * u = kr r + ki xi - K x_hat with xi' = r - y and, for output feedback, the observer
 * x_hat' = A x_hat + B2 u + L (y_m - C_m x_hat). States [x, xi (with integral action), x_hat (with an observer)]:
 * <pre>
 *   x'     = A x + B2 ki xi - B2 K x_hat + B2 kr r + B1 w
 *   xi'    = -c x + r
 *   x_hat' = L C_m x + B2 ki xi + (A - B2 K - L C_m) x_hat + B2 kr r + L v
 * </pre>
 * (x_hat is x itself for full-state feedback). The reference enters plant and observer through the same command,
 * so the error e = x - x_hat obeys e' = (A - L C_m) e + B1 w - L v and r does not excite it.
 */
public final class OutputFeedbackLoop {

    private OutputFeedbackLoop() {}

    /**
     * @param measuredRow   C_m, one entry per plant state
     * @param observerGain  L, or null for full-state feedback
     * @param weights       rho_i of the performance output: on [-xi / c0, x] with integral action, on x without
     */
    public static LoopSystem closed(
            CompanionPlant plant, double[] measuredRow, TrackingLaw law, double[] observerGain, double[] weights) {
        Layout layout = new Layout(plant.order(), law.integralAction(), observerGain != null);
        int n = plant.order();
        int size = layout.size();
        DMatrixRMaj a = new DMatrixRMaj(size, size);
        DMatrixRMaj plantA = plant.stateMatrix();
        double b = plant.b();
        double[] c = plant.numerator();
        double[] d = plant.disturbance();
        DMatrixRMaj command = commandRow(layout, law);
        // plant rows: A x + B2 u, u = command . state
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                a.set(i, j, plantA.get(i, j));
            }
        }
        for (int j = 0; j < size; j++) {
            a.add(n - 1, j, b * command.get(0, j));
        }
        if (layout.integral()) {
            for (int j = 0; j < n; j++) {
                a.set(layout.xi(), j, -c[j]);
            }
        }
        DMatrixRMaj reference = new DMatrixRMaj(size, 1);
        reference.set(n - 1, 0, b * law.referenceGain());
        if (layout.integral()) {
            reference.set(layout.xi(), 0, 1);
        }
        DMatrixRMaj noise = new DMatrixRMaj(size, 1);
        if (layout.observer()) {
            int o = layout.observerStart();
            for (int i = 0; i < n; i++) {
                for (int j = 0; j < n; j++) {
                    a.set(o + i, o + j, plantA.get(i, j) - observerGain[i] * measuredRow[j]);
                    a.add(o + i, j, observerGain[i] * measuredRow[j]);
                }
                noise.set(o + i, 0, observerGain[i]);
            }
            for (int j = 0; j < size; j++) {
                a.add(o + n - 1, j, b * command.get(0, j));
            }
            reference.set(o + n - 1, 0, b * law.referenceGain());
        }
        DMatrixRMaj disturbance = new DMatrixRMaj(size, 1);
        for (int i = 0; i < n; i++) {
            disturbance.set(i, 0, d[i]);
        }
        DMatrixRMaj output = new DMatrixRMaj(1, size);
        for (int j = 0; j < n; j++) {
            output.set(0, j, c[j]);
        }
        return new LoopSystem(
                a, reference, disturbance, noise, output, command, performance(layout, plant, weights, command));
    }

    /**
     * The loop of a law (and observer) designed for {@code model} running on {@code actual} (a perturbed plant of
     * the same order and output row): the plant rows and the integrator row (x' and xi' = r - y) are those of the
     * actual plant, the observer rows those of the model (the controller computes with the model's A and b). The
     * command, noise and performance rows are the design's.
     */
    public static LoopSystem closedOn(
            CompanionPlant actual,
            CompanionPlant model,
            double[] measuredRow,
            TrackingLaw law,
            double[] observerGain,
            double[] weights) {
        if (actual.order() != model.order()) {
            throw new IllegalArgumentException("the actual plant and the model must have the same order");
        }
        LoopSystem designed = closed(model, measuredRow, law, observerGain, weights);
        LoopSystem real = closed(actual, measuredRow, law, observerGain, weights);
        int plantRows = actual.order() + (law.integralAction() ? 1 : 0);
        DMatrixRMaj a = designed.a();
        DMatrixRMaj reference = designed.reference();
        DMatrixRMaj realA = real.a();
        DMatrixRMaj realReference = real.reference();
        for (int i = 0; i < plantRows; i++) {
            for (int j = 0; j < a.numCols; j++) {
                a.set(i, j, realA.get(i, j));
            }
            reference.set(i, 0, realReference.get(i, 0));
        }
        return new LoopSystem(
                a,
                reference,
                real.disturbance(),
                designed.noise(),
                real.output(),
                designed.command(),
                designed.performance());
    }

    /** The same loop broken at the plant input (the plant's own input column cut from the command). */
    public static OpenLoopAtInput atPlantInput(
            CompanionPlant plant, double[] measuredRow, TrackingLaw law, double[] observerGain) {
        Layout layout = new Layout(plant.order(), law.integralAction(), observerGain != null);
        int n = plant.order();
        LoopSystem closed = closed(plant, measuredRow, law, observerGain, new double[law.integralAction() ? n + 1 : n]);
        DMatrixRMaj a = closed.a();
        DMatrixRMaj command = closed.command();
        // undo u on the plant rows: the plant sees the injected input instead
        for (int j = 0; j < layout.size(); j++) {
            a.add(n - 1, j, -plant.b() * command.get(0, j));
        }
        DMatrixRMaj input = new DMatrixRMaj(layout.size(), 1);
        input.set(n - 1, 0, plant.b());
        return new OpenLoopAtInput(a, input, command);
    }

    private static DMatrixRMaj commandRow(Layout layout, TrackingLaw law) {
        DMatrixRMaj command = new DMatrixRMaj(1, layout.size());
        double[] k = law.stateGain();
        int start = layout.observer() ? layout.observerStart() : 0;
        for (int j = 0; j < k.length; j++) {
            command.set(0, start + j, -k[j]);
        }
        if (layout.integral()) {
            command.set(0, layout.xi(), law.integralGain());
        }
        return command;
    }

    private static DMatrixRMaj performance(Layout layout, CompanionPlant plant, double[] weights, DMatrixRMaj command) {
        int n = plant.order();
        int expected = layout.integral() ? n + 1 : n;
        if (weights.length != expected) {
            throw new IllegalArgumentException("need " + expected + " weights, got " + weights.length);
        }
        DMatrixRMaj z = new DMatrixRMaj(expected + 1, layout.size());
        int offset = 0;
        if (layout.integral()) {
            z.set(0, layout.xi(), -weights[0] / plant.numerator()[0]);
            offset = 1;
        }
        for (int i = 0; i < n; i++) {
            z.set(offset + i, i, weights[offset + i]);
        }
        for (int j = 0; j < layout.size(); j++) {
            z.set(expected, j, command.get(0, j));
        }
        return z;
    }

    /** Where each block of states sits. */
    private record Layout(int order, boolean integral, boolean observer) {
        int xi() {
            return order;
        }

        int observerStart() {
            return order + (integral ? 1 : 0);
        }

        int size() {
            return observerStart() + (observer ? order : 0);
        }
    }
}
