package org.spectralsieve.api;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.OptionalDouble;
import org.spectralsieve.library.StoredStateCurve;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.Cutoffs;
import org.spectralsieve.spectrum.StatedCurve;
import org.spectralsieve.states.Exposure;
import org.spectralsieve.states.MaterialState;
import org.spectralsieve.states.Printing;

/** JSON shapes of a sample's curves in other states (docs/material-states.md); NaN is never written, null instead. */
final class StateResponses {

    private StateResponses() {
    }

    /** An aged curve's exposure: {@code hours} and {@code source}, or {@code doseJPerCm2} at {@code doseNm}. */
    record ExposureJson(Double hours, String source, Double doseJPerCm2, Double doseNm) {
        static ExposureJson of(Exposure e) {
            return e == null ? null : e.inHours() ? new ExposureJson(e.hours(), e.source(), null, null)
                    : new ExposureJson(null, null, e.doseJPerCm2(), e.doseNm());
        }
    }

    /** A printed curve's ink load (%) and stated density, each null when not stated. */
    record PrintingJson(Double inkLoadPercent, Double statedDensity) {
        static PrintingJson of(Printing p) {
            return p == null ? null : new PrintingJson(orNull(p.inkLoadPercent()), orNull(p.statedDensity()));
        }
    }

    /**
     * One state curve with what a reader asks first, as a sample's {@code SampleDetail} gives it: {@code kind}
     * (aged, printed), its exposure or printing, {@code description} ({@link MaterialState#describe()}),
     * {@code thicknessMm} (null when not recorded; never rescaled), key figures of its curve, and {@code curve}, the
     * link to its points.
     */
    record StateSummary(long id, long sampleId, String kind, String description, ExposureJson exposure,
                        PrintingJson printing, Double thicknessMm, double detectionLimit, List<Double> rangeNm,
                        Map<String, Double> cutoffsNm, Map<String, Double> transmittanceAt,
                        Map<String, Boolean> belowDetectionAt, String notes, String sourceFileName,
                        String createdAt, String retiredAt, String curve, String sourceFile) {

        static StateSummary of(StoredStateCurve s) {
            MaterialState state = s.stateCurve().state();
            Curve curve = s.stateCurve().curve();
            Map<String, Double> cutoffs = new LinkedHashMap<>();
            for (int level : MaterialResponses.CUTOFF_LEVELS_PERCENT) {
                cutoffs.put(String.valueOf(level), orNull(Cutoffs.edges(curve, level / 100.0).absorptionEdgeNm()));
            }
            Map<String, Double> at = new LinkedHashMap<>();
            Map<String, Boolean> below = new LinkedHashMap<>();
            for (int nm : MaterialResponses.KEY_WAVELENGTHS_NM) {
                OptionalDouble t = curve.transmittanceAt(nm);
                at.put(String.valueOf(nm), t.isPresent() ? t.getAsDouble() : null);
                below.put(String.valueOf(nm), t.isPresent() ? curve.belowDetectionAt(nm) : null);
            }
            String self = "/api/samples/" + s.sampleId() + "/states/" + s.id();
            return new StateSummary(s.id(), s.sampleId(), state.kind().word(), state.describe(),
                    ExposureJson.of(state.exposure()), PrintingJson.of(state.printing()),
                    orNull(s.stateCurve().thicknessMm()), s.detectionLimit(),
                    List.of(curve.minWavelengthNm(), curve.maxWavelengthNm()), cutoffs, at, below, s.notes(),
                    s.sourceFileName(), MaterialResponses.instant(s.createdAt()),
                    MaterialResponses.instant(s.retiredAt()), self, s.hasSourceFile() ? self + "/source-file" : null);
        }
    }

    /** A state curve's points, as {@code GET /api/samples/{id}/curve} gives the sample's own (never rescaled). */
    record StateCurveJson(long id, long sampleId, String kind, String description, ExposureJson exposure,
                          PrintingJson printing, Double thicknessMm, String retiredAt, double[] wavelengthsNm,
                          double[] transmittance, boolean[] belowDetection, double detectionLimit,
                          UncertaintyJson uncertainty) {
        static StateCurveJson of(StoredStateCurve s) {
            MaterialState state = s.stateCurve().state();
            Curve c = StatedCurve.of(s.stateCurve().curve()); // nothing beneath OD 12, as the sample's curve
            return new StateCurveJson(s.id(), s.sampleId(), state.kind().word(), state.describe(),
                    ExposureJson.of(state.exposure()), PrintingJson.of(state.printing()),
                    orNull(s.stateCurve().thicknessMm()), MaterialResponses.instant(s.retiredAt()), c.wavelengthsNm(),
                    c.transmittances(), c.belowDetectionFlags(), c.maxDetectionLimit(), UncertaintyJson.of(c));
        }
    }

    /** A sample's state curves: those in use, and those retired (restorable). */
    record SampleStates(long sampleId, List<StateSummary> states, List<StateSummary> retiredStates) {
    }

    /** What {@code POST /api/samples/{id}/states} stored (or found already stored: {@code duplicate}). */
    record StoredStateJson(long sampleId, long materialId, boolean duplicate, StateSummary state, String fileName,
                           String format, int pointCount, String sha256, List<String> warnings) {
    }

    /** After a state curve's retire or restore; {@code changed} false when it already was so. */
    record StateRetirementJson(String kind, long id, long sampleId, String retiredAt, boolean inUse, boolean changed) {
    }

    private static Double orNull(double v) {
        return Double.isNaN(v) ? null : v;
    }

    private static Double orNull(OptionalDouble v) {
        return v.isPresent() ? v.getAsDouble() : null;
    }
}
