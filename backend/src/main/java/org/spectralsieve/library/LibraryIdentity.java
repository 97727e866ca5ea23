package org.spectralsieve.library;

import static org.spectralsieve.library.db.Tables.LIBRARY_IDENTITY;

import java.util.Optional;
import java.util.UUID;
import org.jooq.DSLContext;
import org.jooq.exception.DataAccessException;

/**
 * Which database this is (table {@code library_identity}, migration V9): a random UUID written once by the
 * first process that asks. An index kept on disk records it beside the change counter, because two databases
 * can stand at the same counter (docs/index-on-disk.md); a backup does not carry it, so a restored library is
 * a library of its own.
 */
public final class LibraryIdentity {

    private static final int ROW = 1;

    private LibraryIdentity() {
    }

    /** The identity, made now when no process has made it yet. */
    public static String read(DSLContext db) {
        Optional<String> stored = stored(db);
        if (stored.isPresent()) {
            return stored.get();
        }
        try {
            db.insertInto(LIBRARY_IDENTITY).set(LIBRARY_IDENTITY.ID, ROW)
                    .set(LIBRARY_IDENTITY.UUID, UUID.randomUUID().toString()).execute();
        } catch (DataAccessException anotherProcessWroteItFirst) {
            // the primary key lets one insert win; the winner's value is read below
        }
        return stored(db).orElseThrow(() -> new IllegalStateException("library_identity has no row after writing it"));
    }

    private static Optional<String> stored(DSLContext db) {
        return db.select(LIBRARY_IDENTITY.UUID).from(LIBRARY_IDENTITY).where(LIBRARY_IDENTITY.ID.eq(ROW))
                .fetchOptional(LIBRARY_IDENTITY.UUID);
    }
}
