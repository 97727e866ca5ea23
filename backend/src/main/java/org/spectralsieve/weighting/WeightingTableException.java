package org.spectralsieve.weighting;

/** A weighting table that cannot be read; the message starts with file:line. */
public final class WeightingTableException extends RuntimeException {

    public WeightingTableException(String message) {
        super(message);
    }
}
