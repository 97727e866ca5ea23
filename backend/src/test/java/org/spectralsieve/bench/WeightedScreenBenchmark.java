package org.spectralsieve.bench;

import static org.spectralsieve.bench.BenchStats.ms;
import static org.spectralsieve.bench.BenchStats.percentile;

import java.nio.charset.StandardCharsets;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.UUID;
import org.flywaydb.core.Flyway;
import org.h2.jdbcx.JdbcDataSource;
import org.jooq.DSLContext;
import org.jooq.SQLDialect;
import org.jooq.impl.DSL;
import org.junit.jupiter.api.Test;
import org.spectralsieve.ingest.Checksums;
import org.spectralsieve.library.Geometry;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.MaterialClass;
import org.spectralsieve.library.NewMaterial;
import org.spectralsieve.library.NewSample;
import org.spectralsieve.library.Provenance;
import org.spectralsieve.library.Scaling;
import org.spectralsieve.library.StatedThicknesses;
import org.spectralsieve.requirement.CrossingFinder;
import org.spectralsieve.requirement.MarginReuse;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.RequirementParser;
import org.spectralsieve.search.SearchService;
import org.spectralsieve.search.Shortlist;
import org.spectralsieve.seed.DemoLibraryLoader;
import org.spectralsieve.spectrum.PerPointArithmetic;
import org.spectralsieve.store.SpectralStore;
import org.spectralsieve.store.SyntheticCurves;
import org.springframework.core.io.DefaultResourceLoader;

/**
 * Weighted requirements through the real {@link SearchService}, with the store's weighted screen
 * ({@code store.WeightedScreen}) on and off, side by side in one run (interleaved: one search of each in
 * turn, so a noisy neighbour hurts both alike). Prints {@code BENCH search-weighted ...} lines with the
 * service's own {@code tookMs} (p50 / p95), the samples judged exactly and the store's bytes per curve;
 * asserts nothing about time. Run by {@code mvn -B -q -Pbench -pl backend -am verify}.
 *
 * <p>Libraries: {@code demo} (the committed demo library, loaded by the application's loader into a fresh
 * in-memory H2) and {@code synthetic-N} (the demo library plus N curves of {@link SyntheticCurves} as
 * library samples, three per material, so the layer's glass resolves as in the demo). Variants of one
 * requirement: {@code measured}, {@code solve} (thickness 1 to 6 mm), {@code layer} (behind 4 mm clear
 * float glass). Switches: {@code -Dbench.screenSizes=10000} (empty: demo only), {@code -Dbench.screenRuns=21}
 * (demo), {@code -Dbench.screenSyntheticRuns=5}, {@code -Dbench.limit=20}. Screens timed side by side, interleaved:
 * {@code on} (the current rule), {@code earlier} (the rule before blocks were bounded thicker than measured and
 * solved ranges split, {@link SearchService#withEarlierWeightedScreen}; {@code -Dbench.screenSkipEarlier=true}
 * leaves it out) and {@code off} ({@code -Dbench.screenSkipOff=true} leaves it out); and the judging loop
 * ({@link SearchService.Judging}): {@code on} judges by bounds in parallel, {@code on-judging-earlier} the
 * loop before that, {@code on-judging-bounded} by bounds on one thread ({@code -Dbench.screenJudging=earlier,bounded},
 * empty: neither); {@code on-earlier-layer-bounds} the layer bounds before weighted blocks behind a layer were bounded and the layer read per point
 * ({@link SearchService#withEarlierLayerBounds}; {@code -Dbench.screenSkipNoLayerBlocks=true} leaves it out).
 * {@code on-no-second-stage} the bounded loop without its second, exact-curve stage
 * ({@link SearchService#withoutSecondStage}; {@code -Dbench.screenSkipNoSecondStage=true} leaves it out).
 * {@code on-materials-whole} every material judged whole, no sample a contender of its own
 * ({@link SearchService#withMaterialsWhole}; {@code -Dbench.screenSkipMaterialsWhole=true} leaves it out).
 * {@code on-sixth-pass-loop} the loop before rows settled by thickness and second bounds up to the bar
 * ({@link SearchService#withoutSettledRows}, {@link SearchService#withEverySecondBound};
 * {@code -Dbench.screenSkipSixthPassLoop=true} leaves it out).
 * {@code on-earlier-arithmetic} the same service judging with the per-point arithmetic before the sixth pass
 * ({@link PerPointArithmetic}; {@code -Dbench.screenArithmetic=earlier} adds it).
 * {@code on-bisection} the same service with its thickness solves by bisection, as before the seventh pass
 * ({@link CrossingFinder#useBisection}; {@code -Dbench.screenRoots=bisection} adds it); for every line whose
 * searches solved a thickness, a {@code DEBUG solve-trials} line gives the root finder's trial thicknesses per
 * sample judged exactly. Its {@code same_rows} compares rows bit for bit, so it reads false where a solve's reported
 * thicknesses differ in their last bits (both finders' ends lie within {@code ThicknessSolver.TOLERANCE_MM} of the same
 * crossing; {@code RootFinderAgreementTest} checks that the rows agree within it).
 * {@code on-no-figure-codes} the service before the ninth pass: the screen's bins alone, every contender formed first
 * ({@code -Dbench.screenSkipNoFigureCodes=true} leaves it out).
 * {@code on-no-margin-reuse} the same service computing every margin a solve asks, as before the eighth pass
 * ({@link MarginReuse#use}; {@code -Dbench.screenMarginReuse=off} adds it; its rows must equal the default's or the
 * benchmark fails).
 * {@code -Dbench.screenModes=measured,solve,layer} picks the variants; {@code -Dbench.screenAlternateOrder=true} runs
 * the services in reverse order every other run; {@code -Dbench.screenTwin=true} adds {@code on-twin}, a second
 * default service, to show what two identical services differ by in the run.
 */
class WeightedScreenBenchmark {

    /** The service judged with the per-point arithmetic before the sixth pass ({@code -Dbench.screenArithmetic=earlier}). */
    private static final String EARLIER_ARITHMETIC = "on-earlier-arithmetic";
    /** The service with thickness solves by bisection, as before the seventh pass ({@code -Dbench.screenRoots=bisection}). */
    private static final String BISECTION = "on-bisection";
    /** The service computing every margin a solve asks, as before the eighth pass ({@code -Dbench.screenMarginReuse=off}). */
    private static final String NO_MARGIN_REUSE = "on-no-margin-reuse";
    /**
     * The service before the ninth pass: the screen's bins alone ({@code -Dsieve.store.figure-codes=false}, set around
     * its searches only) and every contender formed first; {@code -Dbench.screenSkipNoFigureCodes=true} leaves it out.
     */
    private static final String NO_FIGURE_CODES = "on-no-figure-codes";

    static final String WEIGHTED = "passes over 85% of led 365 and uv hazard under 0.1% and luminous over 70%";

    @Test
    void weightedSearchesWithAndWithoutTheScreen() {
        int limit = BenchStats.intProperty("bench.limit", 20);
        Map<String, Requirement> variants = new LinkedHashMap<>();
        variants.put("measured", RequirementParser.parse(WEIGHTED));
        variants.put("solve", RequirementParser.parse(WEIGHTED + ", thickness 1 to 6 mm"));
        variants.put("layer", RequirementParser.parse(WEIGHTED + ", behind 4 mm clear float glass"));
        List<String> modes = BenchStats.stringList("bench.screenModes", "measured,solve,layer");
        variants.keySet().retainAll(modes);

        time("demo", demoLibrary(), variants, limit, 2, BenchStats.intProperty("bench.screenRuns", 21));
        for (int n : BenchStats.intList("bench.screenSizes", "10000")) {
            JooqLibraryRepository library = demoLibrary();
            addSynthetic(library, n, 20261202L);
            time("synthetic-" + n, library, variants, limit, 1, BenchStats.intProperty("bench.screenSyntheticRuns", 5));
        }
    }

    private static void time(String name, JooqLibraryRepository library, Map<String, Requirement> variants, int limit,
                             int warmUps, int runs) {
        Map<String, SearchService> services = new LinkedHashMap<>();
        services.put("on", new SearchService(library));
        // the judging loop side by side (docs/weighted-screening.md, "Bounds that rank"): the earlier loop, and
        // the bounded loop on one thread; the default ("on") is the bounded loop in parallel
        for (String way : BenchStats.stringList("bench.screenJudging", "earlier,bounded")) {
            SearchService.Judging judging = switch (way) {
                case "earlier" -> SearchService.Judging.EARLIER;
                case "bounded" -> SearchService.Judging.BOUNDED;
                default -> throw new IllegalArgumentException("bench.screenJudging: earlier or bounded, not " + way);
            };
            services.put("on-judging-" + way, new SearchService(library).judging(judging));
        }
        if (BenchStats.stringList("bench.screenArithmetic", "").contains("earlier")) {
            // the per-point arithmetic before the sixth pass (PerPointArithmetic), the same service otherwise
            services.put(EARLIER_ARITHMETIC, new SearchService(library));
        }
        if (BenchStats.stringList("bench.screenRoots", "").contains("bisection")) {
            // thickness solves by bisection (CrossingFinder), the same service otherwise
            services.put(BISECTION, new SearchService(library));
        }
        if (BenchStats.stringList("bench.screenMarginReuse", "").contains("off")) {
            // every margin a solve asks computed anew, and the figure checks with their notes (MarginReuse)
            services.put(NO_MARGIN_REUSE, new SearchService(library));
        }
        if (!Boolean.getBoolean("bench.screenSkipNoFigureCodes")) {
            services.put(NO_FIGURE_CODES, new SearchService(library).withoutContenderReserve());
        }
        if (!Boolean.getBoolean("bench.screenSkipNoSecondStage")) {
            // the judging loop without its second, exact-curve stage: the rule before it, side by side
            services.put("on-no-second-stage", new SearchService(library).withoutSecondStage());
        }
        if (!Boolean.getBoolean("bench.screenSkipMaterialsWhole")) {
            // every material judged whole: the loop before samples were contenders of their own, side by side
            services.put("on-materials-whole", new SearchService(library).withMaterialsWhole());
        }
        if (Boolean.getBoolean("bench.screenTwin")) {
            // a second default service: what two identical services differ by in this run (order, caches, the JIT)
            services.put("on-twin", new SearchService(library));
        }
        if (!Boolean.getBoolean("bench.screenSkipSixthPassLoop")) {
            // the loop of the sixth pass: rows settled by thickness judged as any other, every second bound formed
            services.put("on-sixth-pass-loop", new SearchService(library).withoutSettledRows().withEverySecondBound());
        }
        if (!Boolean.getBoolean("bench.screenSkipNoLayerBlocks")) {
            // weighted blocks behind a layer not bounded: the rule before them, side by side
            services.put("on-earlier-layer-bounds", new SearchService(library).withEarlierLayerBounds());
        }
        if (!Boolean.getBoolean("bench.screenSkipEarlier")) {
            services.put("earlier", SearchService.withEarlierWeightedScreen(library));
        }
        if (!Boolean.getBoolean("bench.screenSkipOff")) {
            services.put("off", SearchService.withoutWeightedScreen(library));
        }
        for (int i = 0; i < warmUps; i++) {
            for (Map.Entry<String, SearchService> service : services.entrySet()) {
                figureCodes(!service.getKey().equals(NO_FIGURE_CODES));
                variants.values().forEach(r -> service.getValue().search(r, limit)); // JIT, each service's store
                figureCodes(true);
            }
            PerPointArithmetic.useEarlier(true);
            if (services.containsKey(EARLIER_ARITHMETIC)) {
                variants.values().forEach(r -> services.get(EARLIER_ARITHMETIC).search(r, limit));
            }
            PerPointArithmetic.useEarlier(false);
            if (services.containsKey(BISECTION)) {
                CrossingFinder.useBisection(true);
                variants.values().forEach(r -> services.get(BISECTION).search(r, limit));
                CrossingFinder.useBisection(false);
            }
            if (services.containsKey(NO_MARGIN_REUSE)) {
                MarginReuse.use(false);
                variants.values().forEach(r -> services.get(NO_MARGIN_REUSE).search(r, limit));
                MarginReuse.use(true);
            }
        }
        Map<String, double[]> took = new LinkedHashMap<>();
        Map<String, Shortlist> last = new LinkedHashMap<>();
        // the CPU the whole JVM spent per search (every thread, collector and compiler included): on a shared,
        // loaded machine it moves less than the wall time, since waiting for a core is not counted
        Map<String, double[]> cpu = new LinkedHashMap<>();
        // the root finder's trials (thickness solves) per sample judged exactly, summed over the runs
        Map<String, long[]> trials = new LinkedHashMap<>();
        for (int i = 0; i < runs; i++) {
            // -Dbench.screenAlternateOrder=true: the services in reverse order every other run, so no service is
            // always the first after another's search (an order effect of a few ms was seen at 10k under load)
            List<Map.Entry<String, SearchService>> order = new java.util.ArrayList<>(services.entrySet());
            if (Boolean.getBoolean("bench.screenAlternateOrder") && i % 2 == 1) {
                java.util.Collections.reverse(order);
            }
            for (Map.Entry<String, Requirement> variant : variants.entrySet()) {
                for (Map.Entry<String, SearchService> service : order) {
                    String key = variant.getKey() + " " + service.getKey();
                    PerPointArithmetic.useEarlier(service.getKey().equals(EARLIER_ARITHMETIC));
                    CrossingFinder.useBisection(service.getKey().equals(BISECTION));
                    MarginReuse.use(!service.getKey().equals(NO_MARGIN_REUSE));
                    figureCodes(!service.getKey().equals(NO_FIGURE_CODES));
                    Shortlist answer;
                    long cpuBefore = processCpuNanos();
                    long trialsBefore = CrossingFinder.steps();
                    try {
                        answer = service.getValue().search(variant.getValue(), limit);
                    } finally {
                        PerPointArithmetic.useEarlier(false);
                        CrossingFinder.useBisection(false);
                        MarginReuse.use(true);
                        figureCodes(true);
                    }
                    long[] t = trials.computeIfAbsent(key, k -> new long[2]);
                    t[0] += CrossingFinder.steps() - trialsBefore;
                    t[1] += answer.judgedExactly();
                    cpu.computeIfAbsent(key, k -> new double[runs])[i] = (processCpuNanos() - cpuBefore) / 1e6;
                    took.computeIfAbsent(key, k -> new double[runs])[i] = answer.tookMs();
                    last.put(key, answer);
                }
            }
        }
        SpectralStore store = services.get("on").store();
        for (String variant : variants.keySet()) {
            for (String screen : services.keySet()) {
                String key = variant + " " + screen;
                double[] m = took.get(key);
                Shortlist answer = last.get(key);
                boolean same = answer.rows().equals(last.get(variant + " on").rows());
                if (screen.equals(NO_MARGIN_REUSE) && !same) {
                    // reading a margin once per thickness must change no answer, bit for bit
                    throw new AssertionError("margin reuse changed the rows of " + variant);
                }
                System.out.printf("BENCH search-weighted library=%s curves=%d mode=%s screen=%s p50_ms=%s p95_ms=%s"
                                + " judged=%d of=%d same_rows=%s bytes_per_curve=%.0f runs=%d cpu_p50_ms=%s cpu_p95_ms=%s judgement_memo=%s%n",
                        name, store.size(), variant, screen, ms(percentile(m, 50)), ms(percentile(m, 95)),
                        answer.judgedExactly(), answer.evaluatedSamples(), same, store.bytesPerCurve(), runs,
                        ms(percentile(cpu.get(key), 50)), ms(percentile(cpu.get(key), 95)),
                        // on: every run after the first repeats a question (remembered judgements); off: a first ask's time
                        "false".equals(System.getProperty("sieve.search.judgement-memo")) ? "off" : "on");
                long[] t = trials.get(key);
                if (t[0] > 0) {
                    // a debug line, not a BENCH row: how many trial thicknesses the solves took per judged sample
                    System.out.printf("DEBUG solve-trials library=%s mode=%s screen=%s trials_per_judged=%.1f"
                            + " judged=%d runs=%d%n", name, variant, screen, (double) t[0] / Math.max(1, t[1]), t[1], runs);
                }
            }
        }
    }

    /** The store's figure codes read by the screen or not (read per query: docs/weighted-screening.md). */
    private static void figureCodes(boolean on) {
        if (on) {
            System.clearProperty("sieve.store.figure-codes");
        } else {
            System.setProperty("sieve.store.figure-codes", "false");
        }
    }

    private static long processCpuNanos() {
        return ((com.sun.management.OperatingSystemMXBean) java.lang.management.ManagementFactory
                .getOperatingSystemMXBean()).getProcessCpuTime();
    }

    /** The demo library in a freshly migrated in-memory H2, loaded by the application's loader. */
    private static JooqLibraryRepository demoLibrary() {
        JdbcDataSource ds = new JdbcDataSource();
        ds.setURL("jdbc:h2:mem:bench-screen-" + UUID.randomUUID() + ";DB_CLOSE_DELAY=-1");
        Flyway.configure().dataSource(ds).load().migrate();
        DSLContext db = DSL.using(ds, SQLDialect.H2);
        JooqLibraryRepository library = new JooqLibraryRepository(db);
        new DemoLibraryLoader(library, db, new DefaultResourceLoader(), "classpath:seed-materials/").load();
        return library;
    }

    /**
     * N synthetic curves as library samples (illustrative stock of the invented Fernhollow workshop): the
     * curves of {@link SearchBenchmark#syntheticStore} decoded from the store, three samples per material,
     * two materials in three bulk (rescalable) and the third a fixed part, as there.
     */
    private static void addSynthetic(JooqLibraryRepository library, int n, long seed) {
        SpectralStore store = SearchBenchmark.syntheticStore(n, seed);
        SyntheticCurves specs = new SyntheticCurves(seed, SpectralStore.DEFAULT_GRID);
        long material = 0;
        for (int i = 0; i < n; i++) {
            SyntheticCurves.Spec spec = specs.next();
            if (i % 3 == 0) {
                int m = i / 3;
                material = library.insertMaterial(new NewMaterial("fernhollow-synthetic-" + m,
                        "Fernhollow synthetic stock " + m, MaterialClass.of("plastic sheet"),
                        "Illustrative synthetic stock", List.of(), m % 3 != 2 ? Scaling.BULK : Scaling.FIXED,
                        SyntheticCurves.INDICES[spec.index()], new StatedThicknesses(List.of(), Double.NaN, Double.NaN)));
            }
            byte[] bytes = ("synthetic " + i).getBytes(StandardCharsets.UTF_8);
            library.insertSample(material, new NewSample(store.thicknessMm(i), Geometry.REGULAR, Provenance.MODELLED,
                    "", null, "", "", 1e-3, store.curve(i), "synthetic.csv", Checksums.sha256(bytes)));
        }
    }
}
