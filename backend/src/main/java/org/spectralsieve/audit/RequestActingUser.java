package org.spectralsieve.audit;

import java.security.Principal;
import org.springframework.web.context.request.RequestAttributes;
import org.springframework.web.context.request.RequestContextHolder;
import org.springframework.web.context.request.ServletRequestAttributes;

/**
 * The web's acting user: the signed-in user of the request this thread serves ({@code getUserPrincipal()}, which the
 * security configuration fills when logins are on), else {@value ActingUser#LOCAL_NAME} — the embedded single user,
 * who has no login, and any write made off a request thread.
 */
final class RequestActingUser implements ActingUser {

    @Override
    public String name() {
        RequestAttributes attributes = RequestContextHolder.getRequestAttributes();
        if (attributes instanceof ServletRequestAttributes servlet) {
            Principal principal = servlet.getRequest().getUserPrincipal();
            if (principal != null && principal.getName() != null && !principal.getName().isBlank()) {
                String name = principal.getName().strip();
                return name.length() <= AuditEntry.MAX_ACTOR ? name : name.substring(0, AuditEntry.MAX_ACTOR);
            }
        }
        return LOCAL_NAME;
    }
}
