package com.loopwright.service.routes;

import io.javalin.http.Context;
import io.javalin.http.Handler;
import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.Base64;

/** GET /: the static dashboard page (one self-contained HTML file: inline style and script, no CDN). */
public final class DashboardRoute implements Handler {

    public static final String PATH = "/";
    public static final String RESOURCE = "/dashboard/index.html";

    private final byte[] page;
    private final String contentSecurityPolicy;

    public DashboardRoute() {
        try (InputStream in = DashboardRoute.class.getResourceAsStream(RESOURCE)) {
            if (in == null) {
                throw new IllegalStateException("the dashboard " + RESOURCE + " is missing from the build");
            }
            page = in.readAllBytes();
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        String html = new String(page, StandardCharsets.UTF_8);
        // Only the page's own inline script and style may run: each is allowed by its SHA-256 (CSP level 2).
        contentSecurityPolicy = "default-src 'none'; connect-src 'self'; img-src blob:; frame-ancestors 'none';"
                + " base-uri 'none'; form-action 'self'; script-src " + inlineHash(html, "script")
                + "; style-src " + inlineHash(html, "style");
    }

    /** 'sha256-...' of the text between the first &lt;tag&gt; and &lt;/tag&gt;. */
    static String inlineHash(String html, String tag) {
        int open = html.indexOf("<" + tag + ">");
        int close = html.indexOf("</" + tag + ">", open);
        if (open < 0 || close < 0) {
            throw new IllegalStateException("the dashboard has no inline " + tag);
        }
        String content = html.substring(open + tag.length() + 2, close);
        try {
            byte[] digest = MessageDigest.getInstance("SHA-256").digest(content.getBytes(StandardCharsets.UTF_8));
            return "'sha256-" + Base64.getEncoder().encodeToString(digest) + "'";
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("SHA-256 is required of every Java runtime", e);
        }
    }

    @Override
    public void handle(Context ctx) {
        ctx.contentType("text/html; charset=utf-8")
                .header("Content-Security-Policy", contentSecurityPolicy)
                .result(page);
    }
}
