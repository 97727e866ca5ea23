package org.spectralsieve.search.vector;

import org.spectralsieve.similarity.CurveSignature;

/**
 * The index vector of a curve: its shape on every {@link #STRIDE}-th point of the similarity grid from
 * {@link #FIRST_POINT} on, centred on
 * the mean over the curve's own points and scaled to unit length; a point at or below the detection limit
 * keeps its clipped value, a missing point is 0.
 *
 * <p>Why this vector (docs/similar-curves.md, "The vector index"): the dot product of two such vectors is the
 * correlation of the two shapes over the grid — blind to thickness (a scale of A per mm) and to the reflection
 * loss (an offset), like both exact metrics after centring. The exact metrics weight a point by the product
 * of both curves' weights, which no per-curve vector can reproduce; of the per-curve weightings tried (the
 * weight, its square root, none, bounds left out) none at all nominated the exact top ten best, by far
 * (measured in the docs). A missing point adds nothing to the dot product, as it adds nothing to the exact
 * comparison. The vector only nominates candidates; the exact metrics rank them.
 */
public final class CurveVectors {

    /** Every 2nd grid point: 10 nm, 46 dimensions from 250 to 700 nm (measured against 5 and 20 nm in the docs). */
    public static final int STRIDE = 2;
    /**
     * The vector starts at 250 nm (grid point 10), not 200: the window nearly every curve covers. A curve measured
     * from 250 nm compared with one from 200 nm is compared exactly over 250–700 only, but a vector reaching
     * 200 nm centres and scales the wider curve over points the narrower lacks; with a tenth of the synthetic
     * library measured from 250 nm that alone took the exact top ten's recall from 0.99 to 0.84 (docs). What
     * 200–250 nm tells apart (UV-C: silica grades, UV-transmitting plastics) the exact ranking still sees.
     */
    public static final int FIRST_POINT = 10;
    public static final int DIMENSION = (CurveSignature.DIMENSION - 1 - FIRST_POINT) / STRIDE + 1;

    private CurveVectors() {
    }

    /**
     * The unit vector of {@code signature}. A curve with no shape (flat, or fewer than two points) gets the
     * constant unit vector over its points: nearly orthogonal to every centred shape, and identical for all flat
     * curves, which the exact correlation also calls identical.
     */
    public static float[] of(CurveSignature signature) {
        return of(signature, STRIDE);
    }

    /** The vector on every {@code stride}-th grid point from {@link #FIRST_POINT} (other strides: measured in a test). */
    static float[] of(CurveSignature signature, int stride) {
        int first = FIRST_POINT;
        int dimension = (CurveSignature.DIMENSION - 1 - first) / stride + 1;
        double sum = 0;
        double total = 0;
        for (int j = 0; j < dimension; j++) {
            int i = first + j * stride;
            double w = signature.weight(i);
            if (w > 0) {
                sum += signature.shape(i);
                total++;
            }
        }
        float[] v = new float[dimension];
        if (total == 0) {
            v[0] = 1; // nothing measured on the grid: any unit vector; such a curve is never a candidate anyway
            return v;
        }
        double mean = sum / total;
        double norm = 0;
        double[] u = new double[dimension];
        for (int j = 0; j < dimension; j++) {
            int i = first + j * stride;
            double w = signature.weight(i);
            u[j] = w > 0 ? signature.shape(i) - mean : 0;
            norm += u[j] * u[j];
        }
        norm = Math.sqrt(norm);
        // relative flatness: A per mm varies by orders of magnitude between stocks, so compare with the level
        if (norm <= 1e-9 * (1 + Math.abs(mean))) {
            int points = 0;
            for (int j = 0; j < dimension; j++) {
                points += signature.weight(first + j * stride) > 0 ? 1 : 0;
            }
            float c = (float) (1 / Math.sqrt(points));
            for (int j = 0; j < dimension; j++) {
                v[j] = signature.weight(first + j * stride) > 0 ? c : 0;
            }
            return v;
        }
        for (int j = 0; j < dimension; j++) {
            v[j] = (float) (u[j] / norm);
        }
        return v;
    }
}
