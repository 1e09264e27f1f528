/**
 * A copyable client on the bare JDK: it posts a design request and reads the response and problems.
 */
package com.loopwright.examples;
