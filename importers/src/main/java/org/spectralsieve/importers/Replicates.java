package org.spectralsieve.importers;

/** What to do with a file holding several y columns (replicate measurements) for one sample. */
public enum Replicates {
    /** Read the first x/y pair only; a warning names the columns left unread. The default. */
    FIRST,
    /** Point-by-point mean of all replicates; they must share the same wavelengths and y kind. */
    MEAN,
    /** One spectrum per replicate ({@link DelimitedTextReader#readAll}); each names its columns in metadata. */
    SEPARATE
}
