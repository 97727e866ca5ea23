package org.spectralsieve.library;

import java.time.LocalDate;
import java.util.Objects;
import java.util.regex.Pattern;
import org.spectralsieve.spectrum.Curve;

/** A sample with its curve, to be stored in one transaction; the source checksum traces it to its file. */
public record NewSample(double thicknessMm, Geometry geometry, Provenance provenance, String instrument,
                        LocalDate measuredOn, String lot, String notes, double detectionLimit, Curve curve,
                        String sourceFileName, String sourceSha256) {

    private static final Pattern SHA256 = Pattern.compile("[0-9a-f]{64}");

    public NewSample {
        if (!(thicknessMm > 0) || !Double.isFinite(thicknessMm)) {
            throw new IllegalArgumentException("thicknessMm must be a positive number, got " + thicknessMm);
        }
        if (!(detectionLimit >= 0 && detectionLimit < 1)) {
            throw new IllegalArgumentException("detectionLimit must be a fraction in [0, 1), got " + detectionLimit);
        }
        Objects.requireNonNull(geometry, "geometry");
        Objects.requireNonNull(provenance, "provenance");
        Objects.requireNonNull(curve, "curve");
        if (sourceSha256 == null || !SHA256.matcher(sourceSha256).matches()) {
            throw new IllegalArgumentException("sourceSha256 must be 64 lower-case hex digits");
        }
        instrument = Objects.requireNonNullElse(instrument, "");
        lot = Objects.requireNonNullElse(lot, "");
        notes = Objects.requireNonNullElse(notes, "");
        sourceFileName = Objects.requireNonNullElse(sourceFileName, "");
    }
}
