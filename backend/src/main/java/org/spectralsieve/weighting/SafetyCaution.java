package org.spectralsieve.weighting;

/** The words every eye- or skin-related figure travels with, on the page, in the API and on the command line. */
public final class SafetyCaution {

    public static final String TEXT = "Screening estimate from stored curves, not a certification of protective "
            + "equipment; applicable standards, local codes and a qualified safety professional decide.";

    private SafetyCaution() {
    }
}
