package org.spectralsieve.importers;

/** What a raw detector capture measured. */
public enum CaptureRole {
    /** Source blocked: detector offset plus dark current. */
    DARK,
    /** Empty beam (or blank substrate): the 100 % line. */
    REFERENCE,
    /** Light through the sample. */
    SAMPLE
}
