package org.spectralsieve.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
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
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
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

    @Spec
    CommandSpec spec;

    @Mixin
    FileReadingOptions reading;

    @Option(names = "--each-block", description = "JCAMP-DX: show what storing every block as its own sample would do.")
    boolean eachBlock;

    @Parameters(index = "0", paramLabel = "FILE", description = "The curve file.")
    Path file;

    @Override
    public Integer call() {
        if (!Files.isRegularFile(file)) {
            throw new ParameterException(spec.commandLine(), "'" + file + "' is not a file");
        }
        ImportOptions options;
        try {
            options = reading.options(eachBlock);
        } catch (ImportRequestException e) {
            throw new ParameterException(spec.commandLine(), FileReadingOptions.option(e));
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
            throw new CliFailure(SieveCli.FAILED, "would be refused: " + FileReadingOptions.option(e));
        }
        print(spec.commandLine().getOut(), p);
        return SieveCli.OK;
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
