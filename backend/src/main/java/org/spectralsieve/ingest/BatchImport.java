package org.spectralsieve.ingest;

import java.io.IOException;
import java.io.StringReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.Set;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.spectralsieve.importers.ImportException;
import org.spectralsieve.importers.Replicates;
import org.spectralsieve.ingest.BatchReport.FileReport;
import org.spectralsieve.ingest.BatchReport.Outcome;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.NewMaterial;
import org.spectralsieve.library.NewSample;
import org.spectralsieve.library.NotFoundException;
import org.spectralsieve.library.RetiredException;
import org.spectralsieve.optics.ConstantIndex;

/**
 * Imports a folder or a zip holding {@code manifest.csv}, one row per file:
 *
 * <pre>
 * file,material,thickness,geometry,provenance,instrument,date,notes,class,scaling,index_n
 * acrylic-3mm.csv,Cast acrylic (illustrative),3,regular,measured,bench spectrometer,2026-03-02,,plastic sheet,bulk,1.49
 * acrylic-6mm.csv,cast-acrylic-illustrative,6,,,,,,,,
 * </pre>
 *
 * {@code file} and {@code material} are required; {@code material} is a slug or name already in the
 * library, or the name of a new material, which then needs {@code class} and {@code scaling} (and may
 * give {@code index_n}, else n = 1.5 with a warning, and the thicknesses it exists in: {@code stock}, stock
 * sizes such as "2;3;6" or "25 50 125 um", and {@code made_range}, such as "1 to 12" or "25-125 um"). Later rows find a material created by an earlier
 * one by its name. Optional columns also: {@code lot}, {@code format}, {@code y_kind},
 * {@code detection_limit}, {@code from}, {@code to}: the wavelengths (nm) to keep of that file, each
 * replacing the batch-wide {@link KeepDefault} on its side, for a JCAMP-DX file {@code block} (the block number the
 * preview lists) or {@code each_block} (true: every block its own sample, all in the row's one transaction), and
 * corrections of what a file says about its axes: {@code x_unit} (nm, um, angstrom, cm-1), {@code x_column} and
 * {@code y_column} (counted from 1), {@code decimal_mark} (point, comma), and {@code uncertainty} (the instrument's stated
 * uncertainty for files without a standard-deviation column: "0.5%T" or "0.01A", docs/measurement-uncertainty.md).
 * An unknown column refuses the manifest (a misspelt column would otherwise be
 * silently ignored).
 *
 * <p>Each row is imported in its own transaction: a refused row (unreadable file, missing file, bad
 * cell) stores nothing and the others go on.
 */
public final class BatchImport {

    /** Told before each file is imported, so a terminal can draw a progress bar. */
    public interface Progress {
        void next(int done, int total, String file);

        Progress NONE = (done, total, file) -> { };
    }

    static final List<String> REQUIRED = List.of("file", "material");
    static final List<String> COLUMNS = List.of("file", "material", "thickness", "geometry", "provenance", "instrument",
            "date", "notes", "lot", "class", "scaling", "index_n", "format", "y_kind", "detection_limit", "stock",
            "made_range", "from", "to", "block", "each_block", "x_unit", "x_column", "y_column",
            "decimal_mark", "uncertainty");

    /**
     * A keep range for every row of a batch (the CLI's {@code --from}/{@code --to}); a row's own {@code from}
     * or {@code to} cell replaces it on that side.
     */
    public record KeepDefault(OptionalDouble fromNm, OptionalDouble toNm) {
        public static final KeepDefault NONE = new KeepDefault(OptionalDouble.empty(), OptionalDouble.empty());

        public KeepDefault {
            fromNm = fromNm == null ? OptionalDouble.empty() : fromNm;
            toNm = toNm == null ? OptionalDouble.empty() : toNm;
        }
    }

    private final ImportService imports;
    private final JooqLibraryRepository library;
    private final ImportProperties limits;

    public BatchImport(ImportService imports, JooqLibraryRepository library, ImportProperties limits) {
        this.imports = imports;
        this.library = library;
        this.limits = limits;
    }

    /** A folder, or a file ending in {@code .zip}. */
    public BatchReport run(Path path, Progress progress) throws ImportException {
        return run(path, KeepDefault.NONE, progress);
    }

    /** A folder, or a file ending in {@code .zip}, every row keeping {@code keep} unless it says otherwise. */
    public BatchReport run(Path path, KeepDefault keep, Progress progress) throws ImportException {
        if (Files.isDirectory(path)) {
            return run(new BatchSource.Folder(path, limits), keep, progress);
        }
        String name = String.valueOf(path.getFileName());
        try {
            long size = Files.size(path);
            if (size > limits.maxZipBytes()) {
                throw new ImportLimitException(name, ImportLimitException.Kind.SIZE, "sieve.imports.max-zip-bytes",
                        "the zip has " + size + " bytes, more than the " + limits.maxZipBytes() + " allowed");
            }
            try (BatchSource.Zip zip = BatchSource.Zip.open(ImportService.cleanName(name), path, limits)) {
                return run(zip, keep, progress);
            }
        } catch (IOException e) {
            throw ImportException.ofSource(name, "cannot read: " + e.getMessage());
        }
    }

    public BatchReport zip(String name, byte[] zip, Progress progress) throws ImportException {
        try (BatchSource.Zip source = BatchSource.Zip.of(ImportService.cleanName(name), zip, limits)) {
            return run(source, KeepDefault.NONE, progress);
        }
    }

    private BatchReport run(BatchSource source, KeepDefault keep, Progress progress) throws ImportException {
        List<Row> rows = manifest(source);
        List<FileReport> reports = new ArrayList<>();
        Set<String> named = new LinkedHashSet<>();
        for (int i = 0; i < rows.size(); i++) {
            Row row = rows.get(i);
            progress.next(i, rows.size(), row.file());
            named.add(BatchSource.normalise(row.file()));
            reports.add(importRow(source, row, keep));
        }
        progress.next(rows.size(), rows.size(), "");
        List<String> unlisted = source.files().stream().filter(f -> !named.contains(f)).toList();
        return new BatchReport(source.name, reports, unlisted);
    }

    private record Row(int line, Map<String, String> cells) {
        String get(String column) {
            String v = cells.get(column);
            return v == null || v.isBlank() ? null : v.strip();
        }

        String file() {
            return cells.getOrDefault("file", "").strip();
        }
    }

    private static List<Row> manifest(BatchSource source) throws ImportException {
        String where = source.name + "/" + BatchSource.MANIFEST;
        byte[] bytes = source.manifest();
        String text = new String(bytes, StandardCharsets.UTF_8);
        if (text.startsWith("\uFEFF")) {
            text = text.substring(1);
        }
        List<CSVRecord> records;
        try (CSVParser parser = CSVParser.parse(new StringReader(text), CSVFormat.DEFAULT.builder()
                .setIgnoreSurroundingSpaces(true).setIgnoreEmptyLines(false).get())) {
            records = parser.getRecords();
        } catch (IOException | RuntimeException e) {
            throw ImportException.ofSource(where, "cannot be read as CSV: " + e.getMessage());
        }
        if (records.isEmpty()) {
            throw ImportException.ofSource(where, "is empty; its first line names the columns, e.g. " + String.join(",", COLUMNS.subList(0, 8)));
        }
        List<String> header = new ArrayList<>();
        for (String h : records.get(0)) {
            String column = h.strip().toLowerCase(Locale.ROOT).replace(' ', '_');
            if (!COLUMNS.contains(column)) {
                throw new ImportException(where, 1, h, "unknown column; the columns are " + COLUMNS);
            }
            if (header.contains(column)) {
                throw new ImportException(where, 1, h, "column given twice");
            }
            header.add(column);
        }
        for (String required : REQUIRED) {
            if (!header.contains(required)) {
                throw new ImportException(where, 1, required, "required column missing; the header is " + header);
            }
        }
        List<Row> rows = new ArrayList<>();
        for (int r = 1; r < records.size(); r++) {
            CSVRecord record = records.get(r);
            if (record.size() == 1 && record.get(0).isBlank()) {
                continue; // a blank line
            }
            Map<String, String> cells = new HashMap<>();
            for (int c = 0; c < header.size() && c < record.size(); c++) {
                cells.put(header.get(c), record.get(c));
            }
            int line = (int) record.getRecordNumber();
            if (record.size() > header.size()) {
                cells.put("_error", "line has " + record.size() + " cells, the header " + header.size());
            }
            rows.add(new Row(line, cells));
        }
        return rows;
    }

    private FileReport importRow(BatchSource source, Row row, KeepDefault keep) {
        String file = row.file();
        try {
            if (row.cells().containsKey("_error")) {
                throw new ImportRequestException("manifest", row.cells().get("_error"));
            }
            if (file.isEmpty()) {
                throw new ImportRequestException("file", "no file named in this row");
            }
            String material = row.get("material");
            if (material == null) {
                throw new ImportRequestException("material", "no material named in this row");
            }
            ImportTarget target = target(row, material);
            ImportOptions options = new ImportOptions(OptionText.format("format", row.get("format")),
                    OptionText.yKind("y_kind", row.get("y_kind")),
                    OptionText.decimalMark("decimal_mark", row.get("decimal_mark")), Replicates.FIRST, false,
                    OptionText.number("detection_limit", row.get("detection_limit")), OptionalDouble.empty(),
                    OptionalDouble.empty())
                    .withStatedUncertainty(OptionText.statedUncertainty("uncertainty", row.get("uncertainty")));
            options = keepRange(options, row, keep);
            options = OptionText.withBlocks(options, "block", row.get("block"), "each_block", row.get("each_block"));
            options = OptionText.withAxes(options, "x_unit", row.get("x_unit"), "x_column", row.get("x_column"),
                    "y_column", row.get("y_column"));
            SampleFields fields = new SampleFields(OptionText.thicknessOrNull("thickness", row.get("thickness")),
                    OptionText.geometry("geometry", row.get("geometry")), OptionText.provenance("provenance", row.get("provenance")),
                    OptionText.line("instrument", row.get("instrument"), NewSample.MAX_INSTRUMENT),
                    OptionText.date("date", row.get("date")), OptionText.line("lot", row.get("lot"), NewSample.MAX_LOT),
                    OptionText.paragraph("notes", row.get("notes"), NewSample.MAX_NOTES));
            byte[] bytes = source.read(file);
            ImportResult result = imports.store(file, bytes, options, target, fields);
            return new FileReport(row.line(), file, result.duplicate() ? Outcome.DUPLICATE : Outcome.STORED,
                    result.materialId(), result.materialSlug(), result.sampleId(), null, result.warnings(),
                    result.sampleIds());
        } catch (ImportException | IngestException | ImportLimitException | ImportRequestException | NotFoundException
                 | RetiredException e) {
            return refused(row, file, e.getMessage());
        } catch (IllegalArgumentException e) {
            return refused(row, file, e.getMessage());
        }
    }

    /** The row's {@code from}/{@code to} cells, each side falling back to the batch-wide default. */
    private static ImportOptions keepRange(ImportOptions options, Row row, KeepDefault keep) {
        String from = row.get("from") != null ? row.get("from") : text(keep.fromNm());
        String to = row.get("to") != null ? row.get("to") : text(keep.toNm());
        return OptionText.keepRange(options, "from", from, "to", to);
    }

    private static String text(OptionalDouble v) {
        return v.isPresent() ? Double.toString(v.getAsDouble()) : null;
    }

    private static FileReport refused(Row row, String file, String message) {
        return new FileReport(row.line(), file, Outcome.REFUSED, null, row.get("material"), null,
                "manifest line " + row.line() + ": " + message, List.of());
    }

    /** Slug first (exact), then name (ignoring case), else a new material described by the row. */
    private ImportTarget target(Row row, String material) {
        Optional<Long> id = library.findMaterialIdBySlug(material).or(() -> library.findMaterialIdByName(material));
        if (id.isPresent()) {
            return new ImportTarget.ExistingMaterial(id.get());
        }
        if (row.get("class") == null && row.get("scaling") == null) {
            throw new ImportRequestException("material", "'" + material + "' is neither a slug nor a name in the library;"
                    + " to create it give its class and scaling in the columns class and scaling");
        }
        OptionalDouble n = OptionText.number("index_n", row.get("index_n"));
        ConstantIndex index = null;
        if (n.isPresent()) {
            try {
                index = new ConstantIndex(n.getAsDouble());
            } catch (IllegalArgumentException e) {
                throw new ImportRequestException("index_n", e.getMessage());
            }
        }
        return new ImportTarget.NewMaterial(OptionText.line("material", material, NewMaterial.MAX_NAME),
                OptionText.materialClass("class", row.get("class")),
                OptionText.scaling("scaling", row.get("scaling")), index, "",
                OptionText.thicknesses("stock", row.get("stock"), "made_range", row.get("made_range")));
    }
}
