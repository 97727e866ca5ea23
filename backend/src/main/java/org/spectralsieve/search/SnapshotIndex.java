package org.spectralsieve.search;

import java.util.Arrays;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import org.spectralsieve.library.Geometry;
import org.spectralsieve.library.Material;
import org.spectralsieve.library.SampleInfo;
import org.spectralsieve.requirement.MadeThicknesses;
import org.spectralsieve.store.SpectralStore;

/**
 * What every search that judges the whole library exactly asks of a snapshot and that depends on the snapshot
 * alone: its materials in the order of the store's rows (the snapshot's {@code ordered}) with each sample's store row,
 * id and geometry by slot — material {@code i}'s samples (in the order of {@link Material#samples}) take slots
 * {@code firstSlot[i]} on — so a loop over every material reads plain arrays, and the per-search bounds indexed by row
 * nearly in sequence, instead of each record (scattered over the heap) and a lookup per sample. Formed on the first
 * search that asks, once per snapshot, not per search: at a million curves sorting a third of a million materials,
 * boxing a million sample ids and reading the bounds in id order (a cache miss per sample) cost a search more than its
 * judgement (docs/weighted-screening.md, "The service at a million curves"). Immutable once formed; safe to share
 * between searches on other threads (published through a volatile field, its arrays final).
 */
final class SnapshotIndex {

    /** A slot of {@link Rows} no sample id takes (ids are positive). */
    private static final long EMPTY = 0;

    private final SpectralStore store;
    private final List<Material> ordered;
    private final Map<Long, MadeThicknesses> made;
    private volatile Slots slots;

    /**
     * @param ordered the snapshot's materials in the order of the store's rows
     * @param made    each material's made thicknesses as the snapshot formed them (by material id)
     */
    SnapshotIndex(SpectralStore store, List<Material> ordered, Map<Long, MadeThicknesses> made) {
        this.store = store;
        this.ordered = ordered;
        this.made = made;
    }

    /** The store row of the sample in {@code slot} (see {@link Slots}), or -1 when the store holds none for it. */
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
        int j = Arrays.binarySearch(formed.sortedIds, material.id());
        if (j < 0) {
            return -1;
        }
        int i = formed.indexOfSorted[j];
        for (int slot = formed.firstSlot[i]; slot < formed.firstSlot[i + 1]; slot++) {
            if (formed.sampleIdBySlot[slot] == sampleId) {
                return formed.rowBySlot[slot];
            }
        }
        return -1;
    }

    /** The formed index itself, for a loop over every material that reads its arrays without a call per sample. */
    Slots slots() {
        Slots formed = slots;
        if (formed == null) {
            formed = new Slots(store, ordered, made); // two searches may both form it: the same content, one kept
            slots = formed;
        }
        return formed;
    }

    /** The materials in the store's order and their samples' rows, ids and geometries by slot, formed together. */
    static final class Slots {

        /** The snapshot's materials in the order of the store's rows. */
        final List<Material> materials;
        /** Material {@code i}'s samples take slots {@code firstSlot[i]} up to {@code firstSlot[i + 1]}. */
        final int[] firstSlot;
        final int[] rowBySlot;
        final long[] sampleIdBySlot;
        final Geometry[] geometryBySlot;
        /** Each slot's geometry as its ordinal, for a sweep over every slot that reads a byte, not a reference. */
        final byte[] geometryOrdinalBySlot;
        /** Material {@code i}'s class as an index into {@link #classLabels} (a library holds a handful of classes). */
        final int[] classOf;
        final String[] classLabels;
        /** Whether material {@code i} has a sample measured in regular geometry. */
        final boolean[] hasRegular;
        /** Whether every slot's store row is the slot itself (the store holds the samples in the materials' order). */
        final boolean slotIsRow;
        final MadeThicknesses[] made;
        /** The material ids sorted, and the index in {@link #materials} of each. */
        final long[] sortedIds;
        final int[] indexOfSorted;

        Slots(SpectralStore store, List<Material> ordered, Map<Long, MadeThicknesses> madeById) {
            materials = List.copyOf(ordered);
            int n = materials.size();
            firstSlot = new int[n + 1];
            made = new MadeThicknesses[n];
            for (int i = 0; i < n; i++) {
                Material m = materials.get(i);
                firstSlot[i + 1] = firstSlot[i] + m.samples().size();
                made[i] = Objects.requireNonNull(madeById.get(m.id()), "the snapshot's made thicknesses");
            }
            rowBySlot = new int[firstSlot[n]];
            sampleIdBySlot = new long[rowBySlot.length];
            geometryBySlot = new Geometry[rowBySlot.length];
            geometryOrdinalBySlot = new byte[rowBySlot.length];
            Rows rows = new Rows(store);
            for (int i = 0; i < n; i++) {
                List<SampleInfo> samples = materials.get(i).samples();
                for (int k = 0; k < samples.size(); k++) {
                    SampleInfo sample = samples.get(k);
                    rowBySlot[firstSlot[i] + k] = rows.rowOf(sample.id());
                    sampleIdBySlot[firstSlot[i] + k] = sample.id();
                    geometryBySlot[firstSlot[i] + k] = sample.geometry();
                    geometryOrdinalBySlot[firstSlot[i] + k] = (byte) sample.geometry().ordinal();
                }
            }
            classOf = new int[n];
            Map<String, Integer> classes = new LinkedHashMap<>();
            for (int i = 0; i < n; i++) {
                classOf[i] = classes.computeIfAbsent(materials.get(i).materialClass().label(), label -> classes.size());
            }
            classLabels = classes.keySet().toArray(new String[0]);
            hasRegular = new boolean[n];
            for (int i = 0; i < n; i++) {
                for (int slot = firstSlot[i]; slot < firstSlot[i + 1]; slot++) {
                    hasRegular[i] |= geometryBySlot[slot] == Geometry.REGULAR;
                }
            }
            boolean inOrder = true;
            for (int slot = 0; slot < rowBySlot.length && inOrder; slot++) {
                inOrder = rowBySlot[slot] == slot;
            }
            slotIsRow = inOrder;
            Integer[] byId = new Integer[n];
            for (int i = 0; i < n; i++) {
                byId[i] = i;
            }
            Arrays.sort(byId, Comparator.comparingLong(i -> materials.get(i).id()));
            sortedIds = new long[n];
            indexOfSorted = new int[n];
            for (int j = 0; j < n; j++) {
                indexOfSorted[j] = byId[j];
                sortedIds[j] = materials.get(byId[j]).id();
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
