package org.spectralsieve.store;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Optional;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.spectralsieve.requirement.Candidate;
import org.spectralsieve.requirement.MaterialEvaluation;
import org.spectralsieve.requirement.MaterialJudge;
import org.spectralsieve.requirement.RankedRow;
import org.spectralsieve.requirement.Ranking;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.RequirementParser;
import org.spectralsieve.requirement.SampleEvaluation;

/**
 * The store's pick of a plain requirement, followed as the service follows it (judge the hits exactly, then every
 * material the hand-over still names for the exact last row), gives the rows of judging every sample exactly, on
 * 3,000 synthetic curves (1,000 materials of three samples, each with its own index; the exact evaluator reads the
 * store's own decoded curve, so what differs is the thickness model: the multiple reflections the store leaves out).
 * Requirements in the trades' usual form (common practice, no source), as measured, at one thickness and solved.
 */
class StorePickEqualsExactJudgementTest {

    private static final String[] CLAUSES = {
            "passes over 80% at 365 nm and blocks under 1% at 405 nm",
            "blocks under 0.5% from 300 to 380 nm and passes over 60% at 450 nm",
    };
    private static final String[] THICKNESSES = {"", ", at 3 mm", ", thickness 1 to 6 mm", ", thickness 0.5 to 3 mm"};
    private static final int[] LIMITS = {1, 2, 3, 5, 8, 13, 20, 30};

    @Test
    void theStorePickWithItsHandOverEqualsJudgingEverySample() {
        SyntheticCurves synthetic = new SyntheticCurves(20261205L, SpectralStore.DEFAULT_GRID);
        int n = 3_000;
        SyntheticCurves.Spec[] specs = new SyntheticCurves.Spec[n];
        SpectralStore.Builder builder = SpectralStore.builder(SpectralStore.DEFAULT_GRID, n);
        for (int i = 0; i < n; i++) {
            specs[i] = synthetic.next();
            int material = i / 3;
            builder.addEncoded(i + 1L, new StoredMaterial(material + 1L, "synthetic sheet " + material, "plastic sheet"),
                    specs[i].thicknessMm(), material % 3 != 2, false, SyntheticCurves.INDICES[specs[i].index()],
                    synthetic.codes(specs[i]));
        }
        SpectralStore store = builder.build();

        int handedOver = 0;
        int wrongWithoutIt = 0;
        for (String clauses : CLAUSES) {
            for (String thickness : THICKNESSES) {
                Requirement requirement = RequirementParser.parse(clauses + thickness);
                List<MaterialEvaluation> everySample = new ArrayList<>();
                for (int m = 0; m < store.curvesByMaterial().length; m++) {
                    everySample.addAll(judge(store, specs, m, requirement));
                }
                for (int limit : LIMITS) {
                    StoreResult picked = StoreSearch.search(store, requirement, limit);
                    Set<Integer> materials = new LinkedHashSet<>();
                    picked.hits().forEach(hit -> materials.add(store.materialIndex(hit.curve())));
                    List<RankedRow> first = rank(store, specs, materials, requirement, limit);
                    List<RankedRow> rows = first;
                    if (first.size() >= limit) {
                        SampleEvaluation last = first.get(limit - 1).evaluation();
                        List<StoreHit> more = picked.handOver().reaching(last.standing(), last.worstMarginDecades());
                        handedOver += more.size();
                        more.forEach(hit -> materials.add(store.materialIndex(hit.curve())));
                        rows = rank(store, specs, materials, requirement, limit);
                    }
                    List<RankedRow> exact = Ranking.rank(everySample, limit);
                    assertThat(rows).as(requirement + " (limit " + limit + ")").containsExactlyElementsOf(exact);
                    if (!first.equals(exact)) {
                        wrongWithoutIt++;
                    }
                }
            }
        }
        assertThat(handedOver).as("materials handed over beyond the hits").isPositive();
        assertThat(wrongWithoutIt).as("searches the hits alone would have answered wrongly").isPositive();
    }

    private static List<RankedRow> rank(SpectralStore store, SyntheticCurves.Spec[] specs, Set<Integer> materials,
                                        Requirement requirement, int limit) {
        List<MaterialEvaluation> judged = new ArrayList<>();
        for (int m : materials) {
            judged.addAll(judge(store, specs, m, requirement));
        }
        return Ranking.rank(judged, limit);
    }

    /** Every sample of material {@code m}, judged exactly on the store's decoded curve with its own index. */
    private static List<MaterialEvaluation> judge(SpectralStore store, SyntheticCurves.Spec[] specs, int m,
                                                  Requirement requirement) {
        List<Candidate> samples = new ArrayList<>();
        for (int curve : store.curvesByMaterial()[m]) {
            StoredMaterial material = store.materialAt(m);
            samples.add(new Candidate(store.sampleId(curve), material.id(), material.name(), store.curve(curve),
                    store.thicknessMm(curve), store.isBulk(curve), SyntheticCurves.INDICES[specs[curve].index()]));
        }
        return MaterialJudge.evaluate(samples, requirement, Optional.empty());
    }
}
