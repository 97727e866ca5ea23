package org.spectralsieve.search;

import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import org.spectralsieve.library.Geometry;
import org.spectralsieve.requirement.MaterialEvaluation;
import org.spectralsieve.requirement.RankedRow;
import org.spectralsieve.requirement.Ranking;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.SeeThrough;

/**
 * The ranking every search answers with: {@link Ranking}, except that when a see-through clause cannot be shown by
 * total transmittance the rows of samples measured in total geometry follow every regular row ({@link SeeThrough}).
 */
final class DiffuseLastRanking {

    private DiffuseLastRanking() {
    }

    /**
     * The ranked rows. When the requirement has a see-through clause and does not accept total transmittance
     * ({@link SeeThrough}), samples measured in total geometry cannot show what it asks: their rows follow
     * every row judged in regular geometry, so a diffuser that misses a block clause by less never heads a
     * list of sheets to see through. Otherwise one ranking ({@link Ranking}).
     */
    static List<RankedRow> rank(Snapshot s, Requirement requirement, List<MaterialEvaluation> exact, int limit) {
        if (!diffuseLast(requirement)) {
            return Ranking.rank(exact, limit);
        }
        List<MaterialEvaluation> regular = regularOnly(s, exact);
        List<RankedRow> rows = new ArrayList<>(Ranking.rank(regular, limit));
        if (rows.size() < limit) {
            Set<Long> ranked = new HashSet<>();
            regular.forEach(e -> ranked.add(e.materialId()));
            List<MaterialEvaluation> diffuse = exact.stream()
                    .filter(e -> !ranked.contains(e.materialId()) && !isRegular(s, e)).toList();
            for (RankedRow row : Ranking.rank(diffuse, limit - rows.size())) {
                rows.add(new RankedRow(rows.size() + 1, row.materialId(), row.materialName(), row.evaluation()));
            }
        }
        return List.copyOf(rows);
    }

    /** Whether total-geometry rows go after the regular ones (see {@link #rank}). */
    static boolean diffuseLast(Requirement requirement) {
        return !requirement.acceptsTotalTransmittance() && requirement.clauses().stream().anyMatch(SeeThrough::needsRegular);
    }

    static List<MaterialEvaluation> regularOnly(Snapshot s, List<MaterialEvaluation> exact) {
        return exact.stream().filter(e -> isRegular(s, e)).toList();
    }

    static boolean isRegular(Snapshot s, MaterialEvaluation e) {
        return s.samples().get(e.evaluation().sampleId()).geometry() == Geometry.REGULAR;
    }
}
