package org.spectralsieve.ingest;

import java.util.Arrays;
import java.util.Locale;

/** The file formats an import can read; the label is what users write in options and manifests. */
public enum ImportFormat {
    /** CSV/TSV/blank-separated wavelength and value columns, including the project's own curve CSV. */
    DELIMITED("delimited", "text/csv"),
    /** JCAMP-DX 4.24 / 5.01 (starts with {@code ##TITLE=}). */
    JCAMP_DX("jcamp-dx", "chemical/x-jcamp-dx"),
    /** Dark, reference and sample detector counts, turned into transmittance with a 3σ detection limit. */
    RAW_COUNTS("raw-counts", "text/csv"),
    /** Sparse points read off a published graph ({@code # axis:}, {@code # provenance: datasheet}). */
    DATASHEET_POINTS("datasheet-points", "text/csv");

    private final String label;
    private final String mediaType;

    ImportFormat(String label, String mediaType) {
        this.label = label;
        this.mediaType = mediaType;
    }

    public String label() {
        return label;
    }

    /** The media type the original bytes are kept under. */
    public String mediaType() {
        return mediaType;
    }

    /** Accepts the label or the constant name, any case ({@code jcamp-dx}, {@code JCAMP_DX}). */
    public static ImportFormat parse(String text) {
        String t = text == null ? "" : text.trim().toLowerCase(Locale.ROOT).replace('_', '-');
        for (ImportFormat f : values()) {
            if (f.label.equals(t) || (t.equals("jcamp") && f == JCAMP_DX)) {
                return f;
            }
        }
        throw new IllegalArgumentException("format '" + text + "' is not one of "
                + Arrays.stream(values()).map(ImportFormat::label).toList());
    }
}
