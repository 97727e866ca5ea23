package org.spectralsieve.accounts;

import com.fasterxml.jackson.annotation.JsonValue;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Optional;

/**
 * What an account may do in server mode, each role including the one below it: a viewer reads, searches,
 * exports and previews; an editor also imports, corrects and retires; an admin also manages accounts, restores
 * (backups and retired items), downloads backups and reads the audit trail.
 */
public enum Role {
    VIEWER(List.of("read", "search", "export", "preview")),
    EDITOR(List.of("import", "correct", "retire")),
    ADMIN(List.of("manage-accounts", "restore", "backup", "read-audit"));

    private final List<String> ownActions;

    Role(List<String> ownActions) {
        this.ownActions = ownActions;
    }

    /** The name stored and shown (also in JSON): {@code viewer}, {@code editor}, {@code admin}. */
    @JsonValue
    public String label() {
        return name().toLowerCase(Locale.ROOT);
    }

    /** Spring Security's authority for this role. */
    public String authority() {
        return "ROLE_" + name();
    }

    /** True when this role includes {@code needed}. */
    public boolean includes(Role needed) {
        return ordinal() >= needed.ordinal();
    }

    /** Every action this role allows, its own and those of the roles it includes (for the page). */
    public List<String> actions() {
        return Arrays.stream(values()).filter(this::includes).flatMap(r -> r.ownActions.stream()).toList();
    }

    public static Optional<Role> parse(String text) {
        if (text == null) {
            return Optional.empty();
        }
        return Arrays.stream(values()).filter(r -> r.label().equals(text.strip().toLowerCase(Locale.ROOT))).findFirst();
    }

    public static Optional<Role> fromAuthority(String authority) {
        return Arrays.stream(values()).filter(r -> r.authority().equals(authority)).findFirst();
    }

    static String labels() {
        return "viewer, editor or admin";
    }
}
