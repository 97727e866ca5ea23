package org.spectralsieve.store;

import java.util.LinkedHashMap;
import java.util.Map;
import org.spectralsieve.requirement.Standing;
import org.spectralsieve.store.StoreSearch.Keys;

/**
 * How good each sample's exact result can be, from the store alone: the bound inside a material that lets the
 * caller judge a picked material's samples best first and stop once the rest cannot be its row
 * (docs/search-under-load.md, "Sixth pass").
 *
 * <p>The bound of a curve is its store result over every probe, raised by that curve's own error
 * ({@link CutReach#raised}, {@link CutReach#errorOf}): the same per-curve claim the hand-over at the cut already
 * rests on (a material is left out there only when none of its curves, so raised, reaches the exact row), applied
 * to the curves of one material instead of to whole materials. A curve the store does not judge under the
 * requirement (not admitted, no span) has no bound: {@link #NONE}. Results on detection-limit bounds (bounded
 * misses, unverified results) are bounds like the rest since the store holds a reading under the limit as the
 * bound the exact judgement reads (docs/store.md, "The store's error at the cut").
 *
 * <p>One per search ({@link StoreResult#sampleReach()}), used from one thread: its curve model is reused.
 */
public final class SampleReach {

    /** The ceiling of a curve the store says nothing about: every exact result lies below it. */
    public static final int NONE = Integer.MAX_VALUE;

    private final SpectralStore store;
    private final SearchPlan plan;
    private CurveModel model;
    private CutReach reach;

    SampleReach(SpectralStore store, SearchPlan plan) {
        this.store = store;
        this.plan = plan;
    }

    /** Sample id → curve, for every curve stored with the material of {@code curve}, in the store's order. */
    public Map<Long, Integer> curvesOfMaterialOf(int curve) {
        Map<Long, Integer> out = new LinkedHashMap<>();
        for (int c : store.curvesByMaterial()[store.materialIndex(curve)]) {
            out.put(store.sampleId(c), c);
        }
        return out;
    }

    /**
     * The highest result the exact judgement of the curve's sample can have, as an order-preserving key (compare
     * it only with {@link #below} and {@link #cannotMeet}); {@link #NONE} when the store does not judge the curve.
     */
    public int ceiling(int curve) {
        if (!plan.admits(store, curve) || !plan.judged(curve)) {
            return NONE;
        }
        if (model == null) {
            model = new CurveModel(plan, store, false);
            reach = CutReach.of(store, plan);
        }
        StoreSearch.Evaluation stored = model.load(curve).best();
        return CutReach.raised(stored.key(), reach.errorOf(curve));
    }

    /**
     * Whether every exact result under this ceiling ranks strictly below an exact result of this group and worst
     * margin: the key orders (group, margin) as the ranking does, NaN lowest in its group, so a key strictly below
     * is strictly behind in (group, margin) and no tie-break (confidence, sample id) can lift it.
     */
    public static boolean below(int ceiling, Standing standing, double worstMarginDecades) {
        return ceiling != NONE && ceiling < Keys.of(standing, worstMarginDecades);
    }

    /** Whether no exact result under this ceiling meets every clause. */
    public static boolean cannotMeet(int ceiling) {
        return ceiling != NONE && ceiling < Keys.of(Standing.MEETS, Double.NaN);
    }
}
