/**
 * JMH benchmarks of the solver and the JSON path, with their fixtures (our scenarios, seeded Riccati cases, the
 * Dormand-Prince reference). Invariant: each comparison pairs both sides on the same inputs and accuracy.
 */
package com.loopwright.bench;
