/**
 * The endpoints: {@link com.loopwright.service.routes.RouteTable}, one row per endpoint, and the handlers its rows
 * name (one per path; {@link com.loopwright.service.routes.JsonExchangeRoute} for plain JSON-to-JSON endpoints).
 *
 * <p>Invariant: the route table is the only list of endpoints; registration, CORS preflights, the API-key check
 * and the metric labels are all derived from it, so they cannot disagree.
 */
package com.loopwright.service.routes;
