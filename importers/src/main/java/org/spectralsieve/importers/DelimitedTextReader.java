package org.spectralsieve.importers;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * Reads delimited text curves: the sieve curve CSV written by {@link DelimitedTextWriter}, and the
 * CSV/TSV/blank-separated files users and instruments write.
 *
 * <ul>
 *   <li>Layout: comments, preamble, header and rows as described in {@link TextTable}; the delimiter
 *       (comma, semicolon, tab, blanks, mixed tabs and spaces) and decimal mark as in {@link Delimiter}.</li>
 *   <li>Column roles from header names ({@link ColumnRole}); without a header, column 1 is x in nm,
 *       column 2 is y, and the y kind is guessed from the range.</li>
 *   <li>Several value columns (replicates, x/y pairs): see {@link Replicates}.</li>
 *   <li>x in nm, µm, Å or cm⁻¹, converted to nm. Rows are put in increasing wavelength order; a column
 *       that changes direction, or repeats a wavelength, is refused ({@link XOrder}).</li>
 *   <li>y kind: the read options win; else the name's kind; a transmittance column whose values
 *       exceed {@value #PERCENT_LOOKING} is percent (with a warning when the name said fraction or
 *       said nothing).</li>
 *   <li>A y value written {@code <0.001} is an upper bound ("at or below detection").</li>
 *   <li>A standard-deviation column ({@code StdDev}, {@code Std.Dev.}, {@code sd}…, see {@link ColumnRole})
 *       right after a value column is that column's per-point uncertainty, in its unit; with
 *       {@link Replicates#MEAN} the spread of the replicates gives the mean's standard deviation instead
 *       (s/√n, the experimental standard deviation of the mean). Either is returned in
 *       {@link ParsedSpectrum#standardDeviations()}.</li>
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
        return first(readAll(file, options));
    }

    public ParsedSpectrum read(String sourceName, Reader in) throws ImportException {
        return read(sourceName, in, ReadOptions.defaults());
    }

    /** One spectrum; with {@link Replicates#SEPARATE} the first, noting that {@link #readAll} gives all. */
    public ParsedSpectrum read(String sourceName, Reader in, ReadOptions options) throws ImportException {
        return first(readAll(sourceName, in, options));
    }

    /** All spectra of the file: one, unless the options ask for {@link Replicates#SEPARATE}. */
    public List<ParsedSpectrum> readAll(Path file, ReadOptions options) throws ImportException {
        String name = String.valueOf(file.getFileName());
        try (Reader in = Files.newBufferedReader(file, StandardCharsets.UTF_8)) {
            return readAll(name, in, options);
        } catch (IOException e) {
            throw ImportException.ofSource(name, "cannot read: " + e.getMessage());
        }
    }

    public List<ParsedSpectrum> readAll(String sourceName, Reader in, ReadOptions options) throws ImportException {
        BufferedReader lines = in instanceof BufferedReader b ? b : new BufferedReader(in, 1 << 16);
        Layout layout = new Layout(sourceName, options);
        TextTable table = TextTable.read(sourceName, lines, options.decimalMark(), maxRows, layout::choose);
        return new Assembly(table, layout, options).spectra();
    }

    private static ParsedSpectrum first(List<ParsedSpectrum> all) {
        ParsedSpectrum s = all.get(0);
        if (all.size() == 1) {
            return s;
        }
        List<String> warnings = new ArrayList<>(s.warnings());
        warnings.add("the file holds " + all.size() + " replicates; this is the first (readAll returns all)");
        return s.withWarnings(warnings);
    }

    /**
     * One x/y column pair; {@code role.yKind()} null when there is no header; {@code sd} the column of its
     * standard deviations, -1 when there is none.
     */
    record Series(int x, int y, String xName, String yName, XUnit unit, ColumnRole role, int sd) {

        Series(int x, int y, String xName, String yName, XUnit unit, ColumnRole role) {
            this(x, y, xName, yName, unit, role, -1);
        }

        Series withSpread(int column) {
            return new Series(x, y, xName, yName, unit, role, column);
        }
    }

    /** Column roles, decided when the header is known. */
    private static final class Layout {
        private final String source;
        private final Replicates mode;
        private final ReadOptions options;
        private final List<Series> series = new ArrayList<>();
        private final List<String> notes = new ArrayList<>();
        private int[] parsed;
        private List<String> names = List.of();
        private ColumnRole[] roles = new ColumnRole[0];
        /** Set when the header has a wavelength column but no value column; raised after the x check. */
        private ImportException noValueColumn;
        private Series xOnly;

        Layout(String source, ReadOptions options) {
            this.source = source;
            this.options = options;
            this.mode = options.columnsChosen() ? Replicates.FIRST : options.replicates();
        }

        TextTable.Selection choose(TextTable.Header header) throws ImportException {
            List<String> names = header.names() == null ? positionalNames(header.columnCount()) : header.names();
            this.names = names;
            if (options.columnsChosen()) {
                series.add(ChosenColumns.series(source, header, names, options, notes));
            } else if (header.names() == null) {
                series.add(new Series(0, 1, names.get(0), names.get(1), XUnit.NANOMETRE,
                        new ColumnRole(ColumnRole.Kind.Y, null, null, false)));
            } else {
                fromHeader(header, names);
            }
            forceUnit();
            if (noValueColumn != null) {
                // read the wavelengths anyway: a broken axis is the more useful thing to report
                parsed = new int[] {xOnly.x()};
                return new TextTable.Selection(parsed, names);
            }
            boolean[] used = new boolean[names.size()];
            List<Integer> columns = new ArrayList<>();
            for (int i = 0; i < series.size(); i++) {
                Series s = series.get(i);
                if (i == 0 || mode != Replicates.FIRST) {
                    addOnce(columns, s.x());
                    addOnce(columns, s.y());
                    if (s.sd() >= 0) {
                        addOnce(columns, s.sd());
                    }
                }
                used[s.x()] = true;
                used[s.y()] = true;
                if (s.sd() >= 0) {
                    used[s.sd()] = true;
                }
            }
            List<String> ignored = new ArrayList<>();
            for (int c = 0; c < names.size(); c++) {
                if (!used[c]) {
                    ignored.add(names.get(c));
                }
            }
            if (!ignored.isEmpty()) {
                notes.add("line " + Math.max(header.line(), 1) + ": columns ignored (not a wavelength or value column): "
                        + ignored);
            }
            if (series.size() > 1 && mode == Replicates.FIRST) {
                List<String> unread = new ArrayList<>();
                series.subList(1, series.size()).forEach(s -> unread.add(s.xName() + "/" + s.yName()));
                notes.add(series.size() + " value columns found; only the first (" + series.get(0).xName() + "/"
                        + series.get(0).yName() + ") is read; not read: " + unread
                        + "; set replicates MEAN or SEPARATE in the read options to use them");
            }
            parsed = columns.stream().mapToInt(Integer::intValue).toArray();
            java.util.Set<Integer> spreads = new java.util.HashSet<>();
            series.stream().filter(s -> s.sd() >= 0).forEach(s -> spreads.add(s.sd()));
            return new TextTable.Selection(parsed, names, spreads);
        }

        /** The unit the read options force replaces the header's, with a note when they differ. */
        private void forceUnit() {
            if (options.xUnit().isEmpty()) {
                return;
            }
            XUnit forced = options.xUnit().get();
            for (int i = 0; i < series.size(); i++) {
                Series s = series.get(i);
                if (s.unit() != forced) {
                    notes.add("wavelength column '" + s.xName() + "' read in " + forced + " as the read options say"
                            + (s.unit() == null ? "" : " (its header suggests " + s.unit() + ")"));
                }
                series.set(i, new Series(s.x(), s.y(), s.xName(), s.yName(), forced, s.role()));
            }
            if (xOnly != null) {
                xOnly = new Series(xOnly.x(), xOnly.y(), xOnly.xName(), xOnly.yName(), forced, xOnly.role());
            }
        }

        private static void addOnce(List<Integer> columns, int c) {
            if (!columns.contains(c)) {
                columns.add(c);
            }
        }

        private static List<String> positionalNames(int count) {
            List<String> names = new ArrayList<>();
            names.add("wavelength");
            names.add("value");
            for (int c = 2; c < count; c++) {
                names.add("column " + (c + 1));
            }
            return names;
        }

        private void fromHeader(TextTable.Header header, List<String> names) throws ImportException {
            int currentX = -1;
            int firstX = -1;
            List<Integer> orphans = new ArrayList<>(); // value columns before any wavelength column
            roles = new ColumnRole[names.size()];
            for (int c = 0; c < names.size(); c++) {
                try {
                    roles[c] = ColumnRole.of(names.get(c));
                } catch (IllegalArgumentException e) {
                    if (options.xUnit().isEmpty()) {
                        throw new ImportException(source, header.line(), names.get(c), e.getMessage()
                                + "; or set the x unit in the read options");
                    }
                    roles[c] = new ColumnRole(ColumnRole.Kind.X, null, null, false); // the forced unit replaces it
                }
                if (roles[c].isX()) {
                    currentX = c;
                    firstX = firstX < 0 ? c : firstX;
                } else if (roles[c].isY() && currentX >= 0) {
                    series.add(series(names, roles, currentX, c));
                } else if (roles[c].isSpread() && !series.isEmpty() && spreadFits(series.get(series.size() - 1), c)) {
                    series.set(series.size() - 1, series.get(series.size() - 1).withSpread(c));
                } else if (roles[c].isY()) {
                    orphans.add(c);
                }
            }
            if (firstX < 0) {
                throw new ImportException(source, header.line(), names.get(0), "no wavelength column in header "
                        + names + "; expected one of " + ColumnRole.X_EXAMPLES);
            }
            for (int c : orphans) {
                series.add(0, series(names, roles, firstX, c));
            }
            if (series.isEmpty()) {
                noValueColumn = new ImportException(source, header.line(), null, "no value column in header " + names
                        + "; expected one of " + ColumnRole.Y_EXAMPLES);
                xOnly = series(names, roles, firstX, firstX);
            }
        }

        /** A standard deviation belongs to the value column right before it, when that one has none yet. */
        private static boolean spreadFits(Series last, int column) {
            return last.sd() < 0 && last.y() == column - 1;
        }

        private static Series series(List<String> names, ColumnRole[] roles, int x, int y) {
            return new Series(x, y, names.get(x), names.get(y), roles[x].xUnit(), roles[y]);
        }

        ColumnRole roleOf(int column) {
            return roles[column];
        }

        String namesOf(int column) {
            return names.get(column);
        }

        int parsedIndex(int column) {
            for (int k = 0; k < parsed.length; k++) {
                if (parsed[k] == column) {
                    return k;
                }
            }
            throw new IllegalStateException("column " + column + " not parsed");
        }
    }

    /** Turns the parsed table into spectra: units, order, kinds, replicates. */
    private static final class Assembly {
        private final TextTable table;
        private final Layout layout;
        private final ReadOptions options;
        private final String source;

        Assembly(TextTable table, Layout layout, ReadOptions options) {
            this.table = table;
            this.layout = layout;
            this.options = options;
            this.source = table.source;
        }

        List<ParsedSpectrum> spectra() throws ImportException {
            if (layout.noValueColumn != null) {
                refuseTurningAxis(layout.xOnly);
                throw layout.noValueColumn;
            }
            if (table.rows() < ParsedSpectrum.MIN_POINTS) {
                throw new ImportException(source, table.lastLine(), null,
                        "only 1 data row; a curve needs at least " + ParsedSpectrum.MIN_POINTS);
            }
            List<Series> all = layout.series;
            int count = options.replicates() == Replicates.FIRST ? 1 : all.size();
            List<Curve> curves = new ArrayList<>();
            for (int i = 0; i < count; i++) {
                curves.add(curve(all.get(i)));
            }
            if (options.replicates() == Replicates.MEAN && curves.size() > 1) {
                return List.of(mean(curves));
            }
            List<ParsedSpectrum> out = new ArrayList<>();
            for (int i = 0; i < curves.size(); i++) {
                Map<String, String> extra = new LinkedHashMap<>();
                if (curves.size() > 1) {
                    extra.put("replicate", (i + 1) + " of " + curves.size());
                    extra.put("columns", curves.get(i).series.xName() + ", " + curves.get(i).series.yName());
                }
                out.add(spectrum(curves.get(i), extra, List.of()));
            }
            return out;
        }

        /**
         * One series, in nm, increasing, with its y kind decided; {@code ordered.values()[1]}, when present,
         * its standard deviations.
         */
        private record Curve(Series series, XOrder.Ordered ordered, YKind kind, List<String> notes) {

            boolean hasSpread() {
                return ordered.values().length > 1;
            }
        }

        /** Refuses a wavelength column that changes direction, naming the first line where it turns. */
        private void refuseTurningAxis(Series s) throws ImportException {
            double[] raw = table.column(layout.parsedIndex(s.x()));
            int[] lines = table.lines();
            int direction = 0;
            for (int i = 1; i < raw.length; i++) {
                double before = s.unit().toNanometres(raw[i - 1]);
                double after = s.unit().toNanometres(raw[i]);
                int step = Double.compare(after, before);
                if (step != 0 && direction != 0 && step != direction) {
                    throw new ImportException(source, lines[i], s.xName(), "the wavelength column goes "
                            + (step < 0 ? "back" : "up again") + " from " + before + " nm to " + after
                            + " nm at line " + lines[i] + "; a curve needs its wavelengths in one direction");
                }
                direction = step != 0 ? step : direction;
            }
        }

        private Curve curve(Series s) throws ImportException {
            double[] raw = table.column(layout.parsedIndex(s.x()));
            int[] lines = table.lines();
            double[] x = new double[raw.length];
            for (int i = 0; i < raw.length; i++) {
                if (!(raw[i] > 0)) {
                    throw new ImportException(source, lines[i], s.xName(), "wavelength must be positive, was " + raw[i]);
                }
                x[i] = s.unit().toNanometres(raw[i]);
                if (!Double.isFinite(x[i]) || !(x[i] > 0)) {
                    throw new ImportException(source, lines[i], s.xName(), raw[i] + " " + s.unit()
                            + " is not a finite positive wavelength in nm (" + x[i] + ")");
                }
            }
            int yk = layout.parsedIndex(s.y());
            double[][] columns = {table.column(yk)};
            boolean[][] bounds = {table.bounds(yk)};
            if (s.sd() >= 0) {
                int sk = layout.parsedIndex(s.sd());
                double[] sd = table.column(sk);
                refuseNegativeSpread(s, sd, lines);
                columns = new double[][] {columns[0], sd};
                bounds = new boolean[][] {bounds[0], table.bounds(sk)};
            }
            XOrder.Ordered ordered = XOrder.order(source, s.xName(), x, columns, bounds, lines,
                    options.mergeDuplicates());
            if (ordered.x().length < ParsedSpectrum.MIN_POINTS) {
                throw ImportException.ofSource(source, "only 1 distinct wavelength after merging repeated rows");
            }
            List<String> notes = new ArrayList<>(ordered.notes());
            YKind kind = decideKind(s, ordered.values()[0], notes);
            return new Curve(s, ordered, kind, notes);
        }

        private void refuseNegativeSpread(Series s, double[] sd, int[] lines) throws ImportException {
            String name = layout.namesOf(s.sd());
            for (int i = 0; i < sd.length; i++) {
                if (sd[i] < 0) {
                    throw new ImportException(source, lines[i], name, "a standard deviation cannot be negative, was "
                            + sd[i]);
                }
            }
        }

        private YKind decideKind(Series s, double[] values, List<String> notes) {
            double max = Arrays.stream(values).max().orElseThrow();
            Optional<YKind> named = s.role().namedKind();
            YKind fromFile;
            if (named.isEmpty()) {
                fromFile = max > PERCENT_LOOKING ? YKind.TRANSMITTANCE_PERCENT : YKind.TRANSMITTANCE_FRACTION;
            } else if (named.get() == YKind.TRANSMITTANCE_FRACTION && max > PERCENT_LOOKING) {
                fromFile = YKind.TRANSMITTANCE_PERCENT;
            } else {
                fromFile = named.get();
            }
            Optional<YKind> forced = options.yKind();
            if (forced.isPresent()) {
                if (forced.get() != fromFile) {
                    notes.add("y kind set to " + forced.get() + " by the read options; column '" + s.yName()
                            + "' suggests " + fromFile);
                }
                return forced.get();
            }
            if (named.isEmpty()) {
                notes.add("no header names the value column; y kind guessed as " + fromFile
                        + " from the largest value " + max + " (percent when above " + PERCENT_LOOKING
                        + "); set it in the read options if wrong");
            } else if (fromFile != named.get()) {
                notes.add("column '" + s.yName() + "' " + (s.role().scaleNamed()
                        ? "is labelled as a fraction, which contradicts its values: they reach "
                        : "does not say percent or fraction; its values reach ") + max + " (above "
                        + PERCENT_LOOKING + "), which looks like percent, so it is read as "
                        + YKind.TRANSMITTANCE_PERCENT + "; set the y kind in the read options if wrong");
            }
            return fromFile;
        }

        private ParsedSpectrum mean(List<Curve> curves) throws ImportException {
            Curve first = curves.get(0);
            double[] x = first.ordered().x();
            double[] sum = new double[x.length];
            boolean[] bound = new boolean[x.length];
            List<String> names = new ArrayList<>();
            for (Curve c : curves) {
                names.add(c.series().yName());
                if (c.kind() != first.kind()) {
                    throw ImportException.ofSource(source, "replicates cannot be averaged: column '"
                            + c.series().yName() + "' is " + c.kind() + ", column '" + first.series().yName()
                            + "' is " + first.kind());
                }
                double[] cx = c.ordered().x();
                for (int i = 0; i < x.length; i++) {
                    if (cx.length != x.length || cx[i] != x[i]) {
                        int line = c.ordered().lines()[Math.min(i, cx.length - 1)];
                        throw new ImportException(source, line, c.series().xName(), "replicates cannot be averaged: "
                                + "their wavelengths differ (" + (i < cx.length ? cx[i] : "none") + " nm against "
                                + x[i] + " nm in column '" + first.series().xName() + "')");
                    }
                    sum[i] += c.ordered().values()[0][i] / curves.size(); // divided first so huge values cannot overflow
                    bound[i] |= c.ordered().bounds()[0][i];
                }
            }
            Map<String, String> extra = new LinkedHashMap<>();
            extra.put("replicates", "mean of " + curves.size() + ": " + String.join(", ", names));
            List<String> notes = new ArrayList<>();
            for (Curve c : curves.subList(1, curves.size())) {
                c.notes().stream().filter(n -> !first.notes().contains(n)).forEach(notes::add);
            }
            notes.add("values are the mean of " + curves.size() + " replicate columns " + names
                    + " (an upper bound where any replicate was one)");
            XOrder.Ordered merged = new XOrder.Ordered(x, new double[][] {sum}, new boolean[][] {bound},
                    first.ordered().lines(), List.of());
            ParsedSpectrum mean = spectrum(new Curve(first.series(), merged, first.kind(), first.notes()), extra, notes);
            return mean.withStandardDeviations(spreadOfMean(curves, sum),
                    "spread of " + curves.size() + " replicates " + names + " (standard deviation of their mean)");
        }

        /**
         * The experimental standard deviation of the mean at each point, s/√n with s the sample standard
         * deviation of the n replicates (divisor n − 1): the standard uncertainty of a mean of n independent
         * readings (GUM, JCGM 100:2008, 4.2.2–4.2.3). The mean is what is stored, so its uncertainty is what
         * a verdict on it needs; the spread of a single scan (s itself) would overstate it by √n.
         */
        private static double[] spreadOfMean(List<Curve> curves, double[] mean) {
            int n = curves.size();
            double[] sd = new double[mean.length];
            for (int i = 0; i < mean.length; i++) {
                double squares = 0;
                for (Curve c : curves) {
                    double d = c.ordered().values()[0][i] - mean[i];
                    squares += d * d;
                }
                sd[i] = Math.sqrt(squares / (n - 1) / n);
            }
            return sd;
        }

        private ParsedSpectrum spectrum(Curve c, Map<String, String> extraMetadata, List<String> extraNotes) {
            Map<String, String> metadata = new LinkedHashMap<>(table.metadata);
            metadata.putAll(extraMetadata);
            List<String> warnings = new ArrayList<>(table.warnings);
            warnings.addAll(layout.notes);
            warnings.addAll(c.notes());
            warnings.addAll(extraNotes);
            ParsedSpectrum s = ParsedSpectrum.of(source, c.ordered().x(), c.ordered().values()[0],
                    c.ordered().bounds()[0], c.kind(), c.series().unit(), metadata, warnings)
                    .withLines(c.ordered().lines());
            if (!c.hasSpread()) {
                return s;
            }
            YKind named = layout.roleOf(c.series().sd()).yKind();
            return s.withStandardDeviations(c.ordered().values()[1], named == null ? c.kind() : named,
                    "column '" + layout.namesOf(c.series().sd()) + "'");
        }
    }
}
