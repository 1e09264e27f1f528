/**
 * The HTTP layer below the application: the body gate (API key of keyed routes, size cap, in-flight body budget,
 * minimum rate, all before a request thread is used), the HTTP limits, Jetty's protocol-level error handler and
 * problem+json writing.
 *
 * <p>Invariant: the heap never holds more request bodies than the budget and no request thread waits on a client;
 * whatever this layer answers is problem+json, and every request the body gate answers itself is counted in the
 * metrics like one the application answered.
 */
package com.loopwright.service.http;
