package org.spectralsieve.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import org.spectralsieve.importers.ImportException;
import org.spectralsieve.ingest.FileBlock;
import org.spectralsieve.ingest.FileImport;
import org.spectralsieve.ingest.FilePreview;
import org.spectralsieve.ingest.ImportLimitException;
import org.spectralsieve.ingest.ImportOptions;
import org.spectralsieve.ingest.ImportProperties;
import org.spectralsieve.ingest.ImportRequestException;
import org.spectralsieve.ingest.IngestException;
import org.spectralsieve.ingest.OptionText;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/**
 * {@code preview FILE}: reads a curve file as an import would and says what it holds, storing nothing and
 * opening no library (a dry run, as {@code POST /api/imports/preview}). For a JCAMP-DX file it lists every
 * block, the number {@code --block} and the manifest's {@code block} column take, and which the import
 * would store. Limits are the defaults of {@code sieve.imports}.
 */
@Command(name = "preview", description = "Read a transmittance file as an import would and print what it holds,"
        + " storing nothing: format, points, range, warnings and, for JCAMP-DX, every block (number, title, points,"
        + " range in nm, units) with the one(s) an import would take. Exit 1 when the file would be refused.")
final class PreviewCommand implements Callable<Integer> {

    /** The reader names HTTP form fields; the command line calls them by its option names. */
    private static final Map<String, String> OPTION_OF_FIELD = Map.ofEntries(Map.entry("format", "--format"),
            Map.entry("yKind", "--y-kind"), Map.entry("block", "--block"), Map.entry("eachBlock", "--each-block"),
            Map.entry("from", "--from"), Map.entry("to", "--to"), Map.entry("xUnit", "--x-unit"),
            Map.entry("xColumn", "--x-column"), Map.entry("yColumn", "--y-column"),
            Map.entry("decimalMark", "--decimal-mark"), Map.entry("uncertainty", "--uncertainty"),
            Map.entry("replicates", "--replicates"));

    @Spec
    CommandSpec spec;

    @Option(names = "--format", paramLabel = "FORMAT",
            description = "delimited, jcamp-dx, raw-counts or datasheet-points instead of detecting it.")
    String format;

    @Option(names = "--y-kind", paramLabel = "KIND", description = "percent, fraction or absorbance instead of detecting it.")
    String yKind;

    @Option(names = "--block", paramLabel = "N", description = "JCAMP-DX: the block to read, numbered as this listing"
            + " numbers them (default the first with data).")
    String block;

    @Option(names = "--each-block", description = "JCAMP-DX: show what storing every block as its own sample would do.")
    boolean eachBlock;

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
            + " standard deviation) such as 0.5%T or 0.01A, for a file without a standard-deviation column.")
    String uncertainty;

    @Parameters(index = "0", paramLabel = "FILE", description = "The curve file.")
    Path file;

    @Override
    public Integer call() {
        if (!Files.isRegularFile(file)) {
            throw new ParameterException(spec.commandLine(), "'" + file + "' is not a file");
        }
        ImportOptions options;
        try {
            options = OptionText.options(format, yKind, decimalMark, replicates, null, null, null, null)
                    .withStatedUncertainty(OptionText.statedUncertainty("uncertainty", uncertainty));
            options = OptionText.withBlocks(options, "block", block, "eachBlock", String.valueOf(eachBlock));
            options = OptionText.keepRange(options, "from", from, "to", to);
            options = OptionText.withAxes(options, "xUnit", xUnit, "xColumn", xColumn, "yColumn", yColumn);
        } catch (ImportRequestException e) {
            throw new ParameterException(spec.commandLine(), option(e));
        }
        byte[] bytes;
        try {
            bytes = Files.readAllBytes(file);
        } catch (IOException e) {
            throw new CliFailure(SieveCli.FAILED, "cannot read " + file + ": " + e.getMessage());
        }
        FilePreview p;
        try {
            p = new FileImport(ImportProperties.defaults().maxPoints()).read(String.valueOf(file.getFileName()), bytes,
                    options);
        } catch (ImportException | IngestException | ImportLimitException e) {
            throw new CliFailure(SieveCli.FAILED, "would be refused: " + e.getMessage());
        } catch (ImportRequestException e) {
            throw new CliFailure(SieveCli.FAILED, "would be refused: " + option(e));
        }
        print(spec.commandLine().getOut(), p);
        return SieveCli.OK;
    }

    private static String option(ImportRequestException e) {
        String option = OPTION_OF_FIELD.getOrDefault(e.field(), e.field());
        return option + ": " + e.getMessage().substring(e.getMessage().indexOf(':') + 1).strip();
    }

    static void print(PrintWriter out, FilePreview p) {
        out.println(p.fileName() + ": " + p.format().label() + ", " + p.pointCount() + " points, "
                + Numbers.mm(p.curve().minWavelengthNm()) + "–" + Numbers.mm(p.curve().maxWavelengthNm()) + " nm, written as "
                + p.yKind().name().toLowerCase(Locale.ROOT) + ", detection limit "
                + (p.detectionLimit() == 0 ? "0" : String.format(Locale.ROOT, "%.3g", p.detectionLimit())));
        if (!p.blocks().isEmpty()) {
            blocks(p.blocks()).print(out);
        }
        if (!p.keptRange().isWhole()) {
            out.println("kept " + Numbers.mm(p.keptRange().keptFromNm()) + "–" + Numbers.mm(p.keptRange().keptToNm())
                    + " nm of the file's " + Numbers.mm(p.keptRange().fileFromNm()) + "–"
                    + Numbers.mm(p.keptRange().fileToNm()) + " nm (" + p.keptRange().leftOutBelow() + " points left out"
                    + " below, " + p.keptRange().leftOutAbove() + " above)");
        }
        out.println("measurement uncertainty: " + (p.uncertaintySource() == null ? "none" : p.uncertaintySource()));
        p.warnings().forEach(w -> out.println("note: " + w));
        out.flush();
    }

    static TextTable blocks(List<FileBlock> blocks) {
        TextTable table = new TextTable(List.of(">block", "title", ">points", "range nm", "x units", "y units", "import"));
        for (FileBlock b : blocks) {
            String range = b.fromNm() == null ? Numbers.NONE : Numbers.mm(b.fromNm()) + "–" + Numbers.mm(b.toNm());
            String title = b.title().isBlank() ? "(untitled)" : b.title();
            table.add(List.of(String.valueOf(b.number()), title, String.valueOf(b.points()), range,
                    b.xUnits().isBlank() ? Numbers.NONE : b.xUnits(), b.yUnits().isBlank() ? Numbers.NONE : b.yUnits(),
                    b.taken() ? "taken" : "left out"),
                    b.readable() ? List.of() : List.of("not a transmittance curve: " + b.problem()));
        }
        return table;
    }
}
