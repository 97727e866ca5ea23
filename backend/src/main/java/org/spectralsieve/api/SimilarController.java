package org.spectralsieve.api;

import java.util.List;
import java.util.Optional;
import java.util.OptionalLong;
import java.util.Set;
import org.spectralsieve.library.Geometry;
import org.spectralsieve.library.MaterialClass;
import org.spectralsieve.search.SimilarSamples;
import org.spectralsieve.search.vector.VectorFilter;
import org.spectralsieve.similarity.ComparedBand;
import org.spectralsieve.similarity.CurveSignature;
import org.spectralsieve.similarity.QueryQuality;
import org.spectralsieve.similarity.ShapeMetric;
import org.spectralsieve.similarity.SimilarHit;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.RestController;

/** {@code GET /api/samples/{id}/similar}: the stored samples whose curves look most like this one's. */
@RestController
class SimilarController {

    private final SimilarSamples similar;

    SimilarController(SimilarSamples similar) {
        this.similar = similar;
    }

    /**
     * @param metric {@link SimilarSamples#METRIC_NAMES}; the sample itself is never among its hits
     * @param band   {@code FROM-TO} nm: compare only the grid points inside it (default the whole grid)
     * @param classes    material classes the hits must be of (repeatable, alternatives; none: any), as in
     *                   {@code GET /api/library}
     * @param geometries sample geometries the hits must have ({@code regular}, {@code total}; none: any)
     */
    @GetMapping("/api/samples/{id}/similar")
    SimilarResponse similar(@PathVariable("id") long id,
                            @RequestParam(name = "limit", required = false) String limit,
                            @RequestParam(name = "metric", required = false) String metric,
                            @RequestParam(name = "band", required = false) String band,
                            @RequestParam(name = "class", required = false) List<String> classes,
                            @RequestParam(name = "geometry", required = false) List<String> geometries) {
        ShapeMetric chosen = metric(metric);
        int n = limit(limit);
        Optional<ComparedBand> asked = band(band);
        ComparedBand compared = asked.orElse(ComparedBand.WHOLE_GRID);
        VectorFilter narrowing = new VectorFilter(
                LibrarySearchController.values("class", classes, label -> MaterialClass.of(label).label()),
                LibrarySearchController.values("geometry", geometries, g -> Geometry.parse(g).label()), Set.of());
        CurveSignature query = similar.signatureOf(id);
        List<HitJson> hits = similar.similarTo(query, OptionalLong.of(id), chosen, compared, narrowing, n).stream()
                .map(SimilarController::json).toList();
        List<String> warnings = QueryQuality.of(query, compared).warnings();
        return new SimilarResponse(id, SimilarSamples.metricName(chosen), BandJson.of(asked),
                narrowing.isEmpty() ? null : new NarrowingJson(sorted(narrowing.classes()), sorted(narrowing.geometries())),
                warnings, hits);
    }

    private static List<String> sorted(Set<String> values) {
        return values.stream().sorted().toList();
    }

    /**
     * @param band      the compared band, null for the whole grid
     * @param narrowing the classes and geometries the hits were narrowed to, null when not narrowed
     * @param warnings  about the query (QueryQuality)
     */
    record SimilarResponse(long sampleId, String metric, BandJson band, NarrowingJson narrowing, List<String> warnings,
                           List<HitJson> hits) {
    }

    record NarrowingJson(List<String> classes, List<String> geometries) {
    }

    record HitJson(long materialId, String materialName, String materialClass, long sampleId, double thicknessMm,
                   double distance, int pointsCompared, int resolvedPointsCompared, BandJson differingMost,
                   Double matchingThicknessMm) {
    }

    record BandJson(double fromNm, double toNm) {
        static BandJson of(Optional<ComparedBand> band) {
            return band.map(b -> new BandJson(b.fromNm(), b.toNm())).orElse(null);
        }
    }

    /** {@code FROM-TO} in nm inside the grid, or empty when not given (the whole grid). */
    static Optional<ComparedBand> band(String text) {
        if (text == null || text.isBlank()) {
            return Optional.empty();
        }
        try {
            return Optional.of(ComparedBand.parse(text));
        } catch (IllegalArgumentException e) {
            throw new BadParameterException("band", e.getMessage());
        }
    }

    static ShapeMetric metric(String name) {
        if (name == null) {
            return SimilarSamples.DEFAULT_METRIC;
        }
        return SimilarSamples.metricNamed(name).orElseThrow(() -> new BadParameterException("metric",
                "must be one of " + String.join(", ", SimilarSamples.METRIC_NAMES) + ", got '" + name + "'"));
    }

    static int limit(String text) {
        if (text == null) {
            return SimilarSamples.DEFAULT_LIMIT;
        }
        try {
            int n = Integer.parseInt(text.trim());
            if (n >= 1 && n <= SimilarSamples.MAX_LIMIT) {
                return n;
            }
        } catch (NumberFormatException e) {
            // answered below, as an out-of-range number is
        }
        throw new BadParameterException("limit", "must be a whole number from 1 to " + SimilarSamples.MAX_LIMIT
                + ", got '" + text + "'");
    }

    static HitJson json(SimilarSamples.Hit h) {
        SimilarHit s = h.similarity();
        return new HitJson(h.materialId(), h.materialName(), h.materialClass(), h.sampleId(), h.thicknessMm(),
                s.distance(), s.pointsCompared(), s.resolvedPointsCompared(),
                new BandJson(s.differingMost().fromNm(), s.differingMost().toNm()),
                s.matchingThicknessMm().isPresent() ? s.matchingThicknessMm().getAsDouble() : null);
    }
}
