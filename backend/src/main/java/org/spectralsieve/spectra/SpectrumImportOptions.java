package org.spectralsieve.spectra;

import java.util.Optional;
import java.util.OptionalInt;
import org.spectralsieve.importers.DecimalMark;
import org.spectralsieve.importers.SpectrumValuesOptions;
import org.spectralsieve.importers.XUnit;
import org.spectralsieve.ingest.ImportFormat;
import org.spectralsieve.ingest.ImportRequestException;
import org.spectralsieve.ingest.OptionText;

/**
 * How to read a spectrum file; everything is detected when left empty.
 *
 * @param format delimited or jcamp-dx; empty = by extension ({@code .jdx}, {@code .dx}, {@code .jcamp}) or a
 *               first line starting {@code ##}, else delimited
 * @param read   the importer's options: decimal mark, x unit, value column, merging repeated wavelengths, block
 */
public record SpectrumImportOptions(Optional<ImportFormat> format, SpectrumValuesOptions read) {

    public SpectrumImportOptions {
        format = format == null ? Optional.empty() : format;
        read = read == null ? SpectrumValuesOptions.defaults() : read;
        if (format.isPresent() && format.get() != ImportFormat.DELIMITED && format.get() != ImportFormat.JCAMP_DX) {
            throw new ImportRequestException("format", "a spectrum is read as delimited or jcamp-dx, not "
                    + format.get().label());
        }
    }

    public static SpectrumImportOptions defaults() {
        return new SpectrumImportOptions(Optional.empty(), SpectrumValuesOptions.defaults());
    }

    /**
     * The options from their text forms (HTTP form fields, command-line options); blank means not given.
     * Each refusal is an {@link ImportRequestException} naming the HTTP field (format, decimalMark, xUnit,
     * mergeDuplicates, block).
     */
    public static SpectrumImportOptions parse(String format, String decimalMark, String xUnit, String valueColumn,
                                              String mergeDuplicates, String block) {
        Optional<ImportFormat> f = OptionText.format("format", format);
        SpectrumValuesOptions read = SpectrumValuesOptions.defaults();
        Optional<DecimalMark> mark = OptionText.decimalMark("decimalMark", decimalMark);
        if (mark.isPresent()) {
            read = read.decimalMark(mark.get());
        }
        Optional<XUnit> unit = xUnit("xUnit", xUnit);
        if (unit.isPresent()) {
            read = read.xUnit(unit.get());
        }
        if (valueColumn != null && !valueColumn.isBlank()) {
            read = read.valueColumn(valueColumn);
        }
        read = read.mergeDuplicates(OptionText.bool("mergeDuplicates", mergeDuplicates));
        OptionalInt b = blockIndex("block", block);
        if (b.isPresent()) {
            read = read.jcampBlock(b.getAsInt());
        }
        return new SpectrumImportOptions(f, read);
    }

    /** {@code nm}, {@code um}/{@code µm}, {@code angstrom}/{@code å}, {@code cm-1}, or the constant name. */
    public static Optional<XUnit> xUnit(String field, String s) {
        return OptionText.xUnit(field, s);
    }

    private static OptionalInt blockIndex(String field, String s) {
        if (s == null || s.isBlank()) {
            return OptionalInt.empty();
        }
        try {
            int i = Integer.parseInt(s.strip());
            if (i >= 0) {
                return OptionalInt.of(i);
            }
        } catch (NumberFormatException e) {
            // reported below
        }
        throw new ImportRequestException(field, "'" + s + "' is not a JCAMP-DX block index (0, 1, 2, ...)");
    }
}
