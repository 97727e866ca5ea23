package org.spectralsieve.importers;

import java.util.Objects;
import java.util.Optional;
import java.util.OptionalInt;

/**
 * Choices for reading a file of (wavelength, relative value) pairs as a {@link SpectrumValues}: a source's
 * relative power or a response's weights. Immutable; start from {@link #defaults()} and chain.
 *
 * @param decimalMark     delimited text: the decimal mark instead of detecting it
 * @param xUnit           the wavelength unit instead of the header's (or of nm, for a file without header
 *                        or a JCAMP-DX block without {@code ##XUNITS=})
 * @param valueColumn     delimited text: the value column by header name (any case) or by 1-based number;
 *                        needed when more than one column besides the wavelength could be meant
 * @param mergeDuplicates delimited text: average rows that repeat a wavelength instead of refusing the file
 * @param jcampBlock      JCAMP-DX: which block, as {@code JcampBlock.index()}; empty = the first with data
 */
public record SpectrumValuesOptions(Optional<DecimalMark> decimalMark, Optional<XUnit> xUnit,
        Optional<String> valueColumn, boolean mergeDuplicates, OptionalInt jcampBlock) {

    public SpectrumValuesOptions {
        decimalMark = decimalMark == null ? Optional.empty() : decimalMark;
        xUnit = xUnit == null ? Optional.empty() : xUnit;
        valueColumn = valueColumn == null ? Optional.empty() : valueColumn.map(String::strip).filter(s -> !s.isEmpty());
        jcampBlock = jcampBlock == null ? OptionalInt.empty() : jcampBlock;
        if (jcampBlock.isPresent() && jcampBlock.getAsInt() < 0) {
            throw new IllegalArgumentException("jcampBlock must be >= 0, was " + jcampBlock.getAsInt());
        }
    }

    /** Detect everything; a file with one value column; repeated wavelengths refused. */
    public static SpectrumValuesOptions defaults() {
        return new SpectrumValuesOptions(Optional.empty(), Optional.empty(), Optional.empty(), false, OptionalInt.empty());
    }

    public SpectrumValuesOptions decimalMark(DecimalMark mark) {
        return new SpectrumValuesOptions(Optional.of(Objects.requireNonNull(mark, "mark")), xUnit, valueColumn,
                mergeDuplicates, jcampBlock);
    }

    public SpectrumValuesOptions xUnit(XUnit unit) {
        return new SpectrumValuesOptions(decimalMark, Optional.of(Objects.requireNonNull(unit, "unit")), valueColumn,
                mergeDuplicates, jcampBlock);
    }

    /** A header name ({@code global}) or a 1-based column number ({@code 3}). */
    public SpectrumValuesOptions valueColumn(String column) {
        return new SpectrumValuesOptions(decimalMark, xUnit, Optional.of(Objects.requireNonNull(column, "column")),
                mergeDuplicates, jcampBlock);
    }

    public SpectrumValuesOptions mergeDuplicates(boolean merge) {
        return new SpectrumValuesOptions(decimalMark, xUnit, valueColumn, merge, jcampBlock);
    }

    public SpectrumValuesOptions jcampBlock(int index) {
        return new SpectrumValuesOptions(decimalMark, xUnit, valueColumn, mergeDuplicates, OptionalInt.of(index));
    }
}
