package com.loopwright.api.endpoint;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.util.Properties;

/**
 * The service version as the build stamped it: the Maven project version, filtered into
 * {@code com/loopwright/api/endpoint/build.properties} at build time (the one source; no version is typed in code).
 */
public final class ServiceVersion {

    private static final String RESOURCE = "build.properties";

    private ServiceVersion() {}

    /** The project version of this build, e.g. 0.1.0-SNAPSHOT. */
    public static String fromBuild() {
        Properties properties = new Properties();
        try (InputStream in = ServiceVersion.class.getResourceAsStream(RESOURCE)) {
            if (in == null) {
                throw new IllegalStateException("the build did not package " + RESOURCE);
            }
            properties.load(in);
        } catch (IOException e) {
            throw new UncheckedIOException("cannot read " + RESOURCE, e);
        }
        String version = properties.getProperty("version", "").trim();
        if (version.isEmpty() || version.contains("${")) {
            throw new IllegalStateException("the build did not stamp the version into " + RESOURCE);
        }
        return version;
    }
}
