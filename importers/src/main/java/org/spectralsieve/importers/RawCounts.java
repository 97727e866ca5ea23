package org.spectralsieve.importers;

import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;

/**
 * Raw detector captures on one wavelength grid: dark, reference and sample counts, each with its
 * exposure and number of averaged scans. {@link #transmittance} turns them into a curve (see
 * {@link RawTransmittance} for the arithmetic). Immutable; arrays copied in and out.
 */
public final class RawCounts {

    private final String sourceName;
    private final double[] wavelengthsNm;
    private final XUnit xUnit;
    private final List<Capture> captures;
    private final Map<String, String> metadata;
    private final List<String> warnings;

    private RawCounts(String sourceName, double[] wavelengthsNm, XUnit xUnit, List<Capture> captures,
            Map<String, String> metadata, List<String> warnings) {
        this.sourceName = sourceName;
        this.wavelengthsNm = wavelengthsNm;
        this.xUnit = xUnit;
        this.captures = captures;
        this.metadata = metadata;
        this.warnings = warnings;
    }

    /**
     * @throws IllegalArgumentException for fewer than 2 wavelengths, wavelengths not finite and strictly
     *                                  increasing (quoting the index), or a capture of another length
     */
    public static RawCounts of(String sourceName, double[] wavelengthsNm, XUnit xUnit, List<Capture> captures,
            Map<String, String> metadata, List<String> warnings) {
        Objects.requireNonNull(sourceName, "sourceName");
        Objects.requireNonNull(xUnit, "xUnit");
        double[] x = wavelengthsNm.clone();
        if (x.length < ParsedSpectrum.MIN_POINTS) {
            throw new IllegalArgumentException("need at least " + ParsedSpectrum.MIN_POINTS + " wavelengths, got " + x.length);
        }
        for (int i = 0; i < x.length; i++) {
            if (!Double.isFinite(x[i]) || i > 0 && !(x[i] > x[i - 1])) {
                throw new IllegalArgumentException("wavelength at index " + i + " is not finite and increasing: " + x[i]);
            }
        }
        for (Capture c : captures) {
            if (c.size() != x.length) {
                throw new IllegalArgumentException(c.label() + ": " + c.size() + " counts for " + x.length + " wavelengths");
            }
        }
        Map<String, String> m = new LinkedHashMap<>();
        if (metadata != null) {
            metadata.forEach((k, v) -> m.put(ParsedSpectrum.normaliseKey(k), v));
        }
        return new RawCounts(sourceName, x, xUnit, List.copyOf(captures), Collections.unmodifiableMap(m),
                warnings == null ? List.of() : List.copyOf(warnings));
    }

    public String sourceName() {
        return sourceName;
    }

    public double[] wavelengthsNm() {
        return wavelengthsNm.clone();
    }

    public XUnit xUnit() {
        return xUnit;
    }

    /** All captures in the order read. */
    public List<Capture> captures() {
        return captures;
    }

    /** The captures of one role, in the order read; {@link RawCountsResult#exposureIndex()} indexes these. */
    public List<Capture> captures(CaptureRole role) {
        List<Capture> out = new ArrayList<>();
        for (Capture c : captures) {
            if (c.role() == role) {
                out.add(c);
            }
        }
        return List.copyOf(out);
    }

    public Map<String, String> metadata() {
        return metadata;
    }

    public List<String> warnings() {
        return warnings;
    }

    int size() {
        return wavelengthsNm.length;
    }

    double wavelength(int i) {
        return wavelengthsNm[i];
    }

    /**
     * T = ((S − D)/tS) / ((R − D)/tR) per point, with its detection limit and the exposure it came from.
     *
     * @throws ImportException when a role is missing or fewer than 2 points are usable
     */
    public RawCountsResult transmittance(RawCountsOptions options) throws ImportException {
        return new RawTransmittance(this, options).compute();
    }
}
