package org.spectralsieve.search;

import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.concurrent.atomic.AtomicReference;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.Material;
import org.spectralsieve.library.SampleInfo;
import org.spectralsieve.library.Scaling;
import org.spectralsieve.requirement.Candidate;
import org.spectralsieve.requirement.MaterialEvaluation;
import org.spectralsieve.requirement.RankedRow;
import org.spectralsieve.requirement.Ranking;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.SampleEvaluator;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.store.SpectralStore;
import org.spectralsieve.store.StoreHit;
import org.spectralsieve.store.StoreResult;
import org.spectralsieve.store.StoreSearch;
import org.spectralsieve.store.StoredMaterial;

/**
 * Answers requirements: the in-memory store picks the materials that can be in the shortlist, then every
 * sample of those materials is judged exactly on its stored curve, and the exact judgements are ranked.
 * The store is derived from the database and rebuilt after every committed change.
 */
public class SearchService {

    /** Shortlist length when the caller names none, and the most a caller may ask for (HTTP and command line). */
    public static final int DEFAULT_LIMIT = 20;
    public static final int MAX_LIMIT = 500;

    private final JooqLibraryRepository library;
    private final AtomicReference<Snapshot> snapshot = new AtomicReference<>();

    public SearchService(JooqLibraryRepository library) {
        this.library = library;
    }

    /** The store and the library it was built from, replaced whole so a search never sees half an update. */
    private record Snapshot(SpectralStore store, Map<Long, Material> materials) {
    }

    public Shortlist search(Requirement requirement, int limit) {
        long started = System.nanoTime();
        Snapshot s = current();
        StoreResult picked = StoreSearch.search(s.store(), requirement, limit);
        Set<Long> materialIds = new LinkedHashSet<>();
        for (StoreHit hit : picked.hits()) {
            materialIds.add(hit.material().id());
        }
        List<MaterialEvaluation> exact = new ArrayList<>();
        for (long materialId : materialIds) {
            Material material = s.materials().get(materialId);
            for (SampleInfo sample : material.samples()) {
                if (admits(requirement, material, sample)) {
                    // the exact judgement reads the stored curve itself, not the store's quantized copy
                    Curve curve = library.findCurve(sample.id()).orElseThrow();
                    Candidate candidate = new Candidate(sample.id(), material.id(), material.name(), curve,
                            sample.thicknessMm(), material.scaling() == Scaling.BULK, material.refractiveIndex());
                    exact.add(MaterialEvaluation.of(candidate, SampleEvaluator.evaluate(candidate, requirement)));
                }
            }
        }
        List<RankedRow> rows = Ranking.rank(exact, limit);
        double tookMs = (System.nanoTime() - started) / 1e6;
        return new Shortlist(requirement, rows, picked.evaluatedSamples(), tookMs);
    }

    private static boolean admits(Requirement r, Material m, SampleInfo s) {
        return r.materialClass().map(c -> c.equals(m.materialClass().label())).orElse(true)
                && r.geometry().map(g -> g.equals(s.geometry().label())).orElse(true);
    }

    /** Drops the derived store; the next search rebuilds it from the database. Call after every committed import. */
    public void invalidate() {
        snapshot.set(null);
    }

    private Snapshot current() {
        Snapshot s = snapshot.get();
        if (s == null) {
            synchronized (this) {
                s = snapshot.get();
                if (s == null) {
                    s = build();
                    snapshot.set(s);
                }
            }
        }
        return s;
    }

    private Snapshot build() {
        List<Material> materials = library.findMaterials(null, null);
        Map<Long, Curve> curves = library.findAllCurves();
        int samples = materials.stream().mapToInt(m -> m.samples().size()).sum();
        SpectralStore.Builder builder = SpectralStore.builder(SpectralStore.DEFAULT_GRID, samples);
        Map<Long, Material> byId = new java.util.HashMap<>();
        for (Material m : materials) {
            byId.put(m.id(), m);
            StoredMaterial stored = new StoredMaterial(m.id(), m.name(), m.materialClass().label());
            for (SampleInfo sample : m.samples()) {
                builder.add(sample.id(), stored, sample.thicknessMm(), m.scaling() == Scaling.BULK,
                        sample.geometry() == org.spectralsieve.library.Geometry.TOTAL, m.refractiveIndex(),
                        curves.get(sample.id()));
            }
        }
        return new Snapshot(builder.build(), Map.copyOf(byId));
    }
}
