package org.spectralsieve.store;

import static org.spectralsieve.store.WeightedScreen.BINS;
import static org.spectralsieve.store.WeightedScreen.BIN_NM;
import static org.spectralsieve.store.WeightedScreen.FIRST_NM;
import static org.spectralsieve.store.WeightedScreen.binOf;
import static org.spectralsieve.store.BinCodes.codeAtLeast;
import static org.spectralsieve.store.BinCodes.codeAtMost;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.weighting.BoundedCurves;

/**
 * Collects {@link WeightedScreen}'s bins of each curve slot at store time (a fresh curve, a carried row, a slot
 * without a bound); arrays grow with the store's.
 */
final class WeightedBinsBuilder {
    private byte[][] brightest;
    private byte[][] darkest;
    private short[] rangeOfCurve;
    private final List<double[]> ranges = new ArrayList<>();
    private final Map<List<Double>, Integer> rangeIndex = new HashMap<>();
    private final FigureCodes.Builder figures;

    WeightedBinsBuilder(int capacity) {
        figures = new FigureCodes.Builder(capacity);
        brightest = new byte[BINS][capacity];
        darkest = new byte[BINS][capacity];
        rangeOfCurve = new short[capacity];
        Arrays.fill(rangeOfCurve, (short) -1);
    }

    void grow(int capacity) {
        for (int b = 0; b < BINS; b++) {
            brightest[b] = Arrays.copyOf(brightest[b], capacity);
            darkest[b] = Arrays.copyOf(darkest[b], capacity);
        }
        figures.grow(capacity);
        int old = rangeOfCurve.length;
        rangeOfCurve = Arrays.copyOf(rangeOfCurve, capacity);
        Arrays.fill(rangeOfCurve, old, capacity, (short) -1);
    }

    /** The slot holds no bound (a curve added already on the grid: its exact curve is not known here). */
    void unknown(int slot) {
        for (int b = 0; b < BINS; b++) {
            brightest[b][slot] = 0;
            darkest[b][slot] = 0;
        }
        rangeOfCurve[slot] = -1;
        figures.unknown(slot);
    }

    /**
     * The slot's bins carried over from another store's screen (a rebuild reusing an unchanged curve's row):
     * the same bytes {@link #add} wrote for that curve, so the carried row is screened as a fresh one is.
     */
    void copy(int slot, WeightedScreen from, int fromSlot) {
        unknown(slot);
        figures.copy(slot, from.figures, fromSlot);
        int range = from.rangeOfCurve[fromSlot];
        if (range < 0) {
            return; // not screened there either
        }
        double[] r = from.ranges.get(range);
        Integer here = rangeIndex.computeIfAbsent(List.of(r[0], r[1], r[2]), k -> {
            ranges.add(new double[] {r[0], r[1], r[2]});
            return ranges.size() - 1;
        });
        if (here > Short.MAX_VALUE) {
            return;
        }
        for (int b = 0; b < BINS; b++) {
            brightest[b][slot] = from.brightest[b][fromSlot];
            darkest[b][slot] = from.darkest[b][fromSlot];
        }
        rangeOfCurve[slot] = (short) (int) here;
    }

    /** The slot's bins from the curve the exact judgement reads. */
    void add(int slot, Curve curve) {
        unknown(slot);
        figures.add(slot, curve);
        double min = curve.minWavelengthNm();
        double max = curve.maxWavelengthNm();
        double regular = regular(curve) ? 1 : 0;
        Integer range = rangeIndex.computeIfAbsent(List.of(min, max, regular), k -> {
            ranges.add(new double[] {min, max, regular});
            return ranges.size() - 1;
        });
        if (range > Short.MAX_VALUE) {
            return; // more distinct ranges than a short names: this curve is not screened
        }
        Curve upper = BoundedCurves.upperBounds(curve);
        Curve lower = BoundedCurves.lowerBounds(curve);
        double[] highest = new double[BINS];
        double[] lowest = new double[BINS];
        Arrays.fill(highest, Double.NEGATIVE_INFINITY);
        Arrays.fill(lowest, Double.POSITIVE_INFINITY);
        for (int i = 0; i < curve.size(); i++) {
            double nm = curve.wavelengthNm(i);
            int bin = binOf(nm);
            if (bin < 0) {
                continue;
            }
            bracket(highest, upper, i, bin);
            // a point at T = 0 reads 0 but its neighbours interpolate from the absorbance floor
            double hi = Math.max(upper.transmittance(i), Curve.ABSORBANCE_FLOOR_T);
            double lo = lower.transmittance(i);
            note(highest, lowest, bin, hi, lo);
            if (bin > 0 && nm == FIRST_NM + bin * BIN_NM) {
                note(highest, lowest, bin - 1, hi, lo); // on the shared edge: in both closed bins
            }
        }
        for (int b = 0; b < BINS; b++) {
            double from = Math.max(FIRST_NM + b * BIN_NM, min);
            double to = Math.min(FIRST_NM + (b + 1) * BIN_NM, max);
            if (from > to) {
                continue;
            }
            for (double end : new double[] {from, to}) {
                note(highest, lowest, b, Math.max(upper.transmittanceAt(end).orElseThrow(), Curve.ABSORBANCE_FLOOR_T),
                        lower.transmittanceAt(end).orElseThrow());
            }
            brightest[b][slot] = (byte) codeAtMost(highest[b]);
            darkest[b][slot] = (byte) codeAtLeast(lowest[b]);
        }
        rangeOfCurve[slot] = (short) (int) range;
    }

    /**
     * Whether every bin the curve meets holds one of its points (no two neighbours more than a bin apart)
     * and no point above detection has a limit above its T: then every stored point's upper reading
     * max(T, limit) that any value inside a bin is read from — T interpolated in absorbance, limits
     * linearly, between two neighbours — is held by that bin's brightest ({@link WeightedScreen.Query#behindLayer}).
     */
    static boolean regular(Curve curve) {
        for (int i = 0; i < curve.size(); i++) {
            if (i > 0 && curve.wavelengthNm(i) - curve.wavelengthNm(i - 1) > BIN_NM) {
                return false;
            }
            if (!curve.belowDetection(i) && curve.detectionLimit(i) > curve.transmittance(i)) {
                return false;
            }
        }
        return true;
    }

    /**
     * The brightest of a bin also holds the points just outside it that a value inside it interpolates
     * from (the last point before the bin and the first after it), so that after a change of thickness,
     * which moves every point but interpolates between the moved points, the bin's values still lie
     * below the moved brightest ({@link WeightedScreen#marginBoundsThinned}).
     */
    private static void bracket(double[] highest, Curve upper, int i, int bin) {
        double lowEdge = FIRST_NM + bin * BIN_NM;
        double highEdge = lowEdge + BIN_NM;
        if (i > 0 && upper.wavelengthNm(i - 1) < lowEdge) {
            highest[bin] = Math.max(highest[bin], Math.max(upper.transmittance(i - 1), Curve.ABSORBANCE_FLOOR_T));
        }
        if (i + 1 < upper.size() && upper.wavelengthNm(i + 1) > highEdge) {
            highest[bin] = Math.max(highest[bin], Math.max(upper.transmittance(i + 1), Curve.ABSORBANCE_FLOOR_T));
        }
    }

    private static void note(double[] highest, double[] lowest, int bin, double hi, double lo) {
        highest[bin] = Math.max(highest[bin], hi);
        lowest[bin] = Math.min(lowest[bin], lo);
    }

    WeightedScreen build(int size) {
        byte[][] b = new byte[BINS][];
        byte[][] d = new byte[BINS][];
        for (int i = 0; i < BINS; i++) {
            b[i] = brightest[i].length == size ? brightest[i] : Arrays.copyOf(brightest[i], size);
            d[i] = darkest[i].length == size ? darkest[i] : Arrays.copyOf(darkest[i], size);
        }
        short[] r = rangeOfCurve.length == size ? rangeOfCurve : Arrays.copyOf(rangeOfCurve, size);
        return new WeightedScreen(b, d, r, List.copyOf(ranges), figures.build(size));
    }
}
