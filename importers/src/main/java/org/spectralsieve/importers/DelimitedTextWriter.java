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
 */
public final class DelimitedTextWriter {

    /** First line of every sieve curve file; the reader recognises (but does not require) it. */
    public static final String FORMAT_LINE = "# Spectral Sieve curve v1";
    static final String HEADER = "wavelength_nm,transmittance";

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
        StringWriter out = new StringWriter(32 * wavelengthsNm.length + 256);
        try {
            write(metadata, wavelengthsNm, transmittanceFractions, upperBounds, out);
        } catch (IOException e) {
            throw new UncheckedIOException(e); // StringWriter never throws
        }
        return out.toString();
    }

    /** Streams the file to {@code out} (not closed, flushed), for curves too large to build as one string. */
    public static void write(Map<String, String> metadata, double[] wavelengthsNm,
            double[] transmittanceFractions, boolean[] upperBounds, Writer out) throws IOException {
        check(wavelengthsNm, transmittanceFractions, upperBounds);
        out.write(FORMAT_LINE);
        out.write('\n');
        if (metadata != null) {
            for (Map.Entry<String, String> e : metadata.entrySet()) {
                out.write("# " + key(e.getKey()) + ": " + value(e.getValue()) + "\n");
            }
        }
        out.write(HEADER);
        out.write('\n');
        StringBuilder row = new StringBuilder(48);
        for (int i = 0; i < wavelengthsNm.length; i++) {
            row.setLength(0);
            row.append(Double.toString(wavelengthsNm[i])).append(',');
            if (upperBounds != null && upperBounds[i]) {
                row.append('<');
            }
            row.append(Double.toString(transmittanceFractions[i])).append('\n');
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
