package org.spectralsieve.accounts;

import jakarta.servlet.FilterChain;
import jakarta.servlet.ServletException;
import jakarta.servlet.http.HttpServletRequest;
import jakarta.servlet.http.HttpServletResponse;
import java.io.IOException;
import java.util.Optional;
import org.springframework.security.core.context.SecurityContext;
import org.springframework.security.core.context.SecurityContextHolder;
import org.springframework.web.filter.OncePerRequestFilter;

/**
 * A script's request with {@code Authorization: Bearer <token>}: the token's SHA-256 is looked up, and the
 * request runs as its owner with the owner's current role; a revoked token, or one whose account is disabled,
 * is refused with 401. Nothing is kept between requests (no session).
 */
final class BearerTokenFilter extends OncePerRequestFilter {

    static final String PREFIX = "Bearer ";

    private final AccountStore store;

    BearerTokenFilter(AccountStore store) {
        this.store = store;
    }

    static boolean carriesBearer(HttpServletRequest request) {
        String header = request.getHeader("Authorization");
        return header != null && header.regionMatches(true, 0, PREFIX, 0, PREFIX.length());
    }

    @Override
    protected void doFilterInternal(HttpServletRequest request, HttpServletResponse response, FilterChain chain)
            throws ServletException, IOException {
        String secret = request.getHeader("Authorization").substring(PREFIX.length()).strip();
        Optional<AccountStore.TokenOwner> owner = secret.length() > 200 ? Optional.empty()
                : store.liveTokenOwner(TokenSecrets.hash(secret));
        if (owner.isEmpty()) {
            ApiRefusals.unauthorized(request, response,
                    "the bearer token is not known, was revoked, or its account is disabled");
            return;
        }
        SecurityContext context = SecurityContextHolder.createEmptyContext();
        context.setAuthentication(new SignedIn(owner.get().account(), "token"));
        SecurityContextHolder.setContext(context);
        try {
            chain.doFilter(request, response);
        } finally {
            SecurityContextHolder.clearContext();
        }
    }
}
