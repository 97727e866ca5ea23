package org.spectralsieve.states;

import java.util.Locale;

/** Which condition a curve was measured in. The sample's own curve is always {@link #AS_SUPPLIED}. */
public enum StateKind {
    /** New, unexposed; for a film its clear base, unprinted. */
    AS_SUPPLIED,
    /** After an exposure to light (hours under a named source, or a dose at a wavelength). */
    AGED,
    /** A film's printed black (ink, toner or emulsion image) at a stated ink load or density. */
    PRINTED;

    /** The word the API, the command line and the files use: {@code as-supplied}, {@code aged}, {@code printed}. */
    public String word() {
        return name().toLowerCase(Locale.ROOT).replace('_', '-');
    }

    /** The kind a word names, or null: accepts the {@link #word()} forms and {@code new}, {@code base}, {@code unprinted}. */
    public static StateKind fromWord(String word) {
        if (word == null) {
            return null;
        }
        return switch (word.trim().toLowerCase(Locale.ROOT)) {
            case "as-supplied", "as supplied", "new", "base", "unprinted" -> AS_SUPPLIED;
            case "aged" -> AGED;
            case "printed" -> PRINTED;
            default -> null;
        };
    }
}
