/**
 * POST /v1/designs and its batch items: the request, its validation, the endpoint and the response mapping of the
 * two-state design. The numbers come from solver.pipeline; this package only checks requests and formats results.
 */
package com.loopwright.api.design;
