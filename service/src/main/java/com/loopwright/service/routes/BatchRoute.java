package com.loopwright.service.routes;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.api.design.ComputeBudget;
import com.loopwright.api.endpoint.Reply;
import com.loopwright.api.endpoint.RequestDigest;
import com.loopwright.api.endpoint.Trace;
import com.loopwright.api.json.DecodeFailures;
import com.loopwright.api.problem.Problem;
import com.loopwright.api.problem.ProblemType;
import com.loopwright.service.compute.BatchItem;
import com.loopwright.service.compute.BatchLane;
import com.loopwright.service.compute.ComputePool;
import com.loopwright.service.compute.Designs;
import com.loopwright.service.http.JsonBodies;
import com.loopwright.service.http.ProblemResponses;
import com.loopwright.service.http.StreamCuts;
import com.loopwright.service.observe.Metrics;
import com.loopwright.service.observe.RequestIds;
import io.javalin.http.Context;
import io.javalin.http.Handler;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.util.ArrayDeque;
import java.util.Deque;
import java.util.function.Supplier;

/**
 * POST /v1/designs/batch: {"items": [DesignRequest, ...]} in, NDJSON out, one line per item in request order:
 * {"index":i,"status":200,"design":{...}} or {"index":i,"status":4xx/5xx,"problem":{...}}. One bad item never
 * fails the batch; only a malformed envelope is a 400 problem, and a batch whose estimated work exceeds the cap of
 * {@link ComputeBudget} is a 422 problem naming the fields that drive the cost. One compute deadline covers the whole
 * batch: items not finished by then are 504 lines and their computations are cancelled. Items are computed on the
 * bounded pool, on the {@link ComputePool#batchShare()} workers all batches share (so that single requests keep
 * the other workers) and, for an item estimated at most {@link #BORROW_MAX_WORK_UNITS}, on any worker that is idle
 * while no request waits; a worker the batch holds takes the batch's next item from its {@link BatchLane} while no
 * request waits (no hand-off between items). Lines are written in order;
 * when the next line is not ready within {@value #FLUSH_DELAY_MILLIS} ms the stream is flushed, so no finished line
 * waits longer than that for a later design (and a batch of fast designs goes out in full buffers, not one write per
 * line). The envelope is read as a stream ({@link BatchEnvelope}); each item becomes a tree once, one at a time,
 * for the cost estimate and the envelope digest together, and is designed from its bytes. When a
 * shutdown's grace period is about to end, the stream ends with a {@link BatchCut} line naming the first item
 * without a line.
 */
public final class BatchRoute implements Handler {

    public static final String PATH = "/v1/designs/batch";
    public static final String MEDIA_TYPE = "application/x-ndjson";
    /**
     * Items of one batch in flight (computing, or waiting in its lane for a worker the batch holds), so that a
     * worker finishing an item finds the next one without waiting for the stream's writer. Bounds the memory of a
     * batch to this many responses in flight besides the request body.
     */
    public static final int MAX_ITEMS_IN_FLIGHT = 16;
    /**
     * The largest estimate of an item that may borrow a worker beyond the batch share [work units, about 0.1 ms of
     * CPU each]: a design with a plain verify object. A single request arriving while every worker is busy waits
     * at most for one such item.
     */
    public static final long BORROW_MAX_WORK_UNITS = ComputeBudget.DESIGN_UNITS + ComputeBudget.VERIFY_UNITS;

    /** Longest a finished line waits in the buffer for the next design before the stream is flushed [ms]. */
    public static final int FLUSH_DELAY_MILLIS = 2;

    private static final long FLUSH_DELAY_NANOS = FLUSH_DELAY_MILLIS * 1_000_000L;
    private static final byte NEWLINE = '\n';
    private static final byte[] CLOSE_LINE = {'}', '\n'};

    private final ObjectMapper mapper;
    private final ProblemResponses problems;
    private final Designs designs;
    private final ComputePool pool;
    private final Metrics metrics;
    private final int maxItems;
    private final ComputeBudget budget = new ComputeBudget();
    private final StreamCuts cuts;
    private final RequestDigest digests;

    public BatchRoute(
            ObjectMapper mapper,
            ProblemResponses problems,
            Designs designs,
            ComputePool pool,
            Metrics metrics,
            int maxItems,
            StreamCuts cuts) {
        this.mapper = mapper;
        this.problems = problems;
        this.designs = designs;
        this.pool = pool;
        this.metrics = metrics;
        this.maxItems = maxItems;
        this.cuts = cuts;
        this.digests = new RequestDigest(mapper);
    }

    @Override
    public void handle(Context ctx) throws IOException {
        long deadlineNanos = pool.deadlineFromNow();
        String requestId = ProblemResponses.requestId(ctx);
        if (!JsonBodies.isJson(ctx.contentType())) {
            problems.write(
                    ctx,
                    ProblemType.UNSUPPORTED_MEDIA_TYPE.problem("send the batch with Content-Type: application/json"));
            return;
        }
        BatchEnvelope items;
        try {
            items = BatchEnvelope.read(mapper, ctx.bodyAsBytes(), maxItems);
        } catch (JsonProcessingException e) {
            problems.write(ctx, DecodeFailures.toProblem(e));
            return;
        } catch (BatchEnvelope.Invalid e) {
            problems.write(ctx, e.problem());
            return;
        } catch (IOException e) {
            problems.write(ctx, DecodeFailures.unreadable());
            return;
        }
        // One pass builds each item's tree once, for the cost estimate and for the envelope's digest together.
        int count = items.size();
        long[] itemUnits = new long[count];
        RequestDigest.Envelope envelope = digests.envelope();
        Problem overBudget = budget.refuseBatch(count, index -> envelope.add(items.item(index)), itemUnits);
        if (overBudget != null) {
            problems.write(ctx, overBudget);
            return;
        }
        if (pool.saturated()) {
            // Refuse before the 200 is committed rather than streaming a batch of 503 lines.
            ctx.header("Retry-After", String.valueOf(ComputePool.RETRY_AFTER_SECONDS));
            problems.write(
                    ctx,
                    ProblemType.SERVICE_OVERLOADED.problem(
                            "every design worker is busy; retry after " + ComputePool.RETRY_AFTER_SECONDS + " s"));
            return;
        }
        // The envelope's digest (each item's own digest is in its line's design trace).
        ctx.header(Trace.DIGEST_HEADER, envelope.digest());
        ctx.status(200).contentType(MEDIA_TYPE);
        // The servlet stream itself: each flush sends a chunk (the framework stream would buffer the batch).
        OutputStream out = ctx.res().getOutputStream();
        int window = MAX_ITEMS_IN_FLIGHT;
        Deque<ComputePool.Pending<Reply>> inFlight = new ArrayDeque<>(window);
        BatchLane<Reply> lane = pool.batchLane(Reply::failure, deadlineNanos);
        int next = 0;
        StreamCuts.Stream stream = cuts.open();
        try {
            for (int index = 0; index < count; index++) {
                // Keep up to `window` items of this batch in its lane; the workers the batch holds (slots of the
                // batch share, and for short items idle workers borrowed while no request waits) compute them
                // one after another without waiting for this thread (BatchLane).
                while (next < count && inFlight.size() < window) {
                    inFlight.addLast(lane.add(computation(items, next), itemUnits[next] <= BORROW_MAX_WORK_UNITS));
                    next++;
                }
                ComputePool.Pending<Reply> oldest = inFlight.removeFirst();
                stream.waitingFor(oldest::cancel); // a shutdown cut cancels it, so the wait ends in time
                lane.serve(0);
                if (!lane.awaitDone(oldest, FLUSH_DELAY_NANOS)) {
                    out.flush(); // never wait longer than the flush delay with finished lines unsent
                    // Until it is done or the deadline: the lane wakes this thread when the item ends, and asks for
                    // a worker again when the batch's last one was given back for a queued request.
                    lane.awaitDone(oldest, deadlineNanos - System.nanoTime());
                }
                Reply outcome = oldest.await();
                if (stream.isCut()) {
                    writeCut(out, index, requestId);
                    break;
                }
                metrics.design(PATH, outcome);
                writeLine(out, index, outcome, requestId);
            }
            out.flush();
        } finally {
            // A client that went away mid-batch (or a cut stream): give up the items still queued for it.
            inFlight.forEach(ComputePool.Pending::cancel);
            stream.close();
        }
    }

    /** Item {@code index}'s design: an object straight from its bytes, anything else through its tree. */
    private Supplier<Reply> computation(BatchEnvelope items, int index) {
        BatchItem object = items.object(index);
        if (object != null) {
            return () -> designs.design(object);
        }
        JsonNode other = items.item(index);
        return () -> designs.design(other);
    }

    /** The final line of a stream cut by a shutdown: items from {@code index} on have no line (BatchCut). */
    private void writeCut(OutputStream out, int index, String requestId) throws IOException {
        out.write(mapper.writeValueAsBytes(new BatchCut(
                index,
                503,
                ProblemType.NOT_READY
                        .problem("the service is "
                                + "shutting down and its grace period is ending: the stream was cut before item "
                                + index
                                + "; send items " + index + " and later again")
                        .withInstance(RequestIds.itemInstance(requestId, index)))));
        out.write(NEWLINE);
        out.flush();
    }

    /** One BatchLine: {"index":i,"status":200,"design":{...}} or {"index":i,"status":s,"problem":{...}}. */
    private void writeLine(OutputStream out, int index, Reply outcome, String requestId) throws IOException {
        if (outcome.ok()) {
            out.write(("{\"index\":" + index + ",\"status\":200,\"design\":").getBytes(StandardCharsets.US_ASCII));
            outcome.writeTo(out);
            out.write(CLOSE_LINE);
        } else {
            out.write(mapper.writeValueAsBytes(new BatchLine(
                    index,
                    outcome.status(),
                    null,
                    outcome.problem().withInstance(RequestIds.itemInstance(requestId, index)))));
            out.write(NEWLINE);
        }
    }
}
