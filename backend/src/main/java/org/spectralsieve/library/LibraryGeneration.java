package org.spectralsieve.library;

import static org.spectralsieve.library.db.Tables.LIBRARY_GENERATION;

import org.jooq.DSLContext;

/**
 * The library's change counter (table {@code library_generation}, one row): every write transaction raises
 * it, and every in-memory copy derived from the library remembers the number it was read at, so that a
 * copy older than the database is noticed with one primary-key read — also when another process wrote
 * (a command-line import while the server runs, another application node on PostgreSQL). See
 * docs/freshness.md. The bare {@link #bump(DSLContext)} records nothing in the change log, so an index kept
 * on disk rebuilds whole after it; the overloads that name the material let it re-index only that one
 * (docs/index-on-disk.md).
 */
public final class LibraryGeneration {

    private static final int ROW = 1;

    private LibraryGeneration() {
    }

    /**
     * Raises the counter. Call it inside the write's own transaction (pass the transaction's context), once
     * or more: the number then moves exactly when the write commits, and not at all when it rolls back.
     * {@code UPDATE … SET n = n + 1} locks the row until commit, so concurrent writers queue on it and each
     * commit leaves a larger number (PostgreSQL re-reads the committed row before adding; H2 waits for the
     * lock). Call it as late in the transaction as convenient: the lock is held from here to the commit.
     */
    public static void bump(DSLContext tx) {
        int rows = tx.update(LIBRARY_GENERATION)
                .set(LIBRARY_GENERATION.N, LIBRARY_GENERATION.N.plus(1L))
                .where(LIBRARY_GENERATION.ID.eq(ROW))
                .execute();
        if (rows != 1) {
            throw new IllegalStateException("library_generation has no row " + ROW + "; the V7 migration puts it there");
        }
    }

    /**
     * Raises the counter (as {@link #bump(DSLContext)}) and records in the change log that this write
     * concerned {@code materialId} ({@link LibraryChanges}), so that indexes derived from the library
     * re-index that material alone. Every write of one material's rows (the material, its samples, curves,
     * files, retirement, revisions) calls this rather than the bare raise.
     *
     * @return the number the write's commit leaves
     */
    public static long bump(DSLContext tx, long materialId) {
        return bumpAndRecord(tx, materialId);
    }

    /**
     * Raises the counter and records that the write changed one sample of {@code materialId} and nothing else of
     * that material: the sample's own rows (added, corrected, retired or restored), not the material's row nor
     * another of its samples. The search store then reads that sample again rather than the whole material
     * (docs/search-under-load.md, ninth pass); a write that changes more calls {@link #bump(DSLContext, long)}.
     *
     * @return the number the write's commit leaves
     */
    public static long bumpConcerningSample(DSLContext tx, long materialId, long sampleId) {
        bump(tx);
        long generation = read(tx);
        LibraryChanges.record(tx, generation, materialId, sampleId);
        return generation;
    }

    /**
     * Raises the counter and records that the write concerned no material (an imported emitter or response):
     * indexes of materials then know they have nothing to redo.
     */
    public static long bumpConcerningNoMaterial(DSLContext tx) {
        return bumpAndRecord(tx, null);
    }

    private static long bumpAndRecord(DSLContext tx, Long materialId) {
        bump(tx);
        long generation = read(tx); // the transaction sees its own raise
        LibraryChanges.record(tx, generation, materialId);
        return generation;
    }

    /** The committed number: one read of one row by its primary key. */
    public static long read(DSLContext db) {
        return db.select(LIBRARY_GENERATION.N).from(LIBRARY_GENERATION).where(LIBRARY_GENERATION.ID.eq(ROW))
                .fetchOptional(LIBRARY_GENERATION.N)
                .orElseThrow(() -> new IllegalStateException("library_generation has no row " + ROW
                        + "; the V7 migration puts it there"));
    }
}
