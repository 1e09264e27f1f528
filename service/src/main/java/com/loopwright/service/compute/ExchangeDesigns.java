package com.loopwright.service.compute;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.api.exchange.DesignExchange;
import com.loopwright.api.exchange.EncodedOutcome;

/** The production computation: {@link DesignExchange} writing straight to bytes, stateless and thread-safe. */
public final class ExchangeDesigns implements Designs {

    private final DesignExchange exchange;

    public ExchangeDesigns(ObjectMapper mapper) {
        this.exchange = new DesignExchange(mapper);
    }

    @Override
    public EncodedOutcome design(byte[] body) {
        return exchange.encode(body);
    }

    @Override
    public EncodedOutcome design(JsonNode item) {
        return exchange.encode(item);
    }
}
