package org.spectralsieve.weighting;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.io.Reader;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;

/**
 * A tabulated spectral function, read from a plain text file: {@code #} comment lines (one of them
 * {@code # source: …}, required, so no table ships without its origin, continued on the following comment
 * lines that start with {@code #} and two or more blanks; optionally one
 * {@code # interpolation: log10} or {@code # interpolation: linear}, log10 when absent), blank lines, and
 * data rows of exactly two numbers {@code wavelength_nm value} separated by white space. Wavelengths
 * strictly increase; values are finite and &gt; 0 (a log10 table needs it, and no shipped table has a
 * zero). Numbers are parsed with {@link Double#parseDouble}, which does not depend on the locale.
 */
public final class WeightingTable {

    /** How values between rows are read. */
    public enum Interpolation {
        /**
         * Straight lines in log10 of the value: for hazard weightings that fall by decades across a few
         * nm, where straight lines in the value would overweight the low side.
         */
        LOG10,
        /** Straight lines in the value: what CIE 015 prescribes for its illuminant tables. */
        LINEAR;

        private static Interpolation declared(String file, int lineNo, String text) {
            for (Interpolation i : values()) {
                if (i.name().toLowerCase(Locale.ROOT).equals(text)) {
                    return i;
                }
            }
            throw new WeightingTableException(file + ":" + lineNo + ": field interpolation '" + text
                    + "' is not one of log10, linear");
        }
    }

    private static final String SOURCE = "source:";
    private static final String INTERPOLATION = "interpolation:";

    private final String name;
    private final String source;
    private final Interpolation interpolation;
    private final double[] wavelengthsNm;
    private final double[] values;
    private final double[] log10Values;

    private WeightingTable(String name, String source, Interpolation interpolation, double[] wavelengthsNm,
            double[] values) {
        this.name = name;
        this.source = source;
        this.interpolation = interpolation;
        this.wavelengthsNm = wavelengthsNm;
        this.values = values;
        this.log10Values = Arrays.stream(values).map(Math::log10).toArray();
    }

    /** Reads {@code weighting/<fileName>} from the class path. */
    public static WeightingTable resource(String fileName) {
        String path = "/weighting/" + fileName;
        InputStream in = WeightingTable.class.getResourceAsStream(path);
        if (in == null) {
            throw new WeightingTableException(fileName + ": not found on the class path at " + path);
        }
        try (Reader reader = new InputStreamReader(in, StandardCharsets.UTF_8)) {
            return read(fileName, reader);
        } catch (IOException e) {
            throw new UncheckedIOException(fileName + ": " + e.getMessage(), e);
        }
    }

    /** Reads a table; {@code fileName} only names the file in error messages. */
    public static WeightingTable read(String fileName, Reader reader) throws IOException {
        BufferedReader lines = new BufferedReader(reader);
        String source = null;
        Interpolation interpolation = null;
        boolean inSource = false;
        List<double[]> rows = new ArrayList<>();
        String line;
        int lineNo = 0;
        while ((line = lines.readLine()) != null) {
            lineNo++;
            String text = line.strip();
            if (text.startsWith("#")) {
                String comment = text.substring(1).strip();
                if (inSource && text.startsWith("#  ") && !comment.isEmpty()) {
                    source += " " + comment;
                    continue;
                }
                inSource = false;
                if (comment.startsWith(SOURCE) && source == null) {
                    source = comment.substring(SOURCE.length()).strip();
                    inSource = true;
                } else if (comment.startsWith(INTERPOLATION)) {
                    if (interpolation != null) {
                        throw new WeightingTableException(fileName + ":" + lineNo
                                + ": second '# interpolation:' line; a table is read one way only");
                    }
                    interpolation = Interpolation.declared(fileName, lineNo,
                            comment.substring(INTERPOLATION.length()).strip());
                }
                continue;
            }
            inSource = false;
            if (text.isEmpty()) {
                continue;
            }
            rows.add(row(fileName, lineNo, text, rows.isEmpty() ? Double.NaN : rows.get(rows.size() - 1)[0]));
        }
        if (source == null || source.isEmpty()) {
            throw new WeightingTableException(fileName + ":1: no '# source:' line; every table names its origin");
        }
        if (rows.size() < 2) {
            throw new WeightingTableException(fileName + ":" + lineNo + ": needs at least 2 data rows, got "
                    + rows.size());
        }
        double[] nm = rows.stream().mapToDouble(r -> r[0]).toArray();
        double[] values = rows.stream().mapToDouble(r -> r[1]).toArray();
        return new WeightingTable(fileName, source, interpolation == null ? Interpolation.LOG10 : interpolation,
                nm, values);
    }

    private static double[] row(String file, int lineNo, String text, double previousNm) {
        String[] fields = text.split("\\s+");
        if (fields.length != 2) {
            throw new WeightingTableException(file + ":" + lineNo + ": expected 2 fields (wavelength_nm value), got "
                    + fields.length + " in '" + text + "'");
        }
        double nm = number(file, lineNo, "wavelength_nm", fields[0]);
        double value = number(file, lineNo, "value", fields[1]);
        if (!(nm > 0)) {
            throw new WeightingTableException(file + ":" + lineNo + ": field wavelength_nm is " + nm + ", must be > 0");
        }
        if (!Double.isNaN(previousNm) && !(nm > previousNm)) {
            throw new WeightingTableException(file + ":" + lineNo + ": field wavelength_nm " + nm
                    + " is not greater than the previous row's " + previousNm);
        }
        if (!(value > 0)) {
            throw new WeightingTableException(file + ":" + lineNo + ": field value is " + value
                    + ", must be > 0");
        }
        return new double[] {nm, value};
    }

    private static double number(String file, int lineNo, String field, String text) {
        try {
            double v = Double.parseDouble(text);
            if (Double.isFinite(v)) {
                return v;
            }
        } catch (NumberFormatException e) {
            // reported below with the position
        }
        throw new WeightingTableException(file + ":" + lineNo + ": field " + field + " '" + text
                + "' is not a finite number");
    }

    public String name() {
        return name;
    }

    public String source() {
        return source;
    }

    public Interpolation interpolation() {
        return interpolation;
    }

    /** The rows' wavelengths, a copy. */
    public double[] wavelengthsNm() {
        return wavelengthsNm.clone();
    }

    /** The rows' values as written in the file, a copy. */
    public double[] values() {
        return values.clone();
    }

    public double minWavelengthNm() {
        return wavelengthsNm[0];
    }

    public double maxWavelengthNm() {
        return wavelengthsNm[wavelengthsNm.length - 1];
    }

    /**
     * The value at a row exactly as written; between rows by the table's {@link Interpolation}. 0 outside.
     */
    public double valueAt(double nm) {
        if (!(nm >= minWavelengthNm() && nm <= maxWavelengthNm())) {
            return 0;
        }
        int hit = Arrays.binarySearch(wavelengthsNm, nm);
        if (hit >= 0) {
            return values[hit];
        }
        int upper = -hit - 1;
        int lower = upper - 1;
        double f = (nm - wavelengthsNm[lower]) / (wavelengthsNm[upper] - wavelengthsNm[lower]);
        return switch (interpolation) {
            case LOG10 -> Math.pow(10, log10Values[lower] * (1 - f) + log10Values[upper] * f);
            case LINEAR -> values[lower] * (1 - f) + values[upper] * f;
        };
    }

    @Override
    public String toString() {
        return "WeightingTable[" + name + ", " + interpolation.name().toLowerCase(Locale.ROOT) + ", "
                + wavelengthsNm.length + " rows, " + minWavelengthNm() + ".."
                + maxWavelengthNm() + " nm]";
    }
}
