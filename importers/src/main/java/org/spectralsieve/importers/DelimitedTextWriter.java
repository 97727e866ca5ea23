package org.spectralsieve.importers;

import java.io.IOException;
import java.io.StringWriter;
import java.io.UncheckedIOException;
import java.io.Writer;
import java.util.Locale;
import java.util.Map;
import java.util.regex.Pattern;

/**
 * Writes the sieve curve CSV, the project's own curve file (demo library, HTTP export):
 *
 * <pre>
 * # Spectral Sieve curve v1
 * # thickness_mm: 3.0
 * wavelength_nm,transmittance
 * 190.0,&lt;0.001
 * 191.0,0.0123
 * </pre>
 *
 * Numbers are written with {@link Double#toString(double)}, the shortest decimal that parses back to the
 * same double, so {@link DelimitedTextReader} restores every value bit for bit.
 *
 * <p>A curve with a measurement uncertainty gets a third column, {@value #SD_COLUMN}: one standard deviation
 * in decadic absorbance per point (the unit the project keeps it in, so it reads back exactly, whatever the
 * transmittance), empty where it is unknown.
 */
public final class DelimitedTextWriter {

    /** First line of every sieve curve file; the reader recognises (but does not require) it. */
    public static final String FORMAT_LINE = "# Spectral Sieve curve v1";
    static final String HEADER = "wavelength_nm,transmittance";
    /** The name of the uncertainty column; {@link ColumnRole} reads it as a standard deviation in absorbance. */
    public static final String SD_COLUMN = "absorbance_sd";

    /** Keys the reader will read back as metadata: no separators, no comment or line breaks. */
    private static final Pattern KEY = Pattern.compile("[a-z][a-z0-9_.\\- ]*");
    private static final Pattern LINE_BREAKS = Pattern.compile("\\R");

    private DelimitedTextWriter() {
    }

    /**
     * @param upperBounds true where the point is only an upper bound (written as {@code <value}); null = none
     * @throws IllegalArgumentException for unequal lengths, a non-finite number (quoting index and value),
     *                                  wavelengths not strictly increasing, or a key the reader could not read back
     */
    public static String write(Map<String, String> metadata, double[] wavelengthsNm,
            double[] transmittanceFractions, boolean[] upperBounds) {
        return write(metadata, wavelengthsNm, transmittanceFractions, upperBounds, (double[]) null);
    }

    /**
     * @param absorbanceSd one standard deviation in absorbance per point, finite and &ge; 0 or NaN (unknown,
     *                     written as an empty cell); null = no uncertainty column
     */
    public static String write(Map<String, String> metadata, double[] wavelengthsNm,
            double[] transmittanceFractions, boolean[] upperBounds, double[] absorbanceSd) {
        StringWriter out = new StringWriter(48 * wavelengthsNm.length + 256);
        try {
            write(metadata, wavelengthsNm, transmittanceFractions, upperBounds, absorbanceSd, out);
        } catch (IOException e) {
            throw new UncheckedIOException(e); // StringWriter never throws
        }
        return out.toString();
    }

    /** Streams the file to {@code out} (not closed, flushed), for curves too large to build as one string. */
    public static void write(Map<String, String> metadata, double[] wavelengthsNm,
            double[] transmittanceFractions, boolean[] upperBounds, Writer out) throws IOException {
        write(metadata, wavelengthsNm, transmittanceFractions, upperBounds, null, out);
    }

    /** As {@link #write(Map, double[], double[], boolean[], Writer)}, with an uncertainty column when given. */
    public static void write(Map<String, String> metadata, double[] wavelengthsNm,
            double[] transmittanceFractions, boolean[] upperBounds, double[] absorbanceSd, Writer out)
            throws IOException {
        check(wavelengthsNm, transmittanceFractions, upperBounds);
        checkSd(wavelengthsNm, absorbanceSd);
        out.write(FORMAT_LINE);
        out.write('\n');
        if (metadata != null) {
            for (Map.Entry<String, String> e : metadata.entrySet()) {
                out.write("# " + key(e.getKey()) + ": " + value(e.getValue()) + "\n");
            }
        }
        out.write(absorbanceSd == null ? HEADER : HEADER + "," + SD_COLUMN);
        out.write('\n');
        StringBuilder row = new StringBuilder(48);
        for (int i = 0; i < wavelengthsNm.length; i++) {
            row.setLength(0);
            row.append(Double.toString(wavelengthsNm[i])).append(',');
            if (upperBounds != null && upperBounds[i]) {
                row.append('<');
            }
            row.append(Double.toString(transmittanceFractions[i]));
            if (absorbanceSd != null) {
                row.append(',');
                if (!Double.isNaN(absorbanceSd[i])) {
                    row.append(Double.toString(absorbanceSd[i]));
                }
            }
            row.append('\n');
            out.append(row);
        }
        out.flush();
    }

    private static void check(double[] x, double[] t, boolean[] bounds) {
        if (x.length != t.length || (bounds != null && bounds.length != x.length)) {
            throw new IllegalArgumentException("lengths differ: " + x.length + " wavelengths, " + t.length
                    + " transmittances, " + (bounds == null ? "no" : bounds.length) + " upper-bound flags");
        }
        for (int i = 0; i < x.length; i++) {
            if (!Double.isFinite(x[i]) || !Double.isFinite(t[i])) {
                throw new IllegalArgumentException(
                        "point " + i + " is not finite: " + x[i] + " nm, T = " + t[i]);
            }
            if (i > 0 && !(x[i] > x[i - 1])) {
                throw new IllegalArgumentException("wavelengths not strictly increasing at index " + i + ": "
                        + x[i] + " nm follows " + x[i - 1] + " nm");
            }
        }
    }

    private static void checkSd(double[] x, double[] sd) {
        if (sd == null) {
            return;
        }
        if (sd.length != x.length) {
            throw new IllegalArgumentException("lengths differ: " + x.length + " wavelengths, " + sd.length
                    + " standard deviations");
        }
        for (int i = 0; i < sd.length; i++) {
            if (!Double.isNaN(sd[i]) && !(Double.isFinite(sd[i]) && sd[i] >= 0)) {
                throw new IllegalArgumentException("standard deviation at index " + i + " is " + sd[i]
                        + ", must be finite and >= 0, or NaN (unknown)");
            }
        }
    }

    private static String key(String key) {
        String k = ParsedSpectrum.normaliseKey(key);
        if (!KEY.matcher(k).matches()) {
            throw new IllegalArgumentException("metadata key cannot be written so that it reads back: '" + key
                    + "' (use letters, digits, '_', '-', '.', spaces; start with a letter)");
        }
        return k.toLowerCase(Locale.ROOT);
    }

    /** A line break would end the comment early; the rest of the value would become a data line. */
    private static String value(String value) {
        return value == null ? "" : LINE_BREAKS.matcher(value).replaceAll(" ").strip();
    }
}
