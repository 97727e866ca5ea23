package org.spectralsieve.search;

import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import org.jooq.DSLContext;
import org.junit.jupiter.api.Test;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.MigratedDatabase;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.optics.Illumination;
import org.spectralsieve.optics.Layer;
import org.spectralsieve.optics.LightPath;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.RequirementParser;
import org.spectralsieve.seed.DemoLibraryLoader;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.store.SpectralStore;
import org.springframework.core.io.DefaultResourceLoader;

/**
 * Light at an angle in the weighted search (docs/oblique-incidence.md, docs/benchmarks.md "Light at an angle"): the
 * cost of the angle integral itself, then the service's search on the demo library and on the 10,000-curve synthetic
 * library of {@link ServiceWeightedBenchmark}, for normal incidence and each light, side by side in one run (the
 * lights alternated run by run, medians reported).
 *
 * <p>Prints {@code BENCH angled-integration light=… angles=… points=… us_per_curve=… ns_per_point_angle=…} (one
 * curve of the store's grid through the oblique path, every point and its detection limit formed), and
 * {@code BENCH angled-search library=demo|synthetic-10k mode=measured|solve light=… p50_ms p95_ms judged evaluated
 * runs}, the services without their judgement memo (every search judges anew). Asserts nothing about time. Switches: {@code -Dbench.angledRuns=5}, {@code -Dbench.angledSolveRuns=1} (the synthetic
 * library's solve; the demo's takes {@code angledRuns}), {@code -Dbench.angledSolveLights=,under an LED with 120° beam
 * angle} (the lights of the synthetic solve, comma-separated, empty for normal incidence),
 * {@code -Dbench.angledBase=9999} (0 skips the synthetic library), {@code -Dbench.limit=20}.
 */
class AngledSearchBenchmark {

    private static final String[] LIGHTS = {"", "at 30° incidence", "over a 60° beam", "under an LED with 120° beam angle"};

    @Test
    void lightAtAnAngleInTheWeightedSearch() {
        integrationCost();
        int runs = StoreWeightedBenchmark.intProperty("bench.angledRuns", 5);
        int solveRuns = StoreWeightedBenchmark.intProperty("bench.angledSolveRuns", 1);
        int limit = StoreWeightedBenchmark.intProperty("bench.limit", 20);

        DSLContext db = MigratedDatabase.freshH2();
        JooqLibraryRepository library = new JooqLibraryRepository(db);
        new DemoLibraryLoader(library, db, new DefaultResourceLoader(), "classpath:seed-materials/").load();
        // without the judgement memo: a search asked again would be handed its earlier judgements (docs/judgement-memo.md)
        SearchService demo = new SearchService(library).withoutJudgementMemo();
        searches("demo", demo, limit, runs, runs, List.of(LIGHTS), true);

        int base = StoreWeightedBenchmark.intProperty("bench.angledBase", 9999);
        if (base > 0) {
            ServiceWeightedBenchmark.Base synthetic = ServiceWeightedBenchmark.base(base, 20261202L);
            SearchService service = SearchService.over(synthetic.snapshot(), id -> Optional.of(synthetic.curveOf(id)))
                    .withoutJudgementMemo();
            // a solve at an angle judges every row at dozens of thicknesses: at 10k, one run of the heaviest light beside
            // normal incidence, after the measured mode has warmed the same code
            searches("synthetic-" + (base + 1) / 1000 + "k", service, limit, runs, solveRuns,
                    List.of(System.getProperty("bench.angledSolveLights", ",under an LED with 120° beam angle").split(",", -1)),
                    false);
        }
    }

    /** One curve of the store's grid through the oblique path under each light: the integral's own cost. */
    private static void integrationCost() {
        double[] grid = SpectralStore.DEFAULT_GRID.points();
        double[] t = new double[grid.length];
        for (int i = 0; i < t.length; i++) {
            t[i] = 0.05 + 0.85 / (1 + Math.exp(-(grid[i] - 360) / 8)); // an illustrative absorption edge at 360 nm
        }
        LightPath path = LightPath.of(Layer.bulk(Curve.of(grid, t, 1e-4), 3, 4, new ConstantIndex(1.49)));
        Illumination[] lights = new Illumination[LIGHTS.length];
        for (int l = 0; l < lights.length; l++) {
            lights[l] = LIGHTS[l].isEmpty() ? Illumination.NORMAL : RequirementParser.parseLight(LIGHTS[l]);
        }
        int reps = 60;
        double[][] us = new double[lights.length][reps];
        for (int r = -30; r < reps; r++) { // the first 30 rounds warm up; the lights alternate round by round
            for (int l = 0; l < lights.length; l++) {
                long t0 = System.nanoTime();
                Curve seen = path.transmittance(lights[l]);
                if (seen.size() != grid.length) {
                    throw new IllegalStateException("the path lost points");
                }
                if (r >= 0) {
                    us[l][r] = (System.nanoTime() - t0) / 1e3;
                }
            }
        }
        for (int l = 0; l < lights.length; l++) {
            Illumination light = lights[l];
            int angles = light.normal() ? 0 : light.spread().nodes(org.spectralsieve.optics.ObliquePath.ANGLES)[0].length;
            double[] sorted = us[l].clone();
            Arrays.sort(sorted);
            double median = sorted[reps / 2];
            System.out.printf(Locale.ROOT, "BENCH angled-integration light=\"%s\" angles=%d points=%d us_per_curve=%.0f"
                            + " ns_per_point_angle=%s%n", light.words().isEmpty() ? "normal" : light.words(), angles, grid.length,
                    median, angles == 0 ? "-" : String.format(Locale.ROOT, "%.1f", median * 1e3 / grid.length / angles));
        }
    }

    private static void searches(String libraryName, SearchService service, int limit, int runs, int solveRuns,
                                 List<String> solveLights, boolean warmSolve) {
        Map<String, String> modes = new LinkedHashMap<>();
        modes.put("measured", StoreWeightedBenchmark.WEIGHTED);
        modes.put("solve", StoreWeightedBenchmark.WEIGHTED + ", thickness 1 to 6 mm");
        for (Map.Entry<String, String> mode : modes.entrySet()) {
            int n = mode.getKey().equals("solve") ? solveRuns : runs;
            Map<String, Requirement> byLight = new LinkedHashMap<>();
            boolean solve = mode.getKey().equals("solve");
            for (String words : solve ? solveLights.toArray(String[]::new) : LIGHTS) {
                byLight.put(words.isEmpty() ? "normal" : words,
                        RequirementParser.parse(mode.getValue() + (words.isEmpty() ? "" : ", " + words)));
            }
            if (!solve || warmSolve) {
                byLight.values().forEach(r -> service.search(r, limit)); // warm-up
            }
            Map<String, double[]> ms = new LinkedHashMap<>();
            Map<String, Shortlist> last = new LinkedHashMap<>();
            byLight.keySet().forEach(k -> ms.put(k, new double[n]));
            for (int r = 0; r < n; r++) {
                for (Map.Entry<String, Requirement> light : byLight.entrySet()) {
                    long t0 = System.nanoTime();
                    last.put(light.getKey(), service.search(light.getValue(), limit));
                    ms.get(light.getKey())[r] = (System.nanoTime() - t0) / 1e6;
                }
            }
            for (String light : byLight.keySet()) {
                double[] sorted = ms.get(light).clone();
                Arrays.sort(sorted);
                Shortlist answer = last.get(light);
                System.out.printf(Locale.ROOT, "BENCH angled-search library=%s mode=%s light=\"%s\" p50_ms=%.1f p95_ms=%.1f"
                                + " judged=%d evaluated=%d runs=%d top=%s%n", libraryName, mode.getKey(), light, sorted[n / 2],
                        sorted[Math.min(n - 1, (int) Math.ceil(n * 0.95) - 1)], answer.judgedExactly(),
                        answer.evaluatedSamples(), n, answer.rows().isEmpty() ? "-" : answer.rows().get(0).evaluation().verdict()
                                + "/" + String.format(Locale.ROOT, "%.4f", answer.rows().get(0).evaluation().worstMarginDecades()));
            }
        }
    }

    static List<String> lights() {
        return List.of(LIGHTS);
    }
}
