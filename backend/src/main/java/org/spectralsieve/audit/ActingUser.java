package org.spectralsieve.audit;

import java.util.Objects;

/**
 * Who makes the current change, as the audit trail records it ({@link AuditEntry#actor()}). Asked once per change,
 * inside the change's transaction, so an implementation may read per-request state (the web one reads the signed-in
 * user of the request being served). Plain Java: the library's write paths hold one without knowing where it comes
 * from.
 */
@FunctionalInterface
public interface ActingUser {

    /** The name recorded for the embedded single user, who has no login. */
    String LOCAL_NAME = "local";

    /** The embedded single user: what a write records when nobody signed in (and what tests' plain wiring records). */
    ActingUser LOCAL = () -> LOCAL_NAME;

    /** The name of whoever makes the change now; never null nor blank. */
    String name();

    /** Always the same name (a test's user, a tool's fixed identity). */
    static ActingUser named(String name) {
        String checked = AuditEntry.checkedText(Objects.requireNonNull(name, "name"), "actor", AuditEntry.MAX_ACTOR);
        return () -> checked;
    }

    /** The command line's actor: {@code command line (<OS user name>)}, the name the operating system gives the process. */
    static ActingUser commandLine() {
        return named(commandLineName(System.getProperty("user.name")));
    }

    /** {@code command line (<osUser>)}, or {@code command line (unknown user)} when the system names none. */
    static String commandLineName(String osUser) {
        String who = osUser == null || osUser.isBlank() ? "unknown user" : osUser.strip();
        return "command line (" + who + ")";
    }
}
