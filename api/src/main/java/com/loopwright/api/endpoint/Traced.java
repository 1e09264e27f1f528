package com.loopwright.api.endpoint;

import com.fasterxml.jackson.annotation.JsonUnwrapped;

/** A JSON response body with its {@code trace} member last (the response's own members are written unwrapped). */
record Traced(@JsonUnwrapped Object response, Trace trace) {}
