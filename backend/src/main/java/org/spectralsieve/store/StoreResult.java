package org.spectralsieve.store;

import java.util.List;
import org.spectralsieve.requirement.Standing;

/**
 * @param hits             the best materials by the store's model, as many as asked plus any tied with the
 *                         last of them (the exact ranking breaks such ties by confidence, which the store
 *                         does not see)
 * @param evaluatedSamples samples the requirement was evaluated on (after class and geometry filters)
 * @param refinedSamples   of those, how many needed the full evaluation of every probe (the rest were
 *                         ruled out by the bound from their point probes) before any {@link HandOver}
 * @param handOver         the materials beyond the hits that could still reach a given exact result
 * @param sampleReach      how good each curve's exact result can be, for judging a picked material's samples
 *                         best first ({@link SampleReach})
 */
public record StoreResult(List<StoreHit> hits, int evaluatedSamples, int refinedSamples, HandOver handOver,
                          SampleReach sampleReach) {

    public StoreResult {
        hits = List.copyOf(hits);
    }

    /**
     * The store's margins are not the exact evaluator's (codes rounded; multiple reflections left out of its
     * thickness model), so two materials nearer than that error can swap at the shortlist's last row. The caller
     * judges the hits exactly and asks, with its {@code limit}-th exact row, for every further material whose
     * store result could reach it within the error (docs/store.md, "The store's error at the cut"). Judging those
     * too, the caller's top {@code limit} equals judging every sample. Called once, from one thread.
     */
    public interface HandOver {

        /**
         * @param standing the group of the exact {@code limit}-th row
         * @param margin   its worst margin in decades (NaN: none)
         * @return materials not among the hits (nor an earlier answer) whose store result, raised by the store
         *         model's error, reaches that row; in the store's material order
         */
        List<StoreHit> reaching(Standing standing, double margin);
    }
}
