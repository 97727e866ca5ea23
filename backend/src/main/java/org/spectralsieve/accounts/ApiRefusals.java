package org.spectralsieve.accounts;

import jakarta.servlet.http.HttpServletRequest;
import jakarta.servlet.http.HttpServletResponse;
import java.io.IOException;
import java.util.Map;
import org.spectralsieve.access.EdgeProblems;
import org.springframework.security.access.AccessDeniedException;
import org.springframework.security.core.AuthenticationException;
import org.springframework.security.web.AuthenticationEntryPoint;
import org.springframework.security.web.access.AccessDeniedHandler;
import org.springframework.security.web.authentication.LoginUrlAuthenticationEntryPoint;
import org.springframework.security.web.csrf.CsrfException;

/**
 * How server mode refuses: an API request gets an RFC 9457 problem (401 when nobody is signed in, 403 naming
 * the role it needs), never a redirect; the page's own addresses are sent to the sign-in page.
 */
final class ApiRefusals implements AuthenticationEntryPoint, AccessDeniedHandler {

    static final String SIGN_IN_PAGE = "/sign-in.html";

    private final boolean tokenChain;
    private final LoginUrlAuthenticationEntryPoint toSignIn = new LoginUrlAuthenticationEntryPoint(SIGN_IN_PAGE);

    ApiRefusals(boolean tokenChain) {
        this.tokenChain = tokenChain;
    }

    static String path(HttpServletRequest request) {
        return request.getRequestURI().substring(request.getContextPath().length());
    }

    static boolean isApi(HttpServletRequest request) {
        String path = path(request);
        return path.equals("/api") || path.startsWith("/api/");
    }

    @Override
    public void commence(HttpServletRequest request, HttpServletResponse response, AuthenticationException e)
            throws IOException, jakarta.servlet.ServletException {
        if (!tokenChain && !isApi(request)) {
            toSignIn.commence(request, response, e);
            return;
        }
        unauthorized(request, response, tokenChain
                ? "the bearer token is not known, was revoked, or its account is disabled"
                : "sign in first (the page's sign-in, or an API token sent as 'Authorization: Bearer …')");
    }

    static void unauthorized(HttpServletRequest request, HttpServletResponse response, String detail) throws IOException {
        response.setHeader("WWW-Authenticate", "Bearer");
        EdgeProblems.write(request, response, HttpServletResponse.SC_UNAUTHORIZED, "sign-in-needed",
                "Not signed in", detail, Map.of());
    }

    @Override
    public void handle(HttpServletRequest request, HttpServletResponse response, AccessDeniedException e)
            throws IOException {
        if (e instanceof CsrfException && !signedIn() && isApi(request)) {
            // nobody signed in: that, not the missing token, is what the caller must fix first
            unauthorized(request, response, "sign in first (the page's sign-in, or an API token sent as"
                    + " 'Authorization: Bearer …')");
            return;
        }
        if (e instanceof CsrfException) {
            EdgeProblems.write(request, response, HttpServletResponse.SC_FORBIDDEN, "csrf-token-missing",
                    "Request without the page's token", "a change sent with the page's session must carry the"
                            + " token of the XSRF-TOKEN cookie in the X-XSRF-TOKEN header; reload the page and"
                            + " try again", Map.of());
            return;
        }
        Role needed = EndpointRoles.required(request.getMethod(), path(request));
        EdgeProblems.write(request, response, HttpServletResponse.SC_FORBIDDEN, "role-needed",
                "Not allowed for your role", request.getMethod() + " " + path(request) + " needs the role '"
                        + needed.label() + "'" + ownRole(), Map.of("requiredRole", needed.label()));
    }

    private static boolean signedIn() {
        var auth = org.springframework.security.core.context.SecurityContextHolder.getContext().getAuthentication();
        return auth != null && auth.isAuthenticated()
                && !(auth instanceof org.springframework.security.authentication.AnonymousAuthenticationToken);
    }

    private static String ownRole() {
        var auth = org.springframework.security.core.context.SecurityContextHolder.getContext().getAuthentication();
        return auth instanceof SignedIn s ? "; '" + s.getName() + "' is " + s.account().role().label() : "";
    }
}
