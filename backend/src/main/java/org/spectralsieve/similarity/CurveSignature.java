package org.spectralsieve.similarity;

import java.util.Arrays;
import org.spectralsieve.spectrum.Curve;

/**
 * A curve's shape on the one similarity grid ({@link #FROM_NM}–{@link #TO_NM} nm every {@link #STEP_NM} nm).
 *
 * <p>Per grid point: the absorbance A = −log10 T as measured ({@link #absorbance}), the shape value compared
 * between curves ({@link #shape}: A per millimetre for a bulk material, so that two thicknesses of one material
 * coincide by Beer–Lambert; A as measured for a fixed construction, which cannot be rescaled), and a weight:
 * <ul>
 *   <li>1 for a resolved reading;</li>
 *   <li>{@link #BOUND_WEIGHT} for a reading at or below the detection limit, whose value is clipped at the
 *       limit: it says only "at least this much absorbance", and the same limit gives a different A per mm at
 *       each thickness, so it must not dominate the comparison — but "opaque here" is still shape evidence;</li>
 *   <li>0 (missing, shape NaN) outside the measured range: nothing is extrapolated.</li>
 * </ul>
 * The surface reflection loss (about 0.035 in A for n = 1.5) adds a near-constant offset to A, and to A per mm
 * an offset that changes with the thickness; the metrics centre the shapes on their common points so that
 * no offset counts ({@link ShapeMetric}).
 */
public final class CurveSignature {

    /**
     * 200 nm: UV-C, where silica grades and UV-transmitting plastics differ; below it few instruments read.
     * 700 nm: the red end of the visible; beyond it the curves of the stock this tool serves are flat or show
     * only the iron band of glass, whose visible tail is already on the grid.
     */
    public static final double FROM_NM = 200;
    public static final double TO_NM = 700;
    /**
     * 5 nm: finer than the narrowest absorption edges of the stock (10–30 nm from 1 % to 50 %) and than a
     * typical instrument bandwidth, coarse enough to keep the dimension (101) modest for a vector index.
     */
    public static final double STEP_NM = 5;
    /** 101 points. */
    public static final int DIMENSION = (int) Math.round((TO_NM - FROM_NM) / STEP_NM) + 1;
    /** Weight of a reading at or below its detection limit: a tenth of a resolved one (our choice, see the docs). */
    public static final double BOUND_WEIGHT = 0.1;

    private final double[] absorbance;
    private final double[] shape;
    private final double[] weight;
    private final double thicknessMm;
    private final boolean bulk;

    private CurveSignature(double[] absorbance, double[] shape, double[] weight, double thicknessMm, boolean bulk) {
        this.absorbance = absorbance;
        this.shape = shape;
        this.weight = weight;
        this.thicknessMm = thicknessMm;
        this.bulk = bulk;
    }

    /**
     * The signature of {@code curve}, measured at {@code thicknessMm}; {@code bulk} when the material is a
     * homogeneous absorber that Beer–Lambert may rescale.
     */
    public static CurveSignature of(Curve curve, double thicknessMm, boolean bulk) {
        if (curve == null) {
            throw new IllegalArgumentException("curve must not be null");
        }
        if (!Double.isFinite(thicknessMm) || thicknessMm <= 0) {
            throw new IllegalArgumentException("thicknessMm must be finite and > 0, was " + thicknessMm);
        }
        double[] a = new double[DIMENSION];
        double[] s = new double[DIMENSION];
        double[] w = new double[DIMENSION];
        double[] nmOfPoints = curve.wavelengthsNm();
        for (int i = 0; i < DIMENSION; i++) {
            double nm = wavelengthNm(i);
            if (!curve.covers(nm)) {
                a[i] = Double.NaN;
                s[i] = Double.NaN;
                continue;
            }
            double limit = detectionLimitAt(curve, nmOfPoints, nm);
            double t = curve.transmittanceAt(nm).orElseThrow();
            boolean bound = curve.belowDetectionAt(nm) || t <= limit;
            // a bound is clipped at its limit: the reading says only that T is no higher
            double clipped = bound ? Math.max(t, limit) : t;
            a[i] = -Math.log10(Math.max(clipped, Curve.ABSORBANCE_FLOOR_T));
            s[i] = bulk ? a[i] / thicknessMm : a[i];
            w[i] = bound ? BOUND_WEIGHT : 1;
        }
        return new CurveSignature(a, s, w, thicknessMm, bulk);
    }

    /** The larger detection limit of the two points around {@code nm}: the cautious one for a value between them. */
    private static double detectionLimitAt(Curve curve, double[] nm, double at) {
        int hit = Arrays.binarySearch(nm, at);
        if (hit >= 0) {
            return curve.detectionLimit(hit);
        }
        int upper = -hit - 1;
        return Math.max(curve.detectionLimit(upper - 1), curve.detectionLimit(upper));
    }

    public static double wavelengthNm(int i) {
        return FROM_NM + i * STEP_NM;
    }

    /** Decadic absorbance as measured at grid point i; NaN where missing. */
    public double absorbance(int i) {
        return absorbance[i];
    }

    /** The compared value at grid point i: A per mm (bulk) or A (fixed); NaN where missing. */
    public double shape(int i) {
        return shape[i];
    }

    /** 1 resolved, {@link #BOUND_WEIGHT} at or below detection, 0 missing. */
    public double weight(int i) {
        return weight[i];
    }

    public double thicknessMm() {
        return thicknessMm;
    }

    public boolean bulk() {
        return bulk;
    }

    /** The shape values as a float vector (missing points as NaN), e.g. for a vector index. */
    public float[] shapeVector() {
        float[] v = new float[DIMENSION];
        for (int i = 0; i < DIMENSION; i++) {
            v[i] = (float) shape[i];
        }
        return v;
    }

    /** Number of grid points with a reading (resolved or bound). */
    public int pointsCovered() {
        int n = 0;
        for (double x : weight) {
            if (x > 0) {
                n++;
            }
        }
        return n;
    }
}
