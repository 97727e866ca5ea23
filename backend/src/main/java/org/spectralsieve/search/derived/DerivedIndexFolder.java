package org.spectralsieve.search.derived;

import java.io.Closeable;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashMap;
import java.util.Map;
import java.util.Optional;
import java.util.function.Supplier;
import org.apache.lucene.index.DirectoryReader;
import org.apache.lucene.index.IndexWriter;
import org.apache.lucene.index.IndexWriterConfig;
import org.apache.lucene.index.LeafReaderContext;
import org.apache.lucene.store.ByteBuffersDirectory;
import org.apache.lucene.store.Directory;
import org.apache.lucene.store.FSDirectory;
import org.apache.lucene.store.Lock;
import org.apache.lucene.store.LockObtainFailedException;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;

/**
 * The folder a Lucene index derived from the library lives in, and the one writer this process holds on it:
 * opens it, says what its last commit is worth against the database ({@link #judge}), and commits documents
 * together with their {@link IndexStamp}. Index-neutral, so every derived index (words and facets, curve
 * vectors) keeps itself the same way (docs/index-on-disk.md).
 *
 * <p>The index is derived, never the truth: whatever cannot be trusted is rebuilt, never answered from. A
 * folder that cannot be opened or read (a corrupt or too old file, a missing one) is emptied and rebuilt. When
 * another process holds the folder's write lock, this process keeps its own index in memory instead, rebuilt
 * from the database, and says so in the log; so does a process given no folder ({@code path} null).
 *
 * <p>Not thread-safe: the owner calls it under its own building lock. Readers opened from it may be used by any
 * thread.
 */
public final class DerivedIndexFolder implements Closeable {

    private static final Logger LOG = LoggerFactory.getLogger(DerivedIndexFolder.class);

    private final String name;
    private final Path path;
    private final Supplier<IndexWriterConfig> config;
    private Directory directory;
    private IndexWriter writer;
    private IndexStamp committed; // null: nothing usable committed
    private String unusable = "no index built yet";
    private boolean inMemory;

    private DerivedIndexFolder(String name, Path path, Supplier<IndexWriterConfig> config) {
        this.name = name;
        this.path = path;
        this.config = config;
    }

    /**
     * Opens the index at {@code path} (null: in memory), checking every file's checksum once, so that a
     * damaged file is found now rather than by a query.
     *
     * @param name   what the log calls it ("text index")
     * @param config a new writer configuration each call (the analyzer and merge settings of the index)
     */
    public static DerivedIndexFolder open(String name, Path path, Supplier<IndexWriterConfig> config) {
        DerivedIndexFolder folder = new DerivedIndexFolder(name, path, config);
        folder.openWriter();
        return folder;
    }

    private void openWriter() {
        if (path == null) {
            useMemory(null);
            return;
        }
        try {
            Files.createDirectories(path);
            directory = FSDirectory.open(path);
        } catch (IOException | RuntimeException e) {
            useMemory("its folder " + path + " cannot be opened (" + e + ")");
            return;
        }
        try {
            writer = new IndexWriter(directory, config(IndexWriterConfig.OpenMode.CREATE_OR_APPEND));
        } catch (LockObtainFailedException held) {
            closeDirectory();
            useMemory("its folder " + path + " is in use by another process (the write lock is held)");
            return;
        } catch (IOException | RuntimeException unreadable) {
            // a commit point that cannot be read (CorruptIndexException, IndexFormatTooOldException, a missing file)
            emptyAndCreate("unreadable (" + unreadable + ")");
            return;
        }
        try {
            committed = readStamp().orElse(null);
            if (committed == null) {
                unusable = "it has no stamp (a new folder, or an index older than the stamp)";
            }
            verifyChecksums();
        } catch (IOException | RuntimeException damaged) {
            committed = null;
            rollbackQuietly();
            emptyAndCreate("damaged (" + damaged + ")");
        }
    }

    /** Reads every file of the last commit through (checksums), once on open. */
    private void verifyChecksums() throws IOException {
        try (DirectoryReader reader = DirectoryReader.open(writer)) {
            for (LeafReaderContext leaf : reader.leaves()) {
                leaf.reader().checkIntegrity();
            }
        }
    }

    private void emptyAndCreate(String why) {
        unusable = why;
        committed = null;
        try (Lock lock = directory.obtainLock(IndexWriter.WRITE_LOCK_NAME)) {
            for (String file : directory.listAll()) {
                if (!file.equals(IndexWriter.WRITE_LOCK_NAME)) {
                    directory.deleteFile(file);
                }
            }
        } catch (LockObtainFailedException held) {
            closeDirectory();
            useMemory("its folder " + path + " was " + why + " and is now in use by another process");
            return;
        } catch (IOException | RuntimeException e) {
            closeDirectory();
            useMemory("its folder " + path + " was " + why + " and could not be emptied (" + e + ")");
            return;
        }
        try {
            writer = new IndexWriter(directory, config(IndexWriterConfig.OpenMode.CREATE));
        } catch (IOException | RuntimeException e) {
            closeDirectory();
            useMemory("its folder " + path + " was " + why + " and a new index could not be started there (" + e + ")");
        }
    }

    private void useMemory(String why) {
        if (why != null) {
            LOG.warn("The {} is kept in memory for this process and rebuilt from the database: {}.", name, why);
        }
        inMemory = true;
        committed = null;
        directory = new ByteBuffersDirectory();
        try {
            writer = new IndexWriter(directory, config(IndexWriterConfig.OpenMode.CREATE));
        } catch (IOException e) {
            throw new IllegalStateException("an in-memory " + name + " could not be started", e);
        }
    }

    private IndexWriterConfig config(IndexWriterConfig.OpenMode mode) {
        return config.get().setOpenMode(mode).setCommitOnClose(false);
    }

    private Optional<IndexStamp> readStamp() {
        Map<String, String> data = new HashMap<>();
        Iterable<Map.Entry<String, String>> live = writer.getLiveCommitData();
        if (live != null) {
            live.forEach(e -> data.put(e.getKey(), e.getValue()));
        }
        return IndexStamp.of(data);
    }

    /** The stamp of the last commit, empty when nothing usable is committed. */
    public Optional<IndexStamp> committed() {
        return Optional.ofNullable(committed);
    }

    /** Whether this process keeps the index in memory (no folder set, or the folder unusable or in use). */
    public boolean inMemory() {
        return inMemory;
    }

    /**
     * What the last commit is worth for the database with identity {@code libraryId} standing at
     * {@code generation}, for an index whose current layout is {@code schemaVersion}.
     */
    public IndexJudgement judge(String libraryId, int schemaVersion, long generation) {
        if (committed == null) {
            return new IndexJudgement(IndexJudgement.Verdict.REBUILD, unusable);
        }
        if (!committed.libraryId().equals(libraryId)) {
            return new IndexJudgement(IndexJudgement.Verdict.REBUILD,
                    "it was built from another database (library " + committed.libraryId() + ", this is " + libraryId + ")");
        }
        if (committed.schemaVersion() != schemaVersion) {
            return new IndexJudgement(IndexJudgement.Verdict.REBUILD,
                    "its fields are of schema " + committed.schemaVersion() + ", this program's are " + schemaVersion);
        }
        if (committed.generation() > generation) {
            return new IndexJudgement(IndexJudgement.Verdict.REBUILD, "it is at generation " + committed.generation()
                    + ", newer than the database's " + generation + " (a database put back from an older copy)");
        }
        if (committed.generation() == generation) {
            return new IndexJudgement(IndexJudgement.Verdict.FRESH, "at generation " + generation);
        }
        return new IndexJudgement(IndexJudgement.Verdict.BEHIND,
                "at generation " + committed.generation() + ", the database at " + generation);
    }

    /** The writer: add and delete documents, then {@link #commit}. Uncommitted changes are seen by nobody. */
    public IndexWriter writer() {
        return writer;
    }

    /**
     * Commits the writer's changes with the stamp, as one Lucene commit: after a crash the folder holds either
     * the documents and the new stamp, or neither.
     */
    public void commit(IndexStamp stamp) throws IOException {
        writer.setLiveCommitData(stamp.userData().entrySet());
        writer.commit();
        committed = stamp;
    }

    /**
     * Throws away every uncommitted change (a failed update) and forgets the last commit, so that the next
     * {@link #judge} asks for a rebuild. The writer is reopened on the same folder (or in memory, when the folder
     * was taken meanwhile).
     */
    public void discard(String why) {
        rollbackQuietly();
        committed = null;
        if (inMemory) {
            useMemory(null);
        } else {
            openWriter();
            committed = null;
        }
        unusable = why;
    }

    /**
     * Moves this process's index to memory after the folder failed a write (a full disk, a read-only folder):
     * the query is still answered, from a rebuild.
     */
    public void abandonFolder(String why) {
        rollbackQuietly();
        closeDirectory();
        useMemory("the folder " + path + " failed (" + why + ")");
        unusable = why;
    }

    /** A reader of what is committed now (the caller commits before opening). */
    public DirectoryReader openReader() throws IOException {
        return DirectoryReader.open(writer);
    }

    private void rollbackQuietly() {
        if (writer != null) {
            try {
                writer.rollback();
            } catch (IOException | RuntimeException ignored) {
                // the writer is closed either way; the folder's last commit is untouched
            }
            writer = null;
        }
    }

    private void closeDirectory() {
        if (directory != null) {
            try {
                directory.close();
            } catch (IOException ignored) {
                // nothing of it is used any more
            }
        }
    }

    /** Closes the writer without committing (nothing is pending outside {@link #commit}) and frees the lock. */
    @Override
    public void close() {
        rollbackQuietly();
        closeDirectory();
    }
}
