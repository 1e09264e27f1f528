package com.loopwright.api.exchange;

import com.loopwright.api.problem.Problem;

/**
 * A plot or exported controller, or a problem.
 *
 * @param status    HTTP status
 * @param mediaType media type of the body
 * @param body      UTF-8 text (SVG, source code or JSON)
 * @param problem   the problem when status is not 200, else null
 */
public record Takeaway(int status, String mediaType, String body, Problem problem) {

    public boolean ok() {
        return problem == null;
    }
}
