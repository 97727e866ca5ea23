package org.spectralsieve.search;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collection;
import java.util.Comparator;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import org.spectralsieve.library.Material;
import org.spectralsieve.library.SampleInfo;
import org.spectralsieve.requirement.MadeThicknesses;
import org.spectralsieve.store.SpectralStore;

/**
 * What every search that judges the whole library exactly asks of a snapshot and that depends on the snapshot
 * alone: its materials in id order (the order {@code SearchService.searchExactly} forms contenders in) and the store
 * row of each of their samples, by slot: material {@code i}'s samples (in the order of {@link Material#samples}) take
 * slots {@code firstSlot(i)} on, so a loop over the materials in id order finds each sample's row without a lookup. Formed on the first search that asks, once per snapshot, not per search: at a million curves
 * sorting a third of a million materials and boxing a million sample ids cost a search more than its judgement
 * (docs/weighted-screening.md, "The service at a million curves"). Immutable once formed; safe to share between
 * searches on other threads (each part is published through a volatile field).
 */
final class SnapshotIndex {

    /** A slot of {@link #ids} no sample id takes (ids are positive). */
    private static final long EMPTY = 0;

    private final SpectralStore store;
    private final Collection<Material> materials;
    private final Map<Long, MadeThicknesses> made;
    private volatile Slots slots;

    /** @param made each material's made thicknesses as the snapshot formed them (by material id) */
    SnapshotIndex(SpectralStore store, Collection<Material> materials, Map<Long, MadeThicknesses> made) {
        this.store = store;
        this.materials = materials;
        this.made = made;
    }

    /** The snapshot's materials in id order, sorted once. */
    List<Material> materialsById() {
        return slots().byId;
    }

    /** The first slot of material {@code i} of {@link #materialsById}; its samples take the slots after it. */
    int firstSlot(int i) {
        return slots().firstSlot[i];
    }

    /** The made thicknesses of material {@code i} of {@link #materialsById}, as the snapshot formed them. */
    MadeThicknesses made(int i) {
        return slots().made[i];
    }

    /** The store row of the sample in {@code slot}, or -1 when the store holds none for it. */
    int row(int slot) {
        return slots().rowBySlot[slot];
    }

    /**
     * The store row of a sample of the snapshot's material {@code material}, or -1 when the store holds none for it
     * (or the material is not the snapshot's): found through the material's slots, for the few contenders a search
     * refines.
     */
    int rowOf(Material material, long sampleId) {
        Slots formed = slots();
        int i = Arrays.binarySearch(formed.materialIds, material.id());
        if (i < 0) {
            return -1;
        }
        List<SampleInfo> samples = formed.byId.get(i).samples();
        for (int k = 0; k < samples.size(); k++) {
            if (samples.get(k).id() == sampleId) {
                return formed.rowBySlot[formed.firstSlot[i] + k];
            }
        }
        return -1;
    }

    private Slots slots() {
        Slots formed = slots;
        if (formed == null) {
            formed = new Slots(store, materials, made); // two searches may both form it: the same content, one kept
            slots = formed;
        }
        return formed;
    }

    /** The materials in id order and their samples' rows, formed together. */
    private static final class Slots {

        final List<Material> byId;
        final long[] materialIds;
        final int[] firstSlot;
        final int[] rowBySlot;
        final MadeThicknesses[] made;

        Slots(SpectralStore store, Collection<Material> materials, Map<Long, MadeThicknesses> madeById) {
            List<Material> sorted = new ArrayList<>(materials);
            sorted.sort(Comparator.comparingLong(Material::id));
            byId = List.copyOf(sorted);
            materialIds = new long[byId.size()];
            made = new MadeThicknesses[byId.size()];
            firstSlot = new int[byId.size() + 1];
            for (int i = 0; i < byId.size(); i++) {
                materialIds[i] = byId.get(i).id();
                made[i] = Objects.requireNonNull(madeById.get(materialIds[i]), "the snapshot's made thicknesses");
                firstSlot[i + 1] = firstSlot[i] + byId.get(i).samples().size();
            }
            rowBySlot = new int[firstSlot[byId.size()]];
            Rows rows = new Rows(store);
            for (int i = 0; i < byId.size(); i++) {
                List<SampleInfo> samples = byId.get(i).samples();
                for (int k = 0; k < samples.size(); k++) {
                    rowBySlot[firstSlot[i] + k] = rows.rowOf(samples.get(k).id());
                }
            }
        }
    }

    /** Sample id → store row, open addressing over two plain arrays (no boxed entry per sample). */
    private static final class Rows {

        private final long[] ids;
        private final int[] rowAt;
        private final int mask;

        Rows(SpectralStore store) {
            int capacity = Integer.highestOneBit(Math.max(4, store.size() * 2 - 1)) << 1;
            ids = new long[capacity];
            rowAt = new int[capacity];
            mask = capacity - 1;
            Arrays.fill(ids, EMPTY);
            for (int row = 0; row < store.size(); row++) {
                long id = store.sampleId(row);
                if (id <= EMPTY) {
                    throw new IllegalStateException("the store holds a sample id that is not positive: " + id);
                }
                int slot = slot(id);
                while (ids[slot] != EMPTY && ids[slot] != id) {
                    slot = (slot + 1) & mask;
                }
                ids[slot] = id;
                rowAt[slot] = row; // one row per sample id: a store holds each sample once
            }
        }

        int rowOf(long id) {
            int slot = slot(id);
            while (ids[slot] != EMPTY) {
                if (ids[slot] == id) {
                    return rowAt[slot];
                }
                slot = (slot + 1) & mask;
            }
            return -1;
        }

        private int slot(long id) {
            long h = id * 0x9E3779B97F4A7C15L; // Fibonacci hashing: consecutive ids spread over the table
            return (int) (h >>> 32) & mask;
        }
    }
}
