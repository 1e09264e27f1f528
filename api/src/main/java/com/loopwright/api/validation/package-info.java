/**
 * What every endpoint's validation shares: the field-error failure and the spec wire record. A validator reports
 * every field error of a request at once, never only the first.
 */
package com.loopwright.api.validation;
