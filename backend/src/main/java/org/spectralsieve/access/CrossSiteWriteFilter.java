package org.spectralsieve.access;

import jakarta.servlet.FilterChain;
import jakarta.servlet.ServletException;
import jakarta.servlet.http.HttpServletRequest;
import jakarta.servlet.http.HttpServletResponse;
import java.io.IOException;
import java.net.URI;
import java.net.URISyntaxException;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.web.filter.OncePerRequestFilter;

/**
 * Refuses a state-changing request (anything but GET, HEAD, OPTIONS, TRACE) that a browser sent on
 * behalf of another site's page: 403 with a problem detail saying which header gave it away.
 *
 * <p>Browsers add {@code Origin} to every such request and {@code Sec-Fetch-Site} to every request;
 * page scripts cannot set or forge either (both are forbidden header names). So:
 * <ul>
 *   <li>{@code Sec-Fetch-Site} present and not {@code same-origin} or {@code none} (a user's own
 *       navigation) is refused; {@code same-site} is refused too, since another port on localhost is the
 *       same site but not this tool;</li>
 *   <li>{@code Origin} present and not this server's own origin (scheme, host and port of the request
 *       itself) is refused, including the opaque {@code null} of sandboxed frames and local files;</li>
 *   <li>neither present: not a browser (curl, scripts, the tests), which cannot carry a visitor's
 *       browser into the library, so it passes.</li>
 * </ul>
 * The request is refused before its body is read, so a foreign upload costs no parsing.
 */
public final class CrossSiteWriteFilter extends OncePerRequestFilter {

    private static final Logger log = LoggerFactory.getLogger(CrossSiteWriteFilter.class);
    static final String FETCH_SITE = "Sec-Fetch-Site";
    private static final Set<String> SAFE_METHODS = Set.of("GET", "HEAD", "OPTIONS", "TRACE");
    private static final Set<String> OWN_FETCH_SITES = Set.of("same-origin", "none");

    @Override
    protected void doFilterInternal(HttpServletRequest request, HttpServletResponse response, FilterChain chain)
            throws ServletException, IOException {
        Optional<String> refusal = SAFE_METHODS.contains(request.getMethod().toUpperCase(Locale.ROOT))
                ? Optional.empty() : refusal(request);
        if (refusal.isPresent()) {
            // a page the user visited tried to change the library: worth a trace in the log
            log.warn("Refused {} {}: {}", request.getMethod(), request.getRequestURI(), refusal.get());
            EdgeProblems.write(request, response, HttpServletResponse.SC_FORBIDDEN, "cross-site-write",
                    "Request from another site refused", refusal.get() + "; this tool accepts changes only from its"
                            + " own page or from clients that are not browsers (curl, scripts)",
                    Map.of("method", request.getMethod()));
            return;
        }
        chain.doFilter(request, response);
    }

    /** Why the request must be refused, or empty when it may change the library. */
    static Optional<String> refusal(HttpServletRequest request) {
        String site = request.getHeader(FETCH_SITE);
        if (site != null && !OWN_FETCH_SITES.contains(site.trim().toLowerCase(Locale.ROOT))) {
            return Optional.of("the browser marked this " + request.getMethod() + " as sent from another page ("
                    + FETCH_SITE + ": " + site + ")");
        }
        String origin = request.getHeader("Origin");
        if (origin != null && !isOwnOrigin(origin, request)) {
            return Optional.of("the " + request.getMethod() + " comes from the page of " + origin + ", not from "
                    + ownOrigin(request));
        }
        return Optional.empty();
    }

    private static boolean isOwnOrigin(String origin, HttpServletRequest request) {
        try {
            URI uri = new URI(origin.trim());
            if (uri.getScheme() == null || uri.getHost() == null) {
                return false; // "null" (sandboxed frame, file://) or garbage
            }
            String scheme = uri.getScheme().toLowerCase(Locale.ROOT);
            return scheme.equals(request.getScheme().toLowerCase(Locale.ROOT))
                    && sameHost(uri.getHost(), request.getServerName())
                    && port(scheme, uri.getPort()) == request.getServerPort();
        } catch (URISyntaxException e) {
            return false;
        }
    }

    private static boolean sameHost(String a, String b) {
        return strip(a).equalsIgnoreCase(strip(b));
    }

    /** IPv6 literals come with brackets from one side and without from the other. */
    private static String strip(String host) {
        return host.startsWith("[") && host.endsWith("]") ? host.substring(1, host.length() - 1) : host;
    }

    private static int port(String scheme, int port) {
        if (port >= 0) {
            return port;
        }
        return scheme.equals("https") ? 443 : 80;
    }

    private static String ownOrigin(HttpServletRequest request) {
        String host = request.getServerName();
        if (host.contains(":") && !host.startsWith("[")) {
            host = "[" + host + "]";
        }
        return request.getScheme() + "://" + host + ":" + request.getServerPort();
    }
}
