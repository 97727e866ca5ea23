package org.spectralsieve.store;

import java.util.List;

/**
 * @param hits             the best materials by the store's model, as many as asked plus any tied with the
 *                         last of them (the exact ranking breaks such ties by confidence, which the store
 *                         does not see)
 * @param evaluatedSamples samples the requirement was evaluated on (after class and geometry filters)
 * @param refinedSamples   of those, how many needed the full evaluation of every probe (the rest were
 *                         ruled out by the bound from their point probes)
 */
public record StoreResult(List<StoreHit> hits, int evaluatedSamples, int refinedSamples) {

    public StoreResult {
        hits = List.copyOf(hits);
    }
}
