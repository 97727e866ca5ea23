package org.spectralsieve.accounts;

import jakarta.servlet.http.HttpServletRequest;
import org.springframework.security.web.csrf.CsrfToken;
import org.springframework.security.web.csrf.CsrfTokenRequestAttributeHandler;

/**
 * Reads the CSRF token from the {@code X-XSRF-TOKEN} header only. Spring's default also looks for a form
 * parameter when the header is missing, which parses a multipart upload's whole body before the request is
 * refused; the page and the sign-in page always send the header, so a request without it is refused unread.
 * The token is compared as sent (no per-response masking): it never appears in a response body.
 */
final class HeaderCsrfToken extends CsrfTokenRequestAttributeHandler {

    HeaderCsrfToken() {
        setCsrfRequestAttributeName(null); // load the token on every request, so CsrfCookieFilter can set the cookie
    }

    @Override
    public String resolveCsrfTokenValue(HttpServletRequest request, CsrfToken csrfToken) {
        return request.getHeader(csrfToken.getHeaderName());
    }
}
