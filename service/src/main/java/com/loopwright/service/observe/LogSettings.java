package com.loopwright.service.observe;

import ch.qos.logback.classic.LoggerContext;
import ch.qos.logback.classic.joran.JoranConfigurator;
import ch.qos.logback.core.joran.spi.JoranException;
import java.net.URL;
import java.util.Objects;

/**
 * Applies the validated log format and level to logback. logback.xml names its appender and root level by the
 * context properties {@link #FORMAT_PROPERTY} and {@link #LEVEL_PROPERTY} (defaults json and INFO), so the value
 * logback sees is the one the configuration accepted and normalised, never the raw environment text: an accepted
 * value always logs.
 */
public final class LogSettings {

    public static final String FORMAT_PROPERTY = "loopwright.logFormat";
    public static final String LEVEL_PROPERTY = "loopwright.logLevel";
    private static final String CONFIGURATION = "/logback.xml";

    private LogSettings() {}

    /**
     * Reconfigures {@code context} from the shipped logback.xml with the given settings.
     *
     * @param format "json" or "text" (already validated and lower case)
     * @param level  a logback level name (already validated and upper case)
     */
    public static void apply(LoggerContext context, String format, String level) {
        URL configuration = Objects.requireNonNull(
                LogSettings.class.getResource(CONFIGURATION), "logback.xml is on the class path");
        context.reset();
        context.putProperty(FORMAT_PROPERTY, format);
        context.putProperty(LEVEL_PROPERTY, level);
        JoranConfigurator configurator = new JoranConfigurator();
        configurator.setContext(context);
        try {
            configurator.doConfigure(configuration);
        } catch (JoranException e) {
            throw new IllegalStateException("the shipped logback.xml does not load", e);
        }
    }
}
