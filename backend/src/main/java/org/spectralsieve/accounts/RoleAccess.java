package org.spectralsieve.accounts;

import java.util.function.Supplier;
import org.springframework.security.access.hierarchicalroles.RoleHierarchy;
import org.springframework.security.authorization.AuthorityAuthorizationManager;
import org.springframework.security.authorization.AuthorizationDecision;
import org.springframework.security.authorization.AuthorizationManager;
import org.springframework.security.authorization.AuthorizationResult;
import org.springframework.security.core.Authentication;
import org.springframework.security.web.access.intercept.RequestAuthorizationContext;
import java.util.EnumMap;
import java.util.Map;

/** Admits an API request when the signed-in role reaches the one {@link EndpointRoles} names for it. */
final class RoleAccess implements AuthorizationManager<RequestAuthorizationContext> {

    private final Map<Role, AuthorityAuthorizationManager<RequestAuthorizationContext>> byRole = new EnumMap<>(Role.class);

    RoleAccess(RoleHierarchy hierarchy) {
        for (Role role : Role.values()) {
            AuthorityAuthorizationManager<RequestAuthorizationContext> manager =
                    AuthorityAuthorizationManager.hasAuthority(role.authority());
            manager.setRoleHierarchy(hierarchy);
            byRole.put(role, manager);
        }
    }

    @Override
    public AuthorizationResult authorize(Supplier<? extends Authentication> authentication,
                                         RequestAuthorizationContext context) {
        var request = context.getRequest();
        if (!(authentication.get() instanceof SignedIn)) {
            return new AuthorizationDecision(false);
        }
        Role needed = EndpointRoles.required(request.getMethod(), ApiRefusals.path(request));
        return byRole.get(needed).authorize(authentication, context);
    }
}
