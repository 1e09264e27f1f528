package com.loopwright.service.compute;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.api.design.DesignEndpoint;
import com.loopwright.api.endpoint.EndpointRunner;
import com.loopwright.api.endpoint.Reply;

/** The production computation: {@link DesignEndpoint} run by the {@link EndpointRunner}, stateless and thread-safe. */
public final class ExchangeDesigns implements Designs {

    private final EndpointRunner runner;
    private final DesignEndpoint endpoint = new DesignEndpoint();

    /** Answering as the version the build stamped. */
    public ExchangeDesigns(ObjectMapper mapper) {
        this(new EndpointRunner(mapper));
    }

    /** Through the given runner (which states the service version). */
    public ExchangeDesigns(EndpointRunner runner) {
        this.runner = runner;
    }

    @Override
    public Reply design(byte[] body) {
        return runner.run(endpoint, body);
    }

    @Override
    public Reply design(JsonNode item) {
        return runner.run(endpoint, item);
    }

    @Override
    public Reply design(BatchItem item) {
        return runner.run(endpoint, item.body(), item.offset(), item.length());
    }
}
