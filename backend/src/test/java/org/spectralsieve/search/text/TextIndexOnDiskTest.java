package org.spectralsieve.search.text;

import static org.assertj.core.api.Assertions.assertThat;
import static org.spectralsieve.library.db.Tables.MATERIAL;

import java.io.IOException;
import java.io.RandomAccessFile;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Random;
import java.util.UUID;
import java.util.stream.Stream;
import org.apache.lucene.document.Document;
import org.apache.lucene.document.StoredField;
import org.apache.lucene.index.IndexWriter;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.spectralsieve.library.LibraryChanges;
import org.spectralsieve.library.LibraryGeneration;
import org.spectralsieve.search.derived.DerivedIndexFolder;
import org.spectralsieve.search.derived.IndexStamp;

/**
 * The text index kept in a folder is derived, never the truth (docs/index-on-disk.md): whatever state the
 * folder is found in — missing, damaged, from another database, of another schema, behind, left by a writer
 * that never committed — the answers are those of a fresh rebuild from the database, which is the reference
 * every comparison here uses (no expected answer is written by hand; LibraryTextSearchTest checks the answers
 * themselves).
 */
class TextIndexOnDiskTest {

    @TempDir
    Path work;

    private Path folder;
    private TextIndexFixture library;
    private final List<LibraryTextSearch.Refresh> refreshes = new ArrayList<>();
    private final List<LibraryTextSearch> opened = new ArrayList<>();

    @BeforeEach
    void storeCorpus() {
        folder = work.resolve("index");
        library = new TextIndexFixture(TextIndexFixture.migrated("jdbc:h2:mem:" + UUID.randomUUID() + ";DB_CLOSE_DELAY=-1"));
        library.storeCorpus();
    }

    @AfterEach
    void closeAll() {
        opened.forEach(LibraryTextSearch::close);
    }

    private LibraryTextSearch onDisk(TextIndexFixture of) {
        LibraryTextSearch search = new LibraryTextSearch(of.library(), folder, refreshes::add);
        opened.add(search);
        return search;
    }

    /** Opens the folder, answers every query, closes it again (as a process that starts, serves and stops). */
    private List<String> answersOfARun(TextIndexFixture of) {
        LibraryTextSearch search = onDisk(of);
        List<String> answers = TextIndexFixture.answers(search);
        search.close();
        return answers;
    }

    private LibraryTextSearch.Refresh lastRefresh() {
        return refreshes.get(refreshes.size() - 1);
    }

    @Test
    void aMissingIndexIsBuiltAndAFreshOneIsOpenedWithoutRebuilding() {
        assertThat(answersOfARun(library)).isEqualTo(library.freshAnswers());
        assertThat(refreshes).extracting(LibraryTextSearch.Refresh::how).containsExactly(LibraryTextSearch.How.REBUILT);
        assertThat(folder).isDirectoryContaining(p -> p.getFileName().toString().startsWith("segments_"));

        assertThat(answersOfARun(library)).isEqualTo(library.freshAnswers());
        assertThat(lastRefresh().how()).isEqualTo(LibraryTextSearch.How.OPENED);
    }

    @Test
    void aDeletedFolderIsRebuilt() throws IOException {
        answersOfARun(library);
        deleteRecursively(folder);

        assertThat(answersOfARun(library)).isEqualTo(library.freshAnswers());
        assertThat(lastRefresh().how()).isEqualTo(LibraryTextSearch.How.REBUILT);
    }

    @Test
    void aSegmentFileWithOverwrittenBytesIsRebuiltNotAnswered() throws IOException {
        answersOfARun(library);
        Path segment = largestSegmentFile();
        overwriteMiddle(segment);

        assertThat(answersOfARun(library)).isEqualTo(library.freshAnswers());
        assertThat(lastRefresh().how()).isEqualTo(LibraryTextSearch.How.REBUILT);
        assertThat(lastRefresh().why()).contains("damaged");
    }

    @Test
    void anUnreadableCommitPointIsRebuilt() throws IOException {
        answersOfARun(library);
        try (Stream<Path> files = Files.list(folder)) {
            Path commitPoint = files.filter(p -> p.getFileName().toString().startsWith("segments_")).findFirst().orElseThrow();
            Files.write(commitPoint, new byte[] {1, 2, 3, 4, 5, 6, 7, 8});
        }

        assertThat(answersOfARun(library)).isEqualTo(library.freshAnswers());
        assertThat(lastRefresh().how()).isEqualTo(LibraryTextSearch.How.REBUILT);
        assertThat(lastRefresh().why()).contains("unreadable");
    }

    @Test
    void anIndexOfAnotherDatabaseAtTheSameGenerationIsRebuilt() {
        answersOfARun(library);
        // a second database with the same history of writes stands at the same counter, one name differs
        TextIndexFixture other = new TextIndexFixture(
                TextIndexFixture.migrated("jdbc:h2:mem:" + UUID.randomUUID() + ";DB_CLOSE_DELAY=-1"));
        other.storeCorpus();
        other.db().update(MATERIAL).set(MATERIAL.NAME, "Fernhollow acrylic offcut").where(MATERIAL.ID.eq(1L)).execute();
        assertThat(other.library().generation()).isEqualTo(library.library().generation());

        List<String> answers = answersOfARun(other);

        assertThat(lastRefresh().how()).isEqualTo(LibraryTextSearch.How.REBUILT);
        assertThat(lastRefresh().why()).contains("another database");
        assertThat(answers).isEqualTo(other.freshAnswers()).isNotEqualTo(library.freshAnswers());
    }

    @Test
    void anIndexOfAnotherSchemaVersionIsRebuilt() throws IOException {
        long generation = library.library().generation();
        try (DerivedIndexFolder old = DerivedIndexFolder.open("text index", folder, LibraryTextIndex::writerConfig)) {
            Document stale = new Document();
            stale.add(new StoredField("id", 1L)); // an older layout: a document the present schema cannot read
            old.writer().addDocument(stale);
            old.commit(new IndexStamp(generation, library.library().libraryId(), LibraryIndexSchema.VERSION - 1));
        }

        assertThat(answersOfARun(library)).isEqualTo(library.freshAnswers());
        assertThat(lastRefresh().how()).isEqualTo(LibraryTextSearch.How.REBUILT);
        assertThat(lastRefresh().why()).contains("schema");
    }

    @Test
    void anIndexNewerThanTheDatabaseIsRebuilt() throws IOException {
        try (DerivedIndexFolder ahead = DerivedIndexFolder.open("text index", folder, LibraryTextIndex::writerConfig)) {
            ahead.commit(new IndexStamp(library.library().generation() + 5, library.library().libraryId(),
                    LibraryIndexSchema.VERSION));
        }

        assertThat(answersOfARun(library)).isEqualTo(library.freshAnswers());
        assertThat(lastRefresh().why()).contains("newer than the database");
    }

    @Test
    void aStaleIndexIsUpdatedFromTheChangeLogAtTheNextStart() {
        answersOfARun(library);
        library.randomChange(new Random(1)); // while no process holds the index: the command line, say
        library.randomChange(new Random(2));

        assertThat(answersOfARun(library)).isEqualTo(library.freshAnswers());
        assertThat(lastRefresh().how()).isEqualTo(LibraryTextSearch.How.UPDATED);
        assertThat(lastRefresh().generation()).isEqualTo(library.library().generation());
    }

    @Test
    void aChangeTheLogDoesNotNameIsCaughtByARebuild() {
        answersOfARun(library);
        // a write that raises the counter without recording what it changed (as a backup restore does)
        library.db().transaction(tx -> {
            tx.dsl().update(MATERIAL).set(MATERIAL.NAME, "Fernhollow acrylic offcut").where(MATERIAL.ID.eq(1L)).execute();
            LibraryGeneration.bump(tx.dsl());
        });

        List<String> answers = answersOfARun(library);

        assertThat(lastRefresh().how()).isEqualTo(LibraryTextSearch.How.REBUILT);
        assertThat(lastRefresh().why()).contains("change log");
        assertThat(answers).isEqualTo(library.freshAnswers());
        assertThat(String.join("\n", answers)).contains("Fernhollow acrylic offcut");
    }

    @Test
    void anIndexFurtherBehindThanTheLogRingIsRebuilt() {
        long now = library.library().generation();
        assertThat(library.library().materialsChanged(now - 2, now)).isPresent();
        assertThat(library.library().materialsChanged(now - LibraryChanges.RING - 1, now)).isEmpty();
    }

    @Test
    void eachKindOfChangeIsUpdatedInPlaceAndAnswersAsAFreshRebuild() {
        LibraryTextSearch search = onDisk(library);
        TextIndexFixture.answers(search);
        Random random = new Random(12);
        List<String> done = new ArrayList<>();
        for (int i = 0; i < 40; i++) {
            String change = library.randomChange(random);
            done.add(change);
            assertThat(TextIndexFixture.answers(search)).as("after %s", done).isEqualTo(library.freshAnswers());
            if (!change.equals("nothing")) {
                assertThat(lastRefresh().how()).as("after %s", change).isEqualTo(LibraryTextSearch.How.UPDATED);
            }
        }
        // every kind of change the fixture makes came up at least once
        assertThat(done).anyMatch(d -> d.startsWith("new material")).anyMatch(d -> d.startsWith("import into"))
                .anyMatch(d -> d.startsWith("retire material")).anyMatch(d -> d.startsWith("retire sample"))
                .anyMatch(d -> d.startsWith("restore material")).anyMatch(d -> d.startsWith("revise sample"))
                .anyMatch(d -> d.startsWith("revise material"));
    }

    /**
     * A process killed in the middle of an update, in process: its uncommitted segment files (flushed, and a
     * commit prepared but not finished, with a new stamp) are copied as they lie on disk while the writer
     * still holds the folder, then the copy is opened as the next start would open the folder.
     */
    @Test
    void anUpdateThatNeverCommittedLeavesTheLastCommitWhichIsThenBroughtUpToDate() throws IOException {
        answersOfARun(library);
        IndexStamp before;
        try (DerivedIndexFolder held = DerivedIndexFolder.open("text index", folder, LibraryTextIndex::writerConfig)) {
            before = held.committed().orElseThrow();
            IndexWriter writer = held.writer();
            writer.deleteAll();
            Document junk = new Document();
            junk.add(new StoredField("id", 999L));
            writer.addDocument(junk);
            writer.flush();
            writer.setLiveCommitData(new IndexStamp(before.generation() + 100, before.libraryId(),
                    LibraryIndexSchema.VERSION).userData().entrySet());
            writer.prepareCommit(); // pending_segments written, never renamed: the kill came here
            copyFolder(folder, work.resolve("crashed"));
            writer.rollback();
        }
        folder = work.resolve("crashed");
        library.randomChange(new Random(3));

        assertThat(answersOfARun(library)).isEqualTo(library.freshAnswers());
        assertThat(lastRefresh().how()).isEqualTo(LibraryTextSearch.How.UPDATED);
    }

    @Test
    void aFolderHeldByAnotherProcessIsLeftAloneAndEachSeesTheOthersWrites() {
        LibraryTextSearch first = onDisk(library);
        TextIndexFixture.answers(first);
        // another process on the same database: its own repository, its own search, the same folder
        TextIndexFixture otherProcess = new TextIndexFixture(library.dataSource());
        LibraryTextSearch second = onDisk(otherProcess);

        assertThat(TextIndexFixture.answers(second)).isEqualTo(library.freshAnswers());
        assertThat(second.inMemory()).isTrue();
        assertThat(first.inMemory()).isFalse();

        otherProcess.randomChange(new Random(4));
        assertThat(TextIndexFixture.answers(first)).isEqualTo(library.freshAnswers());
        library.randomChange(new Random(5));
        assertThat(TextIndexFixture.answers(second)).isEqualTo(library.freshAnswers());
        assertThat(TextIndexFixture.answers(first)).isEqualTo(TextIndexFixture.answers(second));
    }

    private Path largestSegmentFile() throws IOException {
        try (Stream<Path> files = Files.list(folder)) {
            return files.filter(p -> !p.getFileName().toString().startsWith("segments_"))
                    .filter(p -> !p.getFileName().toString().equals(IndexWriter.WRITE_LOCK_NAME))
                    .max(Comparator.comparingLong(p -> p.toFile().length())).orElseThrow();
        }
    }

    private static void overwriteMiddle(Path file) throws IOException {
        try (RandomAccessFile f = new RandomAccessFile(file.toFile(), "rw")) {
            long at = f.length() / 2;
            f.seek(at);
            byte[] junk = new byte[Math.min(64, (int) (f.length() - at))];
            java.util.Arrays.fill(junk, (byte) 0x5A);
            f.write(junk);
        }
    }

    private static void copyFolder(Path from, Path to) throws IOException {
        Files.createDirectories(to);
        try (Stream<Path> files = Files.list(from)) {
            for (Path p : files.toList()) {
                Files.copy(p, to.resolve(p.getFileName()));
            }
        }
    }

    private static void deleteRecursively(Path dir) throws IOException {
        try (Stream<Path> all = Files.walk(dir)) {
            for (Path p : all.sorted(Comparator.reverseOrder()).toList()) {
                Files.delete(p);
            }
        }
    }
}
