package org.spectralsieve.bench;

import static org.spectralsieve.bench.BenchStats.ms;
import static org.spectralsieve.bench.BenchStats.percentile;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.UUID;
import org.flywaydb.core.Flyway;
import org.h2.jdbcx.JdbcDataSource;
import org.jooq.DSLContext;
import org.jooq.SQLDialect;
import org.jooq.impl.DSL;
import org.junit.jupiter.api.Test;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.requirement.Candidate;
import org.spectralsieve.requirement.MaterialEvaluation;
import org.spectralsieve.requirement.Ranking;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.RequirementParser;
import org.spectralsieve.requirement.SampleEvaluator;
import org.spectralsieve.requirement.StackLayer;
import org.spectralsieve.search.SearchService;
import org.spectralsieve.search.Shortlist;
import org.spectralsieve.seed.DemoLibraryLoader;
import org.spectralsieve.store.SpectralStore;
import org.spectralsieve.store.SyntheticCurves;
import org.springframework.core.io.DefaultResourceLoader;

/**
 * Requirements the store cannot rank (weighted figures, a fixed layer, thickness solved through the stack):
 * every admitted sample is judged exactly. Run by {@code mvn -B -q -Pbench -pl backend -am verify}; prints
 * {@code BENCH weighted ...} lines, asserts nothing about time.
 *
 * <p>Three variants of one weighted requirement, timed side by side (interleaved, one run of each in turn,
 * so a noisy neighbour hurts all alike): {@code measured} as is, {@code layer} behind a fixed layer,
 * {@code layer-solve} with a thickness range solved through that layer; {@code solve} is the range without
 * the layer. Libraries:
 * <ul>
 *   <li>{@code demo}: the committed demo library loaded into a fresh in-memory H2 by the application's own
 *       {@link DemoLibraryLoader}, searched by the real {@link SearchService} (no Spring; the service's first
 *       search builds its store, which the warm-up absorbs). Curves are read from the database per search, as
 *       in the service.</li>
 *   <li>{@code synthetic-N}: N curves from {@link SyntheticCurves} (three samples per material, two thirds
 *       bulk), judged by the same steps as {@code BoundedExactSearch.searchExactly} for these requirements: no
 *       every-point transmittance clause, so the store proves no miss and every sample is judged by
 *       {@link SampleEvaluator} with the layer the demo search resolved, then {@link Ranking#rank}. Curves are
 *       decoded from the store once, before timing (the service reads them from the database instead).</li>
 * </ul>
 * Switches: {@code -Dbench.weightedSizes=10000} (synthetic sizes, empty for the demo library only),
 * {@code -Dbench.weightedRuns=21} (demo), {@code -Dbench.weightedSyntheticRuns=5}, {@code -Dbench.limit=20}.
 */
class WeightedSearchBenchmark {

    static final String WEIGHTED = "passes over 85% of led 365 and uv hazard under 0.1% and luminous over 70%";
    static final String LAYER = "behind 4 mm clear float glass";
    static final String RANGE = "thickness 1 to 6 mm";

    @Test
    void weightedSearches() {
        int limit = BenchStats.intProperty("bench.limit", 20);
        Map<String, Requirement> variants = new LinkedHashMap<>();
        variants.put("measured", RequirementParser.parse(WEIGHTED));
        variants.put("solve", RequirementParser.parse(WEIGHTED + ", " + RANGE));
        variants.put("layer", RequirementParser.parse(WEIGHTED + ", " + LAYER));
        variants.put("layer-solve", RequirementParser.parse(WEIGHTED + ", " + LAYER + ", " + RANGE));

        SearchService service = new SearchService(demoLibrary());
        Shortlist probe = service.search(variants.get("layer"), limit);
        StackLayer layer = probe.layer().orElseThrow();
        System.out.printf("BENCH weighted library=demo samples=%d layer_sample=%d requirement=\"%s\"%n",
                probe.evaluatedSamples(), layer.sampleId(), WEIGHTED);
        time("demo", variants, 2, BenchStats.intProperty("bench.weightedRuns", 21),
                requirement -> service.search(requirement, limit).judgedExactly());

        for (int n : BenchStats.intList("bench.weightedSizes", "10000")) {
            List<Candidate> candidates = syntheticCandidates(n, 20261202L);
            // one warm-up round: the code is warm from the demo library already
            time("synthetic-" + n, variants, 1, BenchStats.intProperty("bench.weightedSyntheticRuns", 5),
                    requirement -> judgeEverySample(candidates, requirement, layer, limit));
        }
    }

    private interface Search {
        int run(Requirement requirement);
    }

    private static void time(String library, Map<String, Requirement> variants, int warmUps, int runs, Search search) {
        for (int i = 0; i < warmUps; i++) {
            variants.values().forEach(search::run); // warm-up: JIT, the service's store
        }
        Map<String, double[]> ms = new LinkedHashMap<>();
        Map<String, Integer> judged = new LinkedHashMap<>();
        variants.keySet().forEach(mode -> ms.put(mode, new double[runs]));
        for (int i = 0; i < runs; i++) {
            for (Map.Entry<String, Requirement> variant : variants.entrySet()) {
                long t0 = System.nanoTime();
                judged.put(variant.getKey(), search.run(variant.getValue()));
                ms.get(variant.getKey())[i] = (System.nanoTime() - t0) / 1e6;
            }
        }
        for (String mode : variants.keySet()) {
            double[] m = ms.get(mode);
            int count = judged.get(mode);
            System.out.printf("BENCH weighted library=%s mode=%s p50_ms=%s p95_ms=%s judged=%d per_sample_ms=%s runs=%d%n",
                    library, mode, ms(percentile(m, 50)), ms(percentile(m, 95)), count,
                    ms(percentile(m, 50) / Math.max(1, count)), runs);
        }
    }

    /** The demo library in a freshly migrated in-memory H2, loaded by the application's loader. */
    private static JooqLibraryRepository demoLibrary() {
        JdbcDataSource ds = new JdbcDataSource();
        ds.setURL("jdbc:h2:mem:bench-weighted-" + UUID.randomUUID() + ";DB_CLOSE_DELAY=-1");
        Flyway.configure().dataSource(ds).load().migrate();
        DSLContext db = DSL.using(ds, SQLDialect.H2);
        JooqLibraryRepository library = new JooqLibraryRepository(db);
        new DemoLibraryLoader(library, db, new DefaultResourceLoader(), "classpath:seed-materials/").load();
        return library;
    }

    /** The curves of {@link SearchBenchmark#syntheticStore} (same seed, same order), with their own indices. */
    private static List<Candidate> syntheticCandidates(int n, long seed) {
        SpectralStore store = SearchBenchmark.syntheticStore(n, seed);
        SyntheticCurves specs = new SyntheticCurves(seed, SpectralStore.DEFAULT_GRID);
        List<Candidate> out = new ArrayList<>(n);
        for (int i = 0; i < n; i++) {
            SyntheticCurves.Spec spec = specs.next();
            int material = i / 3;
            out.add(new Candidate(store.sampleId(i), material + 1L, "material " + material, store.curve(i),
                    store.thicknessMm(i), store.isBulk(i), SyntheticCurves.INDICES[spec.index()]));
        }
        return out;
    }

    private static int judgeEverySample(List<Candidate> candidates, Requirement requirement, StackLayer layer, int limit) {
        Optional<StackLayer> used = requirement.layer().isPresent() ? Optional.of(layer) : Optional.empty();
        List<MaterialEvaluation> exact = new ArrayList<>(candidates.size());
        for (Candidate c : candidates) {
            exact.add(MaterialEvaluation.of(c, SampleEvaluator.evaluate(c, requirement, used)));
        }
        if (Ranking.rank(exact, limit).isEmpty()) {
            throw new IllegalStateException("no rows");
        }
        return exact.size();
    }
}
