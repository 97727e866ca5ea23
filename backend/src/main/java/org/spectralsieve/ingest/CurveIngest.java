package org.spectralsieve.ingest;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.function.IntFunction;
import org.spectralsieve.importers.ParsedSpectrum;
import org.spectralsieve.importers.YKind;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.CurveException;

/**
 * Turns a parsed file into a core curve: converts the file's y kind to a transmittance fraction and
 * applies the detection limit, so that any value at or below it becomes an upper bound.
 */
public final class CurveIngest {

    private CurveIngest() {
    }

    /**
     * As {@link #toCurve(ParsedSpectrum, double, List)}, the warnings about out-of-range readings discarded
     * (for callers that load files the project ships, which have none).
     */
    public static Curve toCurve(ParsedSpectrum parsed, double detectionLimit) {
        return toCurve(parsed, detectionLimit, new ArrayList<>());
    }

    /**
     * Readings below 0 or above 1 are kept and flagged as {@link OutOfRangeReadings} says, with a warning
     * added to {@code warnings}.
     *
     * @throws IngestException naming the file when the values cannot form a curve (e.g. T far below 0)
     */
    public static Curve toCurve(ParsedSpectrum parsed, double detectionLimit, List<String> warnings) {
        return toCurve(parsed, detectionLimit, warnings, line -> null);
    }

    /**
     * As {@link #toCurve(ParsedSpectrum, double, List)}; a refused value is named by its file line, its value
     * in the file's own kind (e.g. −7.3 %T, not the fraction −0.073) and, where {@code lineText} gives it, the
     * line as written.
     *
     * @param lineText the text of a 1-based file line, or null when not known
     */
    public static Curve toCurve(ParsedSpectrum parsed, double detectionLimit, List<String> warnings,
                                IntFunction<String> lineText) {
        if (!(detectionLimit >= 0 && detectionLimit < 1)) {
            throw new IngestException(parsed.sourceName(), "detection_limit",
                    "detection limit must be a fraction in [0, 1), got " + detectionLimit);
        }
        double[] t = parsed.transmittanceFractions();
        boolean[] below = parsed.upperBounds();
        for (int i = 0; i < t.length; i++) {
            below[i] = below[i] || t[i] <= detectionLimit;
        }
        double[] limits = new double[t.length];
        Arrays.fill(limits, detectionLimit);
        OutOfRangeReadings.settle(parsed.sourceName(), parsed.wavelengthsNm(), t, below, limits, warnings,
                where(parsed, lineText));
        try {
            return Curve.of(parsed.wavelengthsNm(), t, below, limits);
        } catch (CurveException e) {
            throw new IngestException(parsed.sourceName(), "transmittance", e.getMessage());
        }
    }

    /** "line 80: −7.3 %T as written ('350;-7.3')": where a point is in the file, in the file's terms. */
    static IntFunction<String> where(ParsedSpectrum parsed, IntFunction<String> lineText) {
        double[] values = parsed.values();
        return i -> {
            if (i < 0) {
                return null;
            }
            int line = parsed.line(i);
            String text = line > 0 ? lineText.apply(line) : null;
            return (line > 0 ? "line " + line + ": " : "") + inFileTerms(parsed.yKind(), values[i]) + " in the file"
                    + (text == null ? "" : " ('" + text + "')");
        };
    }

    private static String inFileTerms(YKind kind, double v) {
        String number = Double.toString(v).replaceAll("\\.0$", "");
        return switch (kind) {
            case TRANSMITTANCE_PERCENT -> "transmittance " + number + " %T";
            case TRANSMITTANCE_FRACTION -> "transmittance " + number + " (as a fraction)";
            case ABSORBANCE -> "absorbance " + number;
        };
    }
}
