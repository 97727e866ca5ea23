package org.spectralsieve.store;

import java.util.List;
import org.spectralsieve.requirement.Standing;

/**
 * @param hits             the best materials by the store's model, as many as asked plus every other whose
 *                         store result could, within the store model's error, reach the last of them
 *                         (docs/store.md, "The store's error at the cut"); the exact judgement ranks and cuts them
 * @param evaluatedSamples samples the requirement was evaluated on (after class and geometry filters)
 * @param refinedSamples   of those, how many needed the full evaluation of every probe (the rest were
 *                         ruled out by the bound from their point probes)
 * @param floorStanding    the least group the limit-th material's exact result was assumed to reach when the hits
 *                         were chosen; null when fewer materials than asked were found (every one is a hit)
 * @param floorMargin      with it, the least margin assumed (NaN: none)
 */
public record StoreResult(List<StoreHit> hits, int evaluatedSamples, int refinedSamples, Standing floorStanding,
                          double floorMargin) {

    public StoreResult {
        hits = List.copyOf(hits);
    }

    /**
     * Whether the exact limit-th row is at least the assumed floor: then no material left out can rank above it
     * (its exact margin lies below the floor's). When not, the hits may miss a material: judge every sample.
     */
    public boolean exactCutHolds(Standing standing, double margin) {
        if (floorStanding == null || standing.ordinal() < floorStanding.ordinal()) {
            return true;
        }
        return standing == floorStanding && (Double.isNaN(floorMargin) || margin >= floorMargin);
    }
}
