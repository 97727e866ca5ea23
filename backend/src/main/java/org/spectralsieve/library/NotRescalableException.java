package org.spectralsieve.library;

/**
 * A thickness change was asked of a sample whose curve cannot be rescaled: a coating or laminate, or a
 * diffuse or scattering sample ({@link SampleRescaling}).
 */
public class NotRescalableException extends RuntimeException {

    public NotRescalableException(String materialName, long sampleId) {
        super("sample " + sampleId + " is a fixed layer (" + materialName + "): a coating, laminate or scattering part "
                + "is only valid as measured, so it cannot be rescaled to another thickness");
    }

    /** A sample of a bulk material held at its measured thickness, with the reason ({@link SampleRescaling#reason()}). */
    public NotRescalableException(String materialName, long sampleId, String reason) {
        super("sample " + sampleId + " of " + materialName + " is only valid as measured: " + reason);
    }
}
