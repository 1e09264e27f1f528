package com.loopwright.service.http;

import java.util.Locale;

/** Media-type checks for JSON request bodies. */
public final class JsonBodies {

    public static final String JSON = "application/json";

    private JsonBodies() {}

    /** True for application/json with or without parameters such as charset=utf-8. */
    public static boolean isJson(String contentType) {
        if (contentType == null) {
            return false;
        }
        int semicolon = contentType.indexOf(';');
        String mediaType = (semicolon < 0 ? contentType : contentType.substring(0, semicolon)).trim();
        return mediaType.toLowerCase(Locale.ROOT).equals(JSON);
    }
}
