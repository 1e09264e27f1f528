/**
 * Where design computations run: the bounded worker pool with its queue, deadline and batch share, the lanes in
 * which a batch's items wait for the workers the batch holds, and the design computation the routes call.
 *
 * <p>Invariant: no computation runs on a request thread, a full queue is refused at once (503) and a computation
 * past its deadline is answered 504 and cancelled, so the work in progress is bounded by workers plus queue.
 */
package com.loopwright.service.compute;
