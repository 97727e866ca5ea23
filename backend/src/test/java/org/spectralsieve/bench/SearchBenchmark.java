package org.spectralsieve.bench;

import static org.spectralsieve.bench.BenchStats.ms;
import static org.spectralsieve.bench.BenchStats.percentile;

import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.IntStream;
import org.junit.jupiter.api.Test;
import org.spectralsieve.requirement.Candidate;
import org.spectralsieve.requirement.CrossingFinder;
import org.spectralsieve.requirement.MaterialEvaluation;
import org.spectralsieve.requirement.RankedRow;
import org.spectralsieve.requirement.Ranking;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.RequirementParser;
import org.spectralsieve.requirement.SampleEvaluator;
import org.spectralsieve.store.OdCode;
import org.spectralsieve.store.SpectralStore;
import org.spectralsieve.store.StoreHit;
import org.spectralsieve.store.StoreResult;
import org.spectralsieve.store.StoreSearch;
import org.spectralsieve.store.StoredMaterial;
import org.spectralsieve.store.SyntheticCurves;
import org.spectralsieve.store.WeightedScreen;

/**
 * Requirement-search benchmark (run by {@code mvn -B -q -Pbench -pl backend -am verify}; not part of the
 * test suite). Prints {@code BENCH ...} lines; asserts nothing about time.
 *
 * <p>One search = the store's bounded pass over every curve plus the exact re-evaluation of the returned
 * rows, as the service does it. Switches: {@code -Dbench.sizes=10000,100000,1000000},
 * {@code -Dbench.sqlSizes=10000}, {@code -Dbench.runs=41}, {@code -Dbench.sqlRuns=5}, {@code -Dbench.limit=20};
 * {@code -Dbench.searchRoots=true} also times the service's path ({@link #search}) with the thickness solves by
 * ITP and by bisection in turn ({@code BENCH search-roots ... variant=bisection|itp}).
 */
class SearchBenchmark {

    static final String REQUIREMENT =
            "passes over 80% at 365 nm and blocks under 1% at 405 nm and passes at least 70% from 380 to 400 nm";
    private static final int BATCH = 8192;

    @Test
    void searchOverSyntheticLibraries() throws Exception {
        int runs = BenchStats.intProperty("bench.runs", 41);
        int limit = BenchStats.intProperty("bench.limit", 20);
        Requirement fixed = RequirementParser.parse(REQUIREMENT);
        Requirement solve = RequirementParser.parse(REQUIREMENT + ", thickness 1 to 6 mm");
        int[] sqlSizes = BenchStats.intList("bench.sqlSizes", "10000,100000");
        for (int n : BenchStats.intList("bench.sizes", "10000,100000,1000000")) {
            long before = BenchStats.usedHeapAfterGc();
            SpectralStore store = syntheticStore(n, 20261202L);
            long after = BenchStats.usedHeapAfterGc();
            System.out.printf("BENCH memory curves=%d bytes_per_curve=%.0f%n", n, (after - before) / (double) n);
            // the store's own count of its arrays (weighted screen included: its bins are allocated for every
            // slot whether or not a curve is screened) beside the heap growth measured while building it
            System.out.printf("BENCH store-memory curves=%d bytes_per_curve=%.0f counted=%.0f weighted_screen=%d%n", n,
                    (after - before) / (double) n, store.bytesPerCurve(), WeightedScreen.BYTES_PER_CURVE);

            double fixedP50 = time(store, fixed, limit, runs, "fixed");
            time(store, solve, limit, runs, "solve");
            compareScans(store, fixed, limit, runs, "fixed");
            compareScans(store, solve, limit, runs, "solve");
            if (contains(sqlSizes, n)) {
                double sqlP50 = sqlBaseline(n, 20261202L, BenchStats.intProperty("bench.sqlRuns", 5), limit);
                // sql-baseline: the name the table uses; ratio against the whole fixed search's p50
                System.out.printf("BENCH sql-baseline curves=%d p50_ms=%s ratio=%.0f rows_per_curve=%d%n", n, ms(sqlP50),
                        sqlP50 / fixedP50, sqlWavelengths(n).length);
            }
            store = null;
        }
    }

    /**
     * The whole search with its hand-over (the line {@code BENCH search ...}, the row the table reads), and
     * alternated with it in the same loop the same search judging the store's hits alone, as before the hand-over
     * ({@code BENCH search-hand-over ... variant=hits-only|hand-over}): what the exact cut costs, side by side; and
     * the whole search without the integer screen over a range ({@code BENCH search-range-screen ...
     * variant=no-range-screen|after}, store's part and whole, and whether both returned the same rows).
     */
    private static double time(SpectralStore store, Requirement requirement, int limit, int runs, String mode) {
        for (int i = 0; i < 5; i++) {
            search(store, requirement, limit); // warm-up: JIT and caches
        }
        double[] ms = new double[runs];
        double[] hitsOnlyMs = new double[runs];
        double[] storeMs = new double[runs];
        double[] noScreenMs = new double[runs];
        double[] noScreenStoreMs = new double[runs];
        double[] byObjectsMs = new double[runs];
        double[] byObjectsStoreMs = new double[runs];
        boolean sameRows = true;
        boolean sameRowsByObjects = true;
        int refined = 0;
        int handedOver = 0;
        boolean roots = Boolean.getBoolean("bench.searchRoots");
        double[] rootsMs = new double[runs];
        double[] bisectionMs = new double[runs];
        for (int i = 0; i < runs; i++) {
            if (roots) {
                // the whole search with thickness solves by ITP (the default) and by bisection, in turn first
                timedRoots(store, requirement, limit, i, i % 2 == 0, rootsMs, bisectionMs);
            }
            // every other iteration the search without the screen goes first: the place in the loop alone moved
            // the same code's figures by a third under load (as measured both variants take the same path)
            StoreResult unscreened = i % 2 == 1 ? timedWhole(StoreSearch::searchWithoutRangeScreen, store, requirement,
                    limit, i, noScreenMs, noScreenStoreMs) : null;
            // the same for the spans from the material objects (seventh pass's side by side), on the other turns
            StoreResult byObjects = i % 2 == 0 ? timedWhole(StoreSearch::searchWithSpansByMaterialObjects, store,
                    requirement, limit, i, byObjectsMs, byObjectsStoreMs) : null;
            long t0 = System.nanoTime();
            StoreResult picked = StoreSearch.search(store, requirement, limit);
            long t1 = System.nanoTime();
            handedOver = judgeExactly(store, requirement, limit, picked);
            ms[i] = (System.nanoTime() - t0) / 1e6;
            storeMs[i] = (t1 - t0) / 1e6;
            refined = picked.refinedSamples();

            long h0 = System.nanoTime();
            judgeHits(store, requirement, limit, StoreSearch.search(store, requirement, limit));
            hitsOnlyMs[i] = (System.nanoTime() - h0) / 1e6;

            if (unscreened == null) {
                unscreened = timedWhole(StoreSearch::searchWithoutRangeScreen, store, requirement, limit, i, noScreenMs,
                        noScreenStoreMs);
            }
            sameRows &= unscreened.hits().equals(picked.hits());
            if (byObjects == null) {
                byObjects = timedWhole(StoreSearch::searchWithSpansByMaterialObjects, store, requirement, limit, i,
                        byObjectsMs, byObjectsStoreMs);
            }
            sameRowsByObjects &= byObjects.hits().equals(picked.hits());
        }
        // p50/p95: the whole search; store_p50_ms: the store's pick alone; refined: curves evaluated on every probe
        // before the hand-over; handed_over: materials the hand-over added for the exact last row
        System.out.printf("BENCH search curves=%d mode=%s p50_ms=%s p95_ms=%s store_p50_ms=%s refined=%d handed_over=%d%n",
                store.size(), mode, ms(percentile(ms, 50)), ms(percentile(ms, 95)), ms(percentile(storeMs, 50)), refined,
                handedOver);
        System.out.printf("BENCH search-hand-over curves=%d mode=%s variant=hits-only p50_ms=%s p95_ms=%s%n", store.size(),
                mode, ms(percentile(hitsOnlyMs, 50)), ms(percentile(hitsOnlyMs, 95)));
        System.out.printf("BENCH search-hand-over curves=%d mode=%s variant=hand-over p50_ms=%s p95_ms=%s%n", store.size(),
                mode, ms(percentile(ms, 50)), ms(percentile(ms, 95)));
        // the whole search (with its hand-over) without the integer screen over a range, alternated with the above
        System.out.printf("BENCH search-range-screen curves=%d mode=%s variant=no-range-screen p50_ms=%s p95_ms=%s"
                        + " store_p50_ms=%s store_p95_ms=%s same_rows=%s%n", store.size(), mode,
                ms(percentile(noScreenMs, 50)), ms(percentile(noScreenMs, 95)), ms(percentile(noScreenStoreMs, 50)),
                ms(percentile(noScreenStoreMs, 95)), sameRows);
        System.out.printf("BENCH search-range-screen curves=%d mode=%s variant=after p50_ms=%s p95_ms=%s"
                        + " store_p50_ms=%s store_p95_ms=%s same_rows=%s%n", store.size(), mode,
                ms(percentile(ms, 50)), ms(percentile(ms, 95)), ms(percentile(storeMs, 50)),
                ms(percentile(storeMs, 95)), sameRows);
        // the whole search (with its hand-over) with the spans from the material objects, alternated with the above
        System.out.printf("BENCH search-spans curves=%d mode=%s variant=by-objects p50_ms=%s p95_ms=%s"
                        + " store_p50_ms=%s store_p95_ms=%s same_rows=%s%n", store.size(), mode,
                ms(percentile(byObjectsMs, 50)), ms(percentile(byObjectsMs, 95)), ms(percentile(byObjectsStoreMs, 50)),
                ms(percentile(byObjectsStoreMs, 95)), sameRowsByObjects);
        System.out.printf("BENCH search-spans curves=%d mode=%s variant=by-table p50_ms=%s p95_ms=%s"
                        + " store_p50_ms=%s store_p95_ms=%s same_rows=%s%n", store.size(), mode,
                ms(percentile(ms, 50)), ms(percentile(ms, 95)), ms(percentile(storeMs, 50)),
                ms(percentile(storeMs, 95)), sameRowsByObjects);
        if (roots) {
            System.out.printf("BENCH search-roots curves=%d mode=%s variant=bisection p50_ms=%s p95_ms=%s%n", store.size(),
                    mode, ms(percentile(bisectionMs, 50)), ms(percentile(bisectionMs, 95)));
            System.out.printf("BENCH search-roots curves=%d mode=%s variant=itp p50_ms=%s p95_ms=%s%n", store.size(),
                    mode, ms(percentile(rootsMs, 50)), ms(percentile(rootsMs, 95)));
        }
        return percentile(ms, 50);
    }

    /** {@link #search} timed once each way ({@link CrossingFinder#useBisection}), bisection first when asked. */
    private static void timedRoots(SpectralStore store, Requirement requirement, int limit, int i, boolean bisectionFirst,
                                   double[] itpMs, double[] bisectionMs) {
        for (boolean bisection : bisectionFirst ? new boolean[] {true, false} : new boolean[] {false, true}) {
            CrossingFinder.useBisection(bisection);
            try {
                long t0 = System.nanoTime();
                search(store, requirement, limit);
                (bisection ? bisectionMs : itpMs)[i] = (System.nanoTime() - t0) / 1e6;
            } finally {
                CrossingFinder.useBisection(false);
            }
        }
    }

    /** One way of the store's pick, for timing the whole search with it ({@link #timedWhole}). */
    private interface StorePick {
        StoreResult search(SpectralStore store, Requirement requirement, int limit);
    }

    /** The whole search (the store's pick by {@code pick}, then its rows judged with their hand-over), timed into run i. */
    private static StoreResult timedWhole(StorePick pick, SpectralStore store, Requirement requirement, int limit, int i,
                                          double[] wholeMs, double[] storeMs) {
        long u0 = System.nanoTime();
        StoreResult result = pick.search(store, requirement, limit);
        long u1 = System.nanoTime();
        judgeExactly(store, requirement, limit, result);
        wholeMs[i] = (System.nanoTime() - u0) / 1e6;
        storeMs[i] = (u1 - u0) / 1e6;
        return result;
    }

    /**
     * The store's part alone by the earlier scan ({@code variant=before}, {@link StoreSearch#searchReference}),
     * the chunk scan without reading one column first ({@code variant=chunks}, {@link StoreSearch#searchByChunks})
     * the column-first pass as it was before its block screen ({@code variant=gathered},
     * {@link StoreSearch#searchGatheringOtherColumns}: as measured, the other columns gathered per kept curve)
     * the column-first pass over a range without its screen by levels ({@code variant=no-range-screen},
     * {@link StoreSearch#searchWithoutRangeScreen}: every curve's exact caps), the spans worked out from each
     * material's curve array and object ({@code variant=spans-by-objects},
     * {@link StoreSearch#searchWithSpansByMaterialObjects}: the sixth pass) and the default path
     * ({@code variant=after}), run in turn in one loop so all see the same load.
     */
    private static void compareScans(SpectralStore store, Requirement requirement, int limit, int runs, String mode) {
        String[] variants = {"before", "chunks", "gathered", "no-range-screen", "spans-by-objects", "after"};
        for (int i = 0; i < 3; i++) {
            for (String variant : variants) {
                scan(variant, store, requirement, limit);
            }
        }
        double[][] ms = new double[variants.length][runs];
        for (int i = 0; i < runs; i++) {
            for (int turn = 0; turn < variants.length; turn++) {
                // the last two (the sixth pass's spans and the default) swap places every other iteration
                int v = i % 2 == 1 && turn >= variants.length - 2 ? 2 * variants.length - 3 - turn : turn;
                long t0 = System.nanoTime();
                scan(variants[v], store, requirement, limit);
                ms[v][i] = (System.nanoTime() - t0) / 1e6;
            }
        }
        for (int v = 0; v < variants.length; v++) {
            System.out.printf("BENCH store-scan curves=%d mode=%s variant=%s p50_ms=%s p95_ms=%s%n", store.size(), mode,
                    variants[v], ms(percentile(ms[v], 50)), ms(percentile(ms[v], 95)));
        }
    }

    private static StoreResult scan(String variant, SpectralStore store, Requirement requirement, int limit) {
        return switch (variant) {
            case "before" -> StoreSearch.searchReference(store, requirement, limit);
            case "chunks" -> StoreSearch.searchByChunks(store, requirement, limit);
            case "gathered" -> StoreSearch.searchGatheringOtherColumns(store, requirement, limit);
            case "no-range-screen" -> StoreSearch.searchWithoutRangeScreen(store, requirement, limit);
            case "spans-by-objects" -> StoreSearch.searchWithSpansByMaterialObjects(store, requirement, limit);
            default -> StoreSearch.search(store, requirement, limit);
        };
    }

    /** The service's path without the database: store search, then exact judgement of the returned rows. */
    static void search(SpectralStore store, Requirement requirement, int limit) {
        judgeExactly(store, requirement, limit, StoreSearch.search(store, requirement, limit));
    }

    /**
     * As the service does it: the hits judged exactly, then every material the hand-over names for the exact last
     * row (docs/store.md, "The store's error at the cut"). Returns how many materials the hand-over added.
     */
    private static int judgeExactly(SpectralStore store, Requirement requirement, int limit, StoreResult result) {
        List<MaterialEvaluation> exact = new ArrayList<>();
        for (StoreHit hit : result.hits()) {
            exact.add(judge(store, requirement, hit));
        }
        List<RankedRow> rows = Ranking.rank(exact, limit);
        if (rows.isEmpty() && store.size() > 0) {
            throw new IllegalStateException("no rows");
        }
        if (rows.size() < limit) {
            return 0;
        }
        List<StoreHit> more = result.handOver().reaching(rows.get(limit - 1).evaluation().standing(),
                rows.get(limit - 1).evaluation().worstMarginDecades());
        for (StoreHit hit : more) {
            exact.add(judge(store, requirement, hit));
        }
        Ranking.rank(exact, limit);
        return more.size();
    }

    /** The hits judged exactly and ranked, nothing handed over: the service's path before the hand-over. */
    private static void judgeHits(SpectralStore store, Requirement requirement, int limit, StoreResult result) {
        List<MaterialEvaluation> exact = new ArrayList<>();
        for (StoreHit hit : result.hits()) {
            exact.add(judge(store, requirement, hit));
        }
        Ranking.rank(exact, limit);
    }

    private static MaterialEvaluation judge(SpectralStore store, Requirement requirement, StoreHit hit) {
        Candidate c = new Candidate(hit.sampleId(), hit.material().id(), hit.material().name(), store.curve(hit.curve()),
                store.thicknessMm(hit.curve()), store.isBulk(hit.curve()), store.indexOf(hit.curve()));
        return MaterialEvaluation.of(c, SampleEvaluator.evaluate(c, requirement));
    }

    /** n curves in materials of three samples each (a third of them bulk sheets, the rest films and coatings). */
    static SpectralStore syntheticStore(int n, long seed) {
        SyntheticCurves synthetic = new SyntheticCurves(seed, SpectralStore.DEFAULT_GRID);
        SpectralStore.Builder builder = SpectralStore.builder(SpectralStore.DEFAULT_GRID, n);
        for (int start = 0; start < n; start += BATCH) {
            int count = Math.min(BATCH, n - start);
            SyntheticCurves.Spec[] specs = new SyntheticCurves.Spec[count];
            for (int k = 0; k < count; k++) {
                specs[k] = synthetic.next();
            }
            short[][] codes = new short[count][];
            IntStream.range(0, count).parallel().forEach(k -> codes[k] = synthetic.codes(specs[k]));
            for (int k = 0; k < count; k++) {
                int i = start + k;
                int material = i / 3;
                builder.addEncoded(i + 1L, new StoredMaterial(material + 1L, "material " + material, "plastic sheet"),
                        specs[k].thicknessMm(), material % 3 != 2, false, SyntheticCurves.INDICES[specs[k].index()], codes[k]);
            }
        }
        return builder.build();
    }

    /**
     * The same requirement as straightforward SQL over the same curves stored one row per point in H2,
     * with the index a competent engineer would add (primary key on wavelength then curve, so each
     * wavelength is one contiguous range).
     */
    static double sqlBaseline(int n, long seed, int runs, int limit) throws SQLException {
        try (Connection db = DriverManager.getConnection("jdbc:h2:mem:bench-sql-" + n, "sa", "")) {
            try (Statement s = db.createStatement()) {
                s.execute("CREATE TABLE curve (curve_id INT PRIMARY KEY, material_id INT NOT NULL)");
                s.execute("CREATE TABLE point (nm SMALLINT NOT NULL, curve_id INT NOT NULL, t DOUBLE NOT NULL)");
            }
            SyntheticCurves synthetic = new SyntheticCurves(seed, SpectralStore.DEFAULT_GRID);
            double[] grid = SpectralStore.DEFAULT_GRID.points();
            int[] kept = sqlWavelengths(n);
            db.setAutoCommit(false);
            try (PreparedStatement curve = db.prepareStatement("INSERT INTO curve VALUES (?, ?)");
                 PreparedStatement point = db.prepareStatement("INSERT INTO point VALUES (?, ?, ?)")) {
                for (int i = 0; i < n; i++) {
                    short[] codes = synthetic.codes(synthetic.next());
                    curve.setInt(1, i + 1);
                    curve.setInt(2, i / 3 + 1);
                    curve.addBatch();
                    for (int w : kept) {
                        point.setShort(1, (short) grid[w]);
                        point.setInt(2, i + 1);
                        point.setDouble(3, OdCode.transmittance(codes[w]));
                        point.addBatch();
                    }
                    if (i % 200 == 199) {
                        curve.executeBatch();
                        point.executeBatch();
                    }
                }
                curve.executeBatch();
                point.executeBatch();
            }
            db.commit();
            try (Statement s = db.createStatement()) {
                s.execute("ALTER TABLE point ADD PRIMARY KEY (nm, curve_id)"); // after the load: a bulk build is faster
            }
            db.setAutoCommit(true);
            // H2 reuses the result of an identical query on unchanged data, so every run's thresholds differ
            // in the twelfth digit: the same question, but a fresh evaluation
            // one pass over the wavelengths the requirement touches, grouped per curve (joining a grouped
            // subquery back to the points instead made H2 re-scan it per curve: minutes at 10k curves)
            String template = "SELECT curve_id,"
                    + " LEAST(LOG10(MAX(CASE WHEN nm = 365 THEN t END) / %s),"
                    + "       LOG10(%s / MAX(CASE WHEN nm = 405 THEN t END)),"
                    + "       LOG10(MIN(CASE WHEN nm BETWEEN 380 AND 400 THEN t END) / %s)) AS worst"
                    + " FROM point WHERE nm BETWEEN 365 AND 405"
                    + " GROUP BY curve_id ORDER BY worst DESC LIMIT " + limit;
            double[] ms = new double[runs];
            for (int r = -1; r < runs; r++) {
                double jitter = (r + 2) * 1e-12;
                String sql = String.format(java.util.Locale.ROOT, template, 0.8 + jitter, 0.01 + jitter, 0.7 + jitter);
                long t0 = System.nanoTime();
                int rows = 0;
                try (Statement s = db.createStatement(); ResultSet rs = s.executeQuery(sql)) {
                    while (rs.next()) {
                        rows++;
                    }
                }
                if (rows == 0) {
                    throw new IllegalStateException("baseline query returned no rows");
                }
                if (r >= 0) {
                    ms[r] = (System.nanoTime() - t0) / 1e6;
                }
            }
            return percentile(ms, 50);
        }
    }

    /**
     * The grid points the baseline table holds: every one up to 10k curves; above that only 360–410 nm (the
     * query reads 365–405 nm through the primary key's range), since 91 M point rows of 100k curves do not
     * fit an in-memory H2 beside the store. A smaller table only makes the baseline faster, so the ratio is
     * if anything understated.
     */
    static int[] sqlWavelengths(int n) {
        double[] grid = SpectralStore.DEFAULT_GRID.points();
        return IntStream.range(0, grid.length)
                .filter(w -> n <= BenchStats.intProperty("bench.sqlAllPointsUpTo", 10_000) || grid[w] >= 360 && grid[w] <= 410)
                .toArray();
    }

    private static boolean contains(int[] values, int value) {
        for (int v : values) {
            if (v == value) {
                return true;
            }
        }
        return false;
    }
}
