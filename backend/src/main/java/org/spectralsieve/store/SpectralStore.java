package org.spectralsieve.store;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.spectralsieve.optics.RefractiveIndex;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.WavelengthGrid;

/**
 * Every curve of the library on one common grid, wavelength-major, immutable once built. Rebuilt from
 * the database at start and after each committed import; a search reads a consistent snapshot.
 */
public final class SpectralStore {

    /** The default common grid: 1 nm over 190–1100 nm covers deep-UV windows through near-IR. */
    public static final WavelengthGrid DEFAULT_GRID = new WavelengthGrid(190, 1100, 1);

    private final WavelengthGrid grid;
    private final double[] gridNm;
    private final short[][] columns;
    /** Per grid wavelength: whether some curve's code there is the code's ceiling (a reading at least that dark). */
    private final boolean[] atCeiling;
    private final int size;
    private final long[] sampleIds;
    private final int[] materialOfCurve;
    private final float[] thicknessMm;
    private final boolean[] bulk;
    private final boolean[] totalGeometry;
    private final short[] indexModelOfCurve;
    private final List<StoredMaterial> materials;
    private final List<RefractiveIndex> indexModels;
    private final WeightedScreen weightedScreen;

    private SpectralStore(Builder b) {
        this.grid = b.grid;
        this.gridNm = b.grid.points();
        this.size = b.size;
        // the builder hands its arrays over (it refuses further use), trimming only when it over-allocated,
        // so a million-curve store is not held twice while it is built
        this.columns = new short[gridNm.length][];
        for (int w = 0; w < gridNm.length; w++) {
            columns[w] = trimmed(b.columns[w], size);
        }
        this.atCeiling = b.atCeiling;
        this.sampleIds = b.sampleIds.length == size ? b.sampleIds : Arrays.copyOf(b.sampleIds, size);
        this.materialOfCurve = b.materialOfCurve.length == size ? b.materialOfCurve : Arrays.copyOf(b.materialOfCurve, size);
        this.thicknessMm = b.thicknessMm.length == size ? b.thicknessMm : Arrays.copyOf(b.thicknessMm, size);
        this.bulk = b.bulk.length == size ? b.bulk : Arrays.copyOf(b.bulk, size);
        this.totalGeometry = b.totalGeometry.length == size ? b.totalGeometry : Arrays.copyOf(b.totalGeometry, size);
        this.indexModelOfCurve = b.indexModelOfCurve.length == size ? b.indexModelOfCurve
                : Arrays.copyOf(b.indexModelOfCurve, size);
        this.materials = List.copyOf(b.materials);
        this.indexModels = List.copyOf(b.indexModels);
        this.weightedScreen = b.weighted.build(size);
    }

    private static short[] trimmed(short[] column, int size) {
        return column.length == size ? column : Arrays.copyOf(column, size);
    }

    public static Builder builder(WavelengthGrid grid, int expectedCurves) {
        return new Builder(grid, expectedCurves);
    }

    public WavelengthGrid grid() {
        return grid;
    }

    public int size() {
        return size;
    }

    public long sampleId(int curve) {
        return sampleIds[curve];
    }

    public StoredMaterial material(int curve) {
        return materials.get(materialOfCurve[curve]);
    }

    int materialIndex(int curve) {
        return materialOfCurve[curve];
    }

    int materialCount() {
        return materials.size();
    }

    StoredMaterial materialAt(int materialIndex) {
        return materials.get(materialIndex);
    }

    public double thicknessMm(int curve) {
        return thicknessMm[curve];
    }

    /**
     * The curve indices of each material, by material index: the samples the exact judgement weighs together. The
     * same grouping as {@link #materialTable}, one array per material (the layout the earlier spans read; kept so a
     * benchmark can time both side by side).
     */
    int[][] curvesByMaterial() {
        int[][] cached = byMaterial;
        if (cached == null) {
            MaterialTable table = materialTable();
            cached = new int[materials.size()][];
            for (int m = 0; m < cached.length; m++) {
                cached[m] = Arrays.copyOfRange(table.curves(), table.start()[m], table.start()[m + 1]);
            }
            byMaterial = cached;
        }
        return cached;
    }

    private volatile int[][] byMaterial;

    /**
     * Each material's curves in one flat array, and its made thicknesses, by material index: what a search over a
     * thickness works a material's spans out from ({@code SearchPlan.spanOf}). The same curves, in the
     * same order, as {@link #curvesByMaterial}; built once per store on first use.
     */
    MaterialTable materialTable() {
        MaterialTable cached = materialTable;
        if (cached == null) {
            cached = MaterialTable.of(materialOfCurve, size, materials);
            materialTable = cached;
        }
        return cached;
    }

    private volatile MaterialTable materialTable;

    /**
     * The thinnest thickness of any bulk curve (+∞ when there is none): how far the store's thickness model can
     * stretch a reading, which scales its error ({@link CutReach}). Worked out once per store.
     */
    double thinnestBulkMm() {
        double cached = thinnestBulk;
        if (Double.isNaN(cached)) {
            cached = Double.POSITIVE_INFINITY;
            for (int c = 0; c < size; c++) {
                if (bulk[c]) {
                    cached = Math.min(cached, thicknessMm[c]);
                }
            }
            thinnestBulk = cached;
        }
        return cached;
    }

    private volatile double thinnestBulk = Double.NaN;

    /**
     * Each curve's class for the integer screen over a thickness range ({@link RangeLevelScreen}), worked out on
     * the first search over a range; null when the store's models and thicknesses make too many classes. Two
     * threads may work it out at once into equal objects; a reader sees null or a whole one.
     */
    ThicknessClasses thicknessClasses() {
        ThicknessClasses cached = thicknessClasses;
        if (cached == null && !thicknessClassesTried) {
            cached = ThicknessClasses.of(bulk, thicknessMm, indexModelOfCurve, size, indexModels.size());
            thicknessClasses = cached;
            thicknessClassesTried = true;
        }
        return cached;
    }

    private volatile ThicknessClasses thicknessClasses;
    private volatile boolean thicknessClassesTried;

    public boolean isBulk(int curve) {
        return bulk[curve];
    }

    public boolean isTotalGeometry(int curve) {
        return totalGeometry[curve];
    }

    /** The refractive index the curve's material is held with (the exact judgement's, unless the record is unusable). */
    public RefractiveIndex indexOf(int curve) {
        return indexModels.get(indexModelOfCurve[curve]);
    }

    RefractiveIndex indexModel(int model) {
        return indexModels.get(model);
    }

    int indexModelCount() {
        return indexModels.size();
    }

    int indexModelOf(int curve) {
        return indexModelOfCurve[curve];
    }

    double gridNm(int w) {
        return gridNm[w];
    }

    int gridSize() {
        return gridNm.length;
    }

    /**
     * Whether some curve's reading at grid wavelength w is held at the code's ceiling ({@link OdCode#MAX_LEVEL}, OD
     * 6.55): there the store knows only that the judged reading is at least that dark, so a block judged on it may
     * have any larger exact margin (docs/store.md, "The store's error at the cut").
     */
    boolean anyAtCeiling(int w) {
        return atCeiling[w];
    }

    /** The column of one grid wavelength: entry i belongs to curve i. Not copied: searches read it in place. */
    short[] column(int w) {
        return columns[w];
    }

    /** The curve as the store holds it (quantized, on the grid, only where measured), for exact re-evaluation. */
    public Curve curve(int curve) {
        int first = -1;
        int last = -1;
        for (int w = 0; w < gridNm.length; w++) {
            if (OdCode.isMeasured(columns[w][curve])) {
                if (first < 0) {
                    first = w;
                }
                last = w;
            }
        }
        int n = last - first + 1;
        double[] nm = new double[n];
        double[] t = new double[n];
        boolean[] below = new boolean[n];
        double[] limits = new double[n];
        for (int k = 0; k < n; k++) {
            short code = columns[first + k][curve];
            nm[k] = gridNm[first + k];
            t[k] = OdCode.transmittance(code);
            below[k] = OdCode.isBound(code);
            limits[k] = below[k] ? t[k] : 0;
        }
        return Curve.of(nm, t, below, limits);
    }

    /**
     * The curve's codes on the grid, one per grid wavelength (a copy), as {@link Builder#addEncoded} takes them:
     * a rebuild carries an unchanged curve over without reading and encoding it again.
     */
    public short[] codes(int curve) {
        short[] codes = new short[gridNm.length];
        for (int w = 0; w < gridNm.length; w++) {
            codes[w] = columns[w][curve];
        }
        return codes;
    }

    /** Bounds on every curve's weighted figures as measured, for requirements with weighted clauses. */
    public WeightedScreen weightedScreen() {
        return weightedScreen;
    }

    /** Bytes the store's arrays take per curve (columns, per-curve fields, the weighted screen; shared tables excluded). */
    public double bytesPerCurve() {
        // the last Short.BYTES: the thickness classes of the screen over a range, once a range is searched
        long perCurve = (long) gridNm.length * Short.BYTES + Long.BYTES + Integer.BYTES + Float.BYTES + 1 + 1 + Short.BYTES
                + WeightedScreen.BYTES_PER_CURVE + Short.BYTES;
        return size == 0 ? 0 : perCurve;
    }

    /** Collects curves; grows its arrays by doubling, so a million curves load without knowing the count. */
    public static final class Builder {
        private final WavelengthGrid grid;
        private final double[] gridNm;
        private short[][] columns;
        private int size;
        private long[] sampleIds;
        private int[] materialOfCurve;
        private float[] thicknessMm;
        private boolean[] bulk;
        private boolean[] totalGeometry;
        private short[] indexModelOfCurve;
        private final List<StoredMaterial> materials = new ArrayList<>();
        private final Map<Long, Integer> materialIndexById = new HashMap<>();
        private final List<RefractiveIndex> indexModels = new ArrayList<>();
        private final Map<RefractiveIndex, Integer> indexModelIndex = new HashMap<>();
        private final WeightedBinsBuilder weighted;
        private final boolean[] atCeiling;

        private boolean built;
        /** The pending run of carried rows: {@code runLength} rows from {@code runFrom} of {@code runSource} to {@code runTo}. */
        private SpectralStore runSource;
        private int runFrom;
        private int runTo;
        private int runLength;
        /** The previous store whose grid was found equal to this one's (checked once, not per carried row). */
        private SpectralStore sameGridChecked;

        private Builder(WavelengthGrid grid, int expectedCurves) {
            this.grid = grid;
            this.gridNm = grid.points();
            int capacity = Math.max(16, expectedCurves);
            columns = new short[gridNm.length][capacity];
            atCeiling = new boolean[gridNm.length];
            sampleIds = new long[capacity];
            materialOfCurve = new int[capacity];
            thicknessMm = new float[capacity];
            bulk = new boolean[capacity];
            totalGeometry = new boolean[capacity];
            indexModelOfCurve = new short[capacity];
            weighted = WeightedScreen.builder(capacity);
        }

        /**
         * Adds one sample's curve; grid points outside its measured range are stored as not measured. A reading below
         * the detection limit is stored as the bound the exact judgement reads there (at least the limit,
         * {@link Curve#judgedTransmittanceAt}), flagged: were it stored as the curve's own number (which can lie
         * decades below the limit), a pass judged on it would miss in the store by decades more than exactly, and the
         * store's margin would bound nothing (docs/store.md, "The store's error at the cut").
         */
        public Builder add(long sampleId, StoredMaterial material, double thicknessMm, boolean bulk,
                           boolean totalGeometry, RefractiveIndex index, Curve curve) {
            int i = nextSlot();
            for (int w = 0; w < gridNm.length; w++) {
                double nm = gridNm[w];
                if (!curve.covers(nm)) {
                    columns[w][i] = OdCode.NOT_MEASURED;
                } else if (curve.belowDetectionAt(nm)) {
                    columns[w][i] = OdCode.encode(curve.judgedTransmittanceAt(nm).getAsDouble(), true);
                } else {
                    columns[w][i] = OdCode.encode(curve.transmittanceAt(nm).getAsDouble(), false);
                }
                noteCeiling(w, columns[w][i]);
            }
            weighted.add(i, curve);
            record(i, sampleId, material, thicknessMm, bulk, totalGeometry, index);
            return this;
        }

        /** Adds a curve already sampled on this store's grid (codes from {@link OdCode}); for generated libraries. */
        public Builder addEncoded(long sampleId, StoredMaterial material, double thicknessMm, boolean bulk,
                                  boolean totalGeometry, RefractiveIndex index, short[] codesOnGrid) {
            if (codesOnGrid.length != gridNm.length) {
                throw new IllegalArgumentException("expected " + gridNm.length + " codes, got " + codesOnGrid.length);
            }
            int i = nextSlot();
            for (int w = 0; w < gridNm.length; w++) {
                columns[w][i] = codesOnGrid[w];
                noteCeiling(w, codesOnGrid[w]);
            }
            weighted.unknown(i);
            record(i, sampleId, material, thicknessMm, bulk, totalGeometry, index);
            return this;
        }

        /**
         * Adds row {@code row} of {@code previous} unchanged (same grid): its codes and its weighted screen, so a
         * rebuild that carries an unchanged curve over keeps it screened (docs/start-and-load.md). Rows carried
         * in the order they lie in {@code previous} are copied as one run per column ({@link #flushRun}), not
         * cell by cell: after an import a rebuild copies a few runs of 911 columns instead of gathering and
         * scattering every row (docs/search-under-load.md).
         */
        public Builder addCarried(long sampleId, StoredMaterial material, double thicknessMm, boolean bulk,
                                  boolean totalGeometry, RefractiveIndex index, SpectralStore previous, int row) {
            if (previous != sameGridChecked) {
                if (!Arrays.equals(previous.gridNm, gridNm)) {
                    throw new IllegalArgumentException("the previous store has another grid");
                }
                sameGridChecked = previous;
            }
            if (row < 0 || row >= previous.size) {
                throw new IndexOutOfBoundsException("row " + row + " of a store of " + previous.size);
            }
            int i = nextSlot();
            if (runSource == previous && runFrom + runLength == row && runTo + runLength == i) {
                runLength++;
            } else {
                flushRun();
                runSource = previous;
                runFrom = row;
                runTo = i;
                runLength = 1;
            }
            weighted.copy(i, previous.weightedScreen, row);
            record(i, sampleId, material, thicknessMm, bulk, totalGeometry, index);
            return this;
        }

        private void noteCeiling(int w, short code) {
            if (OdCode.isMeasured(code) && OdCode.level(code) == OdCode.MAX_LEVEL) {
                atCeiling[w] = true;
            }
        }

        /** Copies the pending run of carried rows into the columns: one array copy per grid wavelength. */
        private void flushRun() {
            if (runLength > 0) {
                for (int w = 0; w < columns.length; w++) {
                    System.arraycopy(runSource.columns[w], runFrom, columns[w], runTo, runLength);
                    atCeiling[w] |= runSource.atCeiling[w]; // the run's own rows may not be, but never less
                }
            }
            runSource = null;
            runLength = 0;
        }

        private void record(int i, long sampleId, StoredMaterial material, double thickness, boolean isBulk,
                            boolean total, RefractiveIndex index) {
            if (!(thickness > 0)) {
                throw new IllegalArgumentException("sample " + sampleId + ": thickness must be positive, got " + thickness);
            }
            sampleIds[i] = sampleId;
            materialOfCurve[i] = materialIndexById.computeIfAbsent(material.id(), id -> {
                materials.add(material);
                return materials.size() - 1;
            });
            thicknessMm[i] = (float) thickness;
            bulk[i] = isBulk;
            totalGeometry[i] = total;
            int model = indexModelIndex.computeIfAbsent(index, m -> {
                indexModels.add(m);
                return indexModels.size() - 1;
            });
            if (model > Short.MAX_VALUE) {
                throw new IllegalStateException("more than " + Short.MAX_VALUE + " distinct refractive-index models");
            }
            indexModelOfCurve[i] = (short) model;
            size++;
        }

        private int nextSlot() {
            if (built) {
                throw new IllegalStateException("this builder has already built its store");
            }
            if (size == sampleIds.length) {
                int capacity = sampleIds.length * 2;
                for (int w = 0; w < columns.length; w++) {
                    columns[w] = Arrays.copyOf(columns[w], capacity);
                }
                sampleIds = Arrays.copyOf(sampleIds, capacity);
                materialOfCurve = Arrays.copyOf(materialOfCurve, capacity);
                thicknessMm = Arrays.copyOf(thicknessMm, capacity);
                bulk = Arrays.copyOf(bulk, capacity);
                totalGeometry = Arrays.copyOf(totalGeometry, capacity);
                indexModelOfCurve = Arrays.copyOf(indexModelOfCurve, capacity);
                weighted.grow(capacity);
            }
            return size;
        }

        public SpectralStore build() {
            if (built) {
                throw new IllegalStateException("this builder has already built its store");
            }
            flushRun();
            built = true;
            SpectralStore store = new SpectralStore(this);
            columns = null; // handed over
            return store;
        }
    }
}
