/**
 * POST /v1/designs/high-order: the order-n request, its validation, the endpoint and the response mapping. The
 * companion transform, target and design run in solver.pipeline; this package only checks requests and formats.
 */
package com.loopwright.api.highorder;
