package org.spectralsieve.search;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.charset.StandardCharsets;
import java.util.List;
import java.util.UUID;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.atomic.AtomicInteger;
import org.flywaydb.core.Flyway;
import org.h2.jdbcx.JdbcDataSource;
import org.jooq.DSLContext;
import org.jooq.SQLDialect;
import org.jooq.impl.DSL;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.spectralsieve.ingest.Checksums;
import org.spectralsieve.library.Geometry;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.MaterialClass;
import org.spectralsieve.library.NewMaterial;
import org.spectralsieve.library.NewSample;
import org.spectralsieve.library.Provenance;
import org.spectralsieve.library.Scaling;
import org.spectralsieve.library.SourceFile;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.requirement.RankedRow;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.RequirementParser;
import org.spectralsieve.spectrum.Curve;

/**
 * The search answers from the library as committed when it starts, whoever wrote it: a second repository
 * on the same database stands for another process (its writes never call this service's invalidate), and
 * a hook pauses a rebuild between reading the library and installing it to let a write land exactly there.
 */
class SearchFreshnessTest {

    /** Every stored sheet passes this (T = 0.55 at 350 nm on the line 0.3 → 0.8): the list names them all. */
    private static final Requirement ANY = RequirementParser.parse("passes over 10% at 350 nm");

    private JooqLibraryRepository library;
    private JooqLibraryRepository otherProcess;
    private final ExecutorService pool = Executors.newSingleThreadExecutor();

    @BeforeEach
    void migrateFreshDatabase() {
        DSLContext db = freshDatabase();
        library = new JooqLibraryRepository(db);
        otherProcess = new JooqLibraryRepository(db);
        store(library, "first sheet", "plastic sheet");
    }

    /** A migrated, empty database per test; {@link PostgresSearchFreshnessTest} gives one on PostgreSQL. */
    DSLContext freshDatabase() {
        JdbcDataSource dataSource = new JdbcDataSource();
        dataSource.setURL("jdbc:h2:mem:" + UUID.randomUUID() + ";DB_CLOSE_DELAY=-1");
        Flyway.configure().dataSource(dataSource).load().migrate();
        return DSL.using(dataSource, SQLDialect.H2);
    }

    @AfterEach
    void stopPool() {
        pool.shutdownNow();
    }

    private static void store(JooqLibraryRepository into, String name, String materialClass) {
        byte[] bytes = ("wavelength_nm,T\n300,0.3\n400,0.8\n# " + name + "\n").getBytes(StandardCharsets.UTF_8);
        SourceFile file = new SourceFile(name + ".csv", "text/csv", "delimited", bytes, Checksums.sha256(bytes));
        Curve curve = Curve.of(new double[] {300, 400}, new double[] {0.3, 0.8}, 1e-3);
        NewSample sample = new NewSample(2, Geometry.REGULAR, Provenance.MEASURED, "", null, "", "", 1e-3, curve,
                file.fileName(), file.sha256());
        NewMaterial material = new NewMaterial(name.replace(' ', '-'), "Illustrative " + name,
                MaterialClass.of(materialClass), "", List.of(), Scaling.BULK, new ConstantIndex(1.49));
        into.storeImport(null, material, sample, file);
    }

    private static List<String> names(Shortlist shortlist) {
        return shortlist.rows().stream().map(RankedRow::materialName).toList();
    }

    @Test
    void aSampleStoredByAnotherProcessIsInTheNextSearch() {
        SearchService search = new SearchService(library);
        assertThat(names(search.search(ANY, 50))).containsExactly("Illustrative first sheet");

        store(otherProcess, "second sheet", "film");

        assertThat(names(search.search(ANY, 50))).contains("Illustrative first sheet", "Illustrative second sheet");
        assertThat(search.materialClasses()).containsExactly("film", "plastic sheet");
    }

    @Test
    void anUnchangedLibraryIsBuiltOnceAndEachChangeOnceMore() {
        AtomicInteger builds = new AtomicInteger();
        SearchService search = new SearchService(library, generation -> builds.incrementAndGet());

        search.search(ANY, 50);
        search.search(ANY, 50);
        search.materialClasses();
        assertThat(builds).hasValue(1);

        store(otherProcess, "second sheet", "film");
        search.search(ANY, 50);
        search.search(ANY, 50);
        assertThat(builds).hasValue(2);

        search.invalidate();
        search.search(ANY, 50);
        assertThat(builds).hasValue(3);
    }

    /**
     * The old race: a rebuild reads the library, an import commits and drops the store (invalidate), then
     * the rebuild installs what it read before the import, and every later search misses the import.
     */
    @Test
    void aRebuildThatReadTheLibraryBeforeAnImportNeverHidesIt() throws Exception {
        assertNextSearchSeesAWriteLandingDuringARebuild(true);
    }

    /** The same race when the write comes from another process, which cannot call this service's invalidate. */
    @Test
    void aRebuildThatReadTheLibraryBeforeAnotherProcessWroteNeverHidesIt() throws Exception {
        assertNextSearchSeesAWriteLandingDuringARebuild(false);
    }

    private void assertNextSearchSeesAWriteLandingDuringARebuild(boolean invalidate) throws Exception {
        CountDownLatch paused = new CountDownLatch(1);
        CountDownLatch resume = new CountDownLatch(1);
        AtomicBoolean pauseOnce = new AtomicBoolean(true);
        SearchService search = new SearchService(library, generation -> {
            if (pauseOnce.getAndSet(false)) {
                paused.countDown();
                await(resume);
            }
        });
        Future<Shortlist> early = pool.submit(() -> search.search(ANY, 50));
        assertThat(paused.await(30, TimeUnit.SECONDS)).as("the first build reached the hook").isTrue();

        store(invalidate ? library : otherProcess, "late sheet", "film");
        if (invalidate) {
            search.invalidate(); // what the import service does after its commit
        }
        resume.countDown();

        // the early search began before the write: it answers from what it read
        assertThat(names(early.get(30, TimeUnit.SECONDS))).containsExactly("Illustrative first sheet");
        assertThat(names(search.search(ANY, 50))).contains("Illustrative first sheet", "Illustrative late sheet");
    }

    private static void await(CountDownLatch latch) {
        try {
            if (!latch.await(30, TimeUnit.SECONDS)) {
                throw new IllegalStateException("the test never resumed the build");
            }
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException(e);
        }
    }
}
