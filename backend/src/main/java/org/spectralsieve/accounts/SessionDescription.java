package org.spectralsieve.accounts;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.springframework.security.core.Authentication;

/** What {@code /api/session} and a successful sign-in answer: the mode, who is signed in, role and allowed actions. */
final class SessionDescription {

    private SessionDescription() {
    }

    static Map<String, Object> embedded() {
        Map<String, Object> body = new LinkedHashMap<>();
        body.put("mode", "embedded");
        body.put("signedIn", false);
        return body;
    }

    static Map<String, Object> of(Authentication authentication) {
        Map<String, Object> body = new LinkedHashMap<>();
        body.put("mode", "server");
        if (authentication instanceof SignedIn signedIn) {
            body.put("signedIn", true);
            body.put("name", signedIn.account().name());
            body.put("role", signedIn.account().role().label());
            body.put("actions", signedIn.account().role().actions());
            body.put("via", signedIn.via());
        } else {
            body.put("signedIn", false);
            body.put("actions", List.of());
        }
        return body;
    }
}
