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

    private final ThicknessRescaler.Prepared prepared;
    private final Curve measured;
    private final double fromMm;
    private final double toMm;
    private final double[] t;
    private final double[] limits;
    private final boolean[] below;
    private final boolean[] done;
    private final boolean[] limitDone;
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
        int n = measured.size();
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
        compute(i);
        return t[i];
    }

    @Override
    public boolean belowDetection(int i) {
        if (lean && !done[i]) {
            // the flag alone, by the rule compute applies: a figure's lower end reads a point below detection as
            // 0 and never needs its T (SortedReading)
            return measured.belowDetection(i) || prepared.value(i).boundAt(fromMm, toMm);
        }
        compute(i);
        return below[i];
    }

    /**
     * Formed only when asked: a figure reads a point's limit only where the point is below detection, so most
     * points never need the second slab power.
     */
    @Override
    public double detectionLimit(int i) {
        compute(i);
        if (!limitDone[i]) {
            double limit;
            if (!lean) {
                limit = prepared.limit(i).transmittance(fromMm, toMm);
            } else if (prepared.limitIsValue(i)) {
                // the limit stored as the point's T (a reading at the floor): the same reading, the same number
                limit = t[i];
            } else {
                SlabReading reading = prepared.limit(i);
                limit = Double.doubleToRawLongBits(reading.internal()) == ONE_BITS
                        ? prepared.limitTransmittanceAt(i, clearInternal())
                        : Slab.transmittance(Math.pow(reading.internal(), ratio), reading.reflectance());
            }
            if (prepared.value(i).boundAt(fromMm, toMm)) {
                limit = Math.max(limit, Math.min(t[i], BELOW_ONE));
            }
            limit = Math.min(limit, BELOW_ONE);
            if (!(limit >= 0)) {
                // what the built curve would refuse: build it, so the refusal is the same
                prepared.at(fromMm, toMm);
                throw new IllegalStateException("rescaled limit " + i + " is " + limit);
            }
            limits[i] = limit;
            limitDone[i] = true;
        }
        return limits[i];
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
     * {@link BeerLambert#scaleInternal}{@code (1.0, fromMm, toMm)}, the internal transmittance of every clear
     * reading (K0 = 1) at this thickness: the same power of the same two numbers, taken once.
     */
    private double clearInternal() {
        if (Double.isNaN(clearInternal)) {
            clearInternal = Math.pow(1.0, ratio);
        }
        return clearInternal;
    }

    /** Point i as {@link ThicknessRescaler.Prepared#at} computes it. */
    private void compute(int i) {
        if (done[i]) {
            return;
        }
        SlabReading value = prepared.value(i);
        double ti;
        if (!lean) {
            ti = value.transmittance(fromMm, toMm);
        } else if (Double.doubleToRawLongBits(value.internal()) == ONE_BITS) {
            // a clear reading: the same K at every thickness, so the slab formula's T is kept per point
            ti = prepared.valueTransmittanceAt(i, clearInternal());
        } else {
            // SlabReading.transmittance with its checks already passed (K0 a fraction, thicknesses checked here)
            ti = Slab.transmittance(Math.pow(value.internal(), ratio), value.reflectance());
        }
        // the point's limit is formed when read (detectionLimit): the same rule, applied later
        boolean b = measured.belowDetection(i) || value.boundAt(fromMm, toMm);
        if (!(Double.isFinite(ti) && ti >= 0 && ti <= Curve.MAX_TRANSMITTANCE)) {
            // what the built curve would refuse: build it, so the refusal is the same
            prepared.at(fromMm, toMm);
            throw new IllegalStateException("rescaled point " + i + " is " + ti);
        }
        t[i] = ti;
        below[i] = b;
        done[i] = true;
        if (!limitsWhenRead) {
            detectionLimit(i);
        }
    }
}
