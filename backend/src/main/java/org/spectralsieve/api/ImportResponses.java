package org.spectralsieve.api;

import java.util.List;
import java.util.Map;
import java.util.OptionalDouble;
import org.spectralsieve.ingest.FileBlock;
import org.spectralsieve.ingest.FilePreview;
import org.spectralsieve.ingest.ImportResult;
import org.spectralsieve.ingest.KeptRange;
import org.spectralsieve.ingest.NoiseRegion;
import org.spectralsieve.library.SampleInfo;
import org.spectralsieve.spectrum.Curve;

/** JSON shapes of the import endpoints (camelCase from the record components). */
final class ImportResponses {

    private ImportResponses() {
    }

    /** The curve as stored: transmittance fractions, true where a value is only an upper bound. */
    /** {@code uncertainty} is null when the curve carries none ({@link UncertaintyJson}). */
    record CurveJson(double[] wavelengthsNm, double[] transmittance, boolean[] belowDetection,
                     UncertaintyJson uncertainty) {
        static CurveJson of(Curve c) {
            return new CurveJson(c.wavelengthsNm(), c.transmittances(), c.belowDetectionFlags(), UncertaintyJson.of(c));
        }
    }

    /**
     * One spectrum of a JCAMP-DX file: {@code number} is what the {@code block} field takes; {@code rangeNm} is
     * null when the file's x unit is unknown; {@code taken} marks what the import would store; {@code problem}
     * says why a block cannot be a transmittance curve (null when it can).
     */
    record BlockJson(int number, String title, int points, List<Double> rangeNm, String xUnits, String yUnits,
                     boolean taken, String problem) {
        static BlockJson of(FileBlock b) {
            return new BlockJson(b.number(), b.title(), b.points(),
                    b.fromNm() == null ? null : List.of(b.fromNm(), b.toNm()), b.xUnits(), b.yUnits(), b.taken(),
                    b.problem());
        }
    }

    record PreviewResponse(String fileName, String format, String xUnit, String yKind, int pointCount,
                           List<Double> rangeNm, double detectionLimit, String provenance, String sha256,
                           Map<String, String> metadata, List<String> warnings, CurveJson curve, KeepJson keep,
                           List<BlockJson> blocks, String uncertaintySource) {
        static PreviewResponse of(FilePreview p) {
            Curve c = p.curve();
            return new PreviewResponse(p.fileName(), p.format().label(), p.xUnit().name().toLowerCase(java.util.Locale.ROOT),
                    p.yKind().name().toLowerCase(java.util.Locale.ROOT), p.pointCount(),
                    List.of(c.minWavelengthNm(), c.maxWavelengthNm()), p.detectionLimit(), p.provenance().label(),
                    p.sha256(), p.metadata(), p.warnings(), CurveJson.of(c), KeepJson.of(p.keptRange()),
                    p.blocks().stream().map(BlockJson::of).toList(), p.uncertaintySource());
        }
    }

    /**
     * Which part of the file's axis the curve holds: the file's range and points, the kept range, the points
     * left out on each side, the {@code from}/{@code to} asked for (null when not), the noise regions found,
     * and the {@code from}/{@code to} that leaves them out (null when none was found).
     */
    record KeepJson(List<Double> fileRangeNm, int filePoints, List<Double> keptRangeNm, int leftOutBelow,
                    int leftOutAbove, Double from, Double to, List<NoiseRegionJson> noiseRegions,
                    Double suggestedFrom, Double suggestedTo) {
        static KeepJson of(KeptRange k) {
            return new KeepJson(List.of(k.fileFromNm(), k.fileToNm()), k.filePoints(),
                    List.of(k.keptFromNm(), k.keptToNm()), k.leftOutBelow(), k.leftOutAbove(), orNull(k.fromNm()),
                    orNull(k.toNm()), k.noiseRegions().stream().map(r -> NoiseRegionJson.of(r, k)).toList(),
                    orNull(k.suggestedFromNm()), orNull(k.suggestedToNm()));
        }

        private static Double orNull(OptionalDouble v) {
            return v.isPresent() ? v.getAsDouble() : null;
        }
    }

    /** A noise region: its end (short|long), range, points, how many of them are kept, scatter (%T) and why. */
    record NoiseRegionJson(String end, List<Double> rangeNm, int points, int keptPoints, double scatterPercent,
                           String reason) {
        static NoiseRegionJson of(NoiseRegion r, KeptRange k) {
            return new NoiseRegionJson(r.end().label(), List.of(r.fromNm(), r.toNm()), r.points(), k.keptOf(r),
                    r.scatter() * 100, r.reason());
        }
    }

    record StoredSample(long id, double thicknessMm, String geometry, String provenance, String instrument,
                        String measuredOn, String lot, String notes, double detectionLimit) {
        static StoredSample of(SampleInfo s) {
            return new StoredSample(s.id(), s.thicknessMm(), s.geometry().label(), s.provenance().label(), s.instrument(),
                    s.measuredOn() == null ? null : s.measuredOn().toString(), s.lot(), s.notes(), s.detectionLimit());
        }
    }

    /**
     * One sample an import stored or found: {@code block} and {@code blockTitle} are null for a file without
     * blocks; {@code duplicate} true when it was already stored.
     */
    record SampleEntry(Integer block, String blockTitle, boolean duplicate, int pointCount, StoredSample sample) {
    }

    /**
     * {@code sampleId}, {@code sample} and {@code pointCount} are the first sample's; {@code samples} lists every
     * sample of the import (one per block with {@code eachBlock}).
     */
    record StoreResponse(long sampleId, long materialId, String materialSlug, boolean newMaterial, boolean duplicate,
                         StoredSample sample, String fileName, String format, int pointCount, String sha256,
                         List<String> warnings, List<SampleEntry> samples) {
        static StoreResponse of(ImportResult r) {
            FilePreview p = r.preview();
            List<SampleEntry> samples = r.blocks().isEmpty()
                    ? List.of(new SampleEntry(null, null, r.duplicate(), p.pointCount(), StoredSample.of(r.sample())))
                    : r.blocks().stream().map(b -> new SampleEntry(b.block(), b.title(), b.duplicate(), b.pointCount(),
                            StoredSample.of(b.sample()))).toList();
            return new StoreResponse(r.sampleId(), r.materialId(), r.materialSlug(), r.newMaterial(), r.duplicate(),
                    StoredSample.of(r.sample()), p.fileName(), p.format().label(), p.pointCount(), p.sha256(), r.warnings(),
                    samples);
        }
    }
}
