package org.spectralsieve.importers;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;

/**
 * A spectrum that is not a transmittance: a source's relative power (a lamp or LED capture, a solar
 * reference spectrum) or a response's relative weights (a photoinitiator's absorbance, a resist's
 * sensitivity, a sensor's responsivity). Values are kept exactly as written; nothing is read as percent
 * or fraction and absorbance is never turned into transmittance, because here the number itself is the
 * weight.
 *
 * <p>Invariants (checked in {@link #of}, which names the line of the offending point): at least
 * {@link ParsedSpectrum#MIN_POINTS} points; wavelengths in nm, finite, positive, strictly increasing;
 * values finite and not negative (a negative power or weight has no meaning, and clamping it would hide
 * a dark-subtraction or baseline mistake); not every value 0 (nothing to weight with). Arrays are copied
 * in and out.
 */
public final class SpectrumValues {

    private final String sourceName;
    private final double[] wavelengthsNm;
    private final double[] values;
    private final XUnit xUnit;
    private final String valueColumn;
    private final Map<String, String> metadata;
    private final List<String> warnings;

    private SpectrumValues(String sourceName, double[] wavelengthsNm, double[] values, XUnit xUnit,
            String valueColumn, Map<String, String> metadata, List<String> warnings) {
        this.sourceName = sourceName;
        this.wavelengthsNm = wavelengthsNm;
        this.values = values;
        this.xUnit = xUnit;
        this.valueColumn = valueColumn;
        this.metadata = metadata;
        this.warnings = warnings;
    }

    /**
     * @param lines       1-based file line of each point, for messages; null when unknown
     * @param valueColumn the value column's name as written (the field named in messages)
     * @throws ImportException naming the line and the value column of the first bad point
     */
    public static SpectrumValues of(String sourceName, double[] wavelengthsNm, double[] values, int[] lines,
            XUnit xUnit, String valueColumn, Map<String, String> metadata, List<String> warnings)
            throws ImportException {
        Objects.requireNonNull(sourceName, "sourceName");
        Objects.requireNonNull(xUnit, "xUnit");
        Objects.requireNonNull(valueColumn, "valueColumn");
        double[] x = wavelengthsNm.clone();
        double[] y = values.clone();
        if (x.length != y.length || lines != null && lines.length != x.length) {
            throw new IllegalArgumentException("lengths differ: " + x.length + " wavelengths, " + y.length
                    + " values" + (lines == null ? "" : ", " + lines.length + " line numbers"));
        }
        if (x.length < ParsedSpectrum.MIN_POINTS) {
            throw new ImportException(sourceName, line(lines, x.length - 1), valueColumn, "only " + x.length
                    + " point; a spectrum needs at least " + ParsedSpectrum.MIN_POINTS);
        }
        boolean anyAboveZero = false;
        for (int i = 0; i < x.length; i++) {
            if (!(Double.isFinite(x[i]) && x[i] > 0)) {
                throw new ImportException(sourceName, line(lines, i), null, "wavelength " + x[i]
                        + " nm is not finite and positive");
            }
            if (i > 0 && !(x[i] > x[i - 1])) {
                throw new ImportException(sourceName, line(lines, i), null, "wavelengths not strictly increasing: "
                        + x[i] + " nm follows " + x[i - 1] + " nm");
            }
            if (!Double.isFinite(y[i])) {
                throw new ImportException(sourceName, line(lines, i), valueColumn, "not a finite number: " + y[i]);
            }
            if (y[i] < 0) {
                throw new ImportException(sourceName, line(lines, i), valueColumn, "negative value " + y[i] + " at "
                        + x[i] + " nm: relative power and weights cannot be negative (correct the baseline or"
                        + " dark subtraction in the file; values are not clamped)");
            }
            anyAboveZero |= y[i] > 0;
        }
        if (!anyAboveZero) {
            throw new ImportException(sourceName, 0, valueColumn, "every value is 0 (" + x.length
                    + " points): nothing to weight with");
        }
        return new SpectrumValues(sourceName, x, y, xUnit, valueColumn, unmodifiable(metadata),
                warnings == null ? List.of() : List.copyOf(warnings));
    }

    private static int line(int[] lines, int i) {
        return lines == null || i < 0 || i >= lines.length ? 0 : lines[i];
    }

    private static Map<String, String> unmodifiable(Map<String, String> metadata) {
        Map<String, String> copy = new LinkedHashMap<>();
        if (metadata != null) {
            metadata.forEach((k, v) -> copy.put(ParsedSpectrum.normaliseKey(k), Objects.requireNonNull(v, "metadata value")));
        }
        return Collections.unmodifiableMap(copy);
    }

    public String sourceName() {
        return sourceName;
    }

    /** Wavelengths in nm, strictly increasing (a copy). */
    public double[] wavelengthsNm() {
        return wavelengthsNm.clone();
    }

    /** Relative values exactly as written (a copy). */
    public double[] values() {
        return values.clone();
    }

    /** The x unit the file used; {@link #wavelengthsNm()} is already converted from it. */
    public XUnit xUnit() {
        return xUnit;
    }

    /** The column (or JCAMP-DX ordinate) the values were read from, as the file names it. */
    public String valueColumn() {
        return valueColumn;
    }

    /** Keys lower-cased and trimmed, in file order. */
    public Map<String, String> metadata() {
        return metadata;
    }

    /** What the user should know that did not stop the read. */
    public List<String> warnings() {
        return warnings;
    }

    public int size() {
        return values.length;
    }

    @Override
    public String toString() {
        return "SpectrumValues[" + sourceName + ", " + size() + " points, " + wavelengthsNm[0] + "–"
                + wavelengthsNm[wavelengthsNm.length - 1] + " nm, column '" + valueColumn + "']";
    }
}
