package org.spectralsieve.accounts;

import java.time.Instant;

/**
 * A server-mode account as listed: never its password hash.
 *
 * @param disabledAt when it was disabled, or null while it may sign in
 */
public record Account(long id, String name, Role role, Instant createdAt, Instant disabledAt) {

    public boolean active() {
        return disabledAt == null;
    }
}
