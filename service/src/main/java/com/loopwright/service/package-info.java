/**
 * The HTTP service: {@link com.loopwright.service.LoopwrightApp} wires the route table, the body gate, security,
 * observability and the problem+json error model into one Javalin application; {@link
 * com.loopwright.service.ServiceConfig} reads every setting from the environment, {@link
 * com.loopwright.service.LoopwrightMain} starts and stops it.
 *
 * <p>Invariant: every answer, including every error, is a documented response of {@code openapi.yaml} (a problem
 * is RFC 9457 problem+json, never a stack trace), and a configuration is validated whole before anything starts.
 */
package com.loopwright.service;
