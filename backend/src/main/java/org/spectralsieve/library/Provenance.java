package org.spectralsieve.library;

import java.util.Locale;

/** Where a curve comes from; it decides how much a verdict built on it can be trusted. */
public enum Provenance {
    MEASURED, DATASHEET, MODELLED;

    public String label() {
        return name().toLowerCase(Locale.ROOT);
    }

    public static Provenance parse(String text) {
        return Geometry.Labels.parse(Provenance.class, values(), text, "provenance");
    }
}
