package org.spectralsieve.ingest;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.regex.Pattern;
import org.spectralsieve.importers.ImportException;
import org.spectralsieve.importers.YKind;

/**
 * Refuses text files that read as numbers but are not transmittance curves, before a reader turns them
 * into one: colour-matching-function tables (three tristimulus-like value columns), emission or
 * illuminant spectra (values far above 100 with no percent unit), refractive-index tables (n, k), and
 * wavelength axes that no UV–IR transmittance measurement has (entirely outside 100–25,000 nm, typically
 * micrometres read as nanometres). Without this check such a file is stored as, for example,
 * "1.6 %T over 0.4–19.9 nm", and every verdict drawn from it is wrong.
 *
 * <p>Looks only at the raw text (first {@value #ROWS} numeric rows), so it does not depend on how the
 * readers treat noise, floors or replicates. JCAMP-DX and raw counts carry their own units and roles and
 * are not checked here.
 */
final class CurveShapeCheck {

    /** Rows looked at: enough for the shape of any curve, cheap for the largest allowed file. */
    private static final int ROWS = 5000;
    /** Transmittance percent above this is not noise around 100 %T (common practice, no source). */
    private static final double PERCENT_CEILING = 105;
    /** Wavelengths a transmittance curve of this library can have: vacuum UV to mid-IR (common practice, no source). */
    private static final double AXIS_MIN_NM = 100;
    private static final double AXIS_MAX_NM = 25_000;
    private static final Pattern INDEX_TABLE = Pattern.compile(
            "(?im)^\\s*-?\\s*type:\\s*(tabulated\\s+(nk|n|k)|formula\\s*\\d*)\\s*$");
    /** Cell separators of a numeric row (compiled once: {@code String.split} compiles them per line). */
    private static final Pattern SEMICOLONS_OR_TABS = Pattern.compile("[;\\t]+");
    private static final Pattern COMMAS_OR_SPACES = Pattern.compile("[,\\s]+");
    private static final Pattern PERCENT_MARK = Pattern.compile("(?i)%|percent|pct");
    private static final Pattern MICROMETRE_MARK = Pattern.compile("(?i)µm|μm|\\bum\\b|micro|_um\\b");
    /** Header names of axis columns: wavelength (also w.length, lambda, nm), wavenumber, pixel or index. */
    private static final Pattern AXIS_NAME = Pattern.compile("(?i)wave|length|lambda|λ|^nm$|pixel|^index$");
    private static final Pattern INDEX_NAME = Pattern.compile("(?i)pixel|^index$");
    private static final Pattern WAVENUMBER_MARK = Pattern.compile("(?i)cm-1|cm⁻¹|1/cm|wavenumber");

    private static final String SPECTRUM_IMPORT = "if it is an emitter or illuminant spectrum or a detector or"
            + " action response, import it as a spectrum instead (POST /api/emitters or /api/responses;"
            + " CLI import-spectrum)";

    private CurveShapeCheck() {
    }

    /**
     * @throws ImportException naming the file and saying what it looks like, when it is not a transmittance
     *                         curve; returns quietly otherwise (including when the shape is unclear)
     */
    static void refuseNonTransmittance(String fileName, String text, ImportFormat format, ImportOptions options)
            throws ImportException {
        if (format == ImportFormat.JCAMP_DX || format == ImportFormat.RAW_COUNTS) {
            return;
        }
        if (INDEX_TABLE.matcher(text).find()) {
            throw ImportException.ofSource(fileName, "looks like a refractive-index table (n, k against wavelength,"
                    + " a 'type: tabulated' or 'type: formula' block), not a transmittance curve; the rescaling"
                    + " takes the refractive index as a number, so give it there and import a measured"
                    + " transmittance curve here");
        }
        List<double[]> rows = new ArrayList<>();
        StringBuilder header = new StringBuilder();
        StringBuilder columnNames = new StringBuilder(); // without comments: "# thickness: 125 µm" names no axis unit
        for (String raw : (Iterable<String>) text.lines()::iterator) {
            String line = raw.strip();
            if (line.isEmpty()) {
                continue;
            }
            double[] row = numbers(line);
            if (row == null) {
                if (rows.isEmpty()) {
                    header.append(line).append('\n'); // comments and column names above the data
                    if (!line.startsWith("#")) {
                        columnNames.append(line).append('\n');
                    }
                }
                continue;
            }
            rows.add(row);
            if (rows.size() >= ROWS) {
                break;
            }
        }
        if (rows.size() < 3) {
            return; // too little to judge; the readers report it
        }
        String head = header.toString();
        checkTristimulus(fileName, rows);
        if (options.xUnit().isEmpty() && options.xColumn().isEmpty()) {
            checkAxis(fileName, rows, columnNames.toString()); // a user who set the x unit or column has said what the axis is
        }
        checkMagnitude(fileName, rows, head, valueColumns(columnNames.toString(), rows.get(0).length, options), options);
    }

    /** Three value columns peaking at clearly different wavelengths and falling near zero at both ends. */
    private static void checkTristimulus(String fileName, List<double[]> rows) throws ImportException {
        if (!rows.stream().allMatch(r -> r.length == 4)) {
            return;
        }
        double[] peakAt = new double[3];
        for (int c = 1; c <= 3; c++) {
            double max = Double.NEGATIVE_INFINITY;
            for (double[] r : rows) {
                if (r[c] < 0) {
                    return;
                }
                if (r[c] > max) {
                    max = r[c];
                    peakAt[c - 1] = r[0];
                }
            }
            // a colour-matching function vanishes at both ends of its range; a transmittance curve does not
            if (max <= 0 || rows.get(0)[c] > 0.1 * max || rows.get(rows.size() - 1)[c] > 0.1 * max) {
                return;
            }
        }
        double span = Math.abs(rows.get(rows.size() - 1)[0] - rows.get(0)[0]);
        double minSeparation = 0.05 * span;
        if (Math.abs(peakAt[0] - peakAt[1]) > minSeparation && Math.abs(peakAt[1] - peakAt[2]) > minSeparation
                && Math.abs(peakAt[0] - peakAt[2]) > minSeparation) {
            throw ImportException.ofSource(fileName, "looks like a table of colour-matching functions (three value"
                    + " columns peaking at " + nm(peakAt[0]) + ", " + nm(peakAt[1]) + " and " + nm(peakAt[2])
                    + " nm, each falling to zero at both ends), not a transmittance curve; " + SPECTRUM_IMPORT);
        }
    }

    /** The first column, read in the unit its header names, must reach into 100–25,000 nm. */
    private static void checkAxis(String fileName, List<double[]> rows, String head) throws ImportException {
        if (WAVENUMBER_MARK.matcher(head).find()) {
            return;
        }
        double scale = MICROMETRE_MARK.matcher(head).find() ? 1000 : 1;
        double min = Double.POSITIVE_INFINITY;
        double max = Double.NEGATIVE_INFINITY;
        int x = wavelengthColumn(head, rows.get(0).length);
        for (double[] r : rows) {
            min = Math.min(min, r[x] * scale);
            max = Math.max(max, r[x] * scale);
        }
        if (max >= AXIS_MIN_NM && min <= AXIS_MAX_NM) {
            return;
        }
        String range = nm(min) + "–" + nm(max) + " nm";
        String hint = scale == 1 && max < AXIS_MIN_NM && min >= 0.05
                ? " It looks like micrometres read as nanometres: name the unit in the header (e.g. wavelength_um) or set the x unit (xUnit=um)."
                : "";
        throw ImportException.ofSource(fileName, "its wavelength axis runs " + range
                + ", entirely outside the 100–25,000 nm a transmittance curve here can cover, so it is not read"
                + " as one." + hint);
    }

    /** Values far above 100 with no percent unit are not transmittance; an emission spectrum is the usual case. */
    /**
     * The columns that hold values, 0-based: the chosen {@code yColumn}; else every column but the first, the
     * chosen {@code xColumn} and those the header names as an axis (a second wavelength column of replicate
     * pairs, a pixel number before the wavelength): their numbers are wavelengths or indices, not readings.
     */
    static boolean[] valueColumns(String columnNames, int count, ImportOptions options) {
        boolean[] value = new boolean[count];
        if (options.yColumn().isPresent()) {
            int y = options.yColumn().getAsInt() - 1;
            if (y < count) {
                value[y] = true;
            }
            return value;
        }
        int x = options.xColumn().isPresent() ? options.xColumn().getAsInt() - 1 : wavelengthColumn(columnNames, count);
        String[] names = names(columnNames);
        for (int c = 0; c < count; c++) {
            boolean axis = names.length == count && AXIS_NAME.matcher(names[c]).find();
            value[c] = c != x && !axis;
        }
        return value;
    }

    /** The column names: the last line above the data that is not a comment, split at delimiters. */
    private static String[] names(String columnNames) {
        String[] lines = columnNames.strip().split("\n");
        return lines[lines.length - 1].strip().split("\\s*[,;\\t]\\s*|\\s+");
    }

    /** The first column the header names as a wavelength (not a pixel or index), else the first column. */
    private static int wavelengthColumn(String columnNames, int count) {
        String[] names = names(columnNames.lines().filter(l -> !l.strip().startsWith("#"))
                .reduce("", (a, b) -> a + "\n" + b));
        if (names.length == count) {
            for (int c = 0; c < count; c++) {
                if (AXIS_NAME.matcher(names[c]).find() && !INDEX_NAME.matcher(names[c]).find()) {
                    return c;
                }
            }
        }
        return 0;
    }

    private static void checkMagnitude(String fileName, List<double[]> rows, String head, boolean[] valueColumns,
                                       ImportOptions options) throws ImportException {
        if (options.yKind().isPresent() && options.yKind().get() == YKind.ABSORBANCE) {
            return;
        }
        if (PERCENT_MARK.matcher(head).find()) {
            return; // the percent reading and its own T ceiling apply
        }
        double max = Double.NEGATIVE_INFINITY;
        for (double[] r : rows) {
            for (int c = 0; c < r.length && c < valueColumns.length; c++) {
                if (valueColumns[c]) {
                    max = Math.max(max, r[c]);
                }
            }
        }
        if (max > PERCENT_CEILING) {
            throw ImportException.ofSource(fileName, "its values reach " + max + " with no percent sign or percent"
                    + " unit, far above any transmittance (1, or 100 %T); it looks like a relative emission,"
                    + " illuminant or response spectrum, not a transmittance curve; " + SPECTRUM_IMPORT);
        }
    }

    /** The numbers of a data row, or null when the line is not all numbers (a comment or header). */
    private static double[] numbers(String line) {
        if (line.startsWith("#")) {
            return null;
        }
        boolean commaIsDecimal = line.contains(";") || line.contains("\t");
        String[] tokens = (commaIsDecimal ? SEMICOLONS_OR_TABS : COMMAS_OR_SPACES).split(line);
        double[] values = new double[tokens.length];
        for (int i = 0; i < tokens.length; i++) {
            String t = tokens[i].strip();
            if (commaIsDecimal) {
                t = t.replace(',', '.');
            }
            try {
                values[i] = Double.parseDouble(t);
            } catch (NumberFormatException e) {
                return null;
            }
            if (!Double.isFinite(values[i])) {
                return null;
            }
        }
        return values.length >= 2 ? values : null;
    }

    private static String nm(double v) {
        return v == Math.rint(v) && Math.abs(v) < 1e9 ? Long.toString((long) v) : String.format(Locale.ROOT, "%.3g", v);
    }
}
