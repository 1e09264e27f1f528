/**
 * Position-only (output-only) sensing: the observer of the unmeasured plant states, designed as a steady-state
 * Kalman filter by the Hamiltonian Riccati solver or by a multiple of the controller poles (Ackermann's formula),
 * and the full output-feedback loop (plant + integrator + observer + law) assembled as one state space, on which
 * its cost is computed: the H-infinity norm from w to z, margins at the plant input, the gain from measurement
 * noise to the command and the load step. The reference drives plant and observer with the same command, so the
 * estimation error is not excited by it. Results are {@code design/} records ({@code ObserverDesign},
 * {@code OutputFeedbackFigures}).
 */
package com.loopwright.solver.observer;
