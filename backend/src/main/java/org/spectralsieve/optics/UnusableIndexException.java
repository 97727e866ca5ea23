package org.spectralsieve.optics;

/**
 * A computation needed the refractive index of a material whose stored index model fails today's checks
 * ({@link UnusableIndex}). Not the asker's mistake and not a fault of the code: the stored record must be
 * corrected.
 */
public final class UnusableIndexException extends IllegalStateException {

    public UnusableIndexException(String message) {
        super(message);
    }
}
