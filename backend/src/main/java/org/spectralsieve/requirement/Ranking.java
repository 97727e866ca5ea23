package org.spectralsieve.requirement;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/** One row per material — its best sample by {@link RankingOrder} — in that same order, at most {@code limit} rows. */
public final class Ranking {

    private Ranking() {
    }

    /** Evaluates every material's candidates with {@link MaterialJudge} and ranks them. */
    public static List<RankedRow> evaluateAndRank(List<Candidate> candidates, Requirement requirement, int limit) {
        Map<Long, List<Candidate>> byMaterial = new LinkedHashMap<>();
        for (Candidate candidate : candidates) {
            byMaterial.computeIfAbsent(candidate.materialId(), id -> new ArrayList<>()).add(candidate);
        }
        List<MaterialEvaluation> evaluations = new ArrayList<>(candidates.size());
        for (List<Candidate> samples : byMaterial.values()) {
            evaluations.addAll(MaterialJudge.evaluate(samples, requirement, java.util.Optional.empty()));
        }
        return rank(evaluations, limit);
    }

    public static List<RankedRow> rank(List<MaterialEvaluation> evaluations, int limit) {
        if (limit < 0) {
            throw new IllegalArgumentException("limit must be >= 0, was " + limit);
        }
        Map<Long, MaterialEvaluation> best = new LinkedHashMap<>();
        for (MaterialEvaluation e : evaluations) {
            best.merge(e.materialId(), e,
                    (kept, offered) -> RankingOrder.MATERIAL_EVALUATIONS.compare(offered, kept) < 0 ? offered : kept);
        }
        List<MaterialEvaluation> sorted = new ArrayList<>(best.values());
        sorted.sort(RankingOrder.MATERIAL_EVALUATIONS);
        List<RankedRow> rows = new ArrayList<>(Math.min(limit, sorted.size()));
        for (int i = 0; i < sorted.size() && i < limit; i++) {
            MaterialEvaluation e = sorted.get(i);
            rows.add(new RankedRow(i + 1, e.materialId(), e.materialName(), e.evaluation()));
        }
        return List.copyOf(rows);
    }
}
