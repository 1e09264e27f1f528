package com.loopwright.service.compute;

import com.fasterxml.jackson.databind.JsonNode;
import com.loopwright.api.exchange.Outcome;

/** The design computation behind the routes: a request body or one batch item in, an outcome out. */
public interface Designs {

    /** One raw request body. */
    Outcome design(byte[] body);

    /** One already parsed batch item. */
    Outcome design(JsonNode item);
}
