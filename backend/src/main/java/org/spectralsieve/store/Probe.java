package org.spectralsieve.store;

/**
 * One wavelength a clause reads, located on the store's grid: the OD there is interpolated linearly
 * between columns {@code lo} and {@code hi} (linear in OD is linear in absorbance, as everywhere else
 * in the tool). {@code weight} is its trapezoid weight in nm, used by means.
 */
record Probe(double nm, int lo, int hi, double fractionHi, double weight) {

    /** Locates {@code nm} on the grid; -1 columns when the wavelength lies outside the grid. */
    static Probe at(SpectralStore store, double nm, double weight) {
        int n = store.gridSize();
        if (nm < store.gridNm(0) || nm > store.gridNm(n - 1)) {
            return new Probe(nm, -1, -1, 0, weight);
        }
        int lo = lowerIndex(store, nm);
        if (store.gridNm(lo) == nm || lo == n - 1) {
            return new Probe(nm, lo, lo, 0, weight);
        }
        double fraction = (nm - store.gridNm(lo)) / (store.gridNm(lo + 1) - store.gridNm(lo));
        return new Probe(nm, lo, lo + 1, fraction, weight);
    }

    private static int lowerIndex(SpectralStore store, double nm) {
        int low = 0;
        int high = store.gridSize() - 1;
        while (low < high) {
            int mid = (low + high + 1) >>> 1;
            if (store.gridNm(mid) <= nm) {
                low = mid;
            } else {
                high = mid - 1;
            }
        }
        return low;
    }

    boolean onGrid() {
        return lo >= 0;
    }
}
