package org.spectralsieve.search;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.UUID;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.atomic.AtomicInteger;
import org.flywaydb.core.Flyway;
import org.h2.jdbcx.JdbcDataSource;
import org.jooq.SQLDialect;
import org.jooq.impl.DSL;
import org.junit.jupiter.api.Test;
import org.spectralsieve.ingest.Checksums;
import org.spectralsieve.library.Geometry;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.NewSample;
import org.spectralsieve.library.Provenance;
import org.spectralsieve.library.SourceFile;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.RequirementParser;
import org.spectralsieve.seed.DemoLibraryLoader;
import org.spectralsieve.spectrum.Curve;
import org.springframework.core.io.DefaultResourceLoader;

/**
 * Searches under concurrent imports (docs/search-under-load.md): the judgement lanes bound how many searches
 * judge at once, and neither they nor the partial rebuild of the store let a search miss an import that was
 * acknowledged before it began. The reference is the same code's whole build from the database (a fresh
 * service), as in {@link StoreRebuildReuseTest}; the library is the illustrative demo library.
 */
class SearchUnderLoadTest {

    private static final Requirement PLAIN = RequirementParser.parse("passes over 80% at 365 nm and blocks under 1% at 405 nm");
    private static final Requirement SOLVED = RequirementParser.parse(
            "passes over 80% at 365 nm and blocks under 1% at 405 nm, thickness 1 to 6 mm");

    @Test
    void atMostTheGivenNumberOfSearchesJudgeAtOnce() throws Exception {
        JudgementLanes lanes = JudgementLanes.of(2);
        AtomicInteger inside = new AtomicInteger();
        AtomicInteger most = new AtomicInteger();
        CountDownLatch twoInside = new CountDownLatch(2);
        CountDownLatch release = new CountDownLatch(1);
        List<Thread> threads = new ArrayList<>();
        for (int i = 0; i < 5; i++) {
            Thread t = new Thread(() -> lanes.run(() -> {
                most.accumulateAndGet(inside.incrementAndGet(), Math::max);
                twoInside.countDown();
                try {
                    release.await();
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                }
                return inside.decrementAndGet();
            }));
            threads.add(t);
            t.start();
        }
        twoInside.await();
        // the other three are parked at the lane's entrance (waiting for the state, not for a time)
        while (threads.stream().filter(t -> t.getState() == Thread.State.WAITING).count() < 5) {
            Thread.onSpinWait();
        }
        assertThat(inside.get()).isEqualTo(2);
        release.countDown();
        for (Thread t : threads) {
            t.join();
        }
        assertThat(most.get()).isEqualTo(2);
        assertThat(inside.get()).isZero();
    }

    @Test
    void noLanesIsNoBound() {
        assertThat(JudgementLanes.of(0).count()).isZero();
        assertThat(JudgementLanes.of(3).count()).isEqualTo(3);
        assertThat(JudgementLanes.of(0).run(() -> "judged")).isEqualTo("judged");
    }

    @Test
    void anImportAcknowledgedBeforeASearchIsInItsAnswerWhileOthersSearchAndImport() throws Exception {
        JooqLibraryRepository library = demoLibrary();
        SearchService kept = new SearchService(library).limitConcurrentJudgements(1);
        kept.search(PLAIN, 20);
        long materialId = library.findMaterials(null, null).get(0).id();
        ExecutorService pool = Executors.newFixedThreadPool(6);
        try {
            List<Future<?>> work = new ArrayList<>();
            for (int w = 0; w < 3; w++) {
                work.add(pool.submit(() -> {
                    for (int k = 0; k < 15; k++) {
                        kept.search(k % 2 == 0 ? PLAIN : SOLVED, 20);
                    }
                }));
            }
            for (int w = 0; w < 3; w++) {
                int writer = w;
                work.add(pool.submit(() -> {
                    for (int k = 0; k < 5; k++) {
                        long sampleId = importInto(library, materialId, 1 + writer + k * 0.1, "w" + writer + "-" + k);
                        if (writer != 0) {
                            kept.refresh(); // what the import service does after its commit (writer 0 leaves it to the search)
                        }
                        // acknowledged: the very next search (store) of this process holds the sample
                        assertThat(StoreRebuildReuseTest.indexOf(kept.store(), sampleId)).isNotNegative();
                    }
                    return null;
                }));
            }
            for (Future<?> f : work) {
                f.get();
            }
        } finally {
            pool.shutdownNow();
        }
        SearchService fresh = new SearchService(library);
        StoreRebuildReuseTest.assertSameStore(kept.store(), fresh.store());
        for (Requirement r : List.of(PLAIN, SOLVED)) {
            assertThat(kept.search(r, 20).rows()).isEqualTo(fresh.search(r, 20).rows());
        }
    }

    @Test
    @org.junit.jupiter.api.Timeout(value = 120, unit = java.util.concurrent.TimeUnit.SECONDS) // a hang guard, not a speed check
    void aWritersRefreshDoesNotQueueBehindARebuildInProgressAndTheNextSearchStillSeesItsWrite() throws Exception {
        JooqLibraryRepository library = demoLibrary();
        CountDownLatch paused = new CountDownLatch(1);
        CountDownLatch release = new CountDownLatch(1);
        AtomicInteger builds = new AtomicInteger();
        SearchService kept = new SearchService(library, generation -> {
            if (builds.incrementAndGet() == 2) { // the rebuild after the first import waits here, holding the build lock
                paused.countDown();
                try {
                    release.await();
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                }
            }
        });
        kept.search(PLAIN, 20);
        long materialId = library.findMaterials(null, null).get(0).id();
        long first = importInto(library, materialId, 2.0, "first");
        ExecutorService searcher = Executors.newSingleThreadExecutor();
        try {
            Future<Integer> search = searcher.submit(() -> StoreRebuildReuseTest.indexOf(kept.store(), first));
            paused.await();
            long second = importInto(library, materialId, 3.0, "second");
            kept.refresh(); // returns although the other rebuild holds the lock: it did not wait for it
            assertThat(builds.get()).as("the refresh built nothing while the other rebuild ran").isEqualTo(2);
            release.countDown();
            assertThat(search.get()).as("the search that began after the first import holds it").isNotNegative();
            assertThat(StoreRebuildReuseTest.indexOf(kept.store(), second)).as("the next search holds the second")
                    .isNotNegative();
        } finally {
            release.countDown();
            searcher.shutdownNow();
        }
        StoreRebuildReuseTest.assertSameStore(kept.store(), new SearchService(library).store());
    }

    private static JooqLibraryRepository demoLibrary() {
        JdbcDataSource dataSource = new JdbcDataSource();
        dataSource.setURL("jdbc:h2:mem:" + UUID.randomUUID() + ";DB_CLOSE_DELAY=-1");
        Flyway.configure().dataSource(dataSource).load().migrate();
        var db = DSL.using(dataSource, SQLDialect.H2);
        JooqLibraryRepository library = new JooqLibraryRepository(db);
        new DemoLibraryLoader(library, db, new DefaultResourceLoader(), "classpath:seed-materials/").load();
        return library;
    }

    private static long importInto(JooqLibraryRepository library, long materialId, double thicknessMm, String note) {
        byte[] bytes = ("wavelength_nm,T\n300,0.02\n350,0.6\n400,0.9\n# " + note + "\n").getBytes(StandardCharsets.UTF_8);
        SourceFile file = new SourceFile(note + ".csv", "text/csv", "delimited", bytes, Checksums.sha256(bytes));
        Curve curve = Curve.of(new double[] {300, 350, 400}, new double[] {0.02, 0.6, 0.9}, 1e-3);
        return library.storeImport(materialId, null, new NewSample(thicknessMm, Geometry.REGULAR, Provenance.MEASURED, "",
                null, "", note, 1e-3, curve, file.fileName(), file.sha256()), file).sampleId();
    }
}
