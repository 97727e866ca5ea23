package org.spectralsieve.access;

import jakarta.servlet.FilterChain;
import jakarta.servlet.ServletException;
import jakarta.servlet.http.HttpServletRequest;
import jakarta.servlet.http.HttpServletResponse;
import java.io.IOException;
import java.util.Locale;
import java.util.Map;
import java.util.regex.Pattern;
import org.springframework.web.filter.OncePerRequestFilter;

/**
 * While the tool listens on the loopback interface only, it answers only requests addressed to a
 * loopback name ({@code localhost}, {@code *.localhost}, {@code 127.x.x.x}, {@code [::1]}); any other
 * {@code Host} gets 403 with a problem detail.
 *
 * <p>Why: a page on another site can point its own domain name at 127.0.0.1 after loading (DNS
 * rebinding). The browser then treats the tool as that site's own origin, so the Origin check lets its
 * writes through and its reads are no longer protected by the same-origin policy. The Host header still
 * carries the foreign name, and that is what this filter refuses. Names are compared as written and never
 * looked up, since a lookup is exactly what the attacker controls. Not installed when the tool is opened
 * to the network ({@code SIEVE_ADDRESS}), since its names there are not known.
 */
public final class LoopbackHostFilter extends OncePerRequestFilter {

    private static final Pattern IPV4_LOOPBACK = Pattern.compile("127(\\.(25[0-5]|2[0-4]\\d|1?\\d?\\d)){3}");

    @Override
    protected void doFilterInternal(HttpServletRequest request, HttpServletResponse response, FilterChain chain)
            throws ServletException, IOException {
        String host = request.getServerName();
        if (!isLoopbackName(host)) {
            EdgeProblems.write(request, response, HttpServletResponse.SC_FORBIDDEN, "foreign-host", "Unknown host name",
                    "this tool listens on the loopback interface only and answers to localhost, 127.0.0.1 or [::1],"
                            + " not to '" + host + "' (a page of another site may have pointed that name here)",
                    Map.of("host", host));
            return;
        }
        chain.doFilter(request, response);
    }

    static boolean isLoopbackName(String host) {
        if (host == null || host.isEmpty()) {
            return false;
        }
        String h = host.toLowerCase(Locale.ROOT);
        if (h.endsWith(".")) {
            h = h.substring(0, h.length() - 1); // "localhost." is the same name, fully qualified
        }
        return h.equals("localhost") || h.endsWith(".localhost") // RFC 6761: always the loopback
                || IPV4_LOOPBACK.matcher(h).matches()
                || h.equals("[::1]") || h.equals("::1") || h.equals("[0:0:0:0:0:0:0:1]") || h.equals("0:0:0:0:0:0:0:1");
    }
}
