package com.loopwright.service.compute;

import com.fasterxml.jackson.databind.JsonNode;
import com.loopwright.api.endpoint.Reply;

/** The design computation behind the routes: a request body or one batch item in, a reply out. */
public interface Designs {

    /** One raw request body. */
    Reply design(byte[] body);

    /** One already parsed batch item (an item that is not an object). */
    Reply design(JsonNode item);

    /** One object item of a batch, decoded from its bytes; by default through its tree. */
    default Reply design(BatchItem item) {
        return design(item.tree());
    }
}
