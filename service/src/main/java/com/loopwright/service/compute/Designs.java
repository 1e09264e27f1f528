package com.loopwright.service.compute;

import com.fasterxml.jackson.databind.JsonNode;
import com.loopwright.api.exchange.EncodedOutcome;

/** The design computation behind the routes: a request body or one batch item in, an outcome as JSON bytes out. */
public interface Designs {

    /** One raw request body. */
    EncodedOutcome design(byte[] body);

    /** One already parsed batch item. */
    EncodedOutcome design(JsonNode item);
}
