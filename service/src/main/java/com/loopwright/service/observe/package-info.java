/**
 * Observability: request ids (echoed, and in every log line of a request) and the Prometheus metrics (kept by the
 * Prometheus Java client in a registry per application).
 *
 * <p>Invariant: every label value comes from a fixed set (route templates, known methods, status codes, outcomes,
 * refusal reasons), so no client can grow the number of series past {@code Metrics.MAX_SERIES}.
 */
package com.loopwright.service.observe;
