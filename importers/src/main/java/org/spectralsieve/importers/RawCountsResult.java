package org.spectralsieve.importers;

import java.util.Objects;

/**
 * Transmittance computed from raw captures, with what each point rests on. Index i of every array is
 * point i of {@link #spectrum()} (saturated points are not in it at all).
 */
public final class RawCountsResult {

    private final ParsedSpectrum spectrum;
    private final double[] detectionLimits;
    private final int[] exposureIndex;
    private final double[] exposureMs;

    RawCountsResult(ParsedSpectrum spectrum, double[] detectionLimits, int[] exposureIndex, double[] exposureMs) {
        this.spectrum = Objects.requireNonNull(spectrum, "spectrum");
        if (detectionLimits.length != spectrum.size() || exposureIndex.length != spectrum.size()
                || exposureMs.length != spectrum.size()) {
            throw new IllegalArgumentException("per-point arrays must have " + spectrum.size() + " entries");
        }
        this.detectionLimits = detectionLimits.clone();
        this.exposureIndex = exposureIndex.clone();
        this.exposureMs = exposureMs.clone();
    }

    /**
     * T as a fraction; where T is at or below the point's detection limit the value is that limit and
     * the point is an upper bound ("&lt; limit"), as REFERENCE §11 asks.
     */
    public ParsedSpectrum spectrum() {
        return spectrum;
    }

    /** Per point: the larger of 3σ_dark/(R − D) (exposure-scaled) and the stray-light floor, as a fraction. */
    public double[] detectionLimits() {
        return detectionLimits.clone();
    }

    /** Per point: index into {@link RawCounts#captures(CaptureRole)} for SAMPLE of the exposure used. */
    public int[] exposureIndex() {
        return exposureIndex.clone();
    }

    /** Per point: the sample exposure used, in ms. */
    public double[] exposureMs() {
        return exposureMs.clone();
    }
}
