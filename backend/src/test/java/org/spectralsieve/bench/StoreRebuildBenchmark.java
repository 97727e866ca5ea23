package org.spectralsieve.bench;

import static org.spectralsieve.bench.BenchStats.ms;
import static org.spectralsieve.bench.BenchStats.percentile;

import java.nio.charset.StandardCharsets;
import java.util.List;
import java.util.Locale;
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
import org.spectralsieve.library.Material;
import org.spectralsieve.library.NewSample;
import org.spectralsieve.library.Provenance;
import org.spectralsieve.library.SourceFile;
import org.spectralsieve.search.SearchService;
import org.spectralsieve.seed.DemoLibraryLoader;
import org.spectralsieve.spectrum.Curve;
import org.springframework.core.io.DefaultResourceLoader;

/**
 * What one import costs the search store, side by side in one run (docs/search-under-load.md): the
 * illustrative demo library in an in-memory H2 database, then {@code bench.rebuildImports} imports (276-point
 * curves, as the load benchmark sends), first into three materials in turn ({@code into=three}), then, on a new
 * database, all into one material as the load benchmark does ({@code into=one}); after each, three services on
 * the same database are brought up to date, in a rotating order:
 * <ul>
 *   <li>{@code variant=whole}: {@code invalidate()} then {@code store()}, what every import did before
 *       (the whole library read and encoded again);</li>
 *   <li>{@code variant=partial-earlier}: {@code refresh()} the way before the ninth pass
 *       ({@code withEarlierRebuild()}): the changed material read whole, every sample's row looked up one by one and
 *       copied (in runs), the decoded curves carried one by one;</li>
 *   <li>{@code variant=partial}: {@code refresh()}, what an import does now (only the sample the change log names
 *       read again, the other materials' rows, made thicknesses and curves carried as a whole).</li>
 * </ul>
 * Prints {@code BENCH rebuild variant=<v> into=<three|one> imports=<n> curves_at_end=<c> p50_ms p95_ms max_ms}. The services
 * answer the same (StoreRebuildReuseTest); nothing here asserts a time.
 */
class StoreRebuildBenchmark {

    @Test
    void oneImportsRebuildWholeAgainstPartial() {
        int imports = BenchStats.intProperty("bench.rebuildImports", 200);
        rebuilds("three", imports, i -> i % 3 * 7);
        // as the load benchmark imports: every one into the same material, which grows to hundreds of samples
        rebuilds("one", imports, i -> 0);
    }

    private static void rebuilds(String into, int imports, java.util.function.IntUnaryOperator materialOf) {
        JdbcDataSource dataSource = new JdbcDataSource();
        dataSource.setURL("jdbc:h2:mem:" + UUID.randomUUID() + ";DB_CLOSE_DELAY=-1");
        Flyway.configure().dataSource(dataSource).load().migrate();
        DSLContext db = DSL.using(dataSource, SQLDialect.H2);
        JooqLibraryRepository library = new JooqLibraryRepository(db);
        new DemoLibraryLoader(library, db, new DefaultResourceLoader(), "classpath:seed-materials/").load();
        List<Material> materials = library.findMaterials(null, null);
        SearchService whole = new SearchService(library);
        SearchService earlier = new SearchService(library).withEarlierRebuild();
        SearchService partial = new SearchService(library);
        whole.store();
        earlier.store();
        partial.store();

        double[] wholeMs = new double[imports];
        double[] earlierMs = new double[imports];
        double[] partialMs = new double[imports];
        for (int i = 0; i < imports; i++) {
            importInto(library, materials.get(materialOf.applyAsInt(i)).id(), i);
            // the three in a rotating order, so none is always first after the write (caches, the JIT)
            for (int k = 0; k < 3; k++) {
                switch ((i + k) % 3) {
                    case 0 -> wholeMs[i] = timeWhole(whole);
                    case 1 -> earlierMs[i] = timePartial(earlier);
                    default -> partialMs[i] = timePartial(partial);
                }
            }
        }
        int curves = partial.store().size();
        if (curves != whole.store().size() || curves != earlier.store().size()) {
            throw new IllegalStateException("the services hold different stores: " + curves + ", "
                    + whole.store().size() + " and " + earlier.store().size());
        }
        print("whole", into, imports, curves, wholeMs);
        print("partial-earlier", into, imports, curves, earlierMs);
        print("partial", into, imports, curves, partialMs);
    }

    private static double timeWhole(SearchService service) {
        long t0 = System.nanoTime();
        service.invalidate();
        service.store();
        return (System.nanoTime() - t0) / 1e6;
    }

    private static double timePartial(SearchService service) {
        long t0 = System.nanoTime();
        service.refresh();
        return (System.nanoTime() - t0) / 1e6;
    }

    private static void print(String variant, String into, int imports, int curves, double[] times) {
        System.out.printf(Locale.ROOT, "BENCH rebuild variant=%s into=%s imports=%d curves_at_end=%d p50_ms=%s p95_ms=%s max_ms=%s%n",
                variant, into, imports, curves, ms(percentile(times, 50)), ms(percentile(times, 95)), ms(percentile(times, 100)));
    }

    /** The load benchmark's invented curve: a logistic edge near 370 nm, 250–800 nm every 2 nm (illustrative). */
    private static void importInto(JooqLibraryRepository library, long materialId, int i) {
        StringBuilder csv = new StringBuilder("wavelength_nm,transmittance\n# illustrative rebuild-bench sheet " + i + "\n");
        double edge = 360 + Math.floorMod(i, 20);
        double[] nm = new double[276];
        double[] t = new double[276];
        for (int k = 0; k < nm.length; k++) {
            nm[k] = 250 + 2 * k;
            t[k] = 0.001 + 0.9 / (1 + Math.exp(-(nm[k] - edge) / 6.0));
            csv.append((int) nm[k]).append(',').append(String.format(Locale.ROOT, "%.6f", t[k])).append('\n');
        }
        byte[] bytes = csv.toString().getBytes(StandardCharsets.UTF_8);
        SourceFile file = new SourceFile("rebuild-" + i + ".csv", "text/csv", "delimited", bytes, Checksums.sha256(bytes));
        library.storeImport(materialId, null, new NewSample(1 + Math.floorMod(i, 9) * 0.5, Geometry.REGULAR,
                Provenance.MEASURED, "", null, "", "rebuild bench " + i, 1e-3, Curve.of(nm, t, 1e-3), file.fileName(),
                file.sha256()), file);
    }
}
