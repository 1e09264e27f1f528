/**
 * POST /v1/verifications: the request (plant, the caller's gains, checks), its validation and the endpoint. The
 * checks run in solver.pipeline; this package only checks requests and formats results.
 */
package com.loopwright.api.verification;
