package org.spectralsieve.search;

import java.util.List;
import java.util.Map;
import java.util.Set;
import org.spectralsieve.library.Material;
import org.spectralsieve.library.SampleInfo;
import org.spectralsieve.library.SampleRescaling;
import org.spectralsieve.requirement.MadeThicknesses;
import org.spectralsieve.store.SpectralStore;

/**
 * The store and the library it was built from, replaced whole so a search never sees half an update.
 *
 * @param generation    the library's change counter read before any table was: the snapshot holds at
 *                      least every change committed up to that number (perhaps some later ones too)
 * @param invalidations {@code SearchService.invalidations} read at the same moment
 * @param curves        the decoded curves the store was built from, as many as the budget holds
 * @param ordered       the materials in the order of the store's rows ({@link MaterialsRead#ORDER})
 * @param unusable      the samples whose stored record fails today's checks ({@link SampleRescaling#unusable}):
 *                      the store holds them at a storable thickness with an assumed index, so no screen's
 *                      proof on them holds for the exact judgement (see {@code BoundedExactSearch.searchExactly})
 * @param made          each material's made thicknesses ({@link SearchService#made}) as formed from these very objects
 * @param index         what searches ask of this store and these materials, formed once when first asked
 */
record Snapshot(SpectralStore store, Map<Long, Material> materials, Map<Long, SampleInfo> samples,
                        long generation, long invalidations, CurveCache curves, List<Material> ordered,
                        Set<Long> unusable, Map<Long, MadeThicknesses> made, SnapshotIndex index) {

    Snapshot(SpectralStore store, Map<Long, Material> materials, Map<Long, SampleInfo> samples,
             long generation, long invalidations, CurveCache curves, List<Material> ordered,
             Set<Long> unusable, Map<Long, MadeThicknesses> made) {
        this(store, materials, samples, generation, invalidations, curves, ordered, unusable, made,
                new SnapshotIndex(store, ordered, made));
    }

    /** Read no earlier than {@code other}: both counters only grow, so a later read has both at least as large. */
    boolean notOlderThan(Snapshot other) {
        return generation >= other.generation && invalidations >= other.invalidations;
    }
}
