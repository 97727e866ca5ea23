package org.spectralsieve.ingest;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import org.spectralsieve.importers.XUnit;
import org.spectralsieve.importers.YKind;
import org.spectralsieve.library.Provenance;
import org.spectralsieve.spectrum.Curve;

/**
 * What a file holds, read but not stored: the curve as transmittance fractions with its below-detection
 * flags, and what was detected on the way.
 *
 * @param yKind          the kind the values were written in (the curve is always a fraction)
 * @param detectionLimit the sample's limit (the largest per-point limit for raw counts)
 * @param provenance     what the file suggests (datasheet for datasheet points, else measured)
 * @param sha256         of the original bytes, the key that recognises a re-import
 * @param keptRange      which part of the file's axis the curve holds (from/to, noise regions left out)
 */
public record FilePreview(String fileName, ImportFormat format, XUnit xUnit, YKind yKind, Curve curve,
                          double detectionLimit, Provenance provenance, Map<String, String> metadata,
                          List<String> warnings, String sha256, KeptRange keptRange) {

    /** A preview of a file kept whole (no keep range asked for, no noise region looked for). */
    public FilePreview(String fileName, ImportFormat format, XUnit xUnit, YKind yKind, Curve curve,
                       double detectionLimit, Provenance provenance, Map<String, String> metadata,
                       List<String> warnings, String sha256) {
        this(fileName, format, xUnit, yKind, curve, detectionLimit, provenance, metadata, warnings, sha256,
                KeptRange.whole(curve.wavelengthsNm()));
    }

    public FilePreview {
        Objects.requireNonNull(fileName, "fileName");
        Objects.requireNonNull(format, "format");
        Objects.requireNonNull(curve, "curve");
        Objects.requireNonNull(keptRange, "keptRange");
        metadata = Collections.unmodifiableMap(new LinkedHashMap<>(metadata)); // file order kept
        warnings = List.copyOf(warnings);
    }

    public int pointCount() {
        return curve.size();
    }
}
