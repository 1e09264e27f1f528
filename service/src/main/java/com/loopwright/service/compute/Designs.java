package com.loopwright.service.compute;

import com.fasterxml.jackson.databind.JsonNode;
import com.loopwright.api.endpoint.Reply;

/** The design computation behind the routes: a request body or one batch item in, a reply out. */
public interface Designs {

    /** One raw request body. */
    Reply design(byte[] body);

    /** One already parsed batch item. */
    Reply design(JsonNode item);
}
