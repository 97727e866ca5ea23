package org.spectralsieve.importers;

import java.util.Objects;
import java.util.Optional;

/**
 * Choices a user can make when the file alone is not enough. Immutable; start from {@link #defaults()}
 * and chain: {@code ReadOptions.defaults().decimalMark(DecimalMark.COMMA).replicates(Replicates.MEAN)}.
 *
 * @param yKind           when present, the y kind to use whatever the header says or the values suggest
 * @param decimalMark     when present, the decimal mark to use instead of detecting it
 * @param replicates      what to do with several value columns; {@link Replicates#FIRST} by default
 * @param mergeDuplicates average rows that repeat a wavelength instead of refusing the file
 */
public record ReadOptions(Optional<YKind> yKind, Optional<DecimalMark> decimalMark, Replicates replicates,
        boolean mergeDuplicates) {

    public ReadOptions {
        yKind = yKind == null ? Optional.empty() : yKind;
        decimalMark = decimalMark == null ? Optional.empty() : decimalMark;
        replicates = replicates == null ? Replicates.FIRST : replicates;
    }

    /** The original one-choice form, kept for callers written before the other options existed. */
    public ReadOptions(Optional<YKind> yKind) {
        this(yKind, Optional.empty(), Replicates.FIRST, false);
    }

    /** Detect everything from the file; first replicate only; duplicate wavelengths refused. */
    public static ReadOptions defaults() {
        return new ReadOptions(Optional.empty(), Optional.empty(), Replicates.FIRST, false);
    }

    /** Forces the y kind (e.g. a column headed "transmittance" that really holds percent). */
    public ReadOptions withYKind(YKind kind) {
        return new ReadOptions(Optional.of(Objects.requireNonNull(kind, "kind")), decimalMark, replicates,
                mergeDuplicates);
    }

    /** Forces the decimal mark (detection can only guess for a file like {@code 1,5 2,5}). */
    public ReadOptions decimalMark(DecimalMark mark) {
        return new ReadOptions(yKind, Optional.of(Objects.requireNonNull(mark, "mark")), replicates, mergeDuplicates);
    }

    public ReadOptions replicates(Replicates mode) {
        return new ReadOptions(yKind, decimalMark, Objects.requireNonNull(mode, "mode"), mergeDuplicates);
    }

    public ReadOptions mergeDuplicates(boolean merge) {
        return new ReadOptions(yKind, decimalMark, replicates, merge);
    }
}
