package org.spectralsieve.importers;

import java.util.Objects;
import java.util.Optional;
import java.util.OptionalInt;

/**
 * Choices a user can make when the file alone is not enough. Immutable; start from {@link #defaults()}
 * and chain: {@code ReadOptions.defaults().decimalMark(DecimalMark.COMMA).replicates(Replicates.MEAN)}.
 *
 * @param yKind           when present, the y kind to use whatever the header says or the values suggest
 * @param decimalMark     when present, the decimal mark to use instead of detecting it
 * @param replicates      what to do with several value columns; {@link Replicates#FIRST} by default
 * @param mergeDuplicates average rows that repeat a wavelength instead of refusing the file
 * @param xUnit           when present, the unit of the wavelength axis whatever the header or XUNITS say
 *                        (a file may state the wrong one)
 * @param xColumn         delimited text: the wavelength column, counted from 1, instead of the header's
 * @param yColumn         delimited text: the value column, counted from 1, instead of the header's
 */
public record ReadOptions(Optional<YKind> yKind, Optional<DecimalMark> decimalMark, Replicates replicates,
        boolean mergeDuplicates, Optional<XUnit> xUnit, OptionalInt xColumn, OptionalInt yColumn) {

    public ReadOptions {
        yKind = yKind == null ? Optional.empty() : yKind;
        decimalMark = decimalMark == null ? Optional.empty() : decimalMark;
        replicates = replicates == null ? Replicates.FIRST : replicates;
        xUnit = xUnit == null ? Optional.empty() : xUnit;
        xColumn = xColumn == null ? OptionalInt.empty() : xColumn;
        yColumn = yColumn == null ? OptionalInt.empty() : yColumn;
        xColumn.ifPresent(c -> requireColumn("xColumn", c));
        yColumn.ifPresent(c -> requireColumn("yColumn", c));
        if (xColumn.isPresent() && xColumn.equals(yColumn)) {
            throw new IllegalArgumentException("xColumn and yColumn must differ, both are " + xColumn.getAsInt());
        }
    }

    /** The form before axis overrides existed. */
    public ReadOptions(Optional<YKind> yKind, Optional<DecimalMark> decimalMark, Replicates replicates,
            boolean mergeDuplicates) {
        this(yKind, decimalMark, replicates, mergeDuplicates, Optional.empty(), OptionalInt.empty(),
                OptionalInt.empty());
    }

    private static void requireColumn(String name, int column) {
        if (column < 1) {
            throw new IllegalArgumentException(name + " counts columns from 1, got " + column);
        }
    }

    /** The original one-choice form, kept for callers written before the other options existed. */
    public ReadOptions(Optional<YKind> yKind) {
        this(yKind, Optional.empty(), Replicates.FIRST, false);
    }

    /** Detect everything from the file; first replicate only; duplicate wavelengths refused. */
    public static ReadOptions defaults() {
        return new ReadOptions(Optional.empty(), Optional.empty(), Replicates.FIRST, false);
    }

    /** True when the user chose a column, so the header's choice of columns is not used. */
    public boolean columnsChosen() {
        return xColumn.isPresent() || yColumn.isPresent();
    }

    /** Forces the y kind (e.g. a column headed "transmittance" that really holds percent). */
    public ReadOptions withYKind(YKind kind) {
        return new ReadOptions(Optional.of(Objects.requireNonNull(kind, "kind")), decimalMark, replicates,
                mergeDuplicates, xUnit, xColumn, yColumn);
    }

    /** Forces the decimal mark (detection can only guess for a file like {@code 1,5 2,5}). */
    public ReadOptions decimalMark(DecimalMark mark) {
        return new ReadOptions(yKind, Optional.of(Objects.requireNonNull(mark, "mark")), replicates, mergeDuplicates,
                xUnit, xColumn, yColumn);
    }

    public ReadOptions replicates(Replicates mode) {
        return new ReadOptions(yKind, decimalMark, Objects.requireNonNull(mode, "mode"), mergeDuplicates, xUnit,
                xColumn, yColumn);
    }

    public ReadOptions mergeDuplicates(boolean merge) {
        return new ReadOptions(yKind, decimalMark, replicates, merge, xUnit, xColumn, yColumn);
    }

    /** Forces the wavelength unit (e.g. a JCAMP-DX file whose XUNITS=1/CM holds nanometres). */
    public ReadOptions xUnit(XUnit unit) {
        return new ReadOptions(yKind, decimalMark, replicates, mergeDuplicates,
                Optional.of(Objects.requireNonNull(unit, "unit")), xColumn, yColumn);
    }

    /** Chooses the wavelength and value columns (1-based); an empty one is taken from the header as before. */
    public ReadOptions columns(OptionalInt x, OptionalInt y) {
        return new ReadOptions(yKind, decimalMark, replicates, mergeDuplicates, xUnit, x, y);
    }
}
