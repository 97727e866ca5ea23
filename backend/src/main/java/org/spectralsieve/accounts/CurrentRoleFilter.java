package org.spectralsieve.accounts;

import jakarta.servlet.FilterChain;
import jakarta.servlet.ServletException;
import jakarta.servlet.http.HttpServletRequest;
import jakarta.servlet.http.HttpServletResponse;
import jakarta.servlet.http.HttpSession;
import java.io.IOException;
import java.util.Optional;
import org.springframework.security.authentication.AnonymousAuthenticationToken;
import org.springframework.security.core.Authentication;
import org.springframework.security.core.context.SecurityContext;
import org.springframework.security.core.context.SecurityContextHolder;
import org.springframework.web.filter.OncePerRequestFilter;

/**
 * A signed-in session runs with the role its account holds now, not the one it held at sign-in: an admin's
 * change of role or disabling takes effect on the session's next request. A disabled (or vanished) account's
 * session is ended.
 */
final class CurrentRoleFilter extends OncePerRequestFilter {

    private final AccountStore store;

    CurrentRoleFilter(AccountStore store) {
        this.store = store;
    }

    @Override
    protected void doFilterInternal(HttpServletRequest request, HttpServletResponse response, FilterChain chain)
            throws ServletException, IOException {
        Authentication auth = SecurityContextHolder.getContext().getAuthentication();
        if (auth != null && auth.isAuthenticated() && !(auth instanceof AnonymousAuthenticationToken)) {
            Optional<Account> account = store.findByName(auth.getName()).filter(Account::active);
            SecurityContext context = SecurityContextHolder.createEmptyContext();
            if (account.isPresent()) {
                context.setAuthentication(new SignedIn(account.get(), "session"));
            } else {
                HttpSession session = request.getSession(false);
                if (session != null) {
                    session.invalidate();
                }
            }
            SecurityContextHolder.setContext(context);
        }
        chain.doFilter(request, response);
    }
}
