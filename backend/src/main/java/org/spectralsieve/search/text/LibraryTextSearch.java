package org.spectralsieve.search.text;

import java.util.Set;
import java.util.concurrent.atomic.AtomicReference;
import java.util.function.LongConsumer;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.LibraryGeneration;

/**
 * Text and facet search over the library. The index is derived, never the truth: before each query the
 * library's change counter ({@link LibraryGeneration}) is read — one primary-key read — and an index built
 * at an older number is rebuilt from the database first, so a change committed by any process (this
 * server, the command line, another node) before the query is in its answer. The same rule as the
 * spectral store's (docs/freshness.md).
 */
public class LibraryTextSearch {

    private final JooqLibraryRepository library;
    private final AtomicReference<LibraryTextIndex> index = new AtomicReference<>();
    /** One build at a time: queries that find the index stale wait for one rebuild, not start many. */
    private final Object building = new Object();
    /** Called with each built index's generation (tests count rebuilds with it), else nothing. */
    private final LongConsumer onBuild;

    public LibraryTextSearch(JooqLibraryRepository library) {
        this(library, generation -> { });
    }

    LibraryTextSearch(JooqLibraryRepository library, LongConsumer onBuild) {
        this.library = library;
        this.onBuild = onBuild;
    }

    public LibraryAnswer search(LibraryQuery query) {
        return current().search(query);
    }

    /** The ids of every material the query's words and facet values admit, however many (its limit is ignored). */
    public Set<Long> admitted(LibraryQuery query) {
        return current().admitted(query);
    }

    private LibraryTextIndex current() {
        long generation = library.generation();
        LibraryTextIndex built = index.get();
        if (built != null && built.generation() >= generation) {
            return built;
        }
        synchronized (building) {
            built = index.get();
            if (built != null && built.generation() >= generation) {
                return built; // built by another query while this one waited
            }
            // the counter is read before the tables: a write committing meanwhile is either in what is read
            // or announced by a larger number at the next query (a rebuild too many, never a change missed)
            long readAt = library.generation();
            LibraryTextIndex fresh = LibraryTextIndex.build(
                    IndexedMaterial.of(library.findMaterials(null, null), library.findAllCurves()), readAt);
            onBuild.accept(readAt);
            index.set(fresh); // only the builder holding the lock installs, so never an older over a newer
            return fresh;
        }
    }
}
