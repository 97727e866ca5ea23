package org.spectralsieve.api;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.OptionalDouble;
import org.spectralsieve.library.Material;
import org.spectralsieve.library.RefractiveIndexJson;
import org.spectralsieve.library.StatedThicknessesJson;
import org.spectralsieve.requirement.MadeThicknesses;
import org.spectralsieve.search.SearchService;
import org.spectralsieve.library.SampleInfo;
import org.spectralsieve.library.SampleRescaling;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.Cutoffs;

/** JSON shapes of materials and samples (camelCase field names follow the record components). */
final class MaterialResponses {

    /** The lines a UV workshop asks about first: mercury 254/313/365/405, the LED peaks, and blue at 450. */
    static final List<Integer> KEY_WAVELENGTHS_NM = List.of(254, 313, 365, 385, 395, 405, 450);
    static final List<Integer> CUTOFF_LEVELS_PERCENT = List.of(1, 10, 50);

    private MaterialResponses() {
    }

    record SampleSummary(long id, double thicknessMm, String geometry, String provenance) {
        static SampleSummary of(SampleInfo s) {
            return new SampleSummary(s.id(), s.thicknessMm(), s.geometry().label(), s.provenance().label());
        }
    }

    record MaterialSummary(long id, String slug, String name, String materialClass, String scaling, List<String> tags,
                           Map<String, Object> madeThicknesses, List<SampleSummary> samples) {
        static MaterialSummary of(Material m) {
            return new MaterialSummary(m.id(), m.slug(), m.name(), m.materialClass().label(), m.scaling().label(),
                    m.tags(), made(m), m.samples().stream().map(SampleSummary::of).toList());
        }
    }

    /**
     * The thicknesses the material exists in: as stated ({@code unit}, {@code stock}, {@code range}, films in
     * µm) and as judged ({@code basis}: stated, stock only or assumed; {@code judgedMm}: the span rescaling
     * stays in; {@code rule}: the sentence a row outside it gives).
     */
    static Map<String, Object> made(Material m) {
        Map<String, Object> json = new LinkedHashMap<>(StatedThicknessesJson.toJson(m.thicknesses()));
        MadeThicknesses made = SearchService.made(m);
        json.put("basis", switch (made.basis()) {
            case STATED_RANGE -> "stated";
            case STOCK_ONLY -> "stock only";
            case ASSUMED -> "assumed";
            case UNLIMITED -> "unknown";
        });
        json.put("judgedMm", made.basis() == MadeThicknesses.Basis.UNLIMITED ? null : List.of(made.loMm(), made.hiMm()));
        json.put("rule", made.basis() == MadeThicknesses.Basis.UNLIMITED ? null : made.limitText());
        return json;
    }

    /**
     * One sample with what a reader asks first. {@code cutoffsNm}: per level (1, 10, 50 %), the UV absorption
     * edge, where T rises through the level out of the absorbing short-wavelength side ({@link Cutoffs}; the
     * same wavelength a requirement's "cutoff between …" clause judges). {@code passBandEndsNm}: per level,
     * where that first pass band falls back under the level (a band-pass material such as UV-pass black
     * glass or a green tinted sheet); null for a long-pass curve. {@code rescalable}: whether the curve may
     * be rescaled to another thickness; {@code notRescaledReason} says why not for a sample of a bulk
     * material (a diffuse or scattering sample, {@link SampleRescaling}). {@code revision}: the revision
     * of its metadata shown; {@code retiredAt}: when it was retired, null while in use (docs/undo.md).
     * {@code states}: its curves in other states (aged, printed) in use, each with its own figures and a link to its
     * points; its own curve is always its as-supplied state (docs/material-states.md).
     */
    record SampleDetail(long id, int revision, String retiredAt, double thicknessMm, String geometry, String provenance, String instrument,
                        String measuredOn, String lot, String notes, double detectionLimit, List<Double> rangeNm,
                        Map<String, Double> cutoffsNm, Map<String, Double> passBandEndsNm,
                        Map<String, Double> transmittanceAt, Map<String, Boolean> belowDetectionAt,
                        boolean rescalable, String notRescaledReason, List<StateResponses.StateSummary> states) {

        static SampleDetail of(SampleInfo s, Curve curve, SampleRescaling rescaling) {
            return of(s, curve, rescaling, List.of());
        }

        /** @param states the sample's curves in other states that are in use (docs/material-states.md) */
        static SampleDetail of(SampleInfo s, Curve curve, SampleRescaling rescaling,
                               List<org.spectralsieve.library.StoredStateCurve> states) {
            Map<String, Double> cutoffs = new LinkedHashMap<>();
            Map<String, Double> bandEnds = new LinkedHashMap<>();
            for (int level : CUTOFF_LEVELS_PERCENT) {
                Cutoffs.Edges edges = Cutoffs.edges(curve, level / 100.0);
                cutoffs.put(String.valueOf(level), orNull(edges.absorptionEdgeNm()));
                bandEnds.put(String.valueOf(level), orNull(edges.passBandEndNm()));
            }
            Map<String, Double> at = new LinkedHashMap<>();
            Map<String, Boolean> below = new LinkedHashMap<>();
            for (int nm : KEY_WAVELENGTHS_NM) {
                OptionalDouble t = curve.transmittanceAt(nm);
                at.put(String.valueOf(nm), orNull(t));
                below.put(String.valueOf(nm), t.isPresent() ? curve.belowDetectionAt(nm) : null);
            }
            return new SampleDetail(s.id(), s.revision(), instant(s.retiredAt()), s.thicknessMm(), s.geometry().label(), s.provenance().label(),
                    s.instrument(), s.measuredOn() == null ? null : s.measuredOn().toString(), s.lot(), s.notes(),
                    s.detectionLimit(), List.of(curve.minWavelengthNm(), curve.maxWavelengthNm()), cutoffs, bandEnds, at,
                    below, rescaling.rescalable(), rescaling.reason(),
                    states.stream().map(StateResponses.StateSummary::of).toList());
        }
    }

    /** A retired sample of a material in use or not: enough to find it and restore it (docs/undo.md). */
    record RetiredSampleJson(long id, double thicknessMm, String geometry, int revision, String retiredAt) {
        static RetiredSampleJson of(SampleInfo s) {
            return new RetiredSampleJson(s.id(), s.thicknessMm(), s.geometry().label(), s.revision(), instant(s.retiredAt()));
        }
    }

    /**
     * {@code revision}: the revision of its index and made thicknesses shown; {@code retiredAt}: when it was
     * retired, null while in use; {@code retiredSamples}: its samples retired one by one (docs/undo.md).
     */
    record MaterialDetail(long id, String slug, String name, int revision, String retiredAt, String materialClass,
                          String description, String scaling, List<String> tags, Map<String, Object> refractiveIndex,
                          Map<String, Object> madeThicknesses, List<SampleDetail> samples,
                          List<RetiredSampleJson> retiredSamples) {
        static MaterialDetail of(Material m, List<SampleDetail> samples) {
            return of(m, samples, List.of());
        }

        static MaterialDetail of(Material m, List<SampleDetail> samples, List<SampleInfo> retiredSamples) {
            return new MaterialDetail(m.id(), m.slug(), m.name(), m.revision(), instant(m.retiredAt()),
                    m.materialClass().label(), m.description(), m.scaling().label(), m.tags(),
                    RefractiveIndexJson.toJson(m.refractiveIndex()), made(m), samples,
                    retiredSamples.stream().map(RetiredSampleJson::of).toList());
        }
    }

    static String instant(java.time.Instant t) {
        return t == null ? null : t.toString();
    }

    /**
     * {@code sampleRevision}, {@code materialRevision}: the revisions the curve was read through;
     * {@code retiredAt}: when the sample (or its material) was retired, null while in use (docs/undo.md).
     */
    record CurveResponse(long sampleId, int sampleRevision, int materialRevision, String retiredAt, double thicknessMm,
                         boolean rescaled, double[] wavelengthsNm, double[] transmittance, boolean[] belowDetection,
                         double detectionLimit, UncertaintyJson uncertainty) {
    }

    private static Double orNull(OptionalDouble value) {
        return value.isPresent() ? value.getAsDouble() : null;
    }
}
