package org.spectralsieve.api;

import java.util.List;
import java.util.Map;
import org.spectralsieve.ingest.FilePreview;
import org.spectralsieve.ingest.ImportResult;
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

    record PreviewResponse(String fileName, String format, String xUnit, String yKind, int pointCount,
                           List<Double> rangeNm, double detectionLimit, String provenance, String sha256,
                           Map<String, String> metadata, List<String> warnings, CurveJson curve,
                           String uncertaintySource) {
        static PreviewResponse of(FilePreview p) {
            Curve c = p.curve();
            return new PreviewResponse(p.fileName(), p.format().label(), p.xUnit().name().toLowerCase(java.util.Locale.ROOT),
                    p.yKind().name().toLowerCase(java.util.Locale.ROOT), p.pointCount(),
                    List.of(c.minWavelengthNm(), c.maxWavelengthNm()), p.detectionLimit(), p.provenance().label(),
                    p.sha256(), p.metadata(), p.warnings(), CurveJson.of(c), p.uncertaintySource());
        }
    }

    record StoredSample(long id, double thicknessMm, String geometry, String provenance, String instrument,
                        String measuredOn, String lot, String notes, double detectionLimit) {
        static StoredSample of(SampleInfo s) {
            return new StoredSample(s.id(), s.thicknessMm(), s.geometry().label(), s.provenance().label(), s.instrument(),
                    s.measuredOn() == null ? null : s.measuredOn().toString(), s.lot(), s.notes(), s.detectionLimit());
        }
    }

    record StoreResponse(long sampleId, long materialId, String materialSlug, boolean newMaterial, boolean duplicate,
                         StoredSample sample, String fileName, String format, int pointCount, String sha256,
                         List<String> warnings) {
        static StoreResponse of(ImportResult r) {
            FilePreview p = r.preview();
            return new StoreResponse(r.sampleId(), r.materialId(), r.materialSlug(), r.newMaterial(), r.duplicate(),
                    StoredSample.of(r.sample()), p.fileName(), p.format().label(), p.pointCount(), p.sha256(), r.warnings());
        }
    }
}
