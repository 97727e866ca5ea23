package org.spectralsieve.ingest;

import java.util.ArrayList;
import java.util.Arrays;
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
    private static final Pattern PERCENT_MARK = Pattern.compile("(?i)%|percent|pct");
    private static final Pattern MICROMETRE_MARK = Pattern.compile("(?i)µm|μm|\\bum\\b|micro|_um\\b");
    /** A column name that is the wavelength axis (as the delimited reader names it, shortened). */
    private static final Pattern AXIS_NAME = Pattern.compile("wavelength|w\\.length|lambda|nm\\b");
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
        String columnNames = "";
        for (String raw : (Iterable<String>) text.lines()::iterator) {
            String line = raw.strip();
            if (line.isEmpty()) {
                continue;
            }
            double[] row = numbers(line);
            if (row == null) {
                if (rows.isEmpty()) {
                    header.append(line).append('\n'); // comments and column names above the data
                    columnNames = line.startsWith("#") ? columnNames : line;
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
        String lower = columnNames.toLowerCase(Locale.ROOT);
        String[] names = lower.split(lower.matches(".*[,;\\t].*") ? "[,;\\t]" : "\\s+");
        int axis = axisColumn(names);
        if (axis > 0) {
            // a capture export may put a pixel index before the wavelengths (Pixel,Wavelength,Intensity):
            // neither the axis nor a value
            rows = rows.stream().map(r -> r.length > axis + 1 ? Arrays.copyOfRange(r, axis, r.length) : r).toList();
            names = Arrays.copyOfRange(names, axis, names.length);
        }
        String head = header.toString();
        checkTristimulus(fileName, rows);
        checkAxis(fileName, rows, head, columnNames);
        checkMagnitude(fileName, rows, head, names, options);
    }

    /** The first column named as a wavelength, or 0 when none is. */
    private static int axisColumn(String[] names) {
        for (int c = 0; c < names.length; c++) {
            if (isAxisName(names[c])) {
                return c;
            }
        }
        return 0;
    }

    private static boolean isAxisName(String name) {
        return AXIS_NAME.matcher(name.strip().replaceAll("^\"|\"$", "")).lookingAt();
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

    /**
     * The first column, read in the unit its column names give, must reach into 100–25,000 nm. Only the
     * column names count for micrometres: a comment such as {@code # film 50 um} gives a thickness.
     */
    private static void checkAxis(String fileName, List<double[]> rows, String head, String columnNames)
            throws ImportException {
        if (WAVENUMBER_MARK.matcher(head).find()) {
            return;
        }
        double scale = MICROMETRE_MARK.matcher(columnNames).find() ? 1000 : 1;
        double min = Double.POSITIVE_INFINITY;
        double max = Double.NEGATIVE_INFINITY;
        for (double[] r : rows) {
            min = Math.min(min, r[0] * scale);
            max = Math.max(max, r[0] * scale);
        }
        if (max >= AXIS_MIN_NM && min <= AXIS_MAX_NM) {
            return;
        }
        String range = nm(min) + "–" + nm(max) + " nm";
        String hint = scale == 1 && max < AXIS_MIN_NM && min >= 0.05
                ? " It looks like micrometres read as nanometres: name the unit in the header (e.g. wavelength_um)."
                : "";
        throw ImportException.ofSource(fileName, "its wavelength axis runs " + range
                + ", entirely outside the 100–25,000 nm a transmittance curve here can cover, so it is not read"
                + " as one." + hint);
    }

    /** Values far above 100 with no percent unit are not transmittance; an emission spectrum is the usual case. */
    private static void checkMagnitude(String fileName, List<double[]> rows, String head, String[] names,
                                       ImportOptions options) throws ImportException {
        if (options.yKind().isPresent() && options.yKind().get() == YKind.ABSORBANCE) {
            return;
        }
        if (PERCENT_MARK.matcher(head).find()) {
            return; // the percent reading and its own T ceiling apply
        }
        double max = Double.NEGATIVE_INFINITY;
        for (double[] r : rows) {
            for (int c = 1; c < r.length; c++) {
                // replicate pairs (w.length.1 T.1 w.length.2 T.2) repeat the axis: those are not values
                boolean axis = names.length == r.length && isAxisName(names[c]);
                max = axis ? max : Math.max(max, r[c]);
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
        String[] tokens = line.split(commaIsDecimal ? "[;\\t]+" : "[,\\s]+");
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
