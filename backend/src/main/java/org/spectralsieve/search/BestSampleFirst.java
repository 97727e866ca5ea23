package org.spectralsieve.search;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.spectralsieve.requirement.Candidate;
import org.spectralsieve.requirement.MadeThicknesses;
import org.spectralsieve.requirement.MaterialEvaluation;
import org.spectralsieve.requirement.MaterialJudge;
import org.spectralsieve.requirement.RankingOrder;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.SampleJudge;
import org.spectralsieve.requirement.ThicknessSpec;
import org.spectralsieve.store.SampleReach;

/**
 * One material picked by the store, judged best bound first: its chosen samples ({@link MaterialJudge#choose})
 * in the order of their store ceilings ({@link SampleReach}), each judged exactly, and a sample left unjudged once
 * its ceiling is strictly below the best exact result so far — it cannot be the material's row — and,
 * over a thickness range, it provably adds nothing to what the row shows of the others (docs/search-under-load.md,
 * "Sixth pass"). The rows shown are those of judging every chosen sample ({@code BestSampleFirstPropertyTest}).
 *
 * <p>Why that is enough: a material's row is its best evaluation ({@code Ranking}). As measured and at one
 * thickness every sample is judged on its own. Over a range the material's feasible interval is the union of its
 * samples' pieces and its stock advice is gathered from all of them ({@link MaterialJudge#merged}): a sample is
 * left out there only when the material has no stock sizes (so it adds no stock fit) and its ceiling cannot meet
 * (a piece is kept only by a judgement that meets), or it is not rescaled (judged as measured: no piece, no fit).
 * Where regular rows rank before every total one ({@code SearchService#rank}, a see-through clause, never in a
 * requirement the store ranks) the material is judged whole.
 */
final class BestSampleFirst {

    private BestSampleFirst() {
    }

    /** A chosen sample, its span and its ceiling. */
    private record Item(int position, MaterialJudge.Judged judged, int ceiling) {
    }

    /**
     * The material's evaluations, those {@code failed} first; empty when the material is to be judged whole:
     * {@link MaterialJudge#choose} fails (the whole judgement fails it the same way), a range with stock sizes,
     * or rows grouped by geometry.
     *
     * @param curveOfSample the store's curve of each of the material's samples (a sample without one is judged)
     * @param grouped       whether regular rows rank before every total one ({@code SearchService#diffuseLast})
     * @param judge         how one sample is judged exactly ({@link SampleJudge#EXACT}, or the service's memo)
     */
    static Optional<List<MaterialEvaluation>> judge(List<Candidate> candidates, List<MaterialEvaluation> failed,
                                                    Requirement requirement, Map<Long, Integer> curveOfSample,
                                                    SampleReach reach, boolean grouped, SampleJudge judge) {
        ThicknessSpec spec = requirement.thickness();
        boolean range = spec.kind() == ThicknessSpec.Kind.RANGE;
        MadeThicknesses made = candidates.isEmpty() ? MadeThicknesses.UNLIMITED : candidates.get(0).made();
        if (grouped || range && !made.stockMm().isEmpty()) {
            return Optional.empty(); // over a range every bulk sample adds its stock fits to the row's advice
        }
        List<MaterialJudge.Judged> chosen;
        try {
            chosen = MaterialJudge.choose(candidates, spec);
        } catch (RuntimeException e) {
            return Optional.empty();
        }
        List<Item> items = new ArrayList<>();
        for (int i = 0; i < chosen.size(); i++) {
            MaterialJudge.Judged j = chosen.get(i);
            Integer curve = curveOfSample.get(j.candidate().sampleId());
            items.add(new Item(i, j, curve == null ? SampleReach.NONE : reach.ceiling(curve)));
        }
        MaterialEvaluation[] judged = new MaterialEvaluation[chosen.size()];
        judgeBestFirst(items, failed, requirement, range, judged, judge);
        List<MaterialEvaluation> evaluations = new ArrayList<>();
        for (MaterialEvaluation e : judged) {
            if (e != null) {
                evaluations.add(e);
            }
        }
        List<MaterialEvaluation> out = new ArrayList<>(failed);
        try {
            out.addAll(range && chosen.size() >= 2 ? MaterialJudge.merged(evaluations) : evaluations);
        } catch (RuntimeException e) {
            return Optional.empty(); // judged whole, the merge fails there as it would have (or succeeds on all)
        }
        return Optional.of(out);
    }

    /**
     * Judges the samples best ceiling first (the store's order at equal ceilings), skipping each whose ceiling is
     * strictly below the best exact result so far, failed rows included, and that adds nothing to a range's merge.
     */
    private static void judgeBestFirst(List<Item> items, List<MaterialEvaluation> failed, Requirement requirement,
                                       boolean range, MaterialEvaluation[] judged, SampleJudge judge) {
        items.sort(Comparator.comparingInt(Item::ceiling).reversed().thenComparingInt(Item::position));
        MaterialEvaluation best = null;
        for (MaterialEvaluation f : failed) {
            best = better(best, f);
        }
        for (Item item : items) {
            if (best != null && SampleReach.below(item.ceiling(), best.evaluation().standing(),
                    best.evaluation().worstMarginDecades()) && addsNothingToMerge(item, range)) {
                continue;
            }
            MaterialEvaluation e = evaluate(item, requirement, judge);
            judged[item.position()] = e;
            best = better(best, e);
        }
    }

    /**
     * Whether leaving the sample out changes nothing of the others' rows: always at one thickness; over a range
     * (no stock sizes, checked by the caller) when it is not rescaled or its ceiling cannot meet: then its exact
     * judgement keeps no feasible piece ({@code SampleEvaluator}: a piece is kept only with a verdict that meets).
     */
    private static boolean addsNothingToMerge(Item item, boolean range) {
        return !range || !item.judged().candidate().bulk() || SampleReach.cannotMeet(item.ceiling());
    }

    private static MaterialEvaluation evaluate(Item item, Requirement requirement, SampleJudge judge) {
        Candidate c = item.judged().candidate();
        return MaterialEvaluation.of(c, judge.evaluate(c, requirement, Optional.empty(), item.judged().span()));
    }

    private static MaterialEvaluation better(MaterialEvaluation kept, MaterialEvaluation offered) {
        return kept == null || RankingOrder.MATERIAL_EVALUATIONS.compare(offered, kept) < 0 ? offered : kept;
    }
}
