package org.spectralsieve.importers;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.EnumMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Reads raw detector captures from delimited text (same layout rules as {@link DelimitedTextReader}):
 * one wavelength column plus one column per capture. A column's role comes from its name:
 *
 * <ul>
 *   <li>{@code dark}, {@code reference} (or {@code ref}), {@code sample} (or {@code measured});</li>
 *   <li>a generic {@code counts}, {@code signal} or {@code intensity} column takes its role from
 *       {@code # role: dark|reference|sample}, and is a sample when the file gives none;</li>
 *   <li>an exposure may follow the role ({@code sample_10ms}, {@code sample 100 ms}); a replicate number
 *       may end the name ({@code dark.2}: repeated dark scans).</li>
 * </ul>
 *
 * Exposure in ms, first found of: the column name; {@code # <role>_exposure_ms: 100}; {@code # exposure_ms:
 * 100}; {@link #withExposureMs}. Scans averaged: {@code # <role>_scans}, {@code # scans}, else 1. Other
 * columns (e.g. {@code Pixel}) are ignored. Several files (one per capture, say) are merged when
 * their wavelengths are identical.
 *
 * <p>Example (illustrative):
 * <pre>
 * # exposure_ms: 100
 * # scans: 10
 * wavelength_nm,dark,reference,sample
 * 365.0,1010,41010,9010
 * </pre>
 */
public final class RawCountsReader {

    private static final Pattern COLUMN = Pattern.compile(
            "(dark|reference|ref|sample|measured|counts|signal|intensity)(?:[ _@-]*(\\d+(?:\\.\\d+)?)\\s*ms)?(?:[._ ]\\d+)?");
    private static final Pattern LEADING_NUMBER = Pattern.compile("\\s*(\\d+(?:\\.\\d+)?(?:[eE][+-]?\\d+)?)\\s*(ms)?\\s*");

    private final Map<CaptureRole, Double> defaultExposureMs;

    public RawCountsReader() {
        this(new EnumMap<>(CaptureRole.class));
    }

    private RawCountsReader(Map<CaptureRole, Double> defaults) {
        this.defaultExposureMs = defaults;
    }

    /** Exposure for captures of {@code role} whose file does not give one (e.g. known from the instrument). */
    public RawCountsReader withExposureMs(CaptureRole role, double ms) {
        if (!(ms > 0) || !Double.isFinite(ms)) {
            throw new IllegalArgumentException("exposure for " + role + " must be a positive number of ms, was " + ms);
        }
        Map<CaptureRole, Double> copy = new EnumMap<>(CaptureRole.class);
        copy.putAll(defaultExposureMs);
        copy.put(role, ms);
        return new RawCountsReader(copy);
    }

    public RawCounts read(Path... files) throws ImportException {
        return read(Arrays.asList(files));
    }

    /** Reads each file and merges the captures; the wavelengths must be identical in every file. */
    public RawCounts read(List<Path> files) throws ImportException {
        if (files.isEmpty()) {
            throw new IllegalArgumentException("no files given");
        }
        List<RawCounts> parts = new ArrayList<>();
        for (Path file : files) {
            String name = String.valueOf(file.getFileName());
            try (Reader in = Files.newBufferedReader(file, StandardCharsets.UTF_8)) {
                parts.add(read(name, in));
            } catch (IOException e) {
                throw ImportException.ofSource(name, "cannot read: " + e.getMessage());
            }
        }
        return merge(parts);
    }

    private static RawCounts merge(List<RawCounts> parts) throws ImportException {
        if (parts.size() == 1) {
            return parts.get(0);
        }
        RawCounts first = parts.get(0);
        double[] x = first.wavelengthsNm();
        List<Capture> captures = new ArrayList<>();
        Map<String, String> metadata = new LinkedHashMap<>();
        List<String> warnings = new ArrayList<>();
        List<String> names = new ArrayList<>();
        for (RawCounts p : parts) {
            double[] px = p.wavelengthsNm();
            for (int i = 0; i < Math.max(x.length, px.length); i++) {
                if (i >= x.length || i >= px.length || px[i] != x[i]) {
                    throw ImportException.ofSource(p.sourceName(), "wavelengths differ from " + first.sourceName()
                            + " at point " + (i + 1) + " (" + (i < px.length ? px[i] + " nm" : "none") + " against "
                            + (i < x.length ? x[i] + " nm" : "none") + "); captures must share one pixel grid");
                }
            }
            captures.addAll(p.captures());
            p.metadata().forEach((k, v) -> metadata.putIfAbsent(k, v));
            p.warnings().forEach(w -> warnings.add(p.sourceName() + ": " + w));
            names.add(p.sourceName());
        }
        return RawCounts.of(String.join(" + ", names), x, first.xUnit(), captures, metadata, warnings);
    }

    public RawCounts read(String sourceName, Reader in) throws ImportException {
        BufferedReader lines = in instanceof BufferedReader b ? b : new BufferedReader(in, 1 << 16);
        Roles roles = new Roles(sourceName);
        TextTable table = TextTable.read(sourceName, lines, Optional.empty(), DelimitedTextReader.MAX_ROWS, roles::choose);
        if (table.rows() < ParsedSpectrum.MIN_POINTS) {
            throw new ImportException(sourceName, table.lastLine(), null, "only 1 data row; captures need at least 2");
        }
        int[] lineNos = table.lines();
        double[] raw = table.column(0);
        double[] x = new double[raw.length];
        for (int i = 0; i < raw.length; i++) {
            if (!(raw[i] > 0)) {
                throw new ImportException(sourceName, lineNos[i], roles.xName, "wavelength must be positive, was " + raw[i]);
            }
            x[i] = roles.unit.toNanometres(raw[i]);
            if (!Double.isFinite(x[i]) || !(x[i] > 0)) {
                throw new ImportException(sourceName, lineNos[i], roles.xName, "not a finite positive wavelength: " + raw[i]);
            }
        }
        int k = roles.columns.size();
        double[][] values = new double[k][];
        boolean[][] bounds = new boolean[k][];
        for (int c = 0; c < k; c++) {
            values[c] = table.column(c + 1);
        }
        XOrder.Ordered ordered = XOrder.order(sourceName, roles.xName, x, values, bounds, lineNos, false);
        List<Capture> captures = new ArrayList<>();
        for (int c = 0; c < k; c++) {
            captures.add(capture(sourceName, table, roles.columns.get(c), ordered.values()[c]));
        }
        List<String> warnings = new ArrayList<>(table.warnings);
        warnings.addAll(ordered.notes());
        return RawCounts.of(sourceName, ordered.x(), roles.unit, captures, table.metadata, warnings);
    }

    private record CountColumn(int index, String name, CaptureRole role, Double exposureMs, boolean generic) {
    }

    private Capture capture(String source, TextTable table, CountColumn col, double[] counts) throws ImportException {
        Map<String, String> meta = table.metadata;
        CaptureRole role = col.role();
        if (col.generic() && meta.containsKey("role")) {
            role = switch (meta.get("role").strip().toLowerCase(Locale.ROOT)) {
                case "dark" -> CaptureRole.DARK;
                case "reference", "ref" -> CaptureRole.REFERENCE;
                case "sample" -> CaptureRole.SAMPLE;
                default -> throw ImportException.ofSource(source, "metadata 'role' must be dark, reference or sample, was '"
                        + meta.get("role") + "'");
            };
        }
        String prefix = role.name().toLowerCase(Locale.ROOT);
        Double exposure = col.exposureMs();
        if (exposure == null) {
            exposure = number(source, meta, prefix + "_exposure_ms");
        }
        if (exposure == null) {
            exposure = number(source, meta, "exposure_ms");
        }
        if (exposure == null) {
            exposure = defaultExposureMs.get(role);
        }
        if (exposure == null) {
            throw ImportException.ofSource(source, "no exposure time for column '" + col.name() + "' (" + prefix
                    + "): add '# exposure_ms: …' or '# " + prefix + "_exposure_ms: …', or name it '" + prefix
                    + "_100ms'; a plain 'exposure' is not read because its unit is not stated");
        }
        Double scans = number(source, meta, prefix + "_scans");
        scans = scans != null ? scans : number(source, meta, "scans");
        int n = scans == null ? 1 : (int) Math.round(scans);
        try {
            return Capture.of(role, exposure, n, source + " column '" + col.name() + "'", counts);
        } catch (IllegalArgumentException e) {
            throw ImportException.ofSource(source, e.getMessage());
        }
    }

    private static Double number(String source, Map<String, String> meta, String key) throws ImportException {
        String v = meta.get(key);
        if (v == null) {
            return null;
        }
        Matcher m = LEADING_NUMBER.matcher(v);
        if (!m.matches() || !(Double.parseDouble(m.group(1)) > 0)) {
            throw new ImportException(source, 0, key, "must be a positive number (of ms or scans), was '" + v + "'");
        }
        return Double.parseDouble(m.group(1));
    }

    /** Wavelength column first, then the count columns in file order. */
    private static final class Roles {
        private final String source;
        private final List<CountColumn> columns = new ArrayList<>();
        private String xName;
        private XUnit unit;

        Roles(String source) {
            this.source = source;
        }

        TextTable.Selection choose(TextTable.Header header) throws ImportException {
            if (header.names() == null) {
                throw new ImportException(source, 1, null, "raw counts need a header naming the columns, e.g. "
                        + "'wavelength_nm,dark,reference,sample'");
            }
            List<String> names = header.names();
            int x = -1;
            for (int c = 0; c < names.size(); c++) {
                String n = names.get(c).strip().toLowerCase(Locale.ROOT);
                Matcher m = COLUMN.matcher(n);
                if (m.matches()) {
                    String word = m.group(1);
                    CaptureRole role = switch (word) {
                        case "dark" -> CaptureRole.DARK;
                        case "reference", "ref" -> CaptureRole.REFERENCE;
                        default -> CaptureRole.SAMPLE;
                    };
                    boolean generic = word.equals("counts") || word.equals("signal") || word.equals("intensity");
                    Double ms = m.group(2) == null ? null : Double.valueOf(m.group(2));
                    columns.add(new CountColumn(c, names.get(c), role, ms, generic));
                    continue;
                }
                ColumnRole role;
                try {
                    role = ColumnRole.of(names.get(c));
                } catch (IllegalArgumentException e) {
                    throw new ImportException(source, header.line(), names.get(c), e.getMessage());
                }
                if (x < 0 && role.isX()) {
                    x = c;
                    unit = role.xUnit();
                    xName = names.get(c);
                }
            }
            if (x < 0) {
                throw new ImportException(source, header.line(), names.get(0), "no wavelength column in header " + names
                        + "; expected one of " + ColumnRole.X_EXAMPLES);
            }
            if (columns.isEmpty()) {
                throw new ImportException(source, header.line(), null, "no count column in header " + names
                        + "; expected dark, reference, sample, measured, counts, signal or intensity");
            }
            int[] wanted = new int[columns.size() + 1];
            wanted[0] = x;
            for (int k = 0; k < columns.size(); k++) {
                wanted[k + 1] = columns.get(k).index();
            }
            return new TextTable.Selection(wanted, names);
        }
    }
}
