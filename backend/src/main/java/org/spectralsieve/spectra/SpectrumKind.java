package org.spectralsieve.spectra;

import java.util.Locale;

/** What an imported spectrum is used as; the label is what the database and the command line hold. */
public enum SpectrumKind {
    /** A light source's relative spectral power. */
    EMITTER("emitter", "emitters"),
    /** A weighting (action spectrum, sensitivity, responsivity). */
    RESPONSE("response", "responses");

    private final String label;
    private final String plural;

    SpectrumKind(String label, String plural) {
        this.label = label;
        this.plural = plural;
    }

    public String label() {
        return label;
    }

    /** The collection name in HTTP paths: {@code /api/emitters}, {@code /api/responses}. */
    public String plural() {
        return plural;
    }

    /** Accepts the label or the plural, any case. */
    public static SpectrumKind parse(String text) {
        String t = text == null ? "" : text.strip().toLowerCase(Locale.ROOT);
        for (SpectrumKind k : values()) {
            if (k.label.equals(t) || k.plural.equals(t)) {
                return k;
            }
        }
        throw new IllegalArgumentException("kind '" + text + "' is not one of emitter, response");
    }
}
