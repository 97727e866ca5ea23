package org.spectralsieve.importers;

import java.util.Arrays;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;

/**
 * The neutral result of any importer: what the file said, before calibration or validation against a
 * material. Wavelengths are already in nanometres; values are kept as written (their kind says how to
 * read them) so that nothing is lost before the backend decides what to do with them.
 *
 * <p>Invariants (checked in {@link #of}): at least 2 points; all arrays of equal length; every number
 * finite; wavelengths strictly increasing. Arrays are copied in and out, so an instance never changes.
 *
 * <p>A spectrum may also carry one standard deviation per point ({@link #withStandardDeviations}), in the
 * same unit as its values (a %T column's spread in %T, an absorbance column's in absorbance), NaN where the
 * file gives none, with a note of where it came from: a standard-deviation column, or the spread of
 * replicate columns. Turning it into an absorbance uncertainty is the backend's business.
 */
public final class ParsedSpectrum {

    /** Fewer points cannot describe a curve (no interval to interpolate over). */
    public static final int MIN_POINTS = 2;

    private final String sourceName;
    private final double[] wavelengthsNm;
    private final double[] values;
    private final boolean[] upperBounds;
    private final YKind yKind;
    private final XUnit xUnit;
    private final Map<String, String> metadata;
    private final List<String> warnings;
    /** One standard deviation per point in the values' unit, NaN where unknown; null when the file gave none. */
    private final double[] standardDeviations;
    private final String standardDeviationOrigin;
    /** The unit of the standard deviations: the values' kind unless the file said otherwise (e.g. "sd (A)"). */
    private final YKind standardDeviationKind;
    /** File line of each point (1-based), in wavelength order; null when the reader did not say. */
    private final int[] lines;

    private ParsedSpectrum(String sourceName, double[] wavelengthsNm, double[] values, boolean[] upperBounds,
            YKind yKind, XUnit xUnit, Map<String, String> metadata, List<String> warnings,
            double[] standardDeviations, String standardDeviationOrigin, YKind standardDeviationKind, int[] lines) {
        this.lines = lines;
        this.standardDeviationKind = standardDeviationKind;
        this.standardDeviations = standardDeviations;
        this.standardDeviationOrigin = standardDeviationOrigin;
        this.sourceName = sourceName;
        this.wavelengthsNm = wavelengthsNm;
        this.values = values;
        this.upperBounds = upperBounds;
        this.yKind = yKind;
        this.xUnit = xUnit;
        this.metadata = metadata;
        this.warnings = warnings;
    }

    /**
     * @param wavelengthsNm wavelengths already converted to nm, strictly increasing
     * @param values        y values as written in the file, of kind {@code yKind}
     * @param upperBounds   true where the file marked the value as "at or below detection"; null = none
     * @param xUnit         the unit the file used for x (for reporting; the array is in nm regardless)
     * @param metadata      keys are lower-cased and trimmed; insertion order kept
     * @throws IllegalArgumentException naming the bad index and value
     */
    public static ParsedSpectrum of(String sourceName, double[] wavelengthsNm, double[] values,
            boolean[] upperBounds, YKind yKind, XUnit xUnit, Map<String, String> metadata,
            List<String> warnings) {
        Objects.requireNonNull(sourceName, "sourceName");
        Objects.requireNonNull(wavelengthsNm, "wavelengthsNm");
        Objects.requireNonNull(values, "values");
        Objects.requireNonNull(yKind, "yKind");
        Objects.requireNonNull(xUnit, "xUnit");
        boolean[] bounds = upperBounds == null ? new boolean[values.length] : upperBounds.clone();
        if (wavelengthsNm.length != values.length || bounds.length != values.length) {
            throw new IllegalArgumentException("lengths differ: " + wavelengthsNm.length + " wavelengths, "
                    + values.length + " values, " + bounds.length + " upper-bound flags");
        }
        if (values.length < MIN_POINTS) {
            throw new IllegalArgumentException(
                    "need at least " + MIN_POINTS + " points, got " + values.length);
        }
        double[] x = wavelengthsNm.clone();
        double[] y = values.clone();
        checkFiniteAndIncreasing(x, y);
        return new ParsedSpectrum(sourceName, x, y, bounds, yKind, xUnit, normalise(metadata),
                warnings == null ? List.of() : List.copyOf(warnings), null, null, null, null);
    }

    /**
     * This spectrum with one standard deviation per point, in the values' unit: finite and &ge; 0, or NaN
     * where unknown; {@code origin} says where it came from (e.g. "column 'StdDev'"), for the preview.
     *
     * @throws IllegalArgumentException naming the bad index and value
     */
    public ParsedSpectrum withStandardDeviations(double[] sd, String origin) {
        return withStandardDeviations(sd, yKind, origin);
    }

    /**
     * As {@link #withStandardDeviations(double[], String)}, the standard deviations in {@code kind}'s unit
     * (absorbance for a column named so, whatever the values are in).
     */
    public ParsedSpectrum withStandardDeviations(double[] sd, YKind kind, String origin) {
        Objects.requireNonNull(kind, "kind");
        Objects.requireNonNull(sd, "sd");
        Objects.requireNonNull(origin, "origin");
        if (sd.length != values.length) {
            throw new IllegalArgumentException("lengths differ: " + values.length + " values, " + sd.length
                    + " standard deviations");
        }
        for (int i = 0; i < sd.length; i++) {
            if (!Double.isNaN(sd[i]) && !(Double.isFinite(sd[i]) && sd[i] >= 0)) {
                throw new IllegalArgumentException("standard deviation at index " + i + " (" + wavelengthsNm[i]
                        + " nm) is " + sd[i] + ", must be finite and >= 0");
            }
        }
        return new ParsedSpectrum(sourceName, wavelengthsNm, values, upperBounds, yKind, xUnit, metadata, warnings,
                sd.clone(), origin, kind, lines);
    }

    /** This spectrum with other warnings, everything else (standard deviations included) kept. */
    public ParsedSpectrum withWarnings(List<String> newWarnings) {
        return new ParsedSpectrum(sourceName, wavelengthsNm, values, upperBounds, yKind, xUnit, metadata,
                List.copyOf(newWarnings), standardDeviations, standardDeviationOrigin, standardDeviationKind, lines);
    }

    /** True when the file gave a standard deviation (a column, or replicates' spread). */
    public boolean hasStandardDeviations() {
        return standardDeviations != null;
    }

    /** One standard deviation per point in the values' unit, NaN where unknown (a copy; all NaN when none). */
    public double[] standardDeviations() {
        if (standardDeviations == null) {
            double[] none = new double[values.length];
            Arrays.fill(none, Double.NaN);
            return none;
        }
        return standardDeviations.clone();
    }

    /** The unit of {@link #standardDeviations()}: {@link #yKind()} unless the file named another. */
    public YKind standardDeviationKind() {
        return standardDeviationKind == null ? yKind : standardDeviationKind;
    }

    /** Where the standard deviations came from, for the preview; empty when there are none. */
    public Optional<String> standardDeviationOrigin() {
        return Optional.ofNullable(standardDeviationOrigin);
    }

    private static void checkFiniteAndIncreasing(double[] x, double[] y) {
        for (int i = 0; i < x.length; i++) {
            if (!Double.isFinite(x[i])) {
                throw new IllegalArgumentException("wavelength at index " + i + " is not finite: " + x[i]);
            }
            if (!Double.isFinite(y[i])) {
                throw new IllegalArgumentException("value at index " + i + " is not finite: " + y[i]);
            }
            if (i > 0 && !(x[i] > x[i - 1])) {
                throw new IllegalArgumentException("wavelengths not strictly increasing at index " + i
                        + ": " + x[i] + " nm follows " + x[i - 1] + " nm");
            }
        }
    }

    private static Map<String, String> normalise(Map<String, String> metadata) {
        Map<String, String> copy = new LinkedHashMap<>();
        if (metadata != null) {
            metadata.forEach((k, v) -> copy.put(normaliseKey(k), Objects.requireNonNull(v, "metadata value")));
        }
        return Collections.unmodifiableMap(copy);
    }

    /** Metadata keys compare case-insensitively; storing them lower-cased makes lookups simple. */
    static String normaliseKey(String key) {
        return Objects.requireNonNull(key, "metadata key").trim().toLowerCase(Locale.ROOT);
    }

    public String sourceName() {
        return sourceName;
    }

    /** Wavelengths in nm, strictly increasing (a copy). */
    public double[] wavelengthsNm() {
        return wavelengthsNm.clone();
    }

    /** Values as written in the file, of kind {@link #yKind()} (a copy). */
    public double[] values() {
        return values.clone();
    }

    /** True where the value is only an upper bound ("at or below detection"), a copy. */
    public boolean[] upperBounds() {
        return upperBounds.clone();
    }

    public YKind yKind() {
        return yKind;
    }

    /** The x unit found in the file; {@link #wavelengthsNm()} is already converted from it. */
    public XUnit xUnit() {
        return xUnit;
    }

    /** Unmodifiable, in the order found; keys lower-cased and trimmed. */
    public Map<String, String> metadata() {
        return metadata;
    }

    /**
     * This spectrum with the file line of each point (1-based, in the order of {@link #wavelengthsNm()}), so
     * that a value refused later can be named by its line in the file instead of an array index.
     */
    public ParsedSpectrum withLines(int[] pointLines) {
        if (pointLines.length != values.length) {
            throw new IllegalArgumentException(pointLines.length + " line numbers for " + values.length + " points");
        }
        return new ParsedSpectrum(sourceName, wavelengthsNm, values, upperBounds, yKind, xUnit, metadata, warnings,
                standardDeviations, standardDeviationOrigin, standardDeviationKind, pointLines.clone());
    }

    /** File lines of all points (a copy; zeros when the reader did not say). */
    public int[] lines() {
        return lines == null ? new int[values.length] : lines.clone();
    }

    /** The file line (1-based) of point {@code i}; 0 when the reader did not say. */
    public int line(int i) {
        return lines == null ? 0 : lines[i];
    }

    /** Thickness, instrument and date of measurement as the metadata lines give them. */
    public SampleMetadata sampleMetadata() {
        return SampleMetadata.of(metadata);
    }

    /** Things the user should know that did not stop the import (e.g. a guessed y kind). */
    public List<String> warnings() {
        return warnings;
    }

    public int size() {
        return values.length;
    }

    /**
     * The points {@code from} (inclusive) to {@code to} (exclusive), everything else kept: a keep range
     * chosen by the user or around a noisy end. Every per-point array this class holds must be cut here.
     *
     * @throws IllegalArgumentException when fewer than {@link #MIN_POINTS} points would remain
     */
    public ParsedSpectrum slice(int from, int to) {
        if (from < 0 || to > values.length || to - from < MIN_POINTS) {
            throw new IllegalArgumentException("cannot keep points " + from + " to " + to + " of " + values.length
                    + ": need at least " + MIN_POINTS);
        }
        return new ParsedSpectrum(sourceName, Arrays.copyOfRange(wavelengthsNm, from, to),
                Arrays.copyOfRange(values, from, to), Arrays.copyOfRange(upperBounds, from, to), yKind, xUnit,
                metadata, warnings,
                standardDeviations == null ? null : Arrays.copyOfRange(standardDeviations, from, to),
                standardDeviationOrigin, standardDeviationKind, lines == null ? null : Arrays.copyOfRange(lines, from, to));
    }

    /** Values converted to transmittance fractions: %T / 100, or 10^−A for absorbance. */
    public double[] transmittanceFractions() {
        double[] t = new double[values.length];
        for (int i = 0; i < t.length; i++) {
            t[i] = yKind.toTransmittanceFraction(values[i]);
        }
        return t;
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof ParsedSpectrum p
                && sourceName.equals(p.sourceName)
                && Arrays.equals(wavelengthsNm, p.wavelengthsNm)
                && Arrays.equals(values, p.values)
                && Arrays.equals(upperBounds, p.upperBounds)
                && yKind == p.yKind
                && xUnit == p.xUnit
                && metadata.equals(p.metadata)
                && warnings.equals(p.warnings)
                && Arrays.equals(standardDeviations, p.standardDeviations)
                && Objects.equals(standardDeviationOrigin, p.standardDeviationOrigin)
                && standardDeviationKind() == p.standardDeviationKind();
    }

    @Override
    public int hashCode() {
        return Objects.hash(sourceName, Arrays.hashCode(wavelengthsNm), Arrays.hashCode(values), yKind, xUnit);
    }

    @Override
    public String toString() {
        return "ParsedSpectrum[" + sourceName + ", " + size() + " points, " + wavelengthsNm[0] + "–"
                + wavelengthsNm[wavelengthsNm.length - 1] + " nm, " + yKind + " (x in " + xUnit + "), "
                + metadata.size() + " metadata, " + warnings.size() + " warnings]";
    }
}
