package org.spectralsieve.bench;

import static org.spectralsieve.bench.BenchStats.ms;
import static org.spectralsieve.bench.BenchStats.percentile;

import java.util.ArrayList;
import java.util.EnumMap;
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
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.requirement.RequirementParser;
import org.spectralsieve.search.JudgementMemo;
import org.spectralsieve.search.SearchService;
import org.spectralsieve.search.Shortlist;
import org.spectralsieve.seed.DemoLibraryLoader;
import org.spectralsieve.spectrum.Curve;
import org.springframework.core.io.DefaultResourceLoader;

/**
 * The memo of exact judgements (docs/judgement-memo.md) on the load benchmark's library shape: the demo library and
 * one illustrative material holding {@code -Dbench.memoSheets=150} sheets (ten copies of twenty edges, as the load
 * benchmark's imports make). One thread, no HTTP: each search's own {@code tookMs}.
 * <ul>
 *   <li>{@code BENCH judgement-memo-search kind=<k> requirements=fixed|varied memo=on|off p50_ms p95_ms judged runs}:
 *       the load benchmark's four requirements asked again and again ({@code fixed}; the memo's first search of each
 *       kind is a miss and counted), or with their numbers drawn per run ({@code varied}, almost every judgement a
 *       miss: what the memo costs when it cannot help), a service with the memo and one without, alternated search
 *       by search on the same library.</li>
 *   <li>{@code BENCH judgement-memo-memory entries bytes_per_entry}: the heap the memo holds, measured (used heap
 *       after collections with the memo full of the varied requirements' judgements, and again once the service
 *       dropped it), divided by its entries; curves are held weakly and not counted (the snapshot's cache holds
 *       them).</li>
 * </ul>
 * Switches: {@code -Dbench.memoRuns=15}, {@code -Dbench.memoSheets=150}. Asserts nothing about time.
 */
class JudgementMemoBenchmark {

    @Test
    void theLoadBenchmarksSearchesWithAndWithoutTheMemo() {
        alternate(false);
    }

    /** The same with every search's numbers drawn per run ({@code LoadBenchmark.Varied}): almost every judgement a miss. */
    @Test
    void variedSearchesWithAndWithoutTheMemo() {
        alternate(true);
    }

    private static void alternate(boolean varied) {
        JooqLibraryRepository library = library(BenchStats.intProperty("bench.memoSheets", 150));
        SearchService on = new SearchService(library);
        SearchService off = new SearchService(library).withoutJudgementMemo();
        int runs = BenchStats.intProperty("bench.memoRuns", 15);
        String label = varied ? "varied" : "fixed";
        Map<LoadBenchmark.Kind, List<Double>> onMs = new EnumMap<>(LoadBenchmark.Kind.class);
        Map<LoadBenchmark.Kind, List<Double>> offMs = new EnumMap<>(LoadBenchmark.Kind.class);
        Map<LoadBenchmark.Kind, Integer> judged = new EnumMap<>(LoadBenchmark.Kind.class);
        for (int run = 0; run < runs; run++) {
            for (LoadBenchmark.Kind kind : searches()) {
                var requirement = RequirementParser.parse(varied ? LoadBenchmark.Varied.requirement(kind, run)
                        : LoadBenchmark.requirementOf(kind));
                // alternate which goes first, so neither always finds the other's work warm in the caches
                SearchService first = run % 2 == 0 ? on : off;
                SearchService second = first == on ? off : on;
                Shortlist a = first.search(requirement, 20);
                Shortlist b = second.search(requirement, 20);
                if (!a.rows().equals(b.rows())) {
                    throw new IllegalStateException("memo on and off answered differently: " + requirement.text());
                }
                (first == on ? onMs : offMs).computeIfAbsent(kind, k -> new ArrayList<>()).add(a.tookMs());
                (first == on ? offMs : onMs).computeIfAbsent(kind, k -> new ArrayList<>()).add(b.tookMs());
                judged.merge(kind, a.judgedExactly(), Integer::sum);
            }
        }
        for (LoadBenchmark.Kind kind : searches()) {
            print(kind, label, "on", onMs.get(kind), judged.get(kind));
            print(kind, label, "off", offMs.get(kind), judged.get(kind));
        }
        JudgementMemo.Counts counts = on.judgementMemoCounts().orElseThrow();
        System.out.printf(Locale.ROOT, "BENCH judgement-memo-counts requirements=%s hits=%d misses=%d unkept=%d hit_rate=%.3f"
                + " entries=%d%n", label, counts.hits(), counts.misses(), counts.unkept(), counts.hitRate(), counts.entries());
    }

    @Test
    void bytesTheMemoHoldsPerEntry() {
        JooqLibraryRepository library = library(BenchStats.intProperty("bench.memoSheets", 150));
        SearchService service = new SearchService(library);
        for (int i = 0; i < 120; i++) {
            for (LoadBenchmark.Kind kind : searches()) {
                // twice: a question's judgements are kept from its second ask on
                service.search(RequirementParser.parse(LoadBenchmark.Varied.requirement(kind, i)), 20);
                service.search(RequirementParser.parse(LoadBenchmark.Varied.requirement(kind, i)), 20);
            }
        }
        JudgementMemo.Counts counts = service.judgementMemoCounts().orElseThrow();
        long full = BenchStats.usedHeapAfterGc();
        service.withoutJudgementMemo();
        long empty = BenchStats.usedHeapAfterGc();
        System.out.printf(Locale.ROOT, "BENCH judgement-memo-memory entries=%d max_entries=%d questions=%d held_bytes=%d"
                        + " bytes_per_entry=%.0f budget_mb_at_max=%.1f%n", counts.entries(), counts.maxEntries(),
                counts.questions(), full - empty, (double) (full - empty) / counts.entries(),
                (double) (full - empty) / counts.entries() * counts.maxEntries() / (1 << 20));
        service.search(RequirementParser.parse(LoadBenchmark.requirementOf(LoadBenchmark.Kind.SEARCH_FIXED)), 20);
    }

    private static List<LoadBenchmark.Kind> searches() {
        return List.of(LoadBenchmark.Kind.SEARCH_FIXED, LoadBenchmark.Kind.SEARCH_THICKNESS,
                LoadBenchmark.Kind.SEARCH_WEIGHTED, LoadBenchmark.Kind.SEARCH_BEHIND);
    }

    private static void print(LoadBenchmark.Kind kind, String requirements, String memo, List<Double> times, int judged) {
        double[] t = times.stream().mapToDouble(Double::doubleValue).toArray();
        System.out.printf(Locale.ROOT, "BENCH judgement-memo-search kind=%s requirements=%s memo=%s p50_ms=%s p95_ms=%s"
                        + " judged_mean=%.1f runs=%d%n", kind.label(), requirements, memo, ms(percentile(t, 50)),
                ms(percentile(t, 95)), (double) judged / t.length, t.length);
    }

    /** The demo library and one bulk sheet material with {@code sheets} samples of the load benchmark's imports. */
    private static JooqLibraryRepository library(int sheets) {
        DSLContext db = MigratedDatabase.freshH2();
        JooqLibraryRepository library = new JooqLibraryRepository(db);
        new DemoLibraryLoader(library, db, new DefaultResourceLoader(), "classpath:seed-materials/").load();
        long material = library.insertMaterial(new NewMaterial("illustrative-memo-sheet", "Illustrative memo sheet",
                MaterialClass.of("plastic sheet"), "illustrative, generated", List.of(), Scaling.BULK, new ConstantIndex(1.49)));
        for (int k = 0; k < sheets; k++) {
            double edge = 360 + Math.floorMod(k, 20);
            double[] nm = new double[276];
            double[] t = new double[nm.length];
            for (int w = 0; w < nm.length; w++) {
                nm[w] = 250 + 2 * w;
                t[w] = 0.001 + 0.9 / (1 + Math.exp(-(nm[w] - edge) / 6.0));
            }
            double mm = 1 + Math.floorMod(k, 9) * 0.5;
            library.insertSample(material, new NewSample(mm, Geometry.REGULAR, Provenance.MEASURED, "", null, "",
                    "illustrative sheet " + k, 1e-3, Curve.of(nm, t, 1e-3), "sheet-" + k + ".csv",
                    String.format(Locale.ROOT, "%064x", 9_000_000L + k)));
        }
        return library;
    }
}
