package com.loopwright.api.endpoint;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.api.json.CollectingDecoder;
import com.loopwright.api.json.DecodeFailures;
import com.loopwright.api.json.FiniteNumbersModule;
import com.loopwright.api.json.NonFiniteNumberException;
import com.loopwright.api.problem.FieldError;
import com.loopwright.api.validation.InvalidRequestException;
import com.loopwright.solver.pipeline.SolverFailure;
import com.loopwright.solver.plant.PlantParameterException;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;

/**
 * Runs an {@link Endpoint} from request bytes (or one parsed batch item) to a {@link Reply}, without HTTP:
 * decode strictly (a body that does not decode is answered with every field error at once: the decoding errors
 * {@link CollectingDecoder} collects and the validation errors of the rest), validate, compute, respond, and write JSON through {@link FiniteNumbersModule}, the one
 * never-NaN guard, whose serializers refuse NaN and Infinity with the value's pointer. Every request or solver
 * failure becomes a problem through {@link FailureTable}; anything else (a defect, a cancellation) passes on.
 * Stateless and thread-safe.
 */
public final class EndpointRunner {

    private final ObjectMapper reader;
    private final ObjectMapper writer;
    private final RequestDigest digests;
    private final CollectingDecoder decoder;
    private final String serviceVersion;

    /** With the version this build was stamped with ({@link ServiceVersion#fromBuild}). */
    public EndpointRunner(ObjectMapper strict) {
        this(strict, ServiceVersion.fromBuild());
    }

    /**
     * @param strict         the strict request mapper (StrictJson); responses are written by its finite-number copy
     * @param serviceVersion the version every answer states ({@link Trace})
     */
    public EndpointRunner(ObjectMapper strict, String serviceVersion) {
        this.reader = strict;
        this.writer = FiniteNumbersModule.responseWriter(strict);
        this.digests = new RequestDigest(strict);
        this.decoder = new CollectingDecoder(strict);
        this.serviceVersion = java.util.Objects.requireNonNull(serviceVersion, "serviceVersion");
    }

    /** The version every answer states. */
    public String serviceVersion() {
        return serviceVersion;
    }

    /** A raw request body. */
    public <Q, V, R> Reply run(Endpoint<Q, V, R> endpoint, byte[] body) {
        Q request;
        try {
            request = reader.readValue(body, endpoint.requestType());
        } catch (JsonProcessingException e) {
            return undecoded(endpoint, decoder.afterFailure(body, endpoint.requestType(), e));
        } catch (IOException e) {
            return Reply.failure(DecodeFailures.unreadable());
        }
        return run(endpoint, request);
    }

    /**
     * One JSON object at {@code body[offset, offset + length)} (an item of a batch that the envelope reader has
     * already checked as JSON), decoded straight from its bytes. An item that does not decode so is decoded again
     * through its tree ({@link #run(Endpoint, JsonNode)}), so that its problem is the one the tree route gives.
     */
    public <Q, V, R> Reply run(Endpoint<Q, V, R> endpoint, byte[] body, int offset, int length) {
        Q request;
        try {
            request = reader.readValue(body, offset, length, endpoint.requestType());
        } catch (IOException e) {
            JsonNode item;
            try {
                item = reader.readTree(body, offset, length);
            } catch (JsonProcessingException syntax) {
                return Reply.failure(DecodeFailures.toProblem(syntax));
            } catch (IOException unreadable) {
                return Reply.failure(DecodeFailures.unreadable());
            }
            return run(endpoint, item);
        }
        return run(endpoint, request);
    }

    /** An already parsed JSON value (one item of a batch). */
    public <Q, V, R> Reply run(Endpoint<Q, V, R> endpoint, JsonNode item) {
        Q request;
        try {
            request = reader.treeToValue(item, endpoint.requestType());
        } catch (JsonProcessingException e) {
            return undecoded(endpoint, decoder.afterFailure(item, endpoint.requestType(), e));
        }
        return run(endpoint, request);
    }

    /**
     * A body that did not decode strictly: one 400 malformed-request problem with every decoding error and, when
     * the rest decoded, every validation error of the rest (a 422 field error included: a body that is not the
     * JSON the endpoint takes is malformed first, so 400 wins). Nothing is computed.
     */
    private <Q, V, R> Reply undecoded(Endpoint<Q, V, R> endpoint, CollectingDecoder.Outcome<Q> decoded) {
        List<FieldError> errors = new ArrayList<>(decoded.errors());
        if (decoded.request() != null) {
            for (FieldError error : validationErrors(endpoint, decoded.request())) {
                if (!decoded.repeats(error)) {
                    errors.add(error);
                }
            }
        }
        return Reply.failure(DecodeFailures.malformed(errors));
    }

    /** Every field error validation finds in a decoded request, the deferred ones included. */
    private static <Q, V, R> List<FieldError> validationErrors(Endpoint<Q, V, R> endpoint, Q request) {
        try {
            return endpoint.deferredErrors(endpoint.validate(request));
        } catch (InvalidRequestException | PlantParameterException | SolverFailure e) {
            return FailureTable.toProblem(e, endpoint.failureContext(null)).errors();
        }
    }

    /**
     * A decoded request: the reply states its digest, and a JSON body carries the {@link Trace} (without a digest
     * when the decoded value has no canonical form; {@link RequestDigest#of}).
     */
    public <Q, V, R> Reply run(Endpoint<Q, V, R> endpoint, Q request) {
        String digest = digests.of(request);
        if (digest == null) {
            // No canonical form (validation refuses such a request): answered without a digest.
            return answer(endpoint, request, null);
        }
        return answer(endpoint, request, new Trace(serviceVersion, digest)).traced(digest);
    }

    private <Q, V, R> Reply answer(Endpoint<Q, V, R> endpoint, Q request, Trace trace) {
        V validated = null;
        Object response;
        try {
            validated = endpoint.validate(request);
            R result = endpoint.compute(validated);
            try {
                response = endpoint.respond(validated, result, trace);
            } catch (IllegalArgumentException e) {
                return Reply.failure(endpoint.unwritable(e));
            }
        } catch (InvalidRequestException | PlantParameterException | SolverFailure e) {
            return Reply.failure(FailureTable.toProblem(e, endpoint.failureContext(validated)));
        }
        return write(endpoint, response, trace);
    }

    private Reply write(Endpoint<?, ?, ?> endpoint, Object response, Trace trace) {
        if (response instanceof Attachment attachment) {
            Reply written = write(endpoint, attachment.body(), trace);
            return written.ok() ? written.attached(attachment.fileName()) : written;
        }
        if (response instanceof Text text) {
            return Reply.owning(text.mediaType(), text.content().getBytes(StandardCharsets.UTF_8));
        }
        try {
            return Reply.owning(
                    Reply.JSON, writer.writeValueAsBytes(trace == null ? response : new Traced(response, trace)));
        } catch (JsonProcessingException e) {
            NonFiniteNumberException nonFinite = NonFiniteNumberException.in(e);
            if (nonFinite == null) {
                throw new IllegalStateException("a response could not be written", e);
            }
            return Reply.failure(endpoint.nonFinite(nonFinite.pointer()));
        }
    }
}
