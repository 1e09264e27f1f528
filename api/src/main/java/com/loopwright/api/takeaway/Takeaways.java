package com.loopwright.api.takeaway;

import com.loopwright.api.endpoint.EndpointRunner;
import com.loopwright.api.endpoint.Reply;
import com.loopwright.api.plot.Figure;
import com.loopwright.api.problem.ProblemType;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import java.util.stream.Collectors;

/**
 * What people take away from a design: SVG figures and controller code, one endpoint per figure and per format,
 * chosen by the path segment. Each request carries the design request under "design" (pointers of its problems
 * are prefixed with /design). Stateless and thread-safe.
 */
public final class Takeaways {

    public static final String SVG = PlotEndpoint.SVG;
    public static final String STRUCTURED_TEXT = ControllerFormat.STRUCTURED_TEXT.mediaType();
    public static final String C_HEADER = ControllerFormat.C_HEADER.mediaType();
    public static final String C_SOURCE = ControllerFormat.C_SOURCE.mediaType();
    public static final String PLCOPEN_XML = ControllerFormat.PLCOPEN_XML.mediaType();
    public static final String JSON = Reply.JSON;

    /** Controller formats: the path segment of POST /v1/designs/controllers/{format}, one operation each. */
    public static final List<String> FORMATS = ControllerFormat.SLUGS;

    /** Figures: the path segment of POST /v1/designs/plots/{figure}, in declaration order. */
    public static final List<String> FIGURES =
            Arrays.stream(Figure.values()).map(Figure::slug).toList();

    private final EndpointRunner runner;
    private final Map<String, PlotEndpoint> plots;
    private final Map<String, ControllerEndpoint> controllers;

    public Takeaways(EndpointRunner runner) {
        this.runner = runner;
        this.plots =
                Arrays.stream(Figure.values()).collect(Collectors.toUnmodifiableMap(Figure::slug, PlotEndpoint::new));
        this.controllers = Arrays.stream(ControllerFormat.values())
                .collect(Collectors.toUnmodifiableMap(ControllerFormat::slug, ControllerEndpoint::new));
    }

    /** POST /v1/designs/plots/{figure}. */
    public Reply plot(String figureSlug, byte[] body) {
        PlotEndpoint endpoint = plots.get(figureSlug);
        if (endpoint == null) {
            return unknownName("figure", figureSlug, FIGURES);
        }
        return runner.run(endpoint, body);
    }

    /** POST /v1/designs/controllers/{format}. */
    public Reply controller(String format, byte[] body) {
        ControllerEndpoint endpoint = controllers.get(format);
        if (endpoint == null) {
            return unknownName("controller format", format, FORMATS);
        }
        return runner.run(endpoint, body);
    }

    /** 404 for a path segment that names nothing: the detail and {@code validNames} list the names it takes. */
    private static Reply unknownName(String kind, String name, List<String> names) {
        return Reply.failure(ProblemType.NOT_FOUND
                .problem("no " + kind + " '" + name + "'; valid names: " + String.join(", ", names))
                .withValidNames(names));
    }
}
