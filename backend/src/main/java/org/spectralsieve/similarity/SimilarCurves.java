package org.spectralsieve.similarity;

import java.util.ArrayList;
import java.util.Collection;
import java.util.Comparator;
import java.util.List;

/**
 * Exact ranking of candidates by shape distance to a query: every candidate compared, nearest first. This is
 * the ground truth an approximate vector index is measured against, and the re-ranking step after one.
 */
public final class SimilarCurves {

    /**
     * Candidates sharing fewer grid points with the query are left out: 10 points span 45 nm, about one
     * absorption edge; fewer cannot tell one shape from another.
     */
    public static final int MIN_COMMON_POINTS = 10;
    /** The band a hit names as differing most: 25 nm, a typical absorption edge's width (our choice). */
    public static final double BAND_NM = 25;
    static final int BAND_POINTS = (int) Math.round(BAND_NM / CurveSignature.STEP_NM);

    private SimilarCurves() {
    }

    /** A stored curve to compare: its id (sample, material, whatever the caller needs back) and signature. */
    public record Candidate(String id, CurveSignature signature) {
        public Candidate {
            if (id == null || signature == null) {
                throw new IllegalArgumentException("a candidate needs an id and a signature");
            }
        }
    }

    /** The {@code limit} nearest candidates, nearest first (ties by id, so the answer is repeatable). */
    public static List<SimilarHit> rank(CurveSignature query, Collection<Candidate> candidates, ShapeMetric metric,
            int limit) {
        return rank(query, candidates, metric, ComparedBand.WHOLE_GRID, limit);
    }

    /**
     * The {@code limit} nearest candidates compared only over the grid points inside {@code band}, nearest
     * first (ties by id): a candidate sharing fewer than {@link #MIN_COMMON_POINTS} points with the query
     * there is left out.
     */
    public static List<SimilarHit> rank(CurveSignature query, Collection<Candidate> candidates, ShapeMetric metric,
            ComparedBand band, int limit) {
        if (query == null || candidates == null || metric == null || band == null) {
            throw new IllegalArgumentException("query, candidates and metric are required");
        }
        if (limit < 1) {
            throw new IllegalArgumentException("limit must be at least 1, was " + limit);
        }
        List<SimilarHit> hits = new ArrayList<>();
        for (Candidate c : candidates) {
            Comparison comparison = new Comparison(query, c.signature(), band);
            if (comparison.commonPoints() < MIN_COMMON_POINTS) {
                continue;
            }
            hits.add(new SimilarHit(c.id(), comparison.distance(metric), comparison.commonPoints(),
                    comparison.resolvedPoints(),
                    comparison.bandDifferingMost(metric), comparison.matchingThicknessMm()));
        }
        hits.sort(Comparator.comparingDouble(SimilarHit::distance).thenComparing(SimilarHit::id));
        return List.copyOf(hits.subList(0, Math.min(limit, hits.size())));
    }

    /** The distance between two signatures, or NaN when they share fewer than {@link #MIN_COMMON_POINTS}. */
    public static double distance(CurveSignature a, CurveSignature b, ShapeMetric metric) {
        return distance(a, b, metric, ComparedBand.WHOLE_GRID);
    }

    /** The distance over the grid points inside {@code band}, or NaN when they share fewer than {@link #MIN_COMMON_POINTS} there. */
    public static double distance(CurveSignature a, CurveSignature b, ShapeMetric metric, ComparedBand band) {
        Comparison comparison = new Comparison(a, b, band);
        return comparison.commonPoints() < MIN_COMMON_POINTS ? Double.NaN : comparison.distance(metric);
    }
}
