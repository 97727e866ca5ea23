package org.spectralsieve.presets;

import java.time.Instant;

/**
 * A preset stored in the library (table {@code requirement_preset}).
 *
 * @param ownerAccountId the owning account, or null for everyone (shared; every preset of the embedded tool)
 * @param retiredAt      null while live
 */
public record SavedPreset(long id, String name, String text, String note, Long ownerAccountId, Instant createdAt,
                          Instant updatedAt, Instant retiredAt) {

    public boolean shared() {
        return ownerAccountId == null;
    }
}
