package org.spectralsieve.search;

import static org.spectralsieve.search.Admission.admits;
import static org.spectralsieve.search.DiffuseLastRanking.diffuseLast;
import static org.spectralsieve.search.DiffuseLastRanking.rank;
import static org.spectralsieve.search.DiffuseLastRanking.regularOnly;
import static org.spectralsieve.search.RowDecoration.geometries;
import static org.spectralsieve.search.RowDecoration.measured;
import static org.spectralsieve.search.RowDecoration.revisions;
import static org.spectralsieve.search.BoundedExactSearch.madeFor;
import static org.spectralsieve.search.SearchService.made;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.function.Predicate;
import org.spectralsieve.library.Geometry;
import org.spectralsieve.library.Material;
import org.spectralsieve.library.SampleInfo;
import org.spectralsieve.requirement.MaterialEvaluation;
import org.spectralsieve.requirement.RankedRow;
import org.spectralsieve.requirement.Ranking;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.StackLayer;
import org.spectralsieve.search.SearchService.Judging;

/**
 * The exact judgement of a requirement the store cannot rank the way before materials were ordered and left out by
 * their bounds of either sign ({@link SearchService.Judging#EARLIER}): every admitted sample judged except the
 * store's proven misses, which are judged only while they could still enter. The same answer as
 * {@link BoundedExactSearch}; kept so benchmarks and equivalence tests can run both side by side.
 */
final class EarlierExactSearch {

    private final MaterialCandidates candidates;
    private final FirstBoundScreens screens;

    EarlierExactSearch(MaterialCandidates candidates, FirstBoundScreens screens) {
        this.candidates = candidates;
        this.screens = screens;
    }

    /**
     * The exact evaluator on every admitted sample, with the store's proven misses held back: a material all
     * of whose admitted samples are proven to miss has an exact result no better than (misses, its largest
     * bound), so it is judged only while that could still beat the shortlist's last row. The answer is the
     * one judging every admitted sample would give. The judging loop before materials were ordered and left
     * out by their bounds of either sign ({@link Judging#EARLIER}); benchmarks and tests only.
     */
    Shortlist searchExactlyTheEarlierWay(Snapshot s, Requirement requirement, int limit, long started,
                                    Predicate<Material> within) {
        Optional<StackLayer> layer = requirement.layer().map(l -> candidates.resolveLayer(l, s));
        boolean diffuseLayer = layer.map(l -> s.samples().get(l.sampleId()).geometry() == Geometry.TOTAL).orElse(false);
        Map<Long, Double> provenMiss = new java.util.HashMap<>();
        // the store's curves are at normal incidence: for light at an angle no screen bounds a row
        if (!requirement.oblique()) {
            provenMiss.putAll(FirstBoundScreens.provenMisses(s, requirement, layer));
            if (screens.screenLayerBlocks) {
                layer.ifPresent(l -> FirstBoundScreens.addLayerBlockMisses(provenMiss, s.store(), requirement, l));
            }
            if (screens.screenWeighted && screens.earlierWeightedScreen) {
                WeightedMisses.addEarlier(provenMiss, s.store(), requirement, layer, diffuseLayer);
            } else if (screens.screenWeighted) {
                WeightedMisses.add(provenMiss, s.store(), requirement, layer, diffuseLayer);
            }
        }
        // the store holds a sample whose record fails today's checks at a storable thickness with n = 1.5, while
        // the exact judgement reads its own record (a stack with the material's own index, say): a bound formed
        // on the store's stand-in proves nothing about that row, so such a sample is always judged exactly
        s.unusable().forEach(provenMiss::remove);
        List<MaterialEvaluation> exact = new ArrayList<>();
        Map<Material, Double> held = new LinkedHashMap<>();
        int admitted = 0;
        for (Material material : s.materials().values().stream().sorted(Comparator.comparingLong(Material::id))
                .filter(within).toList()) {
            double bound = Double.NEGATIVE_INFINITY;
            boolean allMiss = true;
            int count = 0;
            for (SampleInfo sample : material.samples()) {
                if (admits(requirement, material, sample)) {
                    count++;
                    Double b = provenMiss.get(sample.id());
                    allMiss &= b != null;
                    bound = b == null ? bound : Math.max(bound, b);
                }
            }
            admitted += count;
            if (count == 0) {
                continue;
            }
            if (allMiss && madeFor(requirement.thickness(), material, made(material))) {
                held.put(material, bound);
            } else {
                exact.addAll(candidates.judge(s, material, requirement, layer, diffuseLayer));
            }
        }
        List<RankedRow> rows = rank(s, requirement, exact, limit);
        List<Map.Entry<Material, Double>> byBound = new ArrayList<>(held.entrySet());
        byBound.sort(Map.Entry.<Material, Double>comparingByValue().reversed());
        boolean grouped = diffuseLast(requirement);
        // the top rows are kept up to date from themselves and each newly judged material (a top-k of a union
        // is the top-k of the parts' top-k), not re-ranked from every judgement: that was quadratic
        List<RankedRow> regularRows = grouped ? Ranking.rank(regularOnly(s, exact), limit) : List.of();
        boolean judgedHeld = false;
        for (Map.Entry<Material, Double> entry : byBound) {
            // grouped: a material with a regular sample competes only with the regular rows, which come first
            boolean regular = grouped && entry.getKey().samples().stream()
                    .anyMatch(x -> admits(requirement, entry.getKey(), x) && x.geometry() == Geometry.REGULAR);
            List<RankedRow> competing = regular ? regularRows : rows;
            if (!BoundedJudgement.couldEnter(competing, limit,
                    new BoundedJudgement.Contender(entry.getKey(), entry.getValue(), true, regular))) {
                if (grouped) {
                    continue; // the two groups' bounds are not ordered together
                }
                break; // bounds only fall from here on
            }
            List<MaterialEvaluation> judged = candidates.judge(s, entry.getKey(), requirement, layer, diffuseLayer);
            exact.addAll(judged);
            judgedHeld = true;
            rows = rank(s, requirement, BoundedJudgement.withRows(rows, judged), limit);
            if (grouped) {
                regularRows = Ranking.rank(regularOnly(s, BoundedJudgement.withRows(regularRows, judged)), limit);
            }
        }
        if (judgedHeld) {
            rows = rank(s, requirement, exact, limit); // once, from every judgement: the answer's own rows
        }
        double tookMs = (System.nanoTime() - started) / 1e6;
        return new Shortlist(requirement, rows, admitted, exact.size(), tookMs, layer, geometries(s, rows),
                revisions(s, rows), measured(s, rows), s.generation());
    }
}
