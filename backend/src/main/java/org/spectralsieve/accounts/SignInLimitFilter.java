package org.spectralsieve.accounts;

import jakarta.servlet.FilterChain;
import jakarta.servlet.ServletException;
import jakarta.servlet.http.HttpServletRequest;
import jakarta.servlet.http.HttpServletResponse;
import java.io.IOException;
import java.time.Duration;
import java.util.Map;
import java.util.Optional;
import org.spectralsieve.access.EdgeProblems;
import org.springframework.web.filter.OncePerRequestFilter;

/**
 * Stands before the sign-in: while the name, or the client's address, has used up its wrong passwords for the
 * window, the attempt is answered 429 with {@code Retry-After}, and the password is not checked at all (so a
 * right guess during the lock teaches nothing). The failures are counted by {@link SignInResponses}.
 */
final class SignInLimitFilter extends OncePerRequestFilter {

    private final SignInLimits limits;

    SignInLimitFilter(SignInLimits limits) {
        this.limits = limits;
    }

    @Override
    protected boolean shouldNotFilter(HttpServletRequest request) {
        return !("POST".equals(request.getMethod()) && ApiRefusals.path(request).equals(SignInLimits.SIGN_IN));
    }

    @Override
    protected void doFilterInternal(HttpServletRequest request, HttpServletResponse response, FilterChain chain)
            throws ServletException, IOException {
        Optional<Duration> lock = limits.lockedFor(SignInLimits.name(request), request.getRemoteAddr());
        if (lock.isPresent()) {
            long seconds = Math.max(1, (lock.get().toMillis() + 999) / 1000);
            response.setHeader("Retry-After", Long.toString(seconds));
            EdgeProblems.write(request, response, 429, "sign-in-paused", "Too many wrong passwords",
                    "too many wrong passwords for this name or from this address; sign-in is paused for "
                            + seconds + " s", Map.of("retryAfterSeconds", seconds));
            return;
        }
        chain.doFilter(request, response);
    }
}
