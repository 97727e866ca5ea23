package org.spectralsieve.accounts;

import java.util.List;
import java.util.Locale;
import java.util.Set;
import org.springframework.http.server.PathContainer;
import org.springframework.web.util.pattern.PathPattern;
import org.springframework.web.util.pattern.PathPatternParser;

/**
 * Which role each API request needs in server mode: one table, read both to decide and to say in a refusal
 * which role was missing. Reading (GET, HEAD) needs a viewer. A request that changes anything needs an admin
 * unless the table says less, so an endpoint added later is closed until someone decides who may use it
 * (ServerModeAccessTest checks every mapping against this table).
 */
public final class EndpointRoles {

    private static final Set<String> READING = Set.of("GET", "HEAD", "OPTIONS");
    private static final PathPatternParser PARSER = PathPatternParser.defaultInstance;

    private record Rule(Set<String> methods, PathPattern path, Role role) {
        boolean matches(String method, PathContainer p) {
            return (methods.isEmpty() || methods.contains(method)) && path.matches(p);
        }
    }

    private static final List<Rule> RULES = List.of(
            // admin whatever the method: accounts and the audit trail are admin's to read too
            rule(Set.of(), "/api/accounts/**", Role.ADMIN),
            rule(Set.of(), "/api/audit/**", Role.ADMIN),
            rule(Set.of("GET", "HEAD"), "/api/backup", Role.ADMIN),
            rule(Set.of("POST"), "/api/restore", Role.ADMIN),
            rule(Set.of("POST"), "/api/{kinds}/{id}/restore", Role.ADMIN),
            // anyone signed in: their own session and their own tokens
            rule(Set.of(), "/api/session", Role.VIEWER),
            rule(Set.of(), "/api/tokens/**", Role.VIEWER),
            // requirement presets: anyone signed in keeps their own; PresetCaller refuses shared ones to all but admins
            rule(Set.of("POST"), "/api/presets", Role.VIEWER),
            rule(Set.of("POST"), "/api/presets/import", Role.VIEWER),
            rule(Set.of("PUT", "DELETE"), "/api/presets/{key}", Role.VIEWER),
            // POSTs that only compute an answer, changing nothing
            rule(Set.of("POST"), "/api/search", Role.VIEWER),
            rule(Set.of("POST"), "/api/requirements/parse", Role.VIEWER),
            rule(Set.of("POST"), "/api/similar", Role.VIEWER),
            rule(Set.of("POST"), "/api/imports/preview", Role.VIEWER),
            // editors: import, correct, retire
            rule(Set.of("POST"), "/api/imports", Role.EDITOR),
            rule(Set.of("POST"), "/api/imports/batch", Role.EDITOR),
            rule(Set.of("POST"), "/api/samples/{id}/states", Role.EDITOR),
            rule(Set.of("POST"), "/api/{kinds:samples|materials|state-curves}/{id}/retire", Role.EDITOR),
            rule(Set.of("POST"), "/api/{kinds:samples|materials}/{id}/revisions", Role.EDITOR),
            rule(Set.of("POST"), "/api/{kinds:emitters|responses}", Role.EDITOR),
            rule(Set.of("DELETE"), "/api/{kinds:emitters|responses}/{name}", Role.EDITOR));

    private EndpointRoles() {
    }

    private static Rule rule(Set<String> methods, String pattern, Role role) {
        return new Rule(methods, PARSER.parse(pattern), role);
    }

    /**
     * @param path the request's path inside the application (without the context path)
     */
    public static Role required(String method, String path) {
        String m = method.toUpperCase(Locale.ROOT);
        PathContainer p = PathContainer.parsePath(path);
        for (Rule rule : RULES) {
            if (rule.matches(m, p)) {
                return rule.role();
            }
        }
        return READING.contains(m) ? Role.VIEWER : Role.ADMIN;
    }
}
