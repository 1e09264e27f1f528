package com.loopwright.service.routes;

import io.javalin.http.Context;
import io.javalin.http.Handler;
import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;

/** GET /openapi.yaml: the repository's contract file, bundled into the jar and served byte for byte. */
public final class ContractRoute implements Handler {

    public static final String PATH = "/openapi.yaml";
    public static final String RESOURCE = "/contract/openapi.yaml";
    public static final String MEDIA_TYPE = "application/yaml";

    private final byte[] contract;

    public ContractRoute() {
        try (InputStream in = ContractRoute.class.getResourceAsStream(RESOURCE)) {
            if (in == null) {
                throw new IllegalStateException("the contract " + RESOURCE + " is missing from the build");
            }
            contract = in.readAllBytes();
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    @Override
    public void handle(Context ctx) {
        ctx.contentType(MEDIA_TYPE).result(contract);
    }
}
