package org.spectralsieve.search;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import org.spectralsieve.library.Geometry;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.Material;
import org.spectralsieve.library.SampleInfo;
import org.spectralsieve.library.SampleRescaling;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.optics.PhysicalRanges;
import org.spectralsieve.optics.RefractiveIndex;
import org.spectralsieve.requirement.MadeThicknesses;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.store.SpectralStore;
import org.spectralsieve.store.StoredMaterial;

/**
 * Reads the library into a new {@link Snapshot} for {@link SearchService}: the whole library, or — when the change
 * log accounts for every change since the previous snapshot — only what it names, the rest carried over
 * (docs/search-under-load.md, third and ninth passes; docs/freshness.md for why the order of the reads matters).
 * {@code SearchService} decides when to read (its freshness check and rebuild lock); this class only reads.
 */
final class SnapshotReader {

    private final JooqLibraryRepository library;
    /** Heap for each snapshot's decoded curves ({@link CurveCache}). */
    private final long curveCacheBytes;
    /** False reads every changed material whole and forms its rows sample by sample, the way before the ninth pass. */
    private final boolean rebuildWhatChanged;

    SnapshotReader(JooqLibraryRepository library, long curveCacheBytes, boolean rebuildWhatChanged) {
        this.library = library;
        this.curveCacheBytes = curveCacheBytes;
        this.rebuildWhatChanged = rebuildWhatChanged;
    }

    /** The nearest thickness inside the physical range, for a stored one outside it (never rescaled). */
    private static double storableThickness(double mm) {
        return mm > PhysicalRanges.MIN_THICKNESS_MM ? Math.min(mm, PhysicalRanges.MAX_THICKNESS_MM) : PhysicalRanges.MIN_THICKNESS_MM;
    }

    /**
     * Adds a material the rebuild did not read again as the previous build formed it from the same objects: its rows
     * (copied), its unusable samples and its cached curves (taken under one lock hold), in the order of its samples.
     */
    private static void carryWhole(Material m, StoredMaterial stored, Snapshot previous, SpectralStore.Builder builder,
                                   StoreRowSource curves, CurveCache cache, Set<Long> unusable) {
        curves.carryMaterial(builder, stored);
        List<Long> ids = new ArrayList<>(m.samples().size());
        for (SampleInfo sample : m.samples()) {
            ids.add(sample.id());
            if (previous.unusable().contains(sample.id())) {
                unusable.add(sample.id());
            }
        }
        cache.offerKept(previous.curves(), ids);
    }

    /**
     * Reads the library into a new snapshot; {@code invalidated} is the service's invalidation count, read by the
     * caller just before this call. The counters are read first, before any table: a write that
     * commits after that read is either missing from the tables read (and the number says so: the next
     * search rebuilds) or already in them (a rebuild too many, never a change missed).
     */
    Snapshot read(Snapshot previous, long invalidated) {
        long generation = library.generation();
        // only the materials the change log names are read again, and an unchanged sample's row is carried
        // over from the previous store (MaterialsRead and StoreRowSource say why that is sound); an
        // invalidate() names no material, so after one everything is read again
        Optional<List<Material>> partial = previous != null && previous.invalidations() == invalidated
                ? MaterialsRead.after(library, previous.ordered(), previous.generation(), generation, rebuildWhatChanged)
                : Optional.empty();
        if (partial.isPresent() && partial.get() == previous.ordered()) {
            // no material changed (an imported emitter or response, say): the same store holds at the new number
            return new Snapshot(previous.store(), previous.materials(), previous.samples(), generation, invalidated,
                    previous.curves(), previous.ordered(), previous.unusable(), previous.made(), previous.index());
        }
        List<Material> materials = partial.orElseGet(() -> MaterialsRead.everything(library));
        StoreRowSource curves = partial.isPresent()
                ? StoreRowSource.carryingOver(library, previous.store(), previous.samples())
                : StoreRowSource.everything(library);
        // a partial rebuild takes the previous snapshot's decoded curves as they are (not hashed again)
        CurveCache cache = partial.isPresent() ? previous.curves().successor() : new CurveCache(curveCacheBytes);
        return formed(materials, partial.isPresent() ? previous : null, curves, curves::add, cache, generation, invalidated);
    }

    /**
     * Where a row of the store comes from while a snapshot is formed: {@link StoreRowSource#add} for a library read
     * from the database; a benchmark without a database gives rows of its own ({@link #ofRecords}).
     */
    @FunctionalInterface
    interface RowSource {
        /** Adds the sample's row, or nothing; returns the curve decoded for it, null when none was. */
        Curve add(SpectralStore.Builder builder, SampleInfo sample, StoredMaterial material, double thicknessMm,
                  boolean bulk, boolean totalGeometry, RefractiveIndex index);
    }

    /**
     * A snapshot of these material records formed as a whole build forms it from the database, each row from
     * {@code rows}; the snapshot's generation is 0. For the service's benchmark at a million curves, which no database
     * can be filled with in a benchmark's time (docs/weighted-screening.md, "The service at a million curves").
     */
    static Snapshot ofRecords(List<Material> materials, RowSource rows, long curveCacheBytes) {
        return new SnapshotReader(null, curveCacheBytes, true).formed(materials, null, null, rows,
                new CurveCache(curveCacheBytes), 0, 0);
    }

    /**
     * The snapshot of {@code materials}: a partial rebuild when {@code previous} is given (its unchanged materials
     * carried whole through {@code carrier}), else a whole build; every other row from {@code rows}.
     */
    private Snapshot formed(List<Material> materials, Snapshot previous, StoreRowSource carrier, RowSource rows,
                            CurveCache cache, long generation, long invalidated) {
        boolean partial = previous != null;
        int samples = materials.stream().mapToInt(m -> m.samples().size()).sum();
        SpectralStore.Builder builder = SpectralStore.builder(SpectralStore.DEFAULT_GRID, samples);
        Map<Long, Material> byId = new HashMap<>();
        Map<Long, SampleInfo> sampleById = new HashMap<>();
        Map<Long, MadeThicknesses> madeById = new HashMap<>();
        Set<Long> unusable = new HashSet<>();
        for (Material m : materials) {
            byId.put(m.id(), m);
            m.samples().forEach(sample -> sampleById.put(sample.id(), sample));
            // a material not read again is the previous snapshot's very record (MaterialsRead), and so is each of its
            // samples: its made thicknesses, rows, unusable samples and cached curves are what the previous build
            // formed from the same objects, so they are carried as a whole rather than formed sample by sample
            boolean unchanged = rebuildWhatChanged && partial && previous.materials().get(m.id()) == m;
            MadeThicknesses made = unchanged ? previous.made().get(m.id()) : SearchService.made(m);
            madeById.put(m.id(), made);
            StoredMaterial stored = new StoredMaterial(m.id(), m.name(), m.materialClass().label(), made);
            if (unchanged) {
                carryWhole(m, stored, previous, builder, carrier, cache, unusable);
                continue;
            }
            for (SampleInfo sample : m.samples()) {
                // the store rescales exactly what the exact evaluator rescales: never a diffuse or scattering
                // sample, nor one whose stored thickness or index fails today's checks (SampleRescaling.unusable):
                // such a sample enters at a thickness and index the store can hold, never rescaled, and its
                // exact row is unverified with the reason
                boolean usable = SampleRescaling.unusable(m, sample).isEmpty();
                if (!usable) {
                    unusable.add(sample.id());
                }
                // no readable curve: left out (logged), judged only by the exact evaluator, which says why
                Curve decoded = rows.add(builder, sample, stored,
                        usable ? sample.thicknessMm() : storableThickness(sample.thicknessMm()),
                        SampleRescaling.of(m, sample).rescalable(), sample.geometry() == Geometry.TOTAL,
                        usable ? m.refractiveIndex() : ConstantIndex.WHEN_UNRECORDED);
                // the exact judgement's copy: the curve just decoded, or the previous snapshot's (a stored curve
                // row is never changed, only a sample's record: the same id keeps the same curve)
                if (decoded != null) {
                    cache.offer(sample.id(), decoded);
                } else if (partial) {
                    cache.offerKept(previous.curves(), sample.id());
                }
            }
        }
        return new Snapshot(builder.build(), Map.copyOf(byId), Map.copyOf(sampleById), generation, invalidated, cache,
                materials, Set.copyOf(unusable), Map.copyOf(madeById));
    }
}
