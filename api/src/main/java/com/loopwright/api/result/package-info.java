/**
 * The wire records a design result shares across plant orders: the order-2 response (POST /v1/designs) and the
 * order-n response (POST /v1/designs/high-order) use these same types, so the same quantity has the same name and
 * shape in both. Members that only one order can fill are nullable and omitted from JSON when absent.
 */
package com.loopwright.api.result;
