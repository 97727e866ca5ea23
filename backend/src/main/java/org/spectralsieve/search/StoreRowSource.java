package org.spectralsieve.search;

import java.util.HashMap;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.SampleInfo;
import org.spectralsieve.optics.RefractiveIndex;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.store.SpectralStore;
import org.spectralsieve.store.StoredMaterial;

/**
 * Where a rebuild of the search store takes each sample's curve from: the whole curve table (the first
 * build, or whenever reuse cannot be proven), or — after a few writes — the previous store's encoded row for
 * every sample that is unchanged, and the database only for the samples that are new or changed.
 *
 * <p>Why reuse is sound: a curve row is written once, with its sample, and never updated (corrections and
 * retirements change the sample's record, whose revision, detection limit and retirement are all in
 * {@link SampleInfo}); the store's codes are a function of that curve alone. So a sample whose record equals
 * the one the previous store was built from has the same codes. Everything else of the row (its material,
 * thickness, index, rescalability) is taken from the freshly read records, exactly as a whole build does.
 * A restore rewrites the tables with ids of its own: it raises the change counter without a change-log entry,
 * so {@link JooqLibraryRepository#materialsChanged} cannot account for it and the rebuild reads everything.
 * Without that, under steady imports every search would wait for the whole curve table to be read and
 * decoded again (docs/start-and-load.md).
 */
final class StoreRowSource {

    private static final Logger LOG = LoggerFactory.getLogger(StoreRowSource.class);

    private final JooqLibraryRepository library;
    private final Map<Long, Curve> allCurves;
    private final SpectralStore previous;
    private final Map<Long, SampleInfo> previousSamples;
    /** Each material's rows in the previous store, {first, past the last}: a build lays a material's rows out together. */
    private final Map<Long, int[]> previousRows;
    /** The previous store's row of each sample, for the materials read again only (formed when first asked). */
    private final Map<Long, Map<Long, Integer>> previousRowOfSample = new HashMap<>();
    private int reused;
    private int read;

    private StoreRowSource(JooqLibraryRepository library, Map<Long, Curve> allCurves, SpectralStore previous,
                           Map<Long, SampleInfo> previousSamples) {
        this.library = library;
        this.allCurves = allCurves;
        this.previous = previous;
        this.previousSamples = previousSamples;
        this.previousRows = new HashMap<>();
        if (previous != null) {
            int[] rows = null; // the current material's run: looked up only where the material changes
            for (int i = 0; i < previous.size(); i++) {
                long materialId = previous.material(i).id();
                if (rows != null && previous.material(i - 1).id() == materialId) {
                    rows[1] = i + 1;
                    continue;
                }
                rows = new int[] {i, i + 1};
                if (previousRows.put(materialId, rows) != null) {
                    throw new IllegalStateException("the previous store holds material " + materialId + " apart");
                }
            }
        }
    }

    /** Every curve read from the database in one pass. */
    static StoreRowSource everything(JooqLibraryRepository library) {
        return new StoreRowSource(library, library.findAllCurves(), null, Map.of());
    }

    /**
     * Reuses the previous store's rows when the change log accounts for every change since it was built,
     * else reads everything.
     *
     * @param previousGeneration the change counter the previous store was read at
     * @param generation         the counter read now, before any table
     */
    static StoreRowSource after(JooqLibraryRepository library, SpectralStore previous,
                                Map<Long, SampleInfo> previousSamples, long previousGeneration, long generation) {
        Optional<Set<Long>> changed = library.materialsChanged(previousGeneration, generation);
        if (changed.isEmpty()) {
            LOG.info("search store read whole: the change log does not account for every change from generation {} to {}",
                    previousGeneration, generation);
            return everything(library);
        }
        return new StoreRowSource(library, null, previous, previousSamples);
    }

    /**
     * Reuses the previous store's rows of unchanged samples; the caller has checked that the change log
     * accounts for every change since it was built ({@link MaterialsRead#after}).
     */
    static StoreRowSource carryingOver(JooqLibraryRepository library, SpectralStore previous,
                                       Map<Long, SampleInfo> previousSamples) {
        return new StoreRowSource(library, null, previous, previousSamples);
    }

    /**
     * Adds the sample's row, or nothing when it has no readable curve (left out of the store as a whole build
     * leaves it out; the exact evaluator says why).
     *
     * @return the curve decoded for the row, or null when the row was carried over (or there is no curve)
     */
    Curve add(SpectralStore.Builder builder, SampleInfo sample, StoredMaterial material, double thicknessMm,
              boolean bulk, boolean totalGeometry, RefractiveIndex index) {
        if (allCurves != null) {
            Curve curve = allCurves.get(sample.id());
            if (curve != null) {
                builder.add(sample.id(), material, thicknessMm, bulk, totalGeometry, index, curve);
            }
            return curve;
        }
        if (sample.retired()) {
            return null; // a whole build reads only the curves of samples in use
        }
        Integer row = rowsOfSamples(material.id()).get(sample.id());
        if (row != null && sample.equals(previousSamples.get(sample.id()))) {
            builder.addCarried(sample.id(), material, thicknessMm, bulk, totalGeometry, index, previous, row);
            reused++;
            return null;
        }
        Curve curve;
        try {
            curve = library.findCurve(sample.id()).orElse(null);
        } catch (RuntimeException e) {
            LOG.warn("the curve of sample " + sample.id() + " cannot be read and is left out of searches: " + e.getMessage());
            return null;
        }
        if (curve != null) {
            builder.add(sample.id(), material, thicknessMm, bulk, totalGeometry, index, curve);
            read++;
        }
        return curve;
    }

    /**
     * Adds every row the previous store holds for a material that was not read again (the previous snapshot's very
     * record, so each of its samples is too): as they are, in their order, with their thickness, rescalability,
     * geometry and index as the previous build formed them from those same records. What {@link #add} would do for
     * each of its samples in turn, without looking each one up; only for a source {@link #carryingOver} a store.
     *
     * @return the rows added
     */
    int carryMaterial(SpectralStore.Builder builder, StoredMaterial material) {
        if (previous == null) {
            throw new IllegalStateException("a whole build has no previous rows to carry");
        }
        int[] rows = previousRows.get(material.id());
        if (rows == null) {
            return 0; // none of its samples has a readable curve
        }
        for (int r = rows[0]; r < rows[1]; r++) {
            builder.addCarried(previous.sampleId(r), material, previous.thicknessMm(r), previous.isBulk(r),
                    previous.isTotalGeometry(r), previous.indexOf(r), previous, r);
        }
        reused += rows[1] - rows[0];
        return rows[1] - rows[0];
    }

    private Map<Long, Integer> rowsOfSamples(long materialId) {
        return previousRowOfSample.computeIfAbsent(materialId, id -> {
            int[] rows = previousRows.get(id);
            Map<Long, Integer> bySample = new HashMap<>();
            if (rows != null) {
                for (int r = rows[0]; r < rows[1]; r++) {
                    bySample.put(previous.sampleId(r), r);
                }
            }
            return bySample;
        });
    }

    /** Rows taken from the previous store (0 for a whole build). */
    int reused() {
        return reused;
    }

    /** Curves read one by one from the database (0 for a whole build). */
    int read() {
        return read;
    }
}
