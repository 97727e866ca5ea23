package org.spectralsieve.library;

import java.time.Instant;
import java.util.Objects;
import org.spectralsieve.optics.RefractiveIndex;

/**
 * One revision of how a material's samples are interpreted: its refractive index (surface reflection when
 * rescaling) and the thicknesses it is made in (how far rescaling may reach). Revision 1 holds the values as
 * imported.
 *
 * @param current whether this is the revision searches, exports and figures use now
 */
public record MaterialRevision(long materialId, int revision, RefractiveIndex refractiveIndex,
                               StatedThicknesses thicknesses, String reason, Instant revisedAt, boolean current) {

    public MaterialRevision {
        if (revision < 1) {
            throw new IllegalArgumentException("revision must be 1 or more, got " + revision);
        }
        Objects.requireNonNull(refractiveIndex, "refractiveIndex");
        Objects.requireNonNull(thicknesses, "thicknesses");
        reason = Objects.requireNonNullElse(reason, "");
    }
}
