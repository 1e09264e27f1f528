package com.loopwright.api.problem;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.net.URI;
import java.util.HashSet;
import java.util.Set;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;

/** Every problem type is a tag URI (RFC 4151) under one tagging entity, and no two types share one. */
class ProblemTypeTest {

    /**
     * RFC 4151 section 2.1: tagURI = "tag:" taggingEntity ":" specific; taggingEntity = authorityName "," date
     * (a DNS name, and a date YYYY, YYYY-MM or YYYY-MM-DD); our specific part is "problem/" and a kebab-case name.
     */
    private static final Pattern TAG_URI = Pattern.compile(
            "tag:[a-z0-9]([a-z0-9-]*[a-z0-9])?(\\.[a-z0-9]([a-z0-9-]*[a-z0-9])?)+,\\d{4}(-\\d{2}(-\\d{2})?)?:"
                    + "problem/[a-z]+(-[a-z]+)*");

    @Test
    void everyTypeIsATagUriUnderOneTaggingEntity() {
        Set<String> seen = new HashSet<>();
        for (ProblemType type : ProblemType.values()) {
            String uri = type.uri();
            assertTrue(TAG_URI.matcher(uri).matches(), uri);
            assertTrue(uri.startsWith(ProblemType.URI_PREFIX), uri);
            // An absolute URI by java.net.URI's RFC 2396 grammar too: scheme "tag", opaque part.
            URI parsed = URI.create(uri);
            assertEquals("tag", parsed.getScheme(), uri);
            assertTrue(parsed.isOpaque(), uri);
            assertTrue(seen.add(uri), "two types share " + uri);
        }
    }

    @Test
    void theNameAfterTheSlashIsTheFormerUrnName() {
        // Only the prefix moved since 0.1 (docs/migration-v1.md): the name after it is the same.
        assertEquals("tag:loopwright.dev,2026:problem/infeasible-spec", ProblemType.INFEASIBLE_SPEC.uri());
        assertEquals("tag:loopwright.dev,2026:problem/malformed-http", ProblemType.MALFORMED_HTTP.uri());
        assertEquals(
                ProblemType.INFEASIBLE_SPEC.uri(),
                ProblemType.INFEASIBLE_SPEC.problem(null).type());
    }
}
