package org.spectralsieve.importers;

import java.util.Optional;

/**
 * Choices a user can make when the file alone is not enough. Immutable; start from {@link #defaults()}.
 *
 * @param yKind when present, the y kind to use whatever the header says or the values suggest
 */
public record ReadOptions(Optional<YKind> yKind) {

    public ReadOptions {
        yKind = yKind == null ? Optional.empty() : yKind;
    }

    /** Read the y kind from the header, or guess it from the values when there is no header. */
    public static ReadOptions defaults() {
        return new ReadOptions(Optional.empty());
    }

    /** Forces the y kind (e.g. a column headed "transmittance" that really holds percent). */
    public ReadOptions withYKind(YKind kind) {
        return new ReadOptions(Optional.of(kind));
    }
}
