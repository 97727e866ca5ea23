package org.spectralsieve.ingest;

import java.io.StringReader;
import java.nio.ByteBuffer;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Map;
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
 */
public final class FileImport {

    /** Lines looked at when sniffing: comments and header sit at the top of every format read here. */
    private static final int SNIFF_LINES = 200;
    private static final Pattern CAPTURE_COLUMN = Pattern.compile("(dark|reference|ref)([ _@.-].*|\\d.*)?");
    private static final Pattern METADATA = Pattern.compile("#\\s*([A-Za-z_ ]+?)\\s*[:=]\\s*(.*)");

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
        try {
            return switch (format) {
                case JCAMP_DX -> fromSpectrum(format, bytes, jcamp(fileName, text, options), options, warnings);
                case DATASHEET_POINTS -> fromSpectrum(format, bytes,
                        new DatasheetPointsReader().read(fileName, new StringReader(text), readOptions(options)), options,
                        warnings);
                case RAW_COUNTS -> rawCounts(fileName, bytes, text, options, warnings);
                case DELIMITED -> fromSpectrum(format, bytes,
                        new DelimitedTextReader().read(fileName, new StringReader(text), readOptions(options)), options,
                        warnings);
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
        for (String token : line.toLowerCase(Locale.ROOT).split("[,;\\t]|\\s{2,}")) {
            String t = token.strip().replaceAll("^\"|\"$", "");
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
        return r;
    }

    private static ParsedSpectrum jcamp(String fileName, String text, ImportOptions o) throws ImportException {
        JcampOptions options = JcampOptions.defaults();
        if (o.yKind().isPresent()) {
            options = options.withYKind(o.yKind().get());
        }
        return new JcampReader().read(fileName, new StringReader(text), options);
    }

    private FilePreview fromSpectrum(ImportFormat format, byte[] bytes, ParsedSpectrum s, ImportOptions o,
                                     List<String> warnings) throws ImportException {
        return withUncertainty(readSpectrum(format, bytes, s, o, warnings), s, o);
    }

    /** The preview with the measurement uncertainty of {@link MeasurementUncertainty} on its curve. */
    private static FilePreview withUncertainty(FilePreview preview, ParsedSpectrum s, ImportOptions o) {
        List<String> warnings = new ArrayList<>(preview.warnings());
        var applied = MeasurementUncertainty.apply(s, preview.curve(), o.statedUncertainty(), warnings);
        return preview.withUncertainty(applied, warnings);
    }

    private FilePreview readSpectrum(ImportFormat format, byte[] bytes, ParsedSpectrum s, ImportOptions o,
                                     List<String> warnings) throws ImportException {
        checkPoints(s.sourceName(), s.size());
        double limit = o.detectionLimit().isPresent() ? o.detectionLimit().getAsDouble() : metadataLimit(s);
        List<String> all = new ArrayList<>(warnings);
        all.addAll(s.warnings());
        // a clamped floor is a detection limit the file does not state; a stated limit is never lowered
        var floor = InstrumentFloor.find(s.wavelengthsNm(), s.transmittanceFractions());
        if (floor.isPresent() && floor.get().raise(limit) > limit) {
            limit = floor.get().raise(limit);
            all.add(floor.get().warning());
        }
        Curve curve = CurveIngest.toCurve(s, limit, all);
        Provenance provenance = format == ImportFormat.DATASHEET_POINTS ? Provenance.DATASHEET : provenanceFrom(s.metadata());
        return new FilePreview(s.sourceName(), format, s.xUnit(), s.yKind(), curve, limit, provenance, s.metadata(), all,
                Checksums.sha256(bytes));
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
        double[] t = s.transmittanceFractions();
        boolean[] below = s.upperBounds();
        double[] limits = result.detectionLimits();
        double floor = o.detectionLimit().orElse(0);
        for (int i = 0; i < t.length; i++) {
            // a limit set by the user can only raise the computed one: the 3σ limit is what the data supports
            limits[i] = Math.max(limits[i], floor);
            below[i] = below[i] || t[i] <= limits[i];
        }
        List<String> all = new ArrayList<>(warnings);
        all.addAll(s.warnings());
        OutOfRangeReadings.settle(fileName, s.wavelengthsNm(), t, below, limits, all);
        Curve curve;
        try {
            curve = Curve.of(s.wavelengthsNm(), t, below, limits);
        } catch (CurveException e) {
            throw new IngestException(fileName, "transmittance", e.getMessage());
        }
        return withUncertainty(new FilePreview(fileName, ImportFormat.RAW_COUNTS, s.xUnit(), YKind.TRANSMITTANCE_FRACTION, curve,
                Arrays.stream(limits).max().orElse(0), Provenance.MEASURED, s.metadata(), all, Checksums.sha256(bytes)), s, o);
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
