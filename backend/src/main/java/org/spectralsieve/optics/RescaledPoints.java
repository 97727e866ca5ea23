package org.spectralsieve.optics;

import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.PerPointArithmetic;
import org.spectralsieve.spectrum.PointReadings;

/**
 * A bulk part's curve rescaled to one thickness, each point computed only when it is read: the same numbers,
 * point for point, as the curve {@link ThicknessRescaler.Prepared#at} builds — T, flags, limits and absorbance
 * uncertainties (the same prepared readings, the
 * same rule), without computing the points nobody reads. A weighted figure reads the points around its
 * integration points — a 365 nm LED's 72 nm of a curve of 900 points — and a thickness solve asks for dozens
 * of thicknesses per sample, so this is most of a solve's cost saved (docs/exact-judgement-speed.md).
 * Not shared between threads.
 */
final class RescaledPoints implements PointReadings {

    private static final double BELOW_ONE = Math.nextDown(1.0);
    private static final long ONE_BITS = Double.doubleToRawLongBits(1.0);
    /** Points added beyond a read that falls outside the span held, so a walk along the curve grows it rarely. */
    private static final int SPAN_MARGIN = 64;

    private final ThicknessRescaler.Prepared prepared;
    private final Curve measured;
    private final double fromMm;
    private final double toMm;
    /**
     * Points offset … offset + t.length − 1 (every point the earlier way; the lean way only the span read so far,
     * grown when a read falls outside it: a bisection step reads one figure's few dozen points, and a thickness
     * solve forms a hundred thicknesses per sample, so whole-curve arrays were most of what it allocated).
     */
    private int offset;
    private double[] t;
    private double[] limits;
    private boolean[] below;
    private boolean[] done;
    private boolean[] limitDone;
    private final boolean limitsWhenRead;
    /** The lean arithmetic ({@link PerPointArithmetic}): K of a clear reading taken once, the slab formula reused. */
    private final boolean lean = !PerPointArithmetic.earlier();
    /** toMm / fromMm, the exponent {@link BeerLambert#scaleInternal} applies to every point's K0. */
    private final double ratio;
    /** K0^ratio for K0 = 1 (a clear reading), taken once for all such points; NaN until then. */
    private double clearInternal = Double.NaN;

    RescaledPoints(ThicknessRescaler.Prepared prepared, double fromMm, double toMm) {
        this(prepared, fromMm, toMm, false);
    }

    /**
     * @param limitsWhenRead form a point's detection limit only when it is read (the default of the judgement);
     *                       false forms it with the point's T, the earlier way
     */
    RescaledPoints(ThicknessRescaler.Prepared prepared, double fromMm, double toMm, boolean limitsWhenRead) {
        BeerLambert.requireThickness("fromMm", fromMm);
        BeerLambert.requireThickness("toMm", toMm);
        this.prepared = prepared;
        this.measured = prepared.measured();
        this.fromMm = fromMm;
        this.toMm = toMm;
        int n = lean ? 0 : measured.size();
        this.t = new double[n];
        this.limits = new double[n];
        this.below = new boolean[n];
        this.done = new boolean[n];
        this.limitDone = new boolean[n];
        this.limitsWhenRead = limitsWhenRead;
        this.ratio = toMm / fromMm;
    }

    @Override
    public int size() {
        return measured.size();
    }

    @Override
    public double wavelengthNm(int i) {
        return measured.wavelengthNm(i);
    }

    @Override
    public double transmittance(int i) {
        hold(i);
        compute(i);
        return t[i - offset];
    }

    @Override
    public boolean belowDetection(int i) {
        hold(i);
        if (lean && !done[i - offset]) {
            // the flag alone, by the rule compute applies: a figure's lower end reads a point below detection as
            // 0 and never needs its T (SortedReading)
            return measured.belowDetection(i) || prepared.value(i).boundAt(fromMm, toMm);
        }
        compute(i);
        return below[i - offset];
    }

    /**
     * Formed only when asked: a figure reads a point's limit only where the point is below detection, so most
     * points never need the second slab power.
     */
    @Override
    public double detectionLimit(int i) {
        hold(i);
        compute(i);
        if (!limitDone[i - offset]) {
            double limit;
            if (!lean) {
                limit = prepared.limit(i).transmittance(fromMm, toMm);
            } else if (prepared.limitIsValue(i)) {
                // the limit stored as the point's T (a reading at the floor): the same reading, the same number
                limit = t[i - offset];
            } else {
                limit = prepared.limitTransmittanceAt(i, internalAt(prepared.limit(i).internal()));
            }
            if (prepared.value(i).boundAt(fromMm, toMm)) {
                limit = Math.max(limit, Math.min(t[i - offset], BELOW_ONE));
            }
            limit = Math.min(limit, BELOW_ONE);
            if (!(limit >= 0)) {
                // what the built curve would refuse: build it, so the refusal is the same
                prepared.at(fromMm, toMm);
                throw new IllegalStateException("rescaled limit " + i + " is " + limit);
            }
            limits[i - offset] = limit;
            limitDone[i - offset] = true;
        }
        return limits[i - offset];
    }

    @Override
    public boolean hasUncertainty() {
        return measured.hasUncertainty();
    }

    /**
     * Point i's absorbance uncertainty as {@link ThicknessRescaler.Prepared#at} carries it: NaN at a bound
     * (none is known) or where the measured one is unknown, else {@link ThicknessRescaler#rescaledUncertainty}.
     */
    @Override
    public double absorbanceUncertainty(int i) {
        if (!measured.hasUncertainty() || belowDetection(i)) {
            return Double.NaN;
        }
        double sigma = ThicknessRescaler.rescaledUncertainty(measured.absorbanceUncertainty(i), prepared.value(i),
                fromMm, toMm);
        if (!Double.isNaN(sigma) && !(Double.isFinite(sigma) && sigma >= 0)) {
            // what the built curve would refuse: build it, so the refusal is the same
            prepared.at(fromMm, toMm);
            throw new IllegalStateException("rescaled uncertainty at point " + i + " is " + sigma);
        }
        return sigma;
    }

    /**
     * {@link BeerLambert#scaleInternal}{@code (k0, fromMm, toMm)}: the same power of the same two numbers, its
     * checks already passed (a reading's K0 is a fraction, the thicknesses were checked here), taken once for
     * every clear reading (K0 = 1, bit for bit).
     */
    private double internalAt(double k0) {
        if (Double.doubleToRawLongBits(k0) != ONE_BITS) {
            return Math.pow(k0, ratio);
        }
        if (Double.isNaN(clearInternal)) {
            clearInternal = Math.pow(1.0, ratio);
        }
        return clearInternal;
    }

    /** Makes room for point i: the arrays grown to span it (with a margin), what they held kept. */
    private void hold(int i) {
        if (i >= offset && i < offset + t.length) {
            return;
        }
        int n = measured.size();
        int from = t.length == 0 ? Math.max(0, i - SPAN_MARGIN) : Math.min(offset, Math.max(0, i - SPAN_MARGIN));
        int to = t.length == 0 ? Math.min(n, i + 1 + SPAN_MARGIN)
                : Math.max(offset + t.length, Math.min(n, i + 1 + SPAN_MARGIN));
        t = spanned(t, new double[to - from], from);
        limits = spanned(limits, new double[to - from], from);
        below = spanned(below, new boolean[to - from], from);
        done = spanned(done, new boolean[to - from], from);
        limitDone = spanned(limitDone, new boolean[to - from], from);
        offset = from;
    }

    private <A> A spanned(A old, A grown, int from) {
        int length = java.lang.reflect.Array.getLength(old);
        if (length > 0) {
            System.arraycopy(old, 0, grown, offset - from, length);
        }
        return grown;
    }

    /** Point i as {@link ThicknessRescaler.Prepared#at} computes it. */
    private void compute(int i) {
        if (done[i - offset]) {
            return;
        }
        SlabReading value = prepared.value(i);
        double ti = lean ? prepared.valueTransmittanceAt(i, internalAt(value.internal()))
                : value.transmittance(fromMm, toMm);
        // the point's limit is formed when read (detectionLimit): the same rule, applied later
        boolean b = measured.belowDetection(i) || value.boundAt(fromMm, toMm);
        if (!(Double.isFinite(ti) && ti >= 0 && ti <= Curve.MAX_TRANSMITTANCE)) {
            // what the built curve would refuse: build it, so the refusal is the same
            prepared.at(fromMm, toMm);
            throw new IllegalStateException("rescaled point " + i + " is " + ti);
        }
        t[i - offset] = ti;
        below[i - offset] = b;
        done[i - offset] = true;
        if (!limitsWhenRead) {
            detectionLimit(i);
        }
    }
}
