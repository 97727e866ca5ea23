package org.spectralsieve.api;

import java.util.List;
import org.spectralsieve.search.SimilarSamples;
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

    /** @param metric {@link SimilarSamples#METRIC_NAMES}; the sample itself is never among its hits */
    @GetMapping("/api/samples/{id}/similar")
    SimilarResponse similar(@PathVariable("id") long id,
                            @RequestParam(name = "limit", required = false) String limit,
                            @RequestParam(name = "metric", required = false) String metric) {
        ShapeMetric chosen = metric(metric);
        int n = limit(limit);
        List<HitJson> hits = similar.similarTo(id, chosen, n).stream().map(SimilarController::json).toList();
        return new SimilarResponse(id, SimilarSamples.metricName(chosen), hits);
    }

    record SimilarResponse(long sampleId, String metric, List<HitJson> hits) {
    }

    record HitJson(long materialId, String materialName, String materialClass, long sampleId, double thicknessMm,
                   double distance, int pointsCompared, int resolvedPointsCompared, BandJson differingMost,
                   Double matchingThicknessMm) {
    }

    record BandJson(double fromNm, double toNm) {
    }

    private static ShapeMetric metric(String name) {
        if (name == null) {
            return SimilarSamples.DEFAULT_METRIC;
        }
        return SimilarSamples.metricNamed(name).orElseThrow(() -> new BadParameterException("metric",
                "must be one of " + String.join(", ", SimilarSamples.METRIC_NAMES) + ", got '" + name + "'"));
    }

    private static int limit(String text) {
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

    private static HitJson json(SimilarSamples.Hit h) {
        SimilarHit s = h.similarity();
        return new HitJson(h.materialId(), h.materialName(), h.materialClass(), h.sampleId(), h.thicknessMm(),
                s.distance(), s.pointsCompared(), s.resolvedPointsCompared(),
                new BandJson(s.differingMost().fromNm(), s.differingMost().toNm()),
                s.matchingThicknessMm().isPresent() ? s.matchingThicknessMm().getAsDouble() : null);
    }
}
