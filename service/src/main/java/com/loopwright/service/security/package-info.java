/**
 * Security: API keys (held as SHA-256 digests, compared in constant time) and the one key rule both layers apply,
 * the CORS allowlist and the security headers of every response.
 *
 * <p>Invariant: when keys are configured, no request on a keyed path is served or has its body admitted without an
 * accepted key, and no key is ever logged or echoed.
 */
package com.loopwright.service.security;
