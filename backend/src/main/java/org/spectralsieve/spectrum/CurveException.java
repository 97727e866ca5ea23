package org.spectralsieve.spectrum;

/**
 * A curve, grid or resampling request that breaks an invariant of this package. The message quotes the
 * offending index and value so that an importer can pass it on to the user unchanged.
 */
public final class CurveException extends IllegalArgumentException {

    private static final long serialVersionUID = 1L;

    public CurveException(String message) {
        super(message);
    }
}
