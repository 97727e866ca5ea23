package org.spectralsieve.search;

import static org.spectralsieve.search.DiffuseLastRanking.diffuseLast;
import static org.spectralsieve.search.DiffuseLastRanking.rank;
import static org.spectralsieve.search.RowDecoration.geometries;
import static org.spectralsieve.search.RowDecoration.measured;
import static org.spectralsieve.search.RowDecoration.revisions;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.spectralsieve.library.Material;
import org.spectralsieve.requirement.Aggregate;
import org.spectralsieve.requirement.MaterialEvaluation;
import org.spectralsieve.requirement.RankedRow;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.SampleEvaluation;
import org.spectralsieve.requirement.TransmittanceClause;
import org.spectralsieve.search.MaterialCandidates.Prepared;
import org.spectralsieve.store.SampleReach;
import org.spectralsieve.store.StoreHit;
import org.spectralsieve.store.StoreResult;
import org.spectralsieve.store.StoreSearch;

/**
 * The search of a requirement the store can rank: the store picks the materials that can be in the shortlist, the
 * samples of each are judged exactly on their stored curves, best store ceiling first, leaving out those that
 * provably cannot change the material's row ({@link BestSampleFirst}), and every material whose store result could
 * still reach the exact last row is judged too (docs/store.md, "The store's error at the cut"). A requirement the
 * store cannot rank goes to {@link BoundedExactSearch}.
 */
final class StorePickedSearch {

    private final MaterialCandidates candidates;
    private final BoundedExactSearch exact;
    /**
     * Whether a picked material's samples are judged best store ceiling first, leaving out those that cannot change
     * its row ({@link BestSampleFirst}); the system property {@code sieve.search.sample-bound=false} judges every
     * sample, only so a benchmark can time both ways side by side (the answers are the same).
     */
    boolean boundSamples = !"false".equals(System.getProperty("sieve.search.sample-bound"));

    StorePickedSearch(MaterialCandidates candidates, BoundedExactSearch exact) {
        this.candidates = candidates;
        this.exact = exact;
    }

    Shortlist searchOn(Snapshot s, Requirement requirement, int limit, long started) {
        // a confidence demand can make a wide margin unverified: the store's margins cannot pick those rows; a
        // mean over a band, or a reading between grid wavelengths, the store takes on its grid and the exact
        // evaluator on the curve's own points, with no bound on the difference, so the store cannot pick those
        // rows either; nor a block over readings held at the store's OD ceiling (docs/store.md, "The store's error at
        // the cut")
        if (!requirement.plain() || requirement.asksConfidence() || hasMeanClause(requirement)
                || StoreSearch.readsBetweenGridPoints(s.store(), requirement)
                || StoreSearch.blocksAtTheCodeCeiling(s.store(), requirement)) {
            return exact.searchExactly(s, requirement, limit, started, BoundedExactSearch.EVERY_MATERIAL);
        }
        StoreResult picked = StoreSearch.search(s.store(), requirement, limit);
        // material id → one of its store curves (to find its samples' ceilings), NO_CURVE: judged whole
        Map<Long, Integer> materialIds = new LinkedHashMap<>();
        for (StoreHit hit : picked.hits()) {
            materialIds.put(hit.material().id(), hit.curve());
        }
        // the store holds an unusable sample at a thickness and index of its own: its store result bounds nothing
        s.unusable().forEach(sampleId -> materialIds.put(s.samples().get(sampleId).materialId(), NO_CURVE));
        List<MaterialEvaluation> exact = new ArrayList<>();
        judgeInto(s, requirement, materialIds, picked.sampleReach(), exact);
        List<RankedRow> rows = rank(s, requirement, exact, limit);
        if (rows.size() >= limit) {
            // the store's margins are off by a little: every material whose store result could still reach the
            // exact last row is judged too (docs/store.md, "The store's error at the cut")
            SampleEvaluation last = rows.get(limit - 1).evaluation();
            Map<Long, Integer> more = new LinkedHashMap<>();
            for (StoreHit hit : picked.handOver().reaching(last.standing(), last.worstMarginDecades())) {
                if (!materialIds.containsKey(hit.material().id())) {
                    more.put(hit.material().id(), hit.curve());
                }
            }
            if (!more.isEmpty()) {
                judgeInto(s, requirement, more, picked.sampleReach(), exact);
                rows = rank(s, requirement, exact, limit);
            }
        }
        double tookMs = (System.nanoTime() - started) / 1e6;
        return new Shortlist(requirement, rows, picked.evaluatedSamples(), exact.size(), tookMs, Optional.empty(),
                geometries(s, rows), revisions(s, rows), measured(s, rows), s.generation());
    }

    /** In {@link #searchOn}'s map of materials to judge: no store curve speaks for the material's samples. */
    private static final int NO_CURVE = -1;

    /**
     * Judges the picked materials: each best sample first, leaving out samples whose store ceiling proves they
     * cannot change the material's row ({@link BestSampleFirst}), unless a sample of the material has an unusable
     * record (its store row bounds nothing, and it moves the others' spans) or the switch is off.
     */
    private void judgeInto(Snapshot s, Requirement requirement, Map<Long, Integer> curveOfMaterial, SampleReach reach,
                           List<MaterialEvaluation> exact) {
        boolean grouped = diffuseLast(requirement);
        curveOfMaterial.forEach((materialId, curve) -> {
            Material material = s.materials().get(materialId);
            if (boundSamples && curve != NO_CURVE) {
                Prepared p = candidates.prepare(s, material, requirement, false);
                Optional<List<MaterialEvaluation>> bestFirst = BestSampleFirst.judge(p.candidates(), p.failed(),
                        requirement, reach.curvesOfMaterialOf(curve), reach, grouped, p.sampleJudge());
                exact.addAll(bestFirst.orElseGet(() -> p.judge(requirement, Optional.empty())));
            } else {
                exact.addAll(candidates.judge(s, material, requirement, Optional.empty(), false));
            }
        });
    }

    private static boolean hasMeanClause(Requirement requirement) {
        return requirement.clauses().stream()
                .anyMatch(c -> c instanceof TransmittanceClause t && t.aggregate() == Aggregate.MEAN);
    }
}
