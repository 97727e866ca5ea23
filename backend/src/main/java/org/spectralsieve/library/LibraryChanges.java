package org.spectralsieve.library;

import static org.spectralsieve.library.db.Tables.LIBRARY_CHANGE;

import java.util.HashSet;
import java.util.Optional;
import java.util.Set;
import org.jooq.DSLContext;
import org.jooq.Record2;

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
        int slot = Math.floorMod(generation, RING);
        int rows = tx.update(LIBRARY_CHANGE)
                .set(LIBRARY_CHANGE.GENERATION, generation)
                .set(LIBRARY_CHANGE.MATERIAL_ID, materialId)
                .where(LIBRARY_CHANGE.SLOT.eq(slot))
                .execute();
        if (rows == 0) {
            tx.insertInto(LIBRARY_CHANGE)
                    .set(LIBRARY_CHANGE.SLOT, slot)
                    .set(LIBRARY_CHANGE.GENERATION, generation)
                    .set(LIBRARY_CHANGE.MATERIAL_ID, materialId)
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
        if (upTo < after) {
            return Optional.empty();
        }
        if (upTo - after > RING) {
            return Optional.empty();
        }
        Set<Long> generations = new HashSet<>();
        Set<Long> materials = new HashSet<>();
        for (Record2<Long, Long> r : db.select(LIBRARY_CHANGE.GENERATION, LIBRARY_CHANGE.MATERIAL_ID).from(LIBRARY_CHANGE)
                .where(LIBRARY_CHANGE.GENERATION.gt(after)).and(LIBRARY_CHANGE.GENERATION.le(upTo)).fetch()) {
            generations.add(r.value1());
            if (r.value2() != null) {
                materials.add(r.value2());
            }
        }
        return generations.size() == upTo - after ? Optional.of(Set.copyOf(materials)) : Optional.empty();
    }
}
