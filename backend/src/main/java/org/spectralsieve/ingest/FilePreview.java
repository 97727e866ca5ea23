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
 * @param uncertaintySource where the curve's measurement uncertainty came from (a file column, replicates'
 *                       spread, a stated instrument figure); null when the curve has none
 */
public record FilePreview(String fileName, ImportFormat format, XUnit xUnit, YKind yKind, Curve curve,
                          double detectionLimit, Provenance provenance, Map<String, String> metadata,
                          List<String> warnings, String sha256, String uncertaintySource) {

    /** A preview whose curve carries no measurement uncertainty (or whose source is set later). */
    public FilePreview(String fileName, ImportFormat format, XUnit xUnit, YKind yKind, Curve curve,
                       double detectionLimit, Provenance provenance, Map<String, String> metadata,
                       List<String> warnings, String sha256) {
        this(fileName, format, xUnit, yKind, curve, detectionLimit, provenance, metadata, warnings, sha256, null);
    }

    /** This preview with the curve's uncertainty applied: the curve, its source and any warnings it raised. */
    public FilePreview withUncertainty(MeasurementUncertainty.Applied applied, List<String> allWarnings) {
        return new FilePreview(fileName, format, xUnit, yKind, applied.curve(), detectionLimit, provenance, metadata,
                allWarnings, sha256, applied.source().orElse(null));
    }

    public FilePreview {
        Objects.requireNonNull(fileName, "fileName");
        Objects.requireNonNull(format, "format");
        Objects.requireNonNull(curve, "curve");
        metadata = Collections.unmodifiableMap(new LinkedHashMap<>(metadata)); // file order kept
        warnings = List.copyOf(warnings);
    }

    public int pointCount() {
        return curve.size();
    }
}
