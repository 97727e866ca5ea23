package org.spectralsieve.accounts;

import java.util.Map;
import org.springframework.beans.factory.annotation.Value;
import org.springframework.security.core.context.SecurityContextHolder;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.RestController;

/**
 * {@code GET /api/session}: for the page, whether this is server mode and, if so, who is signed in, their role
 * and what it allows. The embedded tool answers {@code mode: embedded} and the page shows nothing of accounts.
 */
@RestController
class SessionController {

    private final boolean serverMode;

    SessionController(@Value("${sieve.server-mode:false}") boolean serverMode) {
        this.serverMode = serverMode;
    }

    @GetMapping("/api/session")
    Map<String, Object> session() {
        return serverMode ? SessionDescription.of(SecurityContextHolder.getContext().getAuthentication())
                : SessionDescription.embedded();
    }
}
