package com.loopwright.service.compute;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.api.exchange.DesignExchange;
import com.loopwright.api.exchange.Outcome;

/** The production computation: {@link DesignExchange}, stateless and thread-safe. */
public final class ExchangeDesigns implements Designs {

    private final DesignExchange exchange;

    public ExchangeDesigns(ObjectMapper mapper) {
        this.exchange = new DesignExchange(mapper);
    }

    @Override
    public Outcome design(byte[] body) {
        return exchange.exchange(body);
    }

    @Override
    public Outcome design(JsonNode item) {
        return exchange.exchange(item);
    }
}
