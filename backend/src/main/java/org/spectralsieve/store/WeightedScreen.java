package org.spectralsieve.store;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.spectralsieve.requirement.Direction;
import org.spectralsieve.requirement.WeightedClause;
import org.spectralsieve.requirement.Weighting;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.weighting.BoundedCurves;
import org.spectralsieve.weighting.LuminousTransmittance;
import org.spectralsieve.weighting.WeightedFigures;

/**
 * What the store can prove about weighted figures (an emitter's share that passes, erythemal, UV hazard,
 * luminous τv) without reading a curve: bounds on the exact figure of every curve as measured, for any
 * emitter × response, from 102 bytes per curve. See docs/weighted-screening.md.
 *
 * <p>Why it holds: every weighted figure the requirement judges is a ratio Σ aₙ·T(λₙ) / Σ aₙ with weights
 * aₙ ≥ 0 at fixed wavelengths λₙ (the figure's integration points, which depend only on the weighting and
 * on where the curve starts and ends), so it is a weighted mean of T and lies between the means of any
 * lower and upper envelopes of T. The store keeps, per curve and per 12 nm bin, the highest T of the curve
 * with points below detection at their upper bounds and the lowest T with those points at 0 — over the
 * whole closed bin (the curve's own points inside it and its interpolated values at the bin's ends: between
 * points T is monotone, being linear in absorbance), so every integration point is covered, however finely
 * the curve was sampled. The exact judgement reads a pass on its upper end U and a block on its lower end L
 * when it calls them missed, so Σ share_b · highest_b &lt; threshold proves a pass missed and
 * Σ share_b · lowest_b &gt; threshold a block, with a margin no better than the bound's.
 *
 * <p>Each bin value is one byte of optical density in steps of {@link #STEP} decades, rounded towards the
 * safe side (the highest T up, the lowest down), and the sums carry a relative slack of {@link #SLACK} for
 * the exact figure's own rounding. Code 0 means "no bound": for the highest T a value above T = 1.45 (or no
 * curve, as for curves added already on the grid), for the lowest T a value that may be 0.
 */
public final class WeightedScreen {

    /** The bins: 12 nm each over 190–790 nm (curves start at 190 nm at the earliest; τv ends at 780 nm). */
    public static final double FIRST_NM = 190;
    public static final double BIN_NM = 12;
    public static final int BINS = 50;
    /** Optical density per code step; code c stands for OD (c − {@link #OFFSET}) · STEP. */
    public static final double STEP = 0.02;
    static final int OFFSET = 9;
    /** Relative room for the exact figure's floating-point rounding, on the safe side of every bound. */
    static final double SLACK = 1e-6;
    /** Bytes per curve: two bin codes per bin and a short naming the curve's wavelength range. */
    public static final int BYTES_PER_CURVE = 2 * BINS + Short.BYTES;

    private static final double[] T_OF_CODE = new double[256];

    static {
        for (int c = 1; c < 256; c++) {
            T_OF_CODE[c] = Math.pow(10, -(c - OFFSET) * STEP);
        }
    }

    private final byte[][] brightest;
    private final byte[][] darkest;
    private final short[] rangeOfCurve;
    private final List<double[]> ranges;

    private WeightedScreen(byte[][] brightest, byte[][] darkest, short[] rangeOfCurve, List<double[]> ranges) {
        this.brightest = brightest;
        this.darkest = darkest;
        this.rangeOfCurve = rangeOfCurve;
        this.ranges = ranges;
    }

    static Builder builder(int capacity) {
        return new Builder(capacity);
    }

    /**
     * An upper bound on the exact clause margin (decades) of every curve as measured, or +∞ where the screen
     * can say nothing; negative only where the exact judgement of that curve, as measured, is a miss of the
     * clause (pass: U below the threshold; block: L above it).
     *
     * @param layerRange with a fixed layer, {from, to} of the layer's curve: a curve is bounded only where
     *                   the layer covers the part of the weighting's range the curve covers, so the stack
     *                   integrates over the same points (a pass only: the stack's T is at most the curve's)
     */
    public double[] marginBounds(WeightedClause clause, Optional<double[]> layerRange) {
        int n = rangeOfCurve.length;
        double[] out = new double[n];
        Arrays.fill(out, Double.POSITIVE_INFINITY);
        if (layerRange.isPresent() && clause.direction() != Direction.PASS) {
            return out;
        }
        boolean pass = clause.direction() == Direction.PASS;
        byte[][] codes = pass ? brightest : darkest;
        double threshold = clause.thresholdT();
        double floor = Math.min(Curve.ABSORBANCE_FLOOR_T, threshold);
        Map<Integer, double[]> sharesOfRange = new HashMap<>();
        for (int curve = 0; curve < n; curve++) {
            int range = rangeOfCurve[curve];
            if (range < 0) {
                continue;
            }
            double[] shares = sharesOfRange.computeIfAbsent(range,
                    r -> binShares(clause.weighting(), ranges.get(r), layerRange));
            if (shares.length == 0) {
                continue;
            }
            double mean = 0;
            boolean bounded = true;
            for (int b = 0; b < BINS && bounded; b++) {
                if (shares[b] > 0) {
                    int code = codes[b][curve] & 0xFF;
                    bounded = code != 0 || !pass;
                    mean += shares[b] * T_OF_CODE[code];
                }
            }
            if (!bounded) {
                continue;
            }
            out[curve] = pass ? Math.log10(Math.max(mean * (1 + SLACK), floor) / threshold)
                    : Math.log10(threshold / Math.max(mean * (1 - SLACK), floor));
        }
        return out;
    }

    /**
     * An upper bound on the exact pass margin of every bulk curve judged at or above {@code thinnestMm}, for
     * curves measured thicker than that (the others: +∞; {@link #marginBounds} serves them). Why: a thinner
     * cut passes more, but a slab's T is at most its internal transmittance K ((1 − R)²K / (1 − R²K²) ≤ K),
     * K0 ≤ T0 / (1 − R)² at the measured thickness, and K = K0^(d/d0); a reading the data cannot resolve keeps
     * its T0 (flat in d), which is below that too. So each point thinned to d has T ≤ min(1, (T0 / (1 − R)²)^(d/d0)),
     * rising in T0 and R: the brightest of a bin (which holds the points a value inside it interpolates from)
     * and the largest R of the curve's index over its range bound every value of the thinned curve in the bin.
     */
    public double[] marginBoundsThinned(SpectralStore store, WeightedClause clause, Optional<double[]> layerRange,
                                        double thinnestMm) {
        int n = rangeOfCurve.length;
        double[] out = new double[n];
        Arrays.fill(out, Double.POSITIVE_INFINITY);
        if (clause.direction() != Direction.PASS || !(thinnestMm > 0)) {
            return out;
        }
        double threshold = clause.thresholdT();
        double floor = Math.min(Curve.ABSORBANCE_FLOOR_T, threshold);
        Map<Integer, double[]> sharesOfRange = new HashMap<>();
        Map<List<Integer>, Double> surface = new HashMap<>();
        for (int curve = 0; curve < n; curve++) {
            int range = rangeOfCurve[curve];
            double d0 = store.thicknessMm(curve);
            if (range < 0 || !store.isBulk(curve) || !(d0 > thinnestMm)) {
                continue;
            }
            double[] shares = sharesOfRange.computeIfAbsent(range,
                    r -> binShares(clause.weighting(), ranges.get(r), layerRange));
            if (shares.length == 0) {
                continue;
            }
            int model = store.indexModelOf(curve);
            double r = surface.computeIfAbsent(List.of(model, range),
                    k -> largestReflectance(store.indexModel(model), ranges.get(range)));
            if (!(r < 1)) {
                continue;
            }
            double k = thinnestMm / d0;
            double loss = (1 - r) * (1 - r);
            double mean = 0;
            boolean bounded = true;
            for (int b = 0; b < BINS && bounded; b++) {
                if (shares[b] > 0) {
                    int code = brightest[b][curve] & 0xFF;
                    bounded = code != 0;
                    double t = Math.min(1, Math.pow(T_OF_CODE[code] * (1 + SLACK) / loss, k));
                    mean += shares[b] * Math.max(t, Curve.ABSORBANCE_FLOOR_T);
                }
            }
            if (bounded) {
                out[curve] = Math.log10(Math.max(mean * (1 + SLACK), floor) / threshold);
            }
        }
        return out;
    }

    /**
     * The largest normal-incidence surface reflectance of the index over the curve's range (every 0.25 nm
     * and both ends, n raised by 0.02 for what lies between the samples); 1 (no bound) when the index cannot
     * give n there, where the exact rescaling fails too and says so (an unverified row, never a miss).
     */
    static double largestReflectance(org.spectralsieve.optics.RefractiveIndex index, double[] curveRange) {
        double largest = 0;
        try {
            for (double nm = curveRange[0]; ; nm = Math.min(curveRange[1], nm + 0.25)) {
                double n = index.at(nm);
                if (!(n >= 1) || !Double.isFinite(n)) {
                    return 1;
                }
                largest = Math.max(largest, org.spectralsieve.optics.Fresnel.reflectanceInAir(n + 0.02));
                if (nm >= curveRange[1]) {
                    return largest;
                }
            }
        } catch (RuntimeException e) {
            return 1;
        }
    }

    /**
     * Each bin's share of the figure's weight for a curve spanning {min, max}; empty when the figure is not
     * available on such a curve (the exact judgement says unverified, which no bound may claim to be a miss),
     * when an integration point lies outside the bins, or when a layer would change the points.
     */
    static double[] binShares(Weighting weighting, double[] curveRange, Optional<double[]> layerRange) {
        double min = curveRange[0];
        double max = curveRange[1];
        double[][] nodes;
        if (weighting instanceof Weighting.Luminous) {
            if (!(min <= LuminousTransmittance.FROM_NM && max >= LuminousTransmittance.TO_NM)) {
                return new double[0];
            }
            nodes = LuminousTransmittance.integrationNodes();
        } else if (weighting instanceof Weighting.Spectral spectral) {
            double[] span = spectral.rangeNm();
            double from = Math.max(span[0], min);
            double to = Math.min(span[1], max);
            Curve flat = Curve.of(new double[] {min, max}, new double[] {1, 1}, 0);
            if (!(to > from) || !spectral.figure(flat).available()) {
                return new double[0];
            }
            nodes = WeightedFigures.integrationNodes(spectral.emitter(), spectral.effectiveResponse(), from, to);
        } else {
            return new double[0];
        }
        double[] nm = nodes[0];
        double[] weight = nodes[1];
        if (nm.length == 0) {
            return new double[0];
        }
        if (layerRange.isPresent() && !(layerRange.get()[0] <= nm[0] && layerRange.get()[1] >= nm[nm.length - 1])) {
            return new double[0];
        }
        double[] shares = new double[BINS];
        double total = 0;
        for (int i = 0; i < nm.length; i++) {
            int bin = binOf(nm[i]);
            if (bin < 0) {
                return new double[0];
            }
            shares[bin] += weight[i];
            total += weight[i];
        }
        if (!(total > 0)) {
            return new double[0];
        }
        for (int b = 0; b < BINS; b++) {
            shares[b] /= total;
        }
        return shares;
    }

    /** The bin whose closed interval holds the wavelength (the lower one on a shared edge); −1 outside. */
    private static int binOf(double nm) {
        if (!(nm >= FIRST_NM && nm <= FIRST_NM + BINS * BIN_NM)) {
            return -1;
        }
        return Math.min(BINS - 1, (int) Math.floor((nm - FIRST_NM) / BIN_NM));
    }

    /** Code of an upper bound on T: OD rounded down; 0 (no bound) above T = 10^(OFFSET·STEP). */
    static int codeAtMost(double t) {
        if (!(t > 0)) {
            return 255;
        }
        long c = (long) Math.floor(-Math.log10(t) / STEP - 1e-6) + OFFSET;
        return c < 1 ? 0 : (int) Math.min(255, c);
    }

    /** Code of a lower bound on T: OD rounded up; 0 (T may be 0) where the OD is beyond the code. */
    static int codeAtLeast(double t) {
        if (!(t > 0)) {
            return 0;
        }
        long c = (long) Math.ceil(-Math.log10(t) / STEP + 1e-6) + OFFSET;
        return c > 255 ? 0 : (int) Math.max(1, c);
    }

    /** The transmittance a code stands for (0 for code 0). */
    static double transmittanceOf(int code) {
        return T_OF_CODE[code];
    }

    /** Collects the bins of each curve slot; arrays grow with the store's. */
    static final class Builder {
        private byte[][] brightest;
        private byte[][] darkest;
        private short[] rangeOfCurve;
        private final List<double[]> ranges = new ArrayList<>();
        private final Map<List<Double>, Integer> rangeIndex = new HashMap<>();

        private Builder(int capacity) {
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
        }

        /**
         * The slot's bins carried over from another store's screen (a rebuild reusing an unchanged curve's row):
         * the same bytes {@link #add} wrote for that curve, so the carried row is screened as a fresh one is.
         */
        void copy(int slot, WeightedScreen from, int fromSlot) {
            unknown(slot);
            int range = from.rangeOfCurve[fromSlot];
            if (range < 0) {
                return; // not screened there either
            }
            double[] r = from.ranges.get(range);
            Integer here = rangeIndex.computeIfAbsent(List.of(r[0], r[1]), k -> {
                ranges.add(new double[] {r[0], r[1]});
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
            double min = curve.minWavelengthNm();
            double max = curve.maxWavelengthNm();
            Integer range = rangeIndex.computeIfAbsent(List.of(min, max), k -> {
                ranges.add(new double[] {min, max});
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
         * The brightest of a bin also holds the points just outside it that a value inside it interpolates
         * from (the last point before the bin and the first after it), so that after a change of thickness,
         * which moves every point but interpolates between the moved points, the bin's values still lie
         * below the moved brightest ({@link #marginBoundsThinned}).
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
            return new WeightedScreen(b, d, r, List.copyOf(ranges));
        }
    }
}
