package org.spectralsieve.bench;

import java.util.ArrayList;
import java.util.List;
import java.util.stream.IntStream;
import org.spectralsieve.requirement.Candidate;
import org.spectralsieve.requirement.MaterialEvaluation;
import org.spectralsieve.requirement.Ranking;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.RequirementParser;
import org.spectralsieve.requirement.SampleEvaluator;
import org.spectralsieve.store.SpectralStore;
import org.spectralsieve.store.StoreHit;
import org.spectralsieve.store.StoreResult;
import org.spectralsieve.store.StoreSearch;
import org.spectralsieve.store.StoredMaterial;
import org.spectralsieve.store.SyntheticCurves;

/**
 * One side of {@link EarlierBuildSearchBenchmark}, loaded once per build by its own class loader: the store of
 * {@link SearchBenchmark#syntheticStore} (same seed, same curves) and one timed search. Uses only the core's
 * public classes, which an earlier build has too; the JDK's types only cross the class loaders.
 */
public final class SideOfTheComparison {

    private static final String REQUIREMENT = "passes over 80% at 365 nm and blocks under 1% at 405 nm"
            + " and passes at least 70% from 380 to 400 nm"; // SearchBenchmark.REQUIREMENT
    private final SpectralStore store;
    private final Requirement fixed = RequirementParser.parse(REQUIREMENT);
    private final Requirement solve = RequirementParser.parse(REQUIREMENT + ", thickness 1 to 6 mm");

    public SideOfTheComparison(int n) {
        SyntheticCurves synthetic = new SyntheticCurves(20261202L, SpectralStore.DEFAULT_GRID);
        SpectralStore.Builder builder = SpectralStore.builder(SpectralStore.DEFAULT_GRID, n);
        int batch = 8192;
        for (int start = 0; start < n; start += batch) {
            int count = Math.min(batch, n - start);
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
                        specs[k].thicknessMm(), material % 3 != 2, false, SyntheticCurves.INDICES[specs[k].index()],
                        codes[k]);
            }
        }
        store = builder.build();
    }

    /** One search ({@code fixed} or {@code solve}, limit 20): the store's ms, the whole search's ms, the rows' hash. */
    public double[] search(String mode) {
        Requirement r = mode.equals("solve") ? solve : fixed;
        long t0 = System.nanoTime();
        StoreResult picked = StoreSearch.search(store, r, 20);
        long t1 = System.nanoTime();
        List<MaterialEvaluation> exact = new ArrayList<>();
        for (StoreHit hit : picked.hits()) {
            Candidate c = new Candidate(hit.sampleId(), hit.material().id(), hit.material().name(), store.curve(hit.curve()),
                    store.thicknessMm(hit.curve()), store.isBulk(hit.curve()), SyntheticCurves.INDICES[0]);
            exact.add(MaterialEvaluation.of(c, SampleEvaluator.evaluate(c, r)));
        }
        Ranking.rank(exact, 20);
        long t2 = System.nanoTime();
        return new double[] {(t1 - t0) / 1e6, (t2 - t0) / 1e6, picked.hits().toString().hashCode(), picked.refinedSamples()};
    }

    /** The answer of {@link #search} read back on the caller's side. */
    record Timing(double storeMs, double wholeMs, String rows) {
        static Timing of(double[] answer) {
            return new Timing(answer[0], answer[1], (long) answer[2] + "/" + (long) answer[3]);
        }
    }
}
