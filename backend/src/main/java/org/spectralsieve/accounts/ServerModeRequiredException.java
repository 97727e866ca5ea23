package org.spectralsieve.accounts;

/** The shared-server (PostgreSQL) profile was started without server mode, so without accounts. */
public class ServerModeRequiredException extends RuntimeException {

    public static final String MESSAGE = "The postgres profile (a shared library) needs server mode: set"
            + " SIEVE_SERVER_MODE=true (sieve.server-mode=true) so that only signed-in accounts may use it.";

    ServerModeRequiredException() {
        super(MESSAGE);
    }
}
