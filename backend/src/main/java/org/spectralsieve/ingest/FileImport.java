package org.spectralsieve.ingest;

import java.io.StringReader;
import java.nio.ByteBuffer;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.function.IntFunction;
import java.util.regex.Pattern;
import org.spectralsieve.importers.DatasheetPointsReader;
import org.spectralsieve.importers.DelimitedTextReader;
import org.spectralsieve.importers.ImportException;
import org.spectralsieve.importers.ParsedSpectrum;
import org.spectralsieve.importers.RawCountsOptions;
import org.spectralsieve.importers.RawCountsReader;
import org.spectralsieve.importers.RawCountsResult;
import org.spectralsieve.importers.ReadOptions;
import org.spectralsieve.importers.YKind;
import org.spectralsieve.importers.jcamp.BlockOutline;
import org.spectralsieve.importers.jcamp.JcampBlock;
import org.spectralsieve.importers.jcamp.JcampOptions;
import org.spectralsieve.importers.jcamp.JcampReader;
import org.spectralsieve.library.Provenance;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.CurveException;

/**
 * Reads one uploaded file into a {@link FilePreview}: decides its format, hands it to the matching
 * reader, and turns what the reader gives into a core curve (transmittance fractions, detection limit
 * applied). Stores nothing.
 *
 * <p>Format, first that applies: the {@code format} option; a JCAMP-DX extension ({@code .jdx},
 * {@code .dx}, {@code .jcamp}); content: a first line starting {@code ##} is JCAMP-DX, {@code # role:}
 * or a header naming a {@code dark} or {@code reference} column is raw counts, {@code # axis:} or
 * {@code # provenance: datasheet} is datasheet points; otherwise delimited text.
 *
 * <p>Text is read as UTF-16 when it starts with a UTF-16 byte-order mark (LE or BE; some instrument
 * software saves "Unicode" text that way), otherwise as strict UTF-8, falling back to Latin-1 with a
 * warning (older instrument software writes Latin-1 µ and °). A file holding a NUL byte is refused as binary.
 *
 * <p>The curve holds the part of the file's axis that {@link KeptRange} chooses: the {@code from}/{@code to}
 * options, else the whole axis without a {@link NoiseRegion} at either end; every point left out is counted
 * in a warning, and the stored original file stays whole.
 */
public final class FileImport {

    /** Lines looked at when sniffing: comments and header sit at the top of every format read here. */
    private static final int SNIFF_LINES = 200;
    /**
     * What {@code String.split} and {@code replaceAll} compiled again for every token of every sniffed line (a
     * fiftieth of the load benchmark's CPU went to format sniffing): the same patterns, compiled once.
     */
    private static final Pattern HEADER_SEPARATOR = Pattern.compile("[,;\\t]|\\s{2,}");
    private static final Pattern OUTER_QUOTE = Pattern.compile("^\"|\"$");
    private static final Pattern CAPTURE_COLUMN = Pattern.compile("(dark|reference|ref)([ _@.-].*|\\d.*)?");
    private static final Pattern METADATA = Pattern.compile("#\\s*([A-Za-z_ ]+?)\\s*[:=]\\s*(.*)");
    private static final Pattern LINE_BREAK = Pattern.compile("\r\n|\r|\n");
    /** Longest line quoted in a message. */
    private static final int QUOTED_LINE = 100;

    private final int maxPoints;

    /** @param maxPoints the most points a curve may have ({@code sieve.imports.max-points}) */
    public FileImport(int maxPoints) {
        if (maxPoints < ParsedSpectrum.MIN_POINTS) {
            throw new IllegalArgumentException("maxPoints must be at least " + ParsedSpectrum.MIN_POINTS + ", got " + maxPoints);
        }
        this.maxPoints = maxPoints;
    }

    /**
     * @throws ImportException naming file, line and field when the file cannot be read
     * @throws IngestException when it reads but cannot form a curve (e.g. T far below 0)
     * @throws ImportLimitException when the curve has more points than allowed
     */
    public FilePreview read(String fileName, byte[] bytes, ImportOptions options) throws ImportException {
        List<String> warnings = new ArrayList<>();
        String text = decodeText(fileName, bytes, warnings);
        ImportFormat format = options.format().orElseGet(() -> detect(fileName, text));
        CurveShapeCheck.refuseNonTransmittance(fileName, text, format, options);
        refuseBlocksOutsideJcamp(fileName, format, options);
        try {
            return switch (format) {
                case JCAMP_DX -> jcampPreview(fileName, bytes, text, options, warnings);
                case DATASHEET_POINTS -> fromSpectrum(format, bytes,
                        new DatasheetPointsReader().read(fileName, new StringReader(text), readOptions(options)), options,
                        warnings, text);
                case RAW_COUNTS -> rawCounts(fileName, bytes, text, options, warnings);
                case DELIMITED -> fromSpectrum(format, bytes,
                        new DelimitedTextReader().read(fileName, new StringReader(text), readOptions(options)), options,
                        warnings, text);
            };
        } catch (IllegalArgumentException e) {
            // readers validate their own results with IllegalArgumentException; for the user it is a bad file
            if (e instanceof CurveException) {
                throw new IngestException(fileName, "transmittance", e.getMessage());
            }
            throw new ImportException(fileName, 0, null, "cannot be read as " + format.label() + ": " + e.getMessage(), e);
        }
    }

    /** The format content and name suggest; see the class comment for the order of the rules. */
    public static ImportFormat detect(String fileName, String text) {
        String name = fileName.toLowerCase(Locale.ROOT);
        if (name.endsWith(".jdx") || name.endsWith(".dx") || name.endsWith(".jcamp")) {
            return ImportFormat.JCAMP_DX;
        }
        boolean datasheet = false;
        boolean first = true;
        int seen = 0;
        for (String raw : (Iterable<String>) text.lines()::iterator) {
            String line = raw.strip();
            if (line.isEmpty()) {
                continue;
            }
            if (first && line.startsWith("##")) {
                return ImportFormat.JCAMP_DX;
            }
            first = false;
            var m = METADATA.matcher(line);
            if (m.matches()) {
                String key = m.group(1).strip().toLowerCase(Locale.ROOT);
                String value = m.group(2).strip().toLowerCase(Locale.ROOT);
                if (key.equals("role")) {
                    return ImportFormat.RAW_COUNTS;
                }
                datasheet |= key.equals("axis") || key.equals("provenance") && value.equals("datasheet");
            } else if (!line.startsWith("#") && headerNamesCaptures(line)) {
                return ImportFormat.RAW_COUNTS;
            }
            if (++seen >= SNIFF_LINES) {
                break;
            }
        }
        return datasheet ? ImportFormat.DATASHEET_POINTS : ImportFormat.DELIMITED;
    }

    private static boolean headerNamesCaptures(String line) {
        for (String token : HEADER_SEPARATOR.split(line.toLowerCase(Locale.ROOT))) {
            String t = OUTER_QUOTE.matcher(token.strip()).replaceAll("");
            if (CAPTURE_COLUMN.matcher(t).matches()) {
                return true;
            }
        }
        return false;
    }

    /**
     * The file's text: strict UTF-8, else Latin-1 with a warning added to {@code warnings}; refused when
     * empty or holding a NUL byte (binary). Shared with the import of reference spectra.
     */
    public static String decodeText(String fileName, byte[] bytes, List<String> warnings) throws ImportException {
        if (bytes.length == 0) {
            throw ImportException.ofSource(fileName, "the file is empty");
        }
        // a byte-order mark is the only safe sign of UTF-16: without it, its NUL bytes look binary
        if (bytes.length >= 2 && (bytes[0] & 0xFF) == 0xFF && (bytes[1] & 0xFF) == 0xFE) {
            return utf16(fileName, bytes, StandardCharsets.UTF_16LE);
        }
        if (bytes.length >= 2 && (bytes[0] & 0xFF) == 0xFE && (bytes[1] & 0xFF) == 0xFF) {
            return utf16(fileName, bytes, StandardCharsets.UTF_16BE);
        }
        for (int i = 0; i < bytes.length; i++) {
            if (bytes[i] == 0) {
                throw ImportException.ofSource(fileName, "not a text file (a NUL byte at offset " + i
                        + "); export the curve as CSV, TSV or JCAMP-DX");
            }
        }
        try {
            return StandardCharsets.UTF_8.newDecoder().onMalformedInput(CodingErrorAction.REPORT)
                    .onUnmappableCharacter(CodingErrorAction.REPORT).decode(ByteBuffer.wrap(bytes)).toString();
        } catch (CharacterCodingException e) {
            warnings.add("not valid UTF-8; read as Latin-1 (ISO 8859-1)");
            return new String(bytes, StandardCharsets.ISO_8859_1);
        }
    }

    private static String utf16(String fileName, byte[] bytes, java.nio.charset.Charset charset)
            throws ImportException {
        try {
            String text = charset.newDecoder().onMalformedInput(CodingErrorAction.REPORT)
                    .onUnmappableCharacter(CodingErrorAction.REPORT)
                    .decode(ByteBuffer.wrap(bytes, 2, bytes.length - 2)).toString();
            if (text.isEmpty()) {
                throw ImportException.ofSource(fileName, "the file is empty");
            }
            return text;
        } catch (CharacterCodingException e) {
            throw ImportException.ofSource(fileName, "starts with a " + charset.name()
                    + " byte-order mark but is not valid " + charset.name());
        }
    }

    private static ReadOptions readOptions(ImportOptions o) {
        ReadOptions r = ReadOptions.defaults().replicates(o.replicates()).mergeDuplicates(o.mergeDuplicates());
        if (o.yKind().isPresent()) {
            r = r.withYKind(o.yKind().get());
        }
        if (o.decimalMark().isPresent()) {
            r = r.decimalMark(o.decimalMark().get());
        }
        if (o.xUnit().isPresent()) {
            r = r.xUnit(o.xUnit().get());
        }
        return r.columns(o.xColumn(), o.yColumn());
    }

    private static JcampOptions jcampOptions(ImportOptions o) {
        // the same overrides as delimited text: y kind, x unit (columns and a decimal comma are noted as not applying)
        return new JcampOptions(readOptions(o), JcampOptions.defaults().block());
    }

    /** Only a JCAMP-DX file has blocks: a block option on another format is a mistake, not something to ignore. */
    private static void refuseBlocksOutsideJcamp(String fileName, ImportFormat format, ImportOptions o) {
        if (format != ImportFormat.JCAMP_DX && (o.block().isPresent() || o.eachBlock())) {
            throw new ImportRequestException(o.block().isPresent() ? "block" : "eachBlock", "only a JCAMP-DX file holds"
                    + " blocks; " + fileName + " is read as " + format.label());
        }
    }

    /**
     * A JCAMP-DX file: the block the options choose (the first with data by default) as the preview's curve,
     * with the warning listing the blocks left out; with {@code eachBlock}, the first readable block's curve.
     * Every block with data is listed, each tried as a transmittance curve so that the list says which
     * cannot be one before anything is stored.
     */
    private FilePreview jcampPreview(String fileName, byte[] bytes, String text, ImportOptions o, List<String> warnings)
            throws ImportException {
        JcampReader reader = new JcampReader();
        List<JcampBlock> all = reader.blocks(fileName, new StringReader(text));
        List<JcampBlock> withData = all.stream().filter(JcampBlock::hasData).toList();
        if (withData.isEmpty()) {
            return fromSpectrum(ImportFormat.JCAMP_DX, bytes, reader.read(fileName, all, jcampOptions(o)), o, warnings, text);
        }
        requireKnownBlock(fileName, withData, o);
        if (!o.eachBlock()) {
            JcampBlock chosen = o.block().isPresent() ? all.get(o.block().getAsInt()) : withData.get(0);
            FilePreview p = fromSpectrum(ImportFormat.JCAMP_DX, bytes,
                    reader.read(fileName, all, jcampOptions(o).withBlock(chosen.index())), o, warnings, text);
            Map<Integer, String> problems = problems(fileName, bytes, text, withData, chosen, o);
            List<FileBlock> list = withData.stream().map(b -> FileBlock.of(BlockOutline.of(b, o.xUnit()), b == chosen,
                    problems.get(b.index()))).toList();
            return p.withBlocks(list, List.of());
        }
        Map<Integer, String> problems = problems(fileName, bytes, text, withData, null, o);
        List<FileBlock> list = withData.stream().map(b -> FileBlock.of(BlockOutline.of(b, o.xUnit()), true,
                problems.get(b.index()))).toList();
        JcampBlock first = withData.stream().filter(b -> !problems.containsKey(b.index())).findFirst()
                .orElseThrow(() -> new ImportException(fileName, withData.get(0).startLine(), null,
                        eachBlockRefusal(list)));
        FilePreview p = fromSpectrum(ImportFormat.JCAMP_DX, bytes, reader.readOne(fileName, first, jcampOptions(o)), o,
                warnings, text);
        List<String> more = new ArrayList<>();
        more.add("each of the file's " + withData.size() + " blocks would be stored as its own sample of the material;"
                + " this preview shows " + FileBlock.of(BlockOutline.of(first, o.xUnit()), true, null).label());
        if (!problems.isEmpty()) {
            more.add("an import with eachBlock would be refused: " + eachBlockRefusal(list));
        }
        return p.withBlocks(list, more);
    }

    /**
     * Every block with data of a JCAMP-DX file, each read as its own curve for an import with
     * {@code eachBlock}: all of them, or, when any cannot be a transmittance curve, an
     * {@link ImportException} naming each such block and why, so that nothing is stored.
     */
    public List<FilePreview> readEachBlock(String fileName, byte[] bytes, ImportOptions options)
            throws ImportException {
        if (!options.eachBlock()) {
            throw new IllegalArgumentException("readEachBlock needs options with eachBlock");
        }
        FilePreview listing = read(fileName, bytes, options); // refuses other formats and files without data
        List<String> warnings = new ArrayList<>();
        String text = decodeText(fileName, bytes, warnings);
        List<FileBlock> list = listing.blocks();
        if (list.stream().anyMatch(b -> !b.readable())) {
            throw ImportException.ofSource(fileName, eachBlockRefusal(list));
        }
        JcampReader reader = new JcampReader();
        List<JcampBlock> all = reader.blocks(fileName, new StringReader(text));
        List<FilePreview> previews = new ArrayList<>();
        for (FileBlock b : list) {
            JcampBlock block = all.get(b.number());
            previews.add(fromSpectrum(ImportFormat.JCAMP_DX, bytes, reader.readOne(fileName, block, jcampOptions(options)),
                    options, warnings, text).withBlocks(list, List.of()));
        }
        return previews;
    }

    /** Refused when the number is not that of a block with data, naming the blocks there are. */
    private static void requireKnownBlock(String fileName, List<JcampBlock> withData, ImportOptions o) {
        if (o.block().isEmpty()) {
            return;
        }
        int wanted = o.block().getAsInt();
        if (withData.stream().noneMatch(b -> b.index() == wanted)) {
            StringBuilder there = new StringBuilder();
            for (JcampBlock b : withData) {
                there.append(there.isEmpty() ? "" : ", ").append(FileBlock.of(BlockOutline.of(b, o.xUnit()), false, null).label());
            }
            throw new ImportRequestException("block", "block " + wanted + " is not a spectrum of " + fileName + "; its "
                    + (withData.size() == 1 ? "only block with data is " : withData.size() + " blocks with data are ")
                    + there + " (the numbers the preview lists)");
        }
    }

    /** Why each block other than {@code skip} cannot be a transmittance curve, by block number; readable ones are absent. */
    private Map<Integer, String> problems(String fileName, byte[] bytes, String text, List<JcampBlock> blocks, JcampBlock skip,
                                          ImportOptions o) {
        Map<Integer, String> problems = new HashMap<>();
        if (blocks.size() < 2 && skip != null) {
            return problems;
        }
        JcampReader reader = new JcampReader();
        for (JcampBlock b : blocks) {
            if (b == skip) {
                continue;
            }
            try {
                fromSpectrum(ImportFormat.JCAMP_DX, bytes, reader.readOne(fileName, b, jcampOptions(o)), o, new ArrayList<>(), text);
            } catch (ImportException | IngestException | ImportLimitException | IllegalArgumentException e) {
                problems.put(b.index(), e.getMessage());
            }
        }
        return problems;
    }

    private static String eachBlockRefusal(List<FileBlock> list) {
        StringBuilder why = new StringBuilder("eachBlock stores every block or none, and ");
        List<FileBlock> bad = list.stream().filter(b -> !b.readable()).toList();
        for (int i = 0; i < bad.size(); i++) {
            why.append(i == 0 ? "" : "; ").append(bad.get(i).label()).append(" cannot be read as a transmittance curve: ")
                    .append(bad.get(i).problem());
        }
        List<Integer> good = list.stream().filter(FileBlock::readable).map(FileBlock::number).toList();
        why.append(good.isEmpty() ? ". No block of the file can be stored as a curve"
                : ". Import the readable " + (good.size() == 1 ? "block" : "blocks") + " " + good
                        + " one at a time with the block option");
        return why.toString();
    }

    private FilePreview fromSpectrum(ImportFormat format, byte[] bytes, ParsedSpectrum s, ImportOptions o,
                                     List<String> warnings, String text) throws ImportException {
        return withUncertainty(readSpectrum(format, bytes, s, o, warnings, text), s, o);
    }

    /** The preview with the measurement uncertainty of {@link MeasurementUncertainty} on its curve. */
    private static FilePreview withUncertainty(FilePreview preview, ParsedSpectrum s, ImportOptions o) {
        List<String> warnings = new ArrayList<>(preview.warnings());
        var applied = MeasurementUncertainty.apply(s, preview.curve(), o.statedUncertainty(), warnings);
        return preview.withUncertainty(applied, warnings);
    }

    private FilePreview readSpectrum(ImportFormat format, byte[] bytes, ParsedSpectrum s, ImportOptions o,
                                     List<String> warnings, String text) throws ImportException {
        IntFunction<String> lineText = lineText(text);
        checkPoints(s.sourceName(), s.size());
        double limit = o.detectionLimit().isPresent() ? o.detectionLimit().getAsDouble() : metadataLimit(s);
        List<String> all = new ArrayList<>(warnings);
        all.addAll(s.warnings());
        // noise is judged on the file's whole axis as read, before any limit or flag changes a value
        double[] axis = s.wavelengthsNm();
        KeptRange kept = KeptRange.choose(axis, NoiseRegion.find(axis, s.transmittanceFractions()), o);
        all.addAll(kept.warnings(axis));
        s = kept.isWhole() ? s : s.slice(kept.firstIndex(), kept.lastIndex() + 1);
        all.addAll(s.sampleMetadata().notes()); // a thickness or date the file gives but that cannot be used
        // a clamped floor is a detection limit the file does not state; a stated limit is never lowered
        var floor = InstrumentFloor.find(s.wavelengthsNm(), s.transmittanceFractions());
        if (floor.isPresent() && floor.get().raise(limit) > limit) {
            limit = floor.get().raise(limit);
            all.add(floor.get().warning());
        }
        Curve curve = CurveIngest.toCurve(s, limit, all, lineText);
        InfraredOnly.warning(curve).ifPresent(all::add);
        Provenance provenance = format == ImportFormat.DATASHEET_POINTS ? Provenance.DATASHEET : provenanceFrom(s.metadata());
        return new FilePreview(s.sourceName(), format, s.xUnit(), s.yKind(), curve, limit, provenance, s.metadata(), all,
                Checksums.sha256(bytes), kept);
    }

    /**
     * The text of a 1-based line as the file has it (stripped), for quoting in a refusal; null when it is
     * longer than {@value #QUOTED_LINE} characters (a packed JCAMP-DX line tells a reader nothing). Lines are
     * split as {@link java.io.BufferedReader#readLine} splits them, so the numbers match the readers'.
     */
    static IntFunction<String> lineText(String text) {
        return line -> {
            String[] lines = LINE_BREAK.split(text, line + 1);
            if (line < 1 || line > lines.length) {
                return null;
            }
            String l = lines[line - 1];
            int end = l.indexOf('\n');
            l = (end >= 0 ? l.substring(0, end) : l).strip();
            return l.length() <= QUOTED_LINE ? l : null;
        };
    }

    private FilePreview rawCounts(String fileName, byte[] bytes, String text, ImportOptions o, List<String> warnings)
            throws ImportException {
        RawCountsOptions options = RawCountsOptions.defaults();
        if (o.fullScale().isPresent()) {
            options = options.fullScale(o.fullScale().getAsDouble());
        }
        if (o.strayLightFloor().isPresent()) {
            options = options.strayLightFloor(o.strayLightFloor().getAsDouble());
        }
        RawCountsResult result = new RawCountsReader().read(fileName, new StringReader(text)).transmittance(options);
        ParsedSpectrum s = result.spectrum();
        checkPoints(fileName, s.size());
        // raw counts are not searched for noise regions: their per-point 3σ limit already bounds low signal
        double[] axis = s.wavelengthsNm();
        KeptRange kept = KeptRange.choose(axis, List.of(), o);
        int from = kept.firstIndex();
        int to = kept.lastIndex() + 1;
        double[] nm = Arrays.copyOfRange(axis, from, to);
        double[] t = Arrays.copyOfRange(s.transmittanceFractions(), from, to);
        boolean[] below = Arrays.copyOfRange(s.upperBounds(), from, to);
        double[] limits = Arrays.copyOfRange(result.detectionLimits(), from, to);
        double floor = o.detectionLimit().orElse(0);
        for (int i = 0; i < t.length; i++) {
            // a limit set by the user can only raise the computed one: the 3σ limit is what the data supports
            limits[i] = Math.max(limits[i], floor);
            below[i] = below[i] || t[i] <= limits[i];
        }
        List<String> all = new ArrayList<>(warnings);
        all.addAll(s.warnings());
        all.addAll(kept.warnings(axis));
        all.addAll(s.sampleMetadata().notes());
        OutOfRangeReadings.settle(fileName, nm, t, below, limits, all);
        Curve curve;
        try {
            curve = Curve.of(nm, t, below, limits);
        } catch (CurveException e) {
            throw new IngestException(fileName, "transmittance", e.getMessage());
        }
        InfraredOnly.warning(curve).ifPresent(all::add);
        return withUncertainty(new FilePreview(fileName, ImportFormat.RAW_COUNTS, s.xUnit(), YKind.TRANSMITTANCE_FRACTION, curve,
                Arrays.stream(limits).max().orElse(0), Provenance.MEASURED, s.metadata(), all, Checksums.sha256(bytes),
                kept), s, o);
    }

    private void checkPoints(String fileName, int points) {
        if (points > maxPoints) {
            throw new ImportLimitException(fileName, ImportLimitException.Kind.COUNT, "sieve.imports.max-points",
                    "the curve has " + points + " points, more than the " + maxPoints
                            + " allowed (sieve.imports.max-points); resample it coarser before importing");
        }
    }

    /** {@code detection_limit} from the file as a fraction ({@code 0.001}) or percent ({@code 0.1%}); else 0. */
    static double metadataLimit(ParsedSpectrum s) throws ImportException {
        String text = s.metadata().get("detection_limit");
        if (text == null || text.isBlank()) {
            return 0;
        }
        String t = text.strip();
        boolean percent = t.endsWith("%");
        try {
            double v = Double.parseDouble(percent ? t.substring(0, t.length() - 1).strip() : t);
            v = percent ? v / 100 : v;
            if (v >= 0 && v < 1) {
                return v;
            }
        } catch (NumberFormatException e) {
            // reported below with the value as written
        }
        throw new ImportException(s.sourceName(), 0, "detection_limit",
                "must be a transmittance fraction in [0, 1) such as 0.001, or a percent such as 0.1%, was '" + text + "'");
    }

    private static Provenance provenanceFrom(Map<String, String> metadata) {
        String p = metadata.get("provenance");
        if (p != null) {
            for (Provenance v : Provenance.values()) {
                if (v.label().equalsIgnoreCase(p.strip())) {
                    return v;
                }
            }
        }
        return Provenance.MEASURED;
    }
}
