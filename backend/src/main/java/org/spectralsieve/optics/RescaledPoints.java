package org.spectralsieve.optics;

import org.spectralsieve.spectrum.Curve;
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

    private final ThicknessRescaler.Prepared prepared;
    private final Curve measured;
    private final double fromMm;
    private final double toMm;
    private final double[] t;
    private final double[] limits;
    private final boolean[] below;
    private final boolean[] done;

    RescaledPoints(ThicknessRescaler.Prepared prepared, double fromMm, double toMm) {
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
        compute(i);
        return below[i];
    }

    @Override
    public double detectionLimit(int i) {
        compute(i);
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

    /** Point i as {@link ThicknessRescaler.Prepared#at} computes it. */
    private void compute(int i) {
        if (done[i]) {
            return;
        }
        SlabReading value = prepared.value(i);
        double ti = value.transmittance(fromMm, toMm);
        double limit = prepared.limit(i).transmittance(fromMm, toMm);
        boolean b = measured.belowDetection(i);
        if (value.boundAt(fromMm, toMm)) {
            b = true;
            limit = Math.max(limit, Math.min(ti, BELOW_ONE));
        }
        limit = Math.min(limit, BELOW_ONE);
        if (!(Double.isFinite(ti) && ti >= 0 && ti <= Curve.MAX_TRANSMITTANCE && limit >= 0)) {
            // what the built curve would refuse: build it, so the refusal is the same
            prepared.at(fromMm, toMm);
            throw new IllegalStateException("rescaled point " + i + " is " + ti + " (limit " + limit + ")");
        }
        t[i] = ti;
        limits[i] = limit;
        below[i] = b;
        done[i] = true;
    }
}
