/**
 * The open-loop plant in every form the service accepts (canonical second order, physical forms, transfer function,
 * two-state model, order-n companion form), the disturbance signals that act on its disturbance input, and the
 * records of a plant identified from a step test (step-test data, fit options, the fitted model and its warnings).
 *
 * <p>Invariant: nothing here knows a controller, a design or a solver algorithm; these are the input records the
 * callers build and the fitted model they read back.
 */
package com.loopwright.solver.plant;
