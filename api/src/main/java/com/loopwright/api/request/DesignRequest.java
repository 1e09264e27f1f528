package com.loopwright.api.request;

/** Body of POST /v1/designs. */
public record DesignRequest(PlantInput plant, SpecInput spec) {
}
