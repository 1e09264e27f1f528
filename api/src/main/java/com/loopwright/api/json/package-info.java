/**
 * JSON on the wire: the strict mapper (unknown fields, duplicates and coercions refused), decoding failures as
 * problems with JSON pointers, and the writer that refuses NaN and Infinity. Invariant: no non-finite number
 * is ever written to a response.
 */
package com.loopwright.api.json;
