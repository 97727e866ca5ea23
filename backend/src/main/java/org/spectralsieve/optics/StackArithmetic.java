package org.spectralsieve.optics;

import org.spectralsieve.spectrum.Curve;

/**
 * {@link LightPath#combine(double[], Curve[], double[][], OpticalElement[][][])} in plain numbers: the same slab
 * elements and the same chains, expression for expression and in the same order, without an element record per
 * part, point and chain step. Why: behind a layer, the stack of every candidate judged is most of its judgement
 * (docs/exact-judgement-speed.md, "One judgement cheaper").
 *
 * <p>What it leaves out, and why the numbers stay the same:
 * <ul>
 *   <li>A clear reading's far factor ({@link SlabReading#of}: a square root and a logarithm): an element reads
 *       only the reading's internal transmittance and reflectance.</li>
 *   <li>The last chain step's two reflectances: nothing reads them. Their checks cannot fail: with both
 *       reflectances in [0, 1) the denominator 1 − R₁R₂ is positive, every term is non-negative and the result
 *       is capped below 1; the same holds for every step, so only T is checked there.</li>
 *   <li>An element formed again from the same T and reflectance as the part's previous one (a uniform detection
 *       limit behind a constant index): the same function of the same two numbers.</li>
 * </ul>
 * Wherever a record would refuse a number (T not finite or outside [0, 1.5], a reflectance outside [0, 1)),
 * {@link #combine} gives up (null) and the caller takes the record route, which refuses it the same way.
 */
final class StackArithmetic {

    private static final double BELOW_ONE = Math.nextDown(1.0);

    private final int parts;
    /** Each part's element of its T at the current point: transmittance, front and back reflectance. */
    private final double[] valueT;
    private final double[] valueRf;
    private final double[] valueRb;
    /** Each part's element of its detection limit at the current point. */
    private final double[] limitT;
    private final double[] limitRf;
    private final double[] limitRb;
    /**
     * Per part and kind (slot 2j: its T, 2j + 1: its detection limit), the last element formed and what it was
     * formed from, for {@link #formed}.
     */
    private final double[] lastFromT;
    private final double[] lastFromR;
    private final double[] lastT;
    private final double[] lastR;

    private StackArithmetic(int parts) {
        this.parts = parts;
        valueT = new double[parts];
        valueRf = new double[parts];
        valueRb = new double[parts];
        limitT = new double[parts];
        limitRf = new double[parts];
        limitRb = new double[parts];
        lastFromT = new double[2 * parts];
        lastFromR = new double[2 * parts];
        lastT = new double[2 * parts];
        lastR = new double[2 * parts];
        java.util.Arrays.fill(lastFromT, Double.NaN); // matches nothing: T is checked finite before it is looked up
    }

    /** The path's curve, or null where a record of the earlier route would refuse a number. */
    static Curve combine(double[] nm, Curve[] onGrid, double[][] reflectances, OpticalElement[][][] known) {
        return new StackArithmetic(onGrid.length).pathCurve(nm, onGrid, reflectances, known);
    }

    private Curve pathCurve(double[] nm, Curve[] onGrid, double[][] reflectances, OpticalElement[][][] known) {
        double[] t = new double[nm.length];
        boolean[] below = new boolean[nm.length];
        double[] limits = new double[nm.length];
        for (int i = 0; i < nm.length; i++) {
            for (int j = 0; j < parts; j++) {
                if (!formPart(j, i, onGrid[j], reflectances[j], known[j])) {
                    return null;
                }
                below[i] |= onGrid[j].belowDetection(i);
            }
            if (!chainPoint()) {
                return null;
            }
            t[i] = pointT;
            limits[i] = pointLimit;
        }
        Curve path = Curve.of(nm, t, below, limits);
        return LightPath.withStackUncertainty(path, onGrid);
    }

    /** The stack's T at the point last formed ({@link #chainPoint}). */
    private double pointT;
    /** The stack's detection limit at the point last formed. */
    private double pointLimit;

    /** A stack of {@code parts} parts, to form point by point ({@link StackedPoints}). */
    static StackArithmetic forParts(int parts) {
        return new StackArithmetic(parts);
    }

    /** Part j's elements at point i: known ones taken, others formed from its curve there; false as {@link #formed}. */
    boolean formPart(int j, int i, Curve onGrid, double[] reflectances, OpticalElement[][] known) {
        if (known != null) {
            take(known[0][i], valueT, valueRf, valueRb, j);
            take(known[1][i], limitT, limitRf, limitRb, j);
            return true;
        }
        return formPart(j, onGrid.transmittance(i), onGrid.detectionLimit(i), reflectances[i]);
    }

    /** Part j's elements of a reading, its detection limit and its surfaces' reflectance; false as {@link #formed}. */
    boolean formPart(int j, double reading, double limit, double r) {
        return formed(reading, r, valueT, valueRf, valueRb, j, 2 * j) && formed(limit, r, limitT, limitRf, limitRb, j, 2 * j + 1);
    }

    /**
     * The chains of the parts formed: the stack's T ({@link #pointT}) and its detection limit ({@link #pointLimit}:
     * the largest T with one part at a time at its limit, kept below 1); false where a record would refuse a T.
     */
    boolean chainPoint() {
        double pathT = chain(-1);
        if (Double.isNaN(pathT)) {
            return false;
        }
        double limit = 0;
        for (int j = 0; j < parts; j++) {
            double swapped = chain(j);
            if (Double.isNaN(swapped)) {
                return false;
            }
            limit = Math.max(limit, swapped);
        }
        pointT = pathT;
        pointLimit = Math.min(limit, BELOW_ONE);
        return true;
    }

    double pointT() {
        return pointT;
    }

    double pointLimit() {
        return pointLimit;
    }

    private static void take(OpticalElement e, double[] t, double[] rf, double[] rb, int j) {
        t[j] = e.transmittance();
        rf[j] = e.reflectanceFront();
        rb[j] = e.reflectanceBack();
    }

    /**
     * Part j's element of a reading {@code reading} behind surfaces reflecting {@code r}: the numbers of
     * {@code SlabReading.of(reading, r).element()}; false where a record there would refuse one.
     */
    private boolean formed(double reading, double r, double[] t, double[] rf, double[] rb, int j, int slot) {
        if (!Double.isFinite(reading) || !(r >= 0 && r < 1)) {
            return false;
        }
        if (reading == lastFromT[slot] && r == lastFromR[slot]
                && Double.doubleToRawLongBits(reading) == Double.doubleToRawLongBits(lastFromT[slot])
                && Double.doubleToRawLongBits(r) == Double.doubleToRawLongBits(lastFromR[slot])) {
            t[j] = lastT[slot];
            rf[j] = lastR[slot];
            rb[j] = lastR[slot];
            return true;
        }
        double reflectance;
        double internal;
        if (reading <= 0) {
            reflectance = r;
            internal = 0;
        } else if (reading < Slab.losslessTransmittance(r) - SlabReading.READING_UNCERTAINTY) {
            reflectance = r;
            internal = Slab.internalFromTransmittance(reading, r);
        } else {
            double clear = Math.min(reading, 1);
            reflectance = (1 - clear) / (1 + clear);
            internal = 1;
        }
        if (!(reflectance >= 0 && reflectance < 1) || !(internal >= 0 && internal <= 1)) {
            return false;
        }
        // OpticalElement.slab: reflectance first, then transmittance, as there
        double rTotal = Slab.reflectance(internal, reflectance);
        double tSlab = Slab.transmittance(internal, reflectance);
        if (!(tSlab >= 0 && tSlab <= 1.5) || !(rTotal >= 0 && rTotal < 1)) {
            return false;
        }
        t[j] = tSlab;
        rf[j] = rTotal;
        rb[j] = rTotal;
        lastFromT[slot] = reading;
        lastFromR[slot] = r;
        lastT[slot] = tSlab;
        lastR[slot] = rTotal;
        return true;
    }

    /**
     * T of the parts' elements in order ({@link OpticalElement#followedBy}, step by step), part {@code swapped}
     * (if ≥ 0) at its detection limit; NaN where an element record would refuse the T of a step.
     */
    private double chain(int swapped) {
        double pathT = swapped == 0 ? limitT[0] : valueT[0];
        double pathRf = swapped == 0 ? limitRf[0] : valueRf[0];
        double pathRb = swapped == 0 ? limitRb[0] : valueRb[0];
        for (int j = 1; j < parts; j++) {
            boolean atLimit = j == swapped;
            double nextT = atLimit ? limitT[j] : valueT[j];
            double nextRf = atLimit ? limitRf[j] : valueRf[j];
            double nextRb = atLimit ? limitRb[j] : valueRb[j];
            double denominator = 1 - pathRb * nextRf;
            double t = pathT * nextT / denominator;
            if (j < parts - 1) {
                double rf = pathRf + pathT * pathT * nextRf / denominator;
                double rb = nextRb + nextT * nextT * pathRb / denominator;
                pathRf = Math.min(rf, BELOW_ONE);
                pathRb = Math.min(rb, BELOW_ONE);
            }
            pathT = t;
            if (!(pathT >= 0 && pathT <= 1.5)) {
                return Double.NaN;
            }
        }
        return pathT;
    }
}
