/**
 * The robustness checks on the wire, shared by POST /v1/designs (its verify object) and POST /v1/verifications:
 * the verify request records and their validation, the response section and its mapping. The checks run in
 * solver.pipeline.RobustnessPipeline; this package only checks requests and formats reports.
 */
package com.loopwright.api.robustness;
