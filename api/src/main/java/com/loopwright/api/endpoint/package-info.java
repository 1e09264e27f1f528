/**
 * The one request pipeline of every endpoint: an {@link com.loopwright.api.endpoint.Endpoint} says how to
 * validate, compute and map; the {@link com.loopwright.api.endpoint.EndpointRunner} decodes strictly, runs it,
 * writes the response through the one finite-number guard and maps every failure to a problem through the one
 * {@link com.loopwright.api.endpoint.FailureTable}. The answer is one {@link com.loopwright.api.endpoint.Reply}:
 * a body with its media type, or a problem, never both; a body never holds NaN or Infinity.
 */
package com.loopwright.api.endpoint;
