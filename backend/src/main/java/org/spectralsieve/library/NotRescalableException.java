package org.spectralsieve.library;

/** A thickness change was asked of a layer whose curve cannot be rescaled (a coating or laminate). */
public class NotRescalableException extends RuntimeException {

    public NotRescalableException(String materialName, long sampleId) {
        super("sample " + sampleId + " is a fixed layer (" + materialName + "): a coating, laminate or scattering part "
                + "is only valid as measured, so it cannot be rescaled to another thickness");
    }
}
