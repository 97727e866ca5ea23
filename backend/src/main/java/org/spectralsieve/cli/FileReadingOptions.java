package org.spectralsieve.cli;

import java.util.Map;
import org.spectralsieve.ingest.ImportOptions;
import org.spectralsieve.ingest.ImportRequestException;
import org.spectralsieve.ingest.OptionText;
import picocli.CommandLine.Option;

/**
 * How to read a curve file, for the commands that read one without storing it ({@code preview},
 * {@code similar --file}): the options of {@code POST /api/imports/preview}'s reading fields, read by the same
 * {@link OptionText} so a file reads alike everywhere.
 */
final class FileReadingOptions {

    /** The reader names HTTP form fields; the command line calls them by its option names. */
    private static final Map<String, String> OPTION_OF_FIELD = Map.ofEntries(Map.entry("format", "--format"),
            Map.entry("yKind", "--y-kind"), Map.entry("block", "--block"), Map.entry("eachBlock", "--each-block"),
            Map.entry("from", "--from"), Map.entry("to", "--to"), Map.entry("xUnit", "--x-unit"),
            Map.entry("xColumn", "--x-column"), Map.entry("yColumn", "--y-column"),
            Map.entry("decimalMark", "--decimal-mark"), Map.entry("uncertainty", "--uncertainty"),
            Map.entry("replicates", "--replicates"));

    @Option(names = "--format", paramLabel = "FORMAT",
            description = "delimited, jcamp-dx, raw-counts or datasheet-points instead of detecting it.")
    String format;

    @Option(names = "--y-kind", paramLabel = "KIND", description = "percent, fraction or absorbance instead of detecting it.")
    String yKind;

    @Option(names = "--block", paramLabel = "N", description = "JCAMP-DX: the block to read, numbered as preview"
            + " numbers them (default the first with data).")
    String block;

    @Option(names = "--from", paramLabel = "NM", description = "Keep only wavelengths from NM up (default: the whole"
            + " axis, less a noise region found at its short end).")
    String from;

    @Option(names = "--to", paramLabel = "NM", description = "Keep only wavelengths up to NM (default: the whole axis,"
            + " less a noise region found at its long end).")
    String to;

    @Option(names = "--x-unit", paramLabel = "UNIT", description = "nm, um, angstrom or cm-1, whatever the file says.")
    String xUnit;

    @Option(names = "--x-column", paramLabel = "N", description = "The wavelength column, counted from 1.")
    String xColumn;

    @Option(names = "--y-column", paramLabel = "N", description = "The value column, counted from 1.")
    String yColumn;

    @Option(names = "--decimal-mark", paramLabel = "MARK", description = "point or comma instead of detecting it.")
    String decimalMark;

    @Option(names = "--replicates", paramLabel = "MODE", description = "Several value columns: first, mean or separate.")
    String replicates;

    @Option(names = "--uncertainty", paramLabel = "SD", description = "The instrument's stated uncertainty (one"
            + " standard deviation) such as 0.5%%T or 0.01A, for a file without a standard-deviation column.")
    String uncertainty;

    /**
     * The reading options, as the preview endpoint builds them from its form.
     *
     * @throws ImportRequestException naming the field; {@link #option} turns it into the option's name
     */
    ImportOptions options(boolean eachBlock) {
        ImportOptions options = OptionText.options(format, yKind, decimalMark, replicates, null, null, null, null)
                .withStatedUncertainty(OptionText.statedUncertainty("uncertainty", uncertainty));
        options = OptionText.withBlocks(options, "block", block, "eachBlock", String.valueOf(eachBlock));
        options = OptionText.keepRange(options, "from", from, "to", to);
        return OptionText.withAxes(options, "xUnit", xUnit, "xColumn", xColumn, "yColumn", yColumn);
    }

    /** The refusal in the command line's words: the option's name, then what is wrong. */
    static String option(ImportRequestException e) {
        String option = OPTION_OF_FIELD.getOrDefault(e.field(), e.field());
        return option + ": " + e.getMessage().substring(e.getMessage().indexOf(':') + 1).strip();
    }
}
