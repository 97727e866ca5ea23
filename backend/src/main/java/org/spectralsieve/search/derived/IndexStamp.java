package org.spectralsieve.search.derived;

import java.util.Map;
import java.util.Optional;

/**
 * What a commit of an index derived from the library says it holds, written into the commit's user data in
 * the same commit as the documents (so a commit has both or neither): the library's change counter it was
 * built at, which database it was built from, and the index's schema version.
 *
 * @param generation    the change counter ({@code library.LibraryGeneration}) the documents are at least as new as
 * @param libraryId     the database's identity ({@code library.LibraryIdentity}): two databases can stand at the
 *                      same counter
 * @param schemaVersion the index's field layout, raised by its schema class whenever a field changes
 */
public record IndexStamp(long generation, String libraryId, int schemaVersion) {

    static final String GENERATION = "sieve.library.generation";
    static final String LIBRARY = "sieve.library.id";
    static final String SCHEMA = "sieve.index.schema";

    public IndexStamp {
        if (generation < 0) {
            throw new IllegalArgumentException("generation must not be negative, got " + generation);
        }
        if (libraryId == null || libraryId.isBlank()) {
            throw new IllegalArgumentException("a library id is required");
        }
    }

    /** The commit user data this stamp is written as. */
    public Map<String, String> userData() {
        return Map.of(GENERATION, Long.toString(generation), LIBRARY, libraryId, SCHEMA, Integer.toString(schemaVersion));
    }

    /** The stamp in a commit's user data, or empty when it has none or a part cannot be read (then: rebuild). */
    static Optional<IndexStamp> of(Map<String, String> userData) {
        String generation = userData.get(GENERATION);
        String library = userData.get(LIBRARY);
        String schema = userData.get(SCHEMA);
        if (generation == null || library == null || schema == null) {
            return Optional.empty();
        }
        try {
            return Optional.of(new IndexStamp(Long.parseLong(generation), library, Integer.parseInt(schema)));
        } catch (IllegalArgumentException unreadable) {
            return Optional.empty();
        }
    }
}
