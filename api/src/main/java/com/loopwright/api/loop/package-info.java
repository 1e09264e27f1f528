/**
 * The loop as it runs on the machine, shared by POST /v1/designs and POST /v1/designs/high-order: integral action on
 * the tracking error and position-only sensing with an observer (request fields, their one validator, and the
 * response sections law, observer, outputFeedback and loadStep).
 */
package com.loopwright.api.loop;
