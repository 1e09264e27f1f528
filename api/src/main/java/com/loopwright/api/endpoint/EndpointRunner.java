package com.loopwright.api.endpoint;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.api.json.DecodeFailures;
import com.loopwright.api.json.FiniteNumbersModule;
import com.loopwright.api.json.NonFiniteNumberException;
import com.loopwright.api.validation.InvalidRequestException;
import com.loopwright.solver.pipeline.SolverFailure;
import com.loopwright.solver.plant.PlantParameterException;
import java.io.IOException;
import java.nio.charset.StandardCharsets;

/**
 * Runs an {@link Endpoint} from request bytes (or one parsed batch item) to a {@link Reply}, without HTTP:
 * decode strictly, validate, compute, respond, and write JSON through {@link FiniteNumbersModule}, the one
 * never-NaN guard, whose serializers refuse NaN and Infinity with the value's pointer. Every request or solver
 * failure becomes a problem through {@link FailureTable}; anything else (a defect, a cancellation) passes on.
 * Stateless and thread-safe.
 */
public final class EndpointRunner {

    private final ObjectMapper reader;
    private final ObjectMapper writer;

    /** @param strict the strict request mapper (StrictJson); responses are written by its finite-number copy */
    public EndpointRunner(ObjectMapper strict) {
        this.reader = strict;
        this.writer = FiniteNumbersModule.responseWriter(strict);
    }

    /** A raw request body. */
    public <Q, V, R> Reply run(Endpoint<Q, V, R> endpoint, byte[] body) {
        Q request;
        try {
            request = reader.readValue(body, endpoint.requestType());
        } catch (JsonProcessingException e) {
            return Reply.failure(DecodeFailures.toProblem(e));
        } catch (IOException e) {
            return Reply.failure(DecodeFailures.unreadable());
        }
        return run(endpoint, request);
    }

    /** An already parsed JSON value (one item of a batch). */
    public <Q, V, R> Reply run(Endpoint<Q, V, R> endpoint, JsonNode item) {
        Q request;
        try {
            request = reader.treeToValue(item, endpoint.requestType());
        } catch (JsonProcessingException e) {
            return Reply.failure(DecodeFailures.toProblem(e));
        }
        return run(endpoint, request);
    }

    /** A decoded request. */
    public <Q, V, R> Reply run(Endpoint<Q, V, R> endpoint, Q request) {
        V validated = null;
        Object response;
        try {
            validated = endpoint.validate(request);
            R result = endpoint.compute(validated);
            try {
                response = endpoint.respond(validated, result);
            } catch (IllegalArgumentException e) {
                return Reply.failure(endpoint.unwritable(e));
            }
        } catch (InvalidRequestException | PlantParameterException | SolverFailure e) {
            return Reply.failure(FailureTable.toProblem(e, endpoint.failureContext(validated)));
        }
        return write(endpoint, response);
    }

    private Reply write(Endpoint<?, ?, ?> endpoint, Object response) {
        if (response instanceof Text text) {
            return Reply.owning(text.mediaType(), text.content().getBytes(StandardCharsets.UTF_8));
        }
        try {
            return Reply.owning(Reply.JSON, writer.writeValueAsBytes(response));
        } catch (JsonProcessingException e) {
            NonFiniteNumberException nonFinite = NonFiniteNumberException.in(e);
            if (nonFinite == null) {
                throw new IllegalStateException("a response could not be written", e);
            }
            return Reply.failure(endpoint.nonFinite(nonFinite.pointer()));
        }
    }
}
