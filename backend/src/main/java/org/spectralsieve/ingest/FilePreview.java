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
 * @param blocks         JCAMP-DX: every block with data, in file order, marking those the import takes;
 *                       empty for other formats
 * @param uncertaintySource where the curve's measurement uncertainty came from (a file column, replicates'
 *                       spread, a stated instrument figure); null when the curve has none
 */
public record FilePreview(String fileName, ImportFormat format, XUnit xUnit, YKind yKind, Curve curve,
                          double detectionLimit, Provenance provenance, Map<String, String> metadata,
                          List<String> warnings, String sha256, KeptRange keptRange, List<FileBlock> blocks,
                          String uncertaintySource) {

    /** A preview of a file kept whole (no keep range asked for, no noise region looked for), without blocks. */
    public FilePreview(String fileName, ImportFormat format, XUnit xUnit, YKind yKind, Curve curve,
                       double detectionLimit, Provenance provenance, Map<String, String> metadata,
                       List<String> warnings, String sha256) {
        this(fileName, format, xUnit, yKind, curve, detectionLimit, provenance, metadata, warnings, sha256,
                KeptRange.whole(curve.wavelengthsNm()), List.of(), null);
    }

    /** A preview without blocks (every format but JCAMP-DX). */
    public FilePreview(String fileName, ImportFormat format, XUnit xUnit, YKind yKind, Curve curve,
                       double detectionLimit, Provenance provenance, Map<String, String> metadata,
                       List<String> warnings, String sha256, KeptRange keptRange) {
        this(fileName, format, xUnit, yKind, curve, detectionLimit, provenance, metadata, warnings, sha256,
                keptRange, List.of(), null);
    }

    /** This preview with the curve's uncertainty applied: the curve, its source and any warnings it raised. */
    public FilePreview withUncertainty(MeasurementUncertainty.Applied applied, List<String> allWarnings) {
        return new FilePreview(fileName, format, xUnit, yKind, applied.curve(), detectionLimit, provenance, metadata,
                allWarnings, sha256, keptRange, blocks, applied.source().orElse(null));
    }

    public FilePreview {
        Objects.requireNonNull(fileName, "fileName");
        Objects.requireNonNull(format, "format");
        Objects.requireNonNull(curve, "curve");
        Objects.requireNonNull(keptRange, "keptRange");
        metadata = Collections.unmodifiableMap(new LinkedHashMap<>(metadata)); // file order kept
        warnings = List.copyOf(warnings);
        blocks = blocks == null ? List.of() : List.copyOf(blocks);
    }

    /** The same preview with its block list and more warnings. */
    FilePreview withBlocks(List<FileBlock> list, List<String> moreWarnings) {
        List<String> all = new java.util.ArrayList<>(warnings);
        all.addAll(moreWarnings);
        return new FilePreview(fileName, format, xUnit, yKind, curve, detectionLimit, provenance, metadata, all, sha256,
                keptRange, list, uncertaintySource);
    }

    /** The block this preview's curve was read from; empty for a file without blocks. */
    public java.util.Optional<FileBlock> block() {
        String index = metadata.get("jcamp block");
        return blocks.stream().filter(b -> String.valueOf(b.number()).equals(index)).findFirst();
    }

    public int pointCount() {
        return curve.size();
    }
}
