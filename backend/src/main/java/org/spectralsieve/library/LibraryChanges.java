package org.spectralsieve.library;

import static org.spectralsieve.library.db.Tables.LIBRARY_CHANGE;

import java.util.HashMap;
import java.util.HashSet;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import org.jooq.DSLContext;
import org.jooq.Record3;

/**
 * The change log beside the library's change counter (table {@code library_change}, migration V9): for each
 * raise of the counter, which material the write concerned. An index derived from the library and built at
 * generation g reads the log for g+1..h and re-indexes only those materials instead of everything
 * (docs/index-on-disk.md).
 *
 * <p>The log is a ring of {@link #RING} slots, one per generation (slot = generation modulo the ring), so it
 * stays bounded without ever deleting a row: a slot is overwritten by the change {@link #RING} generations
 * later. An index further behind than that is rebuilt whole, which then costs less than replaying ten
 * thousand changes one material at a time.
 */
public final class LibraryChanges {

    /** Generations kept: an index this far behind is rebuilt rather than updated. */
    public static final int RING = 10_000;

    private LibraryChanges() {
    }

    /**
     * Records that the change raising the counter to {@code generation} concerned {@code materialId} (null: no
     * material, e.g. an imported emitter). Call inside the write's transaction, after the raise: the raise
     * holds the counter's row lock until commit, so no other writer can reach the same slot meanwhile.
     */
    static void record(DSLContext tx, long generation, Long materialId) {
        record(tx, generation, materialId, null);
    }

    /**
     * As {@link #record(DSLContext, long, Long)}, naming also the one sample the write changed ({@code sampleId};
     * null: the material as a whole, several of its samples, or no material). Name a sample only when the write
     * changed that sample's rows and nothing else of the material's: {@link #since} then tells a reader that the
     * material's other samples and its own row are as they were.
     */
    static void record(DSLContext tx, long generation, Long materialId, Long sampleId) {
        int slot = Math.floorMod(generation, RING);
        int rows = tx.update(LIBRARY_CHANGE)
                .set(LIBRARY_CHANGE.GENERATION, generation)
                .set(LIBRARY_CHANGE.MATERIAL_ID, materialId)
                .set(LIBRARY_CHANGE.SAMPLE_ID, sampleId)
                .where(LIBRARY_CHANGE.SLOT.eq(slot))
                .execute();
        if (rows == 0) {
            tx.insertInto(LIBRARY_CHANGE)
                    .set(LIBRARY_CHANGE.SLOT, slot)
                    .set(LIBRARY_CHANGE.GENERATION, generation)
                    .set(LIBRARY_CHANGE.MATERIAL_ID, materialId)
                    .set(LIBRARY_CHANGE.SAMPLE_ID, sampleId)
                    .execute();
        }
    }

    /**
     * The materials the changes after {@code after} up to {@code upTo} concerned, or empty when the log cannot
     * account for every one of those generations (a path that raised the counter without recording, a
     * restore, a slot overwritten since): the caller must then rebuild whole. Read {@code upTo} from the
     * counter first: every change up to it has committed, and its row with it.
     */
    public static Optional<Set<Long>> materialsChanged(DSLContext db, long after, long upTo) {
        return since(db, after, upTo).map(Changes::materials);
    }

    /**
     * What the changes after {@code after} up to {@code upTo} concerned, material by material, or empty when the
     * log cannot account for every one of those generations (as {@link #materialsChanged}).
     */
    public static Optional<Changes> since(DSLContext db, long after, long upTo) {
        if (upTo < after) {
            return Optional.empty();
        }
        if (upTo - after > RING) {
            return Optional.empty();
        }
        Set<Long> generations = new HashSet<>();
        Map<Long, Set<Long>> samples = new HashMap<>();
        Set<Long> whole = new HashSet<>();
        for (Record3<Long, Long, Long> r : db.select(LIBRARY_CHANGE.GENERATION, LIBRARY_CHANGE.MATERIAL_ID,
                        LIBRARY_CHANGE.SAMPLE_ID).from(LIBRARY_CHANGE)
                .where(LIBRARY_CHANGE.GENERATION.gt(after)).and(LIBRARY_CHANGE.GENERATION.le(upTo)).fetch()) {
            generations.add(r.value1());
            if (r.value2() == null) {
                continue;
            }
            if (r.value3() == null) {
                whole.add(r.value2());
            } else {
                samples.computeIfAbsent(r.value2(), m -> new HashSet<>()).add(r.value3());
            }
        }
        if (generations.size() != upTo - after) {
            return Optional.empty();
        }
        samples.keySet().removeAll(whole);
        Map<Long, Set<Long>> named = new HashMap<>();
        samples.forEach((material, ids) -> named.put(material, Set.copyOf(ids)));
        return Optional.of(new Changes(Set.copyOf(whole), Map.copyOf(named)));
    }

    /**
     * What a run of changes concerned.
     *
     * @param wholeMaterials materials changed as a whole (their row, several samples at once, or a write that named no
     *                       sample): read them again entirely
     * @param samplesOnly    for every other changed material, the samples the changes named: nothing else of the
     *                       material changed (its row and its other samples are as they were)
     */
    public record Changes(Set<Long> wholeMaterials, Map<Long, Set<Long>> samplesOnly) {

        /** Every material concerned, however. */
        public Set<Long> materials() {
            Set<Long> all = new HashSet<>(wholeMaterials);
            all.addAll(samplesOnly.keySet());
            return Set.copyOf(all);
        }

        public boolean isEmpty() {
            return wholeMaterials.isEmpty() && samplesOnly.isEmpty();
        }
    }
}
