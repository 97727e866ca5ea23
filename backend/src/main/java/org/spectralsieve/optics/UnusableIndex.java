package org.spectralsieve.optics;

import java.util.Objects;

/**
 * A stored refractive-index model that today's checks refuse (stored before they existed, or written by
 * another tool): kept so that the material, its samples and their measured curves stay readable, but any
 * computation that needs n — rescaling to another thickness, a stack's interface — fails with the reason,
 * so that the sample is flagged instead of judged on a meaningless number.
 *
 * @param stored what the database holds, as written there
 * @param reason why it is refused, from the check that refused it
 */
public record UnusableIndex(String stored, String reason) implements RefractiveIndex {

    public UnusableIndex {
        Objects.requireNonNull(stored, "stored");
        Objects.requireNonNull(reason, "reason");
    }

    @Override
    public double at(double wavelengthNm) {
        throw new UnusableIndexException(explanation());
    }

    /** One line for a verdict or a problem detail. */
    public String explanation() {
        return "the stored refractive index (" + stored + ") cannot be used: " + reason;
    }
}
