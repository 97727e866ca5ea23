package org.spectralsieve.search.text;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Path;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.concurrent.atomic.AtomicReference;
import java.util.function.Consumer;
import java.util.function.LongConsumer;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.LibraryGeneration;
import org.spectralsieve.library.Material;
import org.spectralsieve.library.SampleInfo;
import org.spectralsieve.search.derived.DerivedIndexFolder;
import org.spectralsieve.search.derived.IndexJudgement;
import org.spectralsieve.search.derived.IndexStamp;
import org.spectralsieve.spectrum.Curve;

/**
 * Text and facet search over the library. The index is derived, never the truth: before each query the
 * library's change counter ({@link LibraryGeneration}) is read — one primary-key read — and an index at an
 * older number is brought up to date from the database first, so a change committed by any process (this
 * server, the command line, another node) before the query is in its answer. The same rule as the spectral
 * store's (docs/freshness.md).
 *
 * <p>The index lives in a folder ({@code sieve.index.dir}) or, when none is given or the folder is another
 * process's, in memory. It is kept by {@link DerivedIndexFolder}: on the first query after start and before
 * each query it is judged against the database — missing, unreadable, from another database, of another
 * schema or newer than the database: rebuilt whole; behind: the materials the change log names for the
 * missing generations are re-indexed and committed with the new number in one commit, or, when the log cannot
 * name them all, rebuilt (docs/index-on-disk.md).
 */
public class LibraryTextSearch implements AutoCloseable {

    private static final Logger LOG = LoggerFactory.getLogger(LibraryTextSearch.class);

    /** How a new view came about: a whole rebuild, an update by the change log, or the folder's commit as found. */
    enum How { REBUILT, UPDATED, OPENED }

    /** Told to the listener once per new view (tests count and tell rebuilds from updates with it). */
    record Refresh(How how, long generation, String why) {
    }

    private final JooqLibraryRepository library;
    private final Path folder;
    private final AtomicReference<LibraryTextIndex> index = new AtomicReference<>();
    /** One refresh at a time: queries that find the index stale wait for one, not start many. */
    private final Object building = new Object();
    private final Consumer<Refresh> onRefresh;
    private DerivedIndexFolder store; // guarded by building; opened by the first query
    private String libraryId; // guarded by building
    private boolean closed; // guarded by building

    /** An index kept in memory only. */
    public LibraryTextSearch(JooqLibraryRepository library) {
        this(library, (Path) null);
    }

    /** An index kept in {@code folder}, or in memory when it is null. */
    public LibraryTextSearch(JooqLibraryRepository library, Path folder) {
        this(library, folder, refresh -> { });
    }

    /** In memory; {@code onBuild} is called with the generation of each new view (rebuilt or updated). */
    LibraryTextSearch(JooqLibraryRepository library, LongConsumer onBuild) {
        this(library, null, refresh -> onBuild.accept(refresh.generation()));
    }

    LibraryTextSearch(JooqLibraryRepository library, Path folder, Consumer<Refresh> onRefresh) {
        this.library = library;
        this.folder = folder;
        this.onRefresh = onRefresh;
    }

    public LibraryAnswer search(LibraryQuery query) {
        LibraryTextIndex view = acquire();
        try {
            return view.search(query);
        } catch (UncheckedIOException unreadable) {
            // a file damaged after it was checked at start: never answer from it; rebuild and ask again once
            LOG.warn("The text index could not be read ({}); it is rebuilt from the database.", unreadable.getMessage());
            forget(view, "a query could not read it (" + unreadable.getMessage() + ")");
        } finally {
            view.release();
        }
        LibraryTextIndex rebuilt = acquire();
        try {
            return rebuilt.search(query);
        } finally {
            rebuilt.release();
        }
    }

    /** The ids of every material the query's words and facet values admit, however many (its limit is ignored). */
    public Set<Long> admitted(LibraryQuery query) {
        LibraryTextIndex view = acquire();
        try {
            return view.admitted(query);
        } finally {
            view.release();
        }
    }

    /** A view at least as new as the counter read now, with one reference taken for the caller. */
    private LibraryTextIndex acquire() {
        long generation = library.generation();
        while (true) {
            LibraryTextIndex built = index.get();
            if (built != null && built.generation() >= generation) {
                if (built.tryAcquire()) {
                    return built;
                }
                continue; // replaced and closed between the read and the reference: read again
            }
            synchronized (building) {
                built = index.get();
                if (built == null || built.generation() < generation) {
                    refresh(); // else refreshed by another query while this one waited
                }
            }
        }
    }

    /** Brings the index to the counter read now and installs a view of it. Called holding {@link #building}. */
    private void refresh() {
        if (closed) {
            throw new IllegalStateException("the text search is closed");
        }
        if (store == null) {
            store = DerivedIndexFolder.open("text index", folder, LibraryTextIndex::writerConfig);
            libraryId = library.libraryId();
        }
        // the counter is read before the tables: a write committing meanwhile is either in what is read or
        // announced by a larger number at the next query (one update too many, never a change missed)
        long readAt = library.generation();
        IndexStamp stamp = new IndexStamp(readAt, libraryId, LibraryIndexSchema.VERSION);
        IndexJudgement judgement = store.judge(libraryId, LibraryIndexSchema.VERSION, readAt);
        Refresh refresh = switch (judgement.verdict()) {
            case FRESH -> new Refresh(How.OPENED, readAt, judgement.why());
            case BEHIND -> updateOrRebuild(stamp);
            case REBUILD -> rebuild(stamp, judgement.why());
        };
        install(refresh);
    }

    private Refresh updateOrRebuild(IndexStamp stamp) {
        long from = store.committed().orElseThrow().generation();
        Optional<Set<Long>> changed = library.materialsChanged(from, stamp.generation());
        if (changed.isEmpty()) {
            return rebuild(stamp, "the change log does not name every change after generation " + from);
        }
        try {
            LibraryTextIndex.replace(store.writer(), changed.get(), withSummaries(library.findMaterialsInUse(changed.get())));
            store.commit(stamp);
            return new Refresh(How.UPDATED, stamp.generation(), changed.get().size() + " material(s) re-indexed");
        } catch (IOException | RuntimeException e) {
            store.discard("an update failed (" + e + ")");
            return rebuild(stamp, "an update failed (" + e + ")");
        }
    }

    private Refresh rebuild(IndexStamp stamp, String why) {
        LOG.info("Rebuilding the text index from the database at generation {}: {}.", stamp.generation(), why);
        List<IndexedMaterial> materials = IndexedMaterial.of(library.findMaterials(null, null), library.findAllCurves());
        try {
            writeAll(materials, stamp);
        } catch (IOException | RuntimeException failed) {
            if (store.inMemory()) {
                throw new IllegalStateException("the in-memory text index could not be built", failed);
            }
            store.abandonFolder(failed.toString()); // a full disk or a read-only folder must not fail the query
            try {
                writeAll(materials, stamp);
            } catch (IOException e) {
                throw new UncheckedIOException("the in-memory text index could not be built", e);
            }
        }
        return new Refresh(How.REBUILT, stamp.generation(), why);
    }

    /**
     * The changed materials with the spectral summaries of their samples' curves. A curve that cannot be read
     * is left out as {@link JooqLibraryRepository#findAllCurves} leaves it out of a rebuild, so an update and
     * a rebuild index the same.
     */
    private List<IndexedMaterial> withSummaries(List<Material> materials) {
        Map<Long, Curve> curves = new HashMap<>();
        for (Material m : materials) {
            for (SampleInfo sample : m.samples()) {
                try {
                    library.findCurve(sample.id()).ifPresent(curve -> curves.put(sample.id(), curve));
                } catch (RuntimeException unreadable) {
                    LOG.warn("the curve of sample {} cannot be read and adds no spectral facet: {}", sample.id(),
                            unreadable.getMessage());
                }
            }
        }
        return IndexedMaterial.of(materials, curves);
    }

    private void writeAll(List<IndexedMaterial> materials, IndexStamp stamp) throws IOException {
        store.writer().deleteAll();
        LibraryTextIndex.addAll(store.writer(), materials);
        store.commit(stamp);
    }

    private void install(Refresh refresh) {
        LibraryTextIndex fresh;
        try {
            fresh = new LibraryTextIndex(store.openReader(), refresh.generation());
        } catch (IOException e) {
            throw new UncheckedIOException("the text index just committed could not be opened", e);
        }
        onRefresh.accept(refresh);
        LibraryTextIndex old = index.getAndSet(fresh); // only the refresher holding the lock installs
        if (old != null) {
            old.release();
        }
    }

    private void forget(LibraryTextIndex unreadable, String why) {
        synchronized (building) {
            if (index.compareAndSet(unreadable, null)) {
                unreadable.release();
                store.discard(why);
            }
        }
    }

    /** Whether this process keeps its index in memory (no folder, or the folder is another process's). */
    boolean inMemory() {
        synchronized (building) {
            return store == null || store.inMemory();
        }
    }

    /** Frees the folder's write lock (the application's shutdown); nothing uncommitted is pending. */
    @Override
    public void close() {
        synchronized (building) {
            closed = true;
            LibraryTextIndex old = index.getAndSet(null);
            if (old != null) {
                old.release();
            }
            if (store != null) {
                store.close();
            }
        }
    }
}
