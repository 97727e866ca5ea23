package org.spectralsieve.search.vector;

import java.util.ArrayList;
import java.util.Collection;
import java.util.Comparator;
import java.util.List;
import org.spectralsieve.similarity.ComparedBand;
import org.spectralsieve.similarity.CurveSignature;
import org.spectralsieve.similarity.ShapeMetric;
import org.spectralsieve.similarity.SimilarCurves;
import org.spectralsieve.similarity.SimilarHit;

/**
 * The exact ranking of nominated candidates, the same answer as {@link SimilarCurves#rank} over them: first
 * only the distance of each (the cheap part), then the full explanation (band, thickness) for the
 * {@code limit} nearest only — a hit's explanation costs several times its distance, and 200 candidates
 * are nominated for 10 hits.
 */
public final class ExactReRank {

    private ExactReRank() {
    }

    public static List<SimilarHit> rank(CurveSignature query, Collection<SimilarCurves.Candidate> candidates,
            ShapeMetric metric, int limit) {
        return rank(query, candidates, metric, ComparedBand.WHOLE_GRID, limit);
    }

    /** As {@link SimilarCurves#rank(CurveSignature, Collection, ShapeMetric, ComparedBand, int)} over the candidates. */
    public static List<SimilarHit> rank(CurveSignature query, Collection<SimilarCurves.Candidate> candidates,
            ShapeMetric metric, ComparedBand band, int limit) {
        record Scored(SimilarCurves.Candidate candidate, double distance) {
        }
        List<Scored> scored = new ArrayList<>(candidates.size());
        for (SimilarCurves.Candidate c : candidates) {
            double d = SimilarCurves.distance(query, c.signature(), metric, band);
            if (!Double.isNaN(d)) {
                scored.add(new Scored(c, d));
            }
        }
        // the order rank() sorts by, so the kept ones are exactly its first `limit`
        scored.sort(Comparator.comparingDouble(Scored::distance).thenComparing(s -> s.candidate().id()));
        List<SimilarCurves.Candidate> nearest = scored.subList(0, Math.min(limit, scored.size())).stream()
                .map(Scored::candidate).toList();
        return nearest.isEmpty() ? List.of() : SimilarCurves.rank(query, nearest, metric, band, limit);
    }
}
