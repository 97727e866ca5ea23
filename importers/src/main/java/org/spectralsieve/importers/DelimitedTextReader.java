package org.spectralsieve.importers;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.Reader;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Reads delimited text curves: the sieve curve CSV written by {@link DelimitedTextWriter}, and ordinary
 * two-column CSV/TSV files from users and instruments.
 *
 * <ul>
 *   <li>{@code #} starts a comment; {@code # key: value} or {@code # key = value} is metadata.</li>
 *   <li>Blank lines are skipped. The delimiter is detected from the first non-comment line
 *       (see {@link Delimiter}).</li>
 *   <li>A first line whose first field is not a number is a header naming the columns' roles and kinds;
 *       without one, column 1 is x in nm, column 2 is y, and the y kind is guessed from the range.</li>
 *   <li>A y value written {@code <0.001} is an upper bound ("at or below detection").</li>
 *   <li>x must be strictly increasing; at most {@value #MAX_ROWS} data rows.</li>
 * </ul>
 *
 * Every refusal is an {@link ImportException} naming source, line and field. Instances hold no state
 * between reads and may be shared.
 */
public final class DelimitedTextReader {

    /** Far beyond any spectrometer (1 pm steps over 190–1190 nm); protects memory against a wrong file. */
    public static final int MAX_ROWS = 1_000_000;

    /** Above this a "fraction" is surely percent: T slightly over 1 occurs from noise, 1.5 does not. */
    static final double PERCENT_LOOKING = 1.5;

    private static final Pattern METADATA = Pattern.compile("([A-Za-z][A-Za-z0-9_.\\- ]*?)\\s*[:=]\\s*(.*)");
    private static final Pattern OWN_FORMAT = Pattern.compile("Spectral Sieve curve v(\\d+)");
    private static final Pattern DECIMAL = Pattern.compile("[+-]?(\\d+\\.?\\d*|\\.\\d+)([eE][+-]?\\d+)?");

    private final int maxRows;

    public DelimitedTextReader() {
        this(MAX_ROWS);
    }

    /** For tests of the row cap without writing a million rows. */
    DelimitedTextReader(int maxRows) {
        this.maxRows = maxRows;
    }

    /** Reads a UTF-8 file; the source name in messages is the file name. */
    public ParsedSpectrum read(Path file) throws ImportException {
        return read(file, ReadOptions.defaults());
    }

    public ParsedSpectrum read(Path file, ReadOptions options) throws ImportException {
        String name = String.valueOf(file.getFileName());
        try (Reader in = Files.newBufferedReader(file, StandardCharsets.UTF_8)) {
            return read(name, in, options);
        } catch (IOException e) {
            throw ImportException.ofSource(name, "cannot read: " + e.getMessage());
        }
    }

    public ParsedSpectrum read(String sourceName, Reader in) throws ImportException {
        return read(sourceName, in, ReadOptions.defaults());
    }

    public ParsedSpectrum read(String sourceName, Reader in, ReadOptions options) throws ImportException {
        BufferedReader lines = in instanceof BufferedReader b ? b : new BufferedReader(in);
        Parse parse = new Parse(sourceName, options);
        try {
            String line;
            while ((line = lines.readLine()) != null) {
                parse.line(line);
            }
        } catch (CharacterCodingException e) {
            throw new ImportException(sourceName, parse.lineNo + 1, null, "not UTF-8 text", e);
        } catch (IOException e) {
            throw new ImportException(sourceName, parse.lineNo + 1, null, "cannot read: " + e.getMessage(), e);
        }
        return parse.finish();
    }

    /** The state of one read: kept out of the reader so the reader itself stays shareable. */
    private final class Parse {
        private final String source;
        private final ReadOptions options;
        private final Map<String, String> metadata = new LinkedHashMap<>();
        private final List<String> warnings = new ArrayList<>();
        private int lineNo;
        private boolean seenContent;
        private Delimiter delimiter;
        private ColumnLayout layout;
        private double[] x = new double[1024];
        private double[] y = new double[1024];
        private boolean[] bounds = new boolean[1024];
        private int rows;
        private int previousLine;

        Parse(String source, ReadOptions options) {
            this.source = source;
            this.options = options;
        }

        void line(String raw) throws ImportException {
            lineNo++;
            String line = lineNo == 1 && raw.startsWith("\uFEFF") ? raw.substring(1) : raw;
            String text = line.strip();
            if (text.isEmpty()) {
                return;
            }
            boolean first = !seenContent;
            seenContent = true;
            if (text.startsWith("#")) {
                comment(text.substring(1).strip(), first);
                return;
            }
            if (layout == null) {
                delimiter = Delimiter.detect(text);
                List<String> fields = split(text);
                if (!isNumber(fields.get(0))) {
                    layout = ColumnLayout.fromHeader(source, lineNo, fields);
                    warnIgnored();
                    return;
                }
                layout = ColumnLayout.positional(fields.size());
                warnIgnored();
            }
            row(split(text));
        }

        private void comment(String body, boolean first) {
            Matcher own = OWN_FORMAT.matcher(body);
            if (own.matches()) {
                if (!first || !own.group(1).equals("1")) {
                    warnings.add("line " + lineNo + ": '" + body + "' read as sieve curve v1"
                            + (first ? "" : " (it is not the first line)"));
                }
                return;
            }
            Matcher m = METADATA.matcher(body);
            if (!m.matches()) {
                return; // a plain comment
            }
            String key = ParsedSpectrum.normaliseKey(m.group(1));
            String value = m.group(2).strip();
            if (metadata.containsKey(key)) {
                warnings.add("line " + lineNo + ": metadata '" + key + "' given again; the later value '"
                        + value + "' replaces '" + metadata.get(key) + "'");
            }
            metadata.put(key, value);
        }

        private void warnIgnored() {
            if (!layout.ignored().isEmpty()) {
                warnings.add("line " + lineNo + ": columns ignored (not a wavelength or value column): "
                        + layout.ignored());
            }
        }

        private List<String> split(String text) throws ImportException {
            try {
                return delimiter.split(text);
            } catch (IllegalArgumentException e) {
                throw new ImportException(source, lineNo, null, e.getMessage());
            }
        }

        private void row(List<String> fields) throws ImportException {
            if (fields.size() < layout.columnCount()) {
                String missing = layout.names().get(fields.size());
                throw new ImportException(source, lineNo, missing, "missing: expected "
                        + layout.columnCount() + " columns separated by " + delimiter.describe()
                        + ", found " + fields.size());
            }
            if (fields.size() > layout.columnCount()) {
                throw new ImportException(source, lineNo, "column " + (layout.columnCount() + 1),
                        "unexpected: expected " + layout.columnCount() + " columns separated by "
                                + delimiter.describe() + ", found " + fields.size());
            }
            if (rows == maxRows) {
                throw new ImportException(source, lineNo, null, "more than " + maxRows
                        + " data rows; a curve this long is surely not one spectrum (split or resample it)");
            }
            double wavelength = layout.xUnit().toNanometres(number(fields.get(layout.xColumn()), layout.xName()));
            String yText = fields.get(layout.yColumn());
            boolean bound = yText.startsWith("<");
            double value = number(bound ? yText.substring(1).strip() : yText, layout.yName());
            checkOrder(wavelength);
            append(wavelength, value, bound);
            previousLine = lineNo;
        }

        private void checkOrder(double wavelength) throws ImportException {
            if (rows == 0 || wavelength > x[rows - 1]) {
                return;
            }
            double before = x[rows - 1];
            String where = "line " + lineNo + " (" + wavelength + " nm) ";
            throw new ImportException(source, lineNo, layout.xName(), wavelength == before
                    ? "duplicate wavelength: " + where + "repeats line " + previousLine + " (" + before + " nm)"
                    : "wavelengths must be strictly increasing: " + where + "follows line " + previousLine
                            + " (" + before + " nm)");
        }

        private double number(String text, String field) throws ImportException {
            if (text.isEmpty()) {
                throw new ImportException(source, lineNo, field, "empty");
            }
            if (!DECIMAL.matcher(text).matches()) {
                String problem = isNonFiniteWord(text) ? "not a finite number: '" : "not a number: '";
                throw new ImportException(source, lineNo, field, problem + text + "'");
            }
            double v = Double.parseDouble(text);
            if (!Double.isFinite(v)) {
                throw new ImportException(source, lineNo, field, "not a finite number: '" + text + "'");
            }
            return v;
        }

        private void append(double wavelength, double value, boolean bound) {
            if (rows == x.length) {
                int size = Math.min(Math.max(rows * 2, 16), maxRows);
                x = Arrays.copyOf(x, size);
                y = Arrays.copyOf(y, size);
                bounds = Arrays.copyOf(bounds, size);
            }
            x[rows] = wavelength;
            y[rows] = value;
            bounds[rows] = bound;
            rows++;
        }

        ParsedSpectrum finish() throws ImportException {
            if (!seenContent) {
                throw ImportException.ofSource(source, "empty file");
            }
            if (rows == 0) {
                throw ImportException.ofSource(source, "no data rows");
            }
            if (rows < ParsedSpectrum.MIN_POINTS) {
                throw new ImportException(source, previousLine, null,
                        "only 1 data row; a curve needs at least " + ParsedSpectrum.MIN_POINTS);
            }
            double[] values = Arrays.copyOf(y, rows);
            YKind kind = decideKind(values);
            return ParsedSpectrum.of(source, Arrays.copyOf(x, rows), values, Arrays.copyOf(bounds, rows),
                    kind, layout.xUnit(), metadata, warnings);
        }

        private YKind decideKind(double[] values) {
            double max = Arrays.stream(values).max().orElseThrow();
            Optional<YKind> forced = options.yKind();
            Optional<YKind> named = layout.yKind();
            if (forced.isPresent()) {
                named.filter(k -> k != forced.get()).ifPresent(k -> warnings.add("y kind set to " + forced.get()
                        + " by the read options; column '" + layout.yName() + "' suggests " + k));
                return forced.get();
            }
            if (named.isEmpty()) {
                YKind guess = max > PERCENT_LOOKING ? YKind.TRANSMITTANCE_PERCENT : YKind.TRANSMITTANCE_FRACTION;
                warnings.add("no header names the value column; y kind guessed as " + guess
                        + " from the largest value " + max + " (percent when above " + PERCENT_LOOKING
                        + "); set it in the read options if wrong");
                return guess;
            }
            if (named.get() == YKind.TRANSMITTANCE_FRACTION && max > PERCENT_LOOKING) {
                warnings.add("column '" + layout.yName() + "' is read as a fraction, but values reach " + max
                        + " (above " + PERCENT_LOOKING + "), which looks like percent; set the y kind to "
                        + YKind.TRANSMITTANCE_PERCENT + " in the read options if so");
            }
            return named.get();
        }
    }

    private static boolean isNumber(String text) {
        String t = text.startsWith("<") ? text.substring(1).strip() : text;
        return DECIMAL.matcher(t).matches() || isNonFiniteWord(t);
    }

    private static boolean isNonFiniteWord(String text) {
        String t = text.replaceFirst("^[+-]", "");
        return t.equalsIgnoreCase("nan") || t.equalsIgnoreCase("infinity") || t.equalsIgnoreCase("inf");
    }
}
