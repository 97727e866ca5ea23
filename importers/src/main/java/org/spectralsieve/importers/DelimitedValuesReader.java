package org.spectralsieve.importers;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;

/**
 * Reads delimited text holding a wavelength column and a column of relative values (a source's power,
 * a response's weights) into {@link SpectrumValues}. Layout, delimiter, decimal mark, comments,
 * preamble and header are read exactly as by {@link DelimitedTextReader} ({@link TextTable}); the
 * wavelength column and its unit are recognised by the same names ({@link ColumnRole}); rows are ordered
 * the same way ({@link XOrder}).
 *
 * <p>What differs: the value column may have any name ({@code global}, {@code irradiance},
 * {@code sensitivity}); when a file has more than one column besides the wavelength, the options must
 * name the one to read, since a wrong guess would weight with the wrong curve. Values are kept as
 * written: no percent guess, and a column headed {@code absorbance} is not converted to transmittance
 * (its numbers are the weights). A value written {@code <x} is refused: an upper bound is no weight.
 *
 * <p>Every refusal is an {@link ImportException} naming source, line and field. Instances hold no state
 * and may be shared.
 */
public final class DelimitedValuesReader {

    private final int maxRows;

    public DelimitedValuesReader() {
        this(DelimitedTextReader.MAX_ROWS);
    }

    DelimitedValuesReader(int maxRows) {
        this.maxRows = maxRows;
    }

    /** Reads a UTF-8 file; the source name in messages is the file name. */
    public SpectrumValues read(Path file, SpectrumValuesOptions options) throws ImportException {
        String name = String.valueOf(file.getFileName());
        try (Reader in = Files.newBufferedReader(file, StandardCharsets.UTF_8)) {
            return read(name, in, options);
        } catch (IOException e) {
            throw ImportException.ofSource(name, "cannot read: " + e.getMessage());
        }
    }

    public SpectrumValues read(String sourceName, Reader in, SpectrumValuesOptions options) throws ImportException {
        BufferedReader lines = in instanceof BufferedReader b ? b : new BufferedReader(in, 1 << 16);
        Columns columns = new Columns(sourceName, options);
        TextTable table = TextTable.read(sourceName, lines, options.decimalMark(), maxRows, columns::choose);
        return assemble(table, columns, options);
    }

    private static SpectrumValues assemble(TextTable table, Columns c, SpectrumValuesOptions options)
            throws ImportException {
        String source = table.source;
        int[] lines = table.lines();
        double[] raw = table.column(0);
        double[] x = new double[raw.length];
        for (int i = 0; i < raw.length; i++) {
            if (!(raw[i] > 0)) {
                throw new ImportException(source, lines[i], c.xName, "wavelength must be positive, was " + raw[i]);
            }
            x[i] = c.unit.toNanometres(raw[i]);
            if (!Double.isFinite(x[i]) || !(x[i] > 0)) {
                throw new ImportException(source, lines[i], c.xName, raw[i] + " " + c.unit
                        + " is not a finite positive wavelength in nm (" + x[i] + ")");
            }
        }
        boolean[] bounds = table.bounds(1);
        for (int i = 0; i < bounds.length; i++) {
            if (bounds[i]) {
                throw new ImportException(source, lines[i], c.yName, "'<' marks an upper bound (below detection);"
                        + " a relative power or weight must be a plain number");
            }
        }
        if (table.rows() < ParsedSpectrum.MIN_POINTS) {
            throw new ImportException(source, table.lastLine(), c.yName, "only 1 data row; a spectrum needs at least "
                    + ParsedSpectrum.MIN_POINTS);
        }
        XOrder.Ordered ordered = XOrder.order(source, c.xName, x, new double[][] {table.column(1)},
                new boolean[][] {bounds}, lines, options.mergeDuplicates());
        List<String> warnings = new ArrayList<>(table.warnings);
        warnings.addAll(c.notes);
        warnings.addAll(ordered.notes());
        return SpectrumValues.of(source, ordered.x(), ordered.values()[0], ordered.lines(), c.unit, c.yName,
                table.metadata, warnings);
    }

    /** Which column is the wavelength and which the value, decided when the header is known. */
    private static final class Columns {
        private final String source;
        private final SpectrumValuesOptions options;
        private final List<String> notes = new ArrayList<>();
        private String xName;
        private String yName;
        private XUnit unit;

        Columns(String source, SpectrumValuesOptions options) {
            this.source = source;
            this.options = options;
        }

        TextTable.Selection choose(TextTable.Header header) throws ImportException {
            int count = header.columnCount();
            List<String> names = header.names() != null ? header.names() : positionalNames(count);
            int line = header.line();
            if (count < 2) {
                throw new ImportException(source, line, null, "one column only; a spectrum needs a wavelength"
                        + " column and a value column");
            }
            int x = header.names() == null ? 0 : wavelengthColumn(names, line);
            List<Integer> candidates = new ArrayList<>();
            for (int c = 0; c < count; c++) {
                if (c != x && (header.names() == null || !role(names.get(c), line).isX())) {
                    candidates.add(c);
                }
            }
            int y = valueColumn(names, candidates, x, line, header.names() != null);
            xName = names.get(x);
            yName = names.get(y);
            unit = xUnit(header.names() == null ? XUnit.NANOMETRE : role(xName, line).xUnit(),
                    header.names() == null);
            if (header.names() != null && role(yName, line).isY()) {
                notes.add("column '" + yName + "' is read as relative values exactly as written: not as percent or"
                        + " fraction, and absorbance is not converted to transmittance");
            }
            List<String> ignored = new ArrayList<>();
            for (int c = 0; c < count; c++) {
                if (c != x && c != y) {
                    ignored.add(names.get(c));
                }
            }
            if (!ignored.isEmpty()) {
                notes.add("values read from column '" + yName + "'; columns not read: " + ignored);
            }
            return new TextTable.Selection(new int[] {x, y}, names);
        }

        private XUnit xUnit(XUnit fromFile, boolean positional) {
            Optional<XUnit> forced = options.xUnit();
            if (forced.isEmpty()) {
                return fromFile;
            }
            if (forced.get() != fromFile && !positional) {
                notes.add("wavelength column '" + xName + "' read in " + forced.get() + " as the options ask"
                        + " (its header suggests " + fromFile + ")");
            }
            return forced.get();
        }

        private int wavelengthColumn(List<String> names, int line) throws ImportException {
            for (int c = 0; c < names.size(); c++) {
                if (role(names.get(c), line).isX()) {
                    return c;
                }
            }
            throw new ImportException(source, line, names.get(0), "no wavelength column in header " + names
                    + "; expected one of " + ColumnRole.X_EXAMPLES);
        }

        private ColumnRole role(String name, int line) throws ImportException {
            try {
                return ColumnRole.of(name);
            } catch (IllegalArgumentException e) {
                throw new ImportException(source, line, name, e.getMessage());
            }
        }

        private int valueColumn(List<String> names, List<Integer> candidates, int x, int line, boolean named)
                throws ImportException {
            Optional<String> asked = options.valueColumn();
            if (asked.isEmpty()) {
                if (candidates.size() == 1) {
                    return candidates.get(0);
                }
                if (candidates.isEmpty()) {
                    throw new ImportException(source, line, null, "no value column: every column of " + names
                            + " is a wavelength");
                }
                List<String> listed = new ArrayList<>();
                candidates.forEach(c -> listed.add((c + 1) + ": " + names.get(c)));
                throw new ImportException(source, line, null, candidates.size() + " columns could hold the values "
                        + listed + "; choose one by name or number with the value column option");
            }
            String want = asked.get();
            if (want.chars().allMatch(Character::isDigit)) {
                int c = Integer.parseInt(want) - 1;
                if (c < 0 || c >= names.size() || c == x) {
                    throw new ImportException(source, line, null, "value column " + want + " asked for: the file has "
                            + names.size() + " columns and column " + (x + 1) + " is the wavelength");
                }
                return c;
            }
            if (!named) {
                throw new ImportException(source, line, null, "value column '" + want + "' asked for by name, but"
                        + " the file has no header; give its number (2 to " + names.size() + ")");
            }
            for (int c : candidates) {
                if (names.get(c).strip().toLowerCase(Locale.ROOT).equals(want.toLowerCase(Locale.ROOT))) {
                    return c;
                }
            }
            throw new ImportException(source, line, null, "value column '" + want + "' asked for is not in the header "
                    + names + (names.get(x).strip().equalsIgnoreCase(want) ? " (it is the wavelength column)" : ""));
        }

        private static List<String> positionalNames(int count) {
            List<String> names = new ArrayList<>();
            names.add("wavelength");
            for (int c = 1; c < count; c++) {
                names.add("column " + (c + 1));
            }
            return names;
        }
    }
}
