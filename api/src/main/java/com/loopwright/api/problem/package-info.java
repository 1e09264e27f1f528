/**
 * RFC 9457 problem details: the stable problem types with their URIs and statuses, field errors by JSON
 * pointer and proposed values. Invariant: a problem type's URI and status never change once published.
 */
package com.loopwright.api.problem;
