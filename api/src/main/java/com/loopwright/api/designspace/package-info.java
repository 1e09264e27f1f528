/**
 * POST /v1/design-spaces and /v1/design-spaces/figure: what one plant can do over a grid of time spec and
 * overshoot. The request, its validation, the endpoints and the response mapping; the numbers come from
 * solver.pipeline.DesignSpacePipeline.
 */
package com.loopwright.api.designspace;
