package org.spectralsieve.importers;

import java.io.BufferedReader;
import java.io.IOException;
import java.nio.charset.CharacterCodingException;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * The layer every delimited reader shares: comments and preamble into metadata, the header line, the
 * delimiter and decimal mark, and numeric rows of the columns a reader asks for. It knows nothing of
 * what the columns mean; the reader decides that from the {@link Header} in its {@link ColumnChooser}.
 *
 * <p>Layout read: blank lines anywhere are skipped; {@code #} starts a comment anywhere, and
 * {@code # key: value} (or {@code =}) is metadata. Before the first data line (a line whose first field
 * is a number) any other lines are kept aside: the last of them is the header, the earlier ones are
 * an instrument preamble, read as metadata where they have the form {@code key: value},
 * {@code key = value}, {@code key;value} or {@code key<tab>value}. Every data line must have as many
 * fields as the header (or as the first data line when there is no header).
 *
 * <p>Only the chosen columns are parsed, so an unused text column does not stop the read. One instance
 * per read; not shared.
 */
final class TextTable {

    /** The header as the reader sees it when choosing columns; {@code names} is null without a header. */
    record Header(List<String> names, int line, int columnCount) {
        Header {
            names = names == null ? null : List.copyOf(names);
        }
    }

    /**
     * The columns to parse, and the name of every column (used in messages); {@code unknownAllowed}: the
     * columns where an empty cell or {@code NaN} means "not known" (read as NaN) rather than an error, such
     * as a standard-deviation column (a point below detection has none).
     */
    record Selection(int[] columns, List<String> names, java.util.Set<Integer> unknownAllowed) {
        Selection {
            columns = columns.clone();
            names = List.copyOf(names);
            unknownAllowed = java.util.Set.copyOf(unknownAllowed);
        }

        Selection(int[] columns, List<String> names) {
            this(columns, names, java.util.Set.of());
        }
    }

    interface ColumnChooser {
        Selection choose(Header header) throws ImportException;
    }

    private static final Pattern METADATA = Pattern.compile("([A-Za-z][A-Za-z0-9_.\\- ]*?)\\s*[:=]\\s*(.*)");
    private static final Pattern PREAMBLE_PAIR = Pattern.compile("([A-Za-z][^;\\t]*?)\\s*[;\\t]\\s*([^;\\t]*?)[;\\t]*");
    private static final Pattern OWN_FORMAT = Pattern.compile("Spectral Sieve curve v(\\d+)");

    final String source;
    final Map<String, String> metadata = new LinkedHashMap<>();
    final List<String> warnings = new ArrayList<>();
    private final Optional<DecimalMark> forcedMark;
    private final int maxRows;
    private final ColumnChooser chooser;
    private final LineFields fields = new LineFields();
    private final List<String> pending = new ArrayList<>();
    private final List<Integer> pendingLines = new ArrayList<>();

    private int lineNo;
    private boolean seenContent;
    private Header header;
    private Selection selection;
    private Delimiter delimiter;
    private char decimal;
    private double[][] columns;
    private boolean[][] bounds;
    private int[] lines = new int[1024];
    private int rows;

    private TextTable(String source, Optional<DecimalMark> forcedMark, int maxRows, ColumnChooser chooser) {
        this.source = source;
        this.forcedMark = forcedMark;
        this.maxRows = maxRows;
        this.chooser = chooser;
    }

    static TextTable read(String source, BufferedReader in, Optional<DecimalMark> decimal, int maxRows,
            ColumnChooser chooser) throws ImportException {
        TextTable table = new TextTable(source, decimal, maxRows, chooser);
        try {
            String line;
            while ((line = in.readLine()) != null) {
                table.line(line);
            }
        } catch (CharacterCodingException e) {
            throw new ImportException(source, table.lineNo + 1, null, "not UTF-8 text", e);
        } catch (IOException e) {
            throw new ImportException(source, table.lineNo + 1, null, "cannot read: " + e.getMessage(), e);
        }
        table.finish();
        return table;
    }

    private void line(String raw) throws ImportException {
        lineNo++;
        String line = lineNo == 1 && raw.startsWith("\uFEFF") ? raw.substring(1) : raw;
        int first = 0;
        int n = line.length();
        while (first < n && Character.isWhitespace(line.charAt(first))) {
            first++;
        }
        if (first == n) {
            return;
        }
        boolean firstContent = !seenContent;
        seenContent = true;
        if (line.charAt(first) == '#') {
            comment(line.substring(first + 1).strip(), firstContent);
        } else if (selection != null) {
            row(line);
        } else if (startsWithNumber(line, first)) {
            begin(line);
            row(line);
        } else {
            pending.add(line.strip());
            pendingLines.add(lineNo);
        }
    }

    /** The first field (up to a delimiter character) is a number, with either decimal mark. */
    private static boolean startsWithNumber(String line, int from) {
        if (line.charAt(from) == '"') {
            int close = line.indexOf('"', from + 1);
            return close > from && NumberText.isNumber(line, from + 1, close, ',');
        }
        int end = from;
        while (end < line.length() && ",; \t".indexOf(line.charAt(end)) < 0) {
            end++;
        }
        return NumberText.isNumber(line, from, end, ',');
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
        if (m.matches()) {
            putMetadata(m.group(1), m.group(2), lineNo);
        }
    }

    private void putMetadata(String rawKey, String rawValue, int line) {
        String key = ParsedSpectrum.normaliseKey(rawKey);
        String value = rawValue.strip();
        if (metadata.containsKey(key)) {
            warnings.add("line " + line + ": metadata '" + key + "' given again; the later value '"
                    + value + "' replaces '" + metadata.get(key) + "'");
        }
        metadata.put(key, value);
    }

    private void begin(String dataLine) throws ImportException {
        String headerText = pending.isEmpty() ? null : pending.get(pending.size() - 1);
        int headerLine = pending.isEmpty() ? 0 : pendingLines.get(pending.size() - 1);
        Delimiter.Choice choice = Delimiter.detect(headerText, dataLine, forcedMark);
        delimiter = choice.delimiter();
        decimal = choice.decimal().symbol();
        split(dataLine);
        int dataCount = fields.count();
        if (headerText != null && METADATA.matcher(headerText).matches()
                && delimiter.headerCount(headerText) != dataCount) {
            headerText = null; // "Integration time: 100 ms" is preamble, not a header
        }
        preamble(headerText == null ? pending.size() : pending.size() - 1);
        List<String> names = null;
        if (headerText != null) {
            try {
                names = delimiter.splitHeader(headerText);
            } catch (IllegalArgumentException e) {
                throw new ImportException(source, headerLine, null, e.getMessage());
            }
        }
        header = new Header(names, headerText == null ? 0 : headerLine, names != null ? names.size() : dataCount);
        selection = chooser.choose(header);
        columns = new double[selection.columns().length][1024];
        bounds = new boolean[selection.columns().length][];
        if (decimal == ',') {
            metadata.putIfAbsent("decimal_mark", "comma");
        }
    }

    private void preamble(int count) {
        if (count == 0) {
            return;
        }
        int kept = 0;
        for (int i = 0; i < count; i++) {
            String text = pending.get(i);
            Matcher m = METADATA.matcher(text);
            Matcher pair = PREAMBLE_PAIR.matcher(text);
            if (m.matches()) {
                putMetadata(m.group(1), m.group(2), pendingLines.get(i));
                kept++;
            } else if (pair.matches()) {
                putMetadata(pair.group(1), pair.group(2), pendingLines.get(i));
                kept++;
            }
        }
        int firstLine = pendingLines.get(0);
        int lastLine = pendingLines.get(count - 1);
        warnings.add((firstLine == lastLine ? "line " + firstLine : "lines " + firstLine + "–" + lastLine)
                + " before the table read as preamble (" + kept + " kept as metadata)");
    }

    private void split(String line) throws ImportException {
        try {
            delimiter.split(line, fields);
        } catch (IllegalArgumentException e) {
            throw new ImportException(source, lineNo, null, e.getMessage());
        }
    }

    private void row(String line) throws ImportException {
        split(line);
        int expected = header.columnCount();
        if (fields.count() < expected) {
            throw new ImportException(source, lineNo, selection.names().get(fields.count()), "missing: expected "
                    + expected + " columns separated by " + delimiter.describe() + ", found " + fields.count());
        }
        if (fields.count() > expected) {
            throw new ImportException(source, lineNo, "column " + (expected + 1), "unexpected: expected "
                    + expected + " columns separated by " + delimiter.describe() + ", found " + fields.count());
        }
        if (rows == maxRows) {
            throw new ImportException(source, lineNo, null, "more than " + maxRows
                    + " data rows; a curve this long is surely not one spectrum (split or resample it)");
        }
        if (rows == lines.length) {
            grow();
        }
        int[] wanted = selection.columns();
        for (int k = 0; k < wanted.length; k++) {
            columns[k][rows] = number(wanted[k], k);
        }
        lines[rows] = lineNo;
        rows++;
    }

    private double number(int column, int k) throws ImportException {
        String s = fields.source(column);
        int from = fields.start(column);
        int to = fields.end(column);
        String name = selection.names().get(column);
        if (from < to && s.charAt(from) == '<') {
            if (bounds[k] == null) {
                bounds[k] = new boolean[columns[k].length];
            }
            bounds[k][rows] = true;
            from++;
            while (from < to && LineFields.isBlank(s.charAt(from))) {
                from++;
            }
        }
        if (selection.unknownAllowed().contains(column)
                && (from == to || s.substring(from, to).equalsIgnoreCase("nan"))) {
            return Double.NaN;
        }
        if (from == to) {
            throw new ImportException(source, lineNo, name, "empty");
        }
        double value;
        try {
            value = NumberText.parse(s, from, to, decimal);
        } catch (NumberFormatException e) {
            String text = s.substring(from, to);
            throw new ImportException(source, lineNo, name, (NumberText.isNonFiniteWord(text)
                    ? "not a finite number: '" : "not a number: '") + text + "'");
        }
        if (!Double.isFinite(value)) {
            throw new ImportException(source, lineNo, name, "not a finite number: '" + s.substring(from, to) + "'");
        }
        return value;
    }

    private void grow() {
        int size = Math.min(Math.max(rows * 2, 16), maxRows);
        lines = Arrays.copyOf(lines, size);
        for (int k = 0; k < columns.length; k++) {
            columns[k] = Arrays.copyOf(columns[k], size);
            if (bounds[k] != null) {
                bounds[k] = Arrays.copyOf(bounds[k], size);
            }
        }
    }

    private void finish() throws ImportException {
        if (!seenContent) {
            throw ImportException.ofSource(source, "empty file");
        }
        if (rows == 0) {
            throw ImportException.ofSource(source, "no data rows");
        }
    }

    Header header() {
        return header;
    }

    int rows() {
        return rows;
    }

    int lastLine() {
        return lines[rows - 1];
    }

    /** Values of the k-th chosen column (a trimmed copy). */
    double[] column(int k) {
        return Arrays.copyOf(columns[k], rows);
    }

    /** Upper-bound flags ({@code <value}) of the k-th chosen column, a trimmed copy; all false when none. */
    boolean[] bounds(int k) {
        return bounds[k] == null ? new boolean[rows] : Arrays.copyOf(bounds[k], rows);
    }

    /** 1-based file line of each row. */
    int[] lines() {
        return Arrays.copyOf(lines, rows);
    }

    String describeDelimiter() {
        return delimiter.describe() + (decimal == ',' ? " with decimal comma" : "");
    }
}
