/**
 * The plant as sent on the wire: a sealed type with one record per description, chosen by {@code form}, and its
 * reduction to the canonical second-order plant the design works in. Each form's fields are declared once, as
 * its record's components; the field lists, the decoding and the "only that form's fields" check derive from them.
 */
package com.loopwright.api.plant;
