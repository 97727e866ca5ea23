package org.spectralsieve.search;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.stream.IntStream;
import org.junit.jupiter.api.Test;
import org.spectralsieve.library.Geometry;
import org.spectralsieve.library.Material;
import org.spectralsieve.library.MaterialClass;
import org.spectralsieve.library.Provenance;
import org.spectralsieve.library.SampleInfo;
import org.spectralsieve.library.Scaling;
import org.spectralsieve.requirement.RankedRow;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.RequirementParser;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.store.SpectralStore;
import org.spectralsieve.store.SyntheticCurves;

/**
 * The service's own weighted search ({@link SearchService#search}) over a synthetic library of up to a million
 * curves, without the database (H2 cannot be filled with a million curves in a benchmark's time): the snapshot is
 * formed from synthetic material and sample records by {@link SnapshotReader#ofRecords}, the production loop that
 * forms a snapshot from the database's records, and the service answers from it ({@link SearchService#over}); a curve
 * its cache does not hold is read from the synthetic source as it would be from the database. The curves and
 * materials are {@link StoreWeightedBenchmark}'s (same seed, materials of three samples, every third material a fixed
 * part); each material takes the refractive index of its first curve (a library material has one). A library larger
 * than the base ({@code -Dbench.serviceWeightedBase=9999}, a multiple of three) repeats the base's materials, each
 * row carried from the base store with its screen ({@code SpectralStore.Builder.addCarried}), as
 * {@link StoreWeightedBenchmark} does (screening a synthetic curve on insertion costs milliseconds).
 *
 * <p>Prints {@code BENCH service-weighted curves=<n> mode=measured|solve variant=deferred-bins|slot-sweep|row-arrays|maps
 * p50_ms p95_ms judged runs same_rows}: {@code deferred-bins} is the default (a solve's bins left unread where the
 * figure codes prove no miss, read in full for the contenders formed; as measured the same as {@code slot-sweep}),
 * {@code slot-sweep} the twelfth pass before it, every bin read ({@code -Dsieve.search.deferred-bins=false}; as
 * measured, the sweep over the snapshot index's slots and the screen's bounds read in place), {@code row-arrays} and
 * {@code maps} every bin read too; {@code row-arrays} the eleventh pass's per-sample
 * bounds in arrays indexed by the store's row ({@code -Dsieve.search.slot-sweep=false}), {@code maps} the boxed maps
 * keyed by sample id before ({@code -Dsieve.search.row-arrays=false}), alternated run by run in one JVM;
 * {@code judged} is the answer's count of exact judgements. Asserts nothing about time. Switches:
 * {@code -Dbench.serviceWeightedSizes=100000,1000000}, {@code -Dbench.serviceWeightedRuns=5},
 * {@code -Dbench.serviceWeightedModes=measured,solve},
 * {@code -Dbench.serviceWeightedVariants=deferred-bins,slot-sweep,row-arrays,maps},
 * {@code -Dbench.limit=20}.
 *
 * <p>Its {@code judged} counts what {@link StoreWeightedBenchmark}'s does (rows judged exactly), but the libraries
 * differ: that one repeats 10,000 rows by default (triples shifted by a row from copy to copy, an index per curve), so
 * the counts are comparable only with {@code -Dbench.storeWeightedBase=9999} there (docs/benchmarks.md, "why the
 * service's 1M solve judges 4,264 samples").
 */
class ServiceWeightedBenchmark {

    private static final int BATCH = 8192;

    @Test
    void theServicesWeightedSearchOverAMillionCurves() {
        int limit = StoreWeightedBenchmark.intProperty("bench.limit", 20);
        int runs = StoreWeightedBenchmark.intProperty("bench.serviceWeightedRuns", 5);
        int base = StoreWeightedBenchmark.intProperty("bench.serviceWeightedBase", 9999);
        if (base % 3 != 0) {
            throw new IllegalArgumentException("the base must be a multiple of three (whole materials), got " + base);
        }
        Map<String, Requirement> modes = new LinkedHashMap<>();
        modes.put("measured", RequirementParser.parse(StoreWeightedBenchmark.WEIGHTED));
        modes.put("solve", RequirementParser.parse(StoreWeightedBenchmark.WEIGHTED + ", thickness 1 to 6 mm"));
        modes.keySet().retainAll(Arrays.asList(System.getProperty("bench.serviceWeightedModes", "measured,solve").split(",")));
        String[] variants = System.getProperty("bench.serviceWeightedVariants", "deferred-bins,slot-sweep,row-arrays,maps").split(",");
        long t0 = System.nanoTime();
        Base synthetic = base(base, 20261202L);
        System.out.printf(Locale.ROOT, "BENCH service-weighted-setup base=%d build_s=%.1f%n", base, (System.nanoTime() - t0) / 1e9);
        for (String size : System.getProperty("bench.serviceWeightedSizes", "100000,1000000").split(",")) {
            if (size.isBlank()) {
                continue;
            }
            int n = Integer.parseInt(size.trim());
            long t1 = System.nanoTime();
            Snapshot snapshot = n <= base ? synthetic.snapshot : repeated(synthetic, n);
            System.out.printf(Locale.ROOT, "BENCH service-weighted-setup curves=%d build_s=%.1f%n", snapshot.store().size(),
                    (System.nanoTime() - t1) / 1e9);
            Map<String, SearchService> services = new LinkedHashMap<>();
            for (String variant : variants) {
                services.put(variant.trim(), SearchService.over(snapshot, id -> Optional.of(synthetic.curveOf(id)))
                        .withRowArrays(!variant.trim().equals("maps"))
                        .withSlotSweep(variant.trim().equals("slot-sweep") || variant.trim().equals("deferred-bins"))
                        .withDeferredBins(variant.trim().equals("deferred-bins")));
            }
            for (Map.Entry<String, Requirement> mode : modes.entrySet()) {
                services.values().forEach(service -> service.search(mode.getValue(), limit)); // warm-up
                Map<String, double[]> ms = new LinkedHashMap<>();
                Map<String, Shortlist> last = new LinkedHashMap<>();
                Map<String, Boolean> same = new LinkedHashMap<>();
                services.keySet().forEach(v -> {
                    ms.put(v, new double[runs]);
                    same.put(v, true);
                });
                for (int r = 0; r < runs; r++) {
                    for (Map.Entry<String, SearchService> variant : services.entrySet()) {
                        long t = System.nanoTime();
                        Shortlist answer = variant.getValue().search(mode.getValue(), limit);
                        ms.get(variant.getKey())[r] = (System.nanoTime() - t) / 1e6;
                        last.put(variant.getKey(), answer);
                        // each variant's rows against the first variant's, run by run (only the work may differ)
                        same.merge(variant.getKey(), rowsOf(answer).equals(rowsOf(last.values().iterator().next())),
                                Boolean::logicalAnd);
                    }
                }
                for (String v : services.keySet()) {
                    double[] sorted = ms.get(v).clone();
                    Arrays.sort(sorted);
                    System.out.printf(Locale.ROOT, "BENCH service-weighted curves=%d mode=%s variant=%s p50_ms=%.1f p95_ms=%.1f"
                                    + " judged=%d runs=%d same_rows=%s rows=%d%n", snapshot.store().size(), mode.getKey(), v,
                            sorted[runs / 2], sorted[Math.min(runs - 1, (int) Math.ceil(runs * 0.95) - 1)],
                            last.get(v).judgedExactly(), runs, same.get(v), last.get(v).rows().size());
                }
            }
        }
    }

    private static List<String> rowsOf(Shortlist answer) {
        List<String> out = new ArrayList<>();
        for (RankedRow r : answer.rows()) {
            out.add(r.materialId() + " " + r.evaluation().sampleId() + " " + r.evaluation().standing() + " "
                    + r.evaluation().worstMarginDecades() + " " + r.evaluation().thicknessMm());
        }
        return out;
    }

    /**
     * The base library: its material records, its snapshot (each curve added through {@code Builder.add}, so the
     * store screens it as a loaded library's) and the decoded curve of each sample, by row.
     */
    record Base(List<Material> materials, Snapshot snapshot, Curve[] curves) {

        /** The stored curve of a sample of the base or of a library repeating it (sample id i + 1 is row i). */
        Curve curveOf(long sampleId) {
            return curves[(int) ((sampleId - 1) % curves.length)];
        }
    }

    static Base base(int n, long seed) {
        SyntheticCurves synthetic = new SyntheticCurves(seed, SpectralStore.DEFAULT_GRID);
        double[] grid = SpectralStore.DEFAULT_GRID.points();
        Curve[] curves = new Curve[n];
        SyntheticCurves.Spec[] specs = new SyntheticCurves.Spec[n];
        for (int start = 0; start < n; start += BATCH) {
            int count = Math.min(BATCH, n - start);
            int from = start;
            for (int k = 0; k < count; k++) {
                specs[from + k] = synthetic.next();
            }
            IntStream.range(0, count).parallel().forEach(k -> curves[from + k] = StoreWeightedBenchmark.curveOf(synthetic.codes(specs[from + k]), grid));
        }
        List<Material> materials = new ArrayList<>();
        for (int m = 0; m < n / 3; m++) {
            materials.add(material(m, k -> specs[k].thicknessMm(), SyntheticCurves.INDICES[specs[3 * m].index()]));
        }
        Snapshot snapshot = SnapshotReader.ofRecords(materials, (builder, sample, stored, thicknessMm, bulk, total, index) -> {
            Curve curve = curves[(int) (sample.id() - 1)];
            builder.add(sample.id(), stored, thicknessMm, bulk, total, index, curve);
            return curve;
        }, SearchService.DEFAULT_CURVE_CACHE_BYTES);
        return new Base(materials, snapshot, curves);
    }

    /** n samples (a multiple of three) repeating the base's materials, each row carried from the base store. */
    private static Snapshot repeated(Base base, int n) {
        int baseSize = base.curves().length;
        List<Material> materials = new ArrayList<>(n / 3);
        for (int m = 0; 3 * m < n; m++) {
            Material like = base.materials().get(m % (baseSize / 3));
            int first = 3 * m;
            // the last material keeps the samples that fit (a size not a multiple of three)
            materials.add(material(m, Math.min(3, n - first), k -> like.samples().get(k - first).thicknessMm(),
                    like.refractiveIndex(), like.scaling()));
        }
        SpectralStore baseStore = base.snapshot().store();
        return SnapshotReader.ofRecords(materials, (builder, sample, stored, thicknessMm, bulk, total, index) -> {
            builder.addCarried(sample.id(), stored, thicknessMm, bulk, total, index, baseStore,
                    (int) ((sample.id() - 1) % baseSize));
            return null; // carried: the exact judgement reads the curve through the service, as from the database
        }, SearchService.DEFAULT_CURVE_CACHE_BYTES);
    }

    private static Material material(int m, java.util.function.IntToDoubleFunction thicknessOfSample,
                                     org.spectralsieve.optics.RefractiveIndex index) {
        return material(m, 3, thicknessOfSample, index, m % 3 != 2 ? Scaling.BULK : Scaling.FIXED);
    }

    /** Synthetic material m (illustrative): samples 3m + 1 … 3m + count, a plastic sheet. */
    private static Material material(int m, int count, java.util.function.IntToDoubleFunction thicknessOfSample,
                                     org.spectralsieve.optics.RefractiveIndex index, Scaling scaling) {
        List<SampleInfo> samples = new ArrayList<>(count);
        for (int k = 3 * m; k < 3 * m + count; k++) {
            samples.add(new SampleInfo(k + 1L, m + 1L, thicknessOfSample.applyAsDouble(k), Geometry.REGULAR,
                    Provenance.MODELLED, "", null, "", "synthetic, illustrative", 0));
        }
        return new Material(m + 1L, "synthetic-" + (m + 1), "synthetic sheet " + (m + 1), MaterialClass.of("plastic sheet"),
                "", List.of(), scaling, index, samples);
    }
}
