package org.spectralsieve.importers.jcamp;

import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.Set;

/**
 * Writes one transmittance curve as JCAMP-DX 5.01: {@code XUNITS=NANOMETERS},
 * {@code YUNITS=TRANSMITTANCE}, {@code ##XYPOINTS=(XY..XY)} in AFFN, one pair per line, each number
 * in {@link Double#toString} form (the shortest text that reads back to the same double, so
 * {@link JcampReader} restores every bit; irregular spacing needs XYPOINTS, not XYDATA). Upper bounds
 * go into the private label {@code ##$SIEVE BELOW DETECTION=} as 0-based point indices.
 */
public final class JcampWriter {

    /** Labels the writer sets itself; metadata with these names would contradict the data. */
    private static final Set<String> OWN = Set.of(Labels.TITLE, "JCAMPDX", "DATATYPE", "ORIGIN", "OWNER",
            Labels.XUNITS, Labels.YUNITS, Labels.XFACTOR, Labels.YFACTOR, Labels.FIRSTX, Labels.LASTX,
            Labels.DELTAX, Labels.NPOINTS, Labels.FIRSTY, Labels.MINY, Labels.MAXY, "MINX", "MAXX", "BLOCKS",
            "BLOCKID", "DATACLASS", "LASTY", Labels.XYDATA, Labels.XYPOINTS, Labels.PEAKTABLE, Labels.END,
            Labels.BELOW_DETECTION, Labels.ABSORBANCE_SD, "JCAMPBLOCK");
    private static final int INDICES_PER_LINE = 12;

    private JcampWriter() {
    }

    /**
     * @param metadata          written as {@code ##KEY= value} (title, origin and owner fill the
     *                          required labels; others follow in map order); null = none
     * @param wavelengthsNm     strictly increasing, finite
     * @param transmittanceFractions finite, same length
     * @param upperBounds       true where the value is only an upper bound; null = none
     * @throws IllegalArgumentException naming the bad index and value, or the bad metadata key
     */
    public static String write(Map<String, String> metadata, double[] wavelengthsNm,
            double[] transmittanceFractions, boolean[] upperBounds) {
        return write(metadata, wavelengthsNm, transmittanceFractions, upperBounds, null);
    }

    /**
     * As {@link #write(Map, double[], double[], boolean[])}, with the curve's measurement uncertainty in the
     * private label {@code ##$SIEVE ABSORBANCE SD=} ({@link AbsorbanceSd}: why a label, not a second table).
     *
     * @param absorbanceSd one standard deviation in absorbance per point, finite and &ge; 0 or NaN (unknown);
     *                     null = none, and no label
     */
    public static String write(Map<String, String> metadata, double[] wavelengthsNm,
            double[] transmittanceFractions, boolean[] upperBounds, double[] absorbanceSd) {
        Objects.requireNonNull(wavelengthsNm, "wavelengthsNm");
        Objects.requireNonNull(transmittanceFractions, "transmittanceFractions");
        Map<String, String> meta = metadata == null ? Map.of() : metadata;
        check(wavelengthsNm, transmittanceFractions, upperBounds);
        int n = wavelengthsNm.length;
        StringBuilder out = new StringBuilder(64 * n + 1024);
        label(out, "TITLE", find(meta, Labels.TITLE, "untitled curve"));
        label(out, "JCAMP-DX", "5.01");
        label(out, "DATA TYPE", "UV/VIS SPECTRUM");
        label(out, "ORIGIN", find(meta, "ORIGIN", "unknown"));
        label(out, "OWNER", find(meta, "OWNER", "unknown"));
        meta.forEach((key, value) -> {
            if (!OWN.contains(Labels.canonical(key))) {
                label(out, key.strip().toUpperCase(Locale.ROOT), value, key);
            }
        });
        double min = Double.POSITIVE_INFINITY;
        double max = Double.NEGATIVE_INFINITY;
        for (double t : transmittanceFractions) {
            min = Math.min(min, t);
            max = Math.max(max, t);
        }
        label(out, "XUNITS", "NANOMETERS");
        label(out, "YUNITS", "TRANSMITTANCE");
        label(out, "XFACTOR", "1");
        label(out, "YFACTOR", "1");
        label(out, "FIRSTX", Double.toString(wavelengthsNm[0]));
        label(out, "LASTX", Double.toString(wavelengthsNm[n - 1]));
        label(out, "NPOINTS", Integer.toString(n));
        label(out, "FIRSTY", Double.toString(transmittanceFractions[0]));
        label(out, "MINX", Double.toString(wavelengthsNm[0]));
        label(out, "MAXX", Double.toString(wavelengthsNm[n - 1]));
        label(out, "MINY", Double.toString(min));
        label(out, "MAXY", Double.toString(max));
        belowDetection(out, upperBounds);
        if (absorbanceSd != null) {
            checkSd(absorbanceSd, n);
            AbsorbanceSd.write(out, absorbanceSd);
        }
        out.append("##XYPOINTS= (XY..XY)\n");
        for (int i = 0; i < n; i++) {
            out.append(wavelengthsNm[i]).append(", ").append(transmittanceFractions[i]).append('\n');
        }
        out.append("##END=\n");
        return out.toString();
    }

    private static void belowDetection(StringBuilder out, boolean[] upperBounds) {
        out.append("##").append(Labels.BELOW_DETECTION_AS_WRITTEN)
                .append("= $$ 0-based indices of XYPOINTS pairs that are upper bounds\n");
        if (upperBounds == null) {
            return;
        }
        int onLine = 0;
        for (int i = 0; i < upperBounds.length; i++) {
            if (upperBounds[i]) {
                out.append(onLine == 0 ? "" : " ").append(i);
                if (++onLine == INDICES_PER_LINE) {
                    out.append('\n');
                    onLine = 0;
                }
            }
        }
        if (onLine > 0) {
            out.append('\n');
        }
    }

    private static void checkSd(double[] sd, int n) {
        if (sd.length != n) {
            throw new IllegalArgumentException("lengths differ: " + n + " points, " + sd.length + " standard deviations");
        }
        for (int i = 0; i < n; i++) {
            if (!Double.isNaN(sd[i]) && !(Double.isFinite(sd[i]) && sd[i] >= 0)) {
                throw new IllegalArgumentException("standard deviation at index " + i + " is " + sd[i]
                        + ", must be finite and >= 0, or NaN (unknown)");
            }
        }
    }

    private static String find(Map<String, String> meta, String canonical, String fallback) {
        for (Map.Entry<String, String> e : meta.entrySet()) {
            if (Labels.canonical(e.getKey()).equals(canonical) && !e.getValue().isBlank()) {
                return e.getValue();
            }
        }
        return fallback;
    }

    /** A value may span lines (the reader joins them) but no line may look like a label or a comment. */
    private static void label(StringBuilder out, String key, String value) {
        label(out, key, value, key);
    }

    /** {@code given} is the metadata key as the caller spelt it, quoted in messages. */
    private static void label(StringBuilder out, String key, String value, String given) {
        Objects.requireNonNull(value, () -> "metadata value of '" + given + "'");
        if (key.isEmpty() || key.contains("=") || key.contains("\n") || key.contains("\r")
                || key.contains("$$")) {
            throw new IllegalArgumentException("metadata key cannot be a JCAMP label: '" + given + "'");
        }
        if (value.contains("$$") || value.contains("\r")) {
            throw new IllegalArgumentException("metadata value of '" + given + "' contains '$$' or a carriage"
                    + " return, which JCAMP-DX cannot carry: '" + value + "'");
        }
        for (String line : value.split("\n", -1)) {
            if (line.strip().startsWith("##")) {
                throw new IllegalArgumentException("metadata value of '" + given + "' has a line starting with"
                        + " '##', which would read back as a label: '" + value + "'");
            }
        }
        out.append("##").append(key).append("= ").append(value.strip()).append('\n');
    }

    private static void check(double[] x, double[] t, boolean[] bounds) {
        if (x.length != t.length || (bounds != null && bounds.length != x.length)) {
            throw new IllegalArgumentException("lengths differ: " + x.length + " wavelengths, " + t.length
                    + " transmittances" + (bounds == null ? "" : ", " + bounds.length + " upper-bound flags"));
        }
        if (x.length < 2) {
            throw new IllegalArgumentException("need at least 2 points, got " + x.length);
        }
        for (int i = 0; i < x.length; i++) {
            if (!(Double.isFinite(x[i]) && x[i] > 0)) {
                throw new IllegalArgumentException("wavelength at index " + i + " is not a positive finite number: "
                        + x[i]);
            }
            if (!Double.isFinite(t[i])) {
                throw new IllegalArgumentException("transmittance at index " + i + " is not finite: " + t[i]);
            }
            if (i > 0 && !(x[i] > x[i - 1])) {
                throw new IllegalArgumentException("wavelengths not strictly increasing at index " + i + ": "
                        + x[i] + " nm follows " + x[i - 1] + " nm");
            }
        }
    }
}
