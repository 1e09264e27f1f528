/**
 * POST /v1/models/fit: the step-test request, its validation, the endpoint and the response mapping. The fit itself
 * runs in solver.pipeline; this package only checks requests and formats results.
 */
package com.loopwright.api.fit;
