package org.spectralsieve.bench;

import static org.spectralsieve.bench.BenchStats.ms;
import static org.spectralsieve.bench.BenchStats.percentile;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.jooq.DSLContext;
import org.junit.jupiter.api.Test;
import org.spectralsieve.library.Geometry;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.MaterialClass;
import org.spectralsieve.library.MigratedDatabase;
import org.spectralsieve.library.NewMaterial;
import org.spectralsieve.library.NewSample;
import org.spectralsieve.library.Provenance;
import org.spectralsieve.library.Scaling;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.RequirementParser;
import org.spectralsieve.search.SearchService;
import org.spectralsieve.seed.DemoLibraryLoader;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.store.SpectralStore;
import org.spectralsieve.store.SyntheticCurves;
import org.spectralsieve.weighting.FigurePath;
import org.springframework.core.io.DefaultResourceLoader;

/**
 * Where the exact judgement's curves come from (docs/curve-cache.md): the real {@link SearchService} with its
 * snapshot's curve cache ({@code path=cache}) beside one that reads every judged curve from the database
 * ({@code path=database}, the way before the cache; budget 0), on the same library, interleaved run by run.
 * Prints {@code BENCH search-exact library=<l> curves=<n> mode=<m> path=<p> p50_ms p95_ms judged runs}, the
 * times being the service's own {@code tookMs}, and {@code BENCH search-exact-memory} with the cache's
 * estimate and the measured heap growth it adds per curve. Asserts nothing about time.
 *
 * <p>Libraries: {@code demo}, the committed demo library in a fresh in-memory H2; {@code demo+synthetic-N},
 * the demo library and N curves of {@link SyntheticCurves} on the store's 911-point grid (three samples a
 * material, two thirds bulk), inserted through the repository. Modes: the weighted requirement of
 * {@link WeightedSearchBenchmark} as is ({@code measured}), with {@code thickness 1 to 6 mm} ({@code solve}),
 * behind 4 mm clear float glass ({@code layer}).
 * Switches: {@code -Dbench.exactSizes=10000} (empty: the demo library only), {@code -Dbench.exactRuns=15}
 * (demo), {@code -Dbench.exactSyntheticRuns=3}.
 */
class ExactJudgementBenchmark {

    @Test
    void exactJudgementFromMemoryAndFromTheDatabase() {
        Map<String, Requirement> variants = new LinkedHashMap<>();
        variants.put("measured", RequirementParser.parse(WeightedSearchBenchmark.WEIGHTED));
        variants.put("solve", RequirementParser.parse(WeightedSearchBenchmark.WEIGHTED + ", " + WeightedSearchBenchmark.RANGE));
        variants.put("layer", RequirementParser.parse(WeightedSearchBenchmark.WEIGHTED + ", " + WeightedSearchBenchmark.LAYER));

        JooqLibraryRepository demo = demoLibrary();
        time("demo", demo, variants, BenchStats.intProperty("bench.exactRuns", 15));
        for (int n : BenchStats.intList("bench.exactSizes", "10000")) {
            JooqLibraryRepository library = demoLibrary();
            long t0 = System.nanoTime();
            addSynthetic(library, n, 20261204L);
            System.out.printf(Locale.ROOT, "BENCH search-exact-setup library=demo+synthetic-%d inserted_s=%.1f%n", n,
                    (System.nanoTime() - t0) / 1e9);
            time("demo+synthetic-" + n, library, variants, BenchStats.intProperty("bench.exactSyntheticRuns", 3));
        }
    }

    /**
     * The exact judgement's weighted figures computed the earlier way ({@code variant=lookup}: a bounded curve
     * built and a binary search per integration point) beside the fast way ({@code variant=walk}: cached
     * integration points read by one walk, docs/exact-judgement-speed.md), the same service and library,
     * interleaved run by run. Prints {@code BENCH exact-figures library=<l> curves=<n> mode=<m> variant=<v>
     * p50_ms p95_ms judged runs}. Switches: {@code -Dbench.figureSizes=10000} (empty: demo only),
     * {@code -Dbench.exactRuns=15} (demo), {@code -Dbench.exactSyntheticRuns=3}.
     */
    @Test
    void weightedFiguresTheEarlierWayAndTheFastWay() {
        Map<String, Requirement> variants = new LinkedHashMap<>();
        variants.put("measured", RequirementParser.parse(WeightedSearchBenchmark.WEIGHTED));
        variants.put("solve", RequirementParser.parse(WeightedSearchBenchmark.WEIGHTED + ", " + WeightedSearchBenchmark.RANGE));
        variants.put("layer", RequirementParser.parse(WeightedSearchBenchmark.WEIGHTED + ", " + WeightedSearchBenchmark.LAYER));
        try {
            figures("demo", demoLibrary(), variants, BenchStats.intProperty("bench.exactRuns", 15));
            for (int n : BenchStats.intList("bench.figureSizes", "10000")) {
                JooqLibraryRepository library = demoLibrary();
                addSynthetic(library, n, 20261204L);
                figures("demo+synthetic-" + n, library, variants, BenchStats.intProperty("bench.exactSyntheticRuns", 3));
            }
        } finally {
            FigurePath.useLookup(false);
        }
    }

    private static void figures(String name, JooqLibraryRepository library, Map<String, Requirement> variants, int runs) {
        SearchService service = new SearchService(library);
        String[] ways = {"lookup", "walk"};
        for (String way : ways) {
            FigurePath.useLookup(way.equals("lookup"));
            variants.values().forEach(r -> service.search(r, 20)); // warm-up: JIT
        }
        Map<String, double[]> took = new LinkedHashMap<>();
        Map<String, Integer> judged = new LinkedHashMap<>();
        for (int i = 0; i < runs; i++) {
            for (Map.Entry<String, Requirement> variant : variants.entrySet()) {
                for (String way : ways) {
                    FigurePath.useLookup(way.equals("lookup"));
                    String key = variant.getKey() + " " + way;
                    var answer = service.search(variant.getValue(), 20);
                    took.computeIfAbsent(key, k -> new double[runs])[i] = answer.tookMs();
                    judged.put(key, answer.judgedExactly());
                }
            }
        }
        FigurePath.useLookup(false);
        for (String key : took.keySet()) {
            String[] modeAndWay = key.split(" ");
            double[] t = took.get(key);
            System.out.printf("BENCH exact-figures library=%s curves=%d mode=%s variant=%s p50_ms=%s p95_ms=%s judged=%d runs=%d%n",
                    name, service.store().size(), modeAndWay[0], modeAndWay[1], ms(percentile(t, 50)),
                    ms(percentile(t, 95)), judged.get(key), runs);
        }
    }

    private static void time(String name, JooqLibraryRepository library, Map<String, Requirement> variants, int runs) {
        Map<String, SearchService> paths = new LinkedHashMap<>();
        long base = BenchStats.usedHeapAfterGc();
        SearchService database = new SearchService(library, 0);
        database.materialClasses(); // builds its snapshot: the store, no cached curve
        long storeOnly = BenchStats.usedHeapAfterGc() - base;
        SearchService cache = new SearchService(library);
        base = BenchStats.usedHeapAfterGc();
        SearchService.CurveCacheUse use = cache.curveCacheUse(); // builds its snapshot: the store and the cache
        long storeAndCache = BenchStats.usedHeapAfterGc() - base;
        System.out.printf(Locale.ROOT, "BENCH search-exact-memory library=%s curves=%d cached=%d cache_mb=%.1f"
                        + " estimate_bytes_per_curve=%d measured_bytes_per_curve=%d budget_mb=%d%n",
                name, database.store().size(), use.curves(), use.heapBytes() / 1048576.0,
                use.heapBytes() / Math.max(1, use.curves()), (storeAndCache - storeOnly) / Math.max(1, use.curves()),
                use.budgetBytes() >> 20);
        paths.put("cache", cache);
        paths.put("database", database);

        for (SearchService service : paths.values()) {
            variants.values().forEach(r -> service.search(r, 20)); // warm-up: JIT
        }
        Map<String, double[]> took = new LinkedHashMap<>();
        Map<String, Integer> judged = new LinkedHashMap<>();
        for (int i = 0; i < runs; i++) {
            for (Map.Entry<String, Requirement> variant : variants.entrySet()) {
                for (Map.Entry<String, SearchService> path : paths.entrySet()) {
                    String key = variant.getKey() + " " + path.getKey();
                    var answer = path.getValue().search(variant.getValue(), 20);
                    took.computeIfAbsent(key, k -> new double[runs])[i] = answer.tookMs();
                    judged.put(key, answer.judgedExactly());
                }
            }
        }
        for (String key : took.keySet()) {
            String[] modeAndPath = key.split(" ");
            double[] t = took.get(key);
            System.out.printf("BENCH search-exact library=%s curves=%d mode=%s path=%s p50_ms=%s p95_ms=%s judged=%d runs=%d%n",
                    name, database.store().size(), modeAndPath[0], modeAndPath[1], ms(percentile(t, 50)),
                    ms(percentile(t, 95)), judged.get(key), runs);
        }
    }

    private static JooqLibraryRepository demoLibrary() {
        DSLContext db = MigratedDatabase.freshH2();
        JooqLibraryRepository library = new JooqLibraryRepository(db);
        new DemoLibraryLoader(library, db, new DefaultResourceLoader(), "classpath:seed-materials/").load();
        return library;
    }

    /** N synthetic curves (illustrative), three samples a material, two thirds of the materials bulk. */
    private static void addSynthetic(JooqLibraryRepository library, int n, long seed) {
        SyntheticCurves specs = new SyntheticCurves(seed, SpectralStore.DEFAULT_GRID);
        double[] nm = SpectralStore.DEFAULT_GRID.points();
        long material = 0;
        for (int i = 0; i < n; i++) {
            SyntheticCurves.Spec spec = specs.next();
            if (i % 3 == 0) {
                material = library.insertMaterial(new NewMaterial("bench-stock-" + i, "Bench stock " + i,
                        MaterialClass.of("plastic sheet"), "illustrative, generated", List.of(),
                        i % 9 == 6 ? Scaling.FIXED : Scaling.BULK, SyntheticCurves.INDICES[spec.index()]));
            }
            double[] t = new double[nm.length];
            for (int w = 0; w < nm.length; w++) {
                t[w] = SyntheticCurves.transmittance(spec, nm[w]);
            }
            library.insertSample(material, new NewSample(spec.thicknessMm(), Geometry.REGULAR, Provenance.MODELLED, "",
                    null, "", "illustrative", spec.floor(), Curve.of(nm, t, spec.floor()), "bench-" + i + ".csv",
                    String.format(Locale.ROOT, "%064x", i)));
        }
    }
}
