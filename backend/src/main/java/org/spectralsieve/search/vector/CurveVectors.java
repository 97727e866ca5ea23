package org.spectralsieve.search.vector;

import org.spectralsieve.similarity.CurveSignature;

/**
 * The index vector of a curve: its shape on every {@link #STRIDE}-th point of the similarity grid, centred on
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

    /** Every 2nd grid point: 10 nm, 51 dimensions (measured against 5 nm in the docs). */
    public static final int STRIDE = 2;
    public static final int DIMENSION = (CurveSignature.DIMENSION - 1) / STRIDE + 1;

    private CurveVectors() {
    }

    /**
     * The unit vector of {@code signature}. A curve with no shape (flat, or fewer than two points) gets the
     * constant unit vector over its points: orthogonal to every centred shape, and identical for all flat
     * curves, which the exact correlation also calls identical.
     */
    public static float[] of(CurveSignature signature) {
        return of(signature, STRIDE);
    }

    static float[] of(CurveSignature signature, int stride) {
        return of(signature, stride, 0);
    }

    /** {@code power}: each point counts its weight to this power (0: every point alike), kept for the measurement. */
    static float[] of(CurveSignature signature, int stride, double power) {
        int dimension = (CurveSignature.DIMENSION - 1) / stride + 1;
        double sum = 0;
        double total = 0;
        for (int j = 0; j < dimension; j++) {
            int i = j * stride;
            double w = signature.weight(i);
            if (w > 0) {
                sum += Math.pow(w, power) * signature.shape(i);
                total += Math.pow(w, power);
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
            int i = j * stride;
            double w = signature.weight(i);
            u[j] = w > 0 ? Math.pow(w, power) * (signature.shape(i) - mean) : 0;
            norm += u[j] * u[j];
        }
        norm = Math.sqrt(norm);
        // relative flatness: A per mm varies by orders of magnitude between stocks, so compare with the level
        if (norm <= 1e-9 * (1 + Math.abs(mean))) {
            int points = 0;
            for (int j = 0; j < dimension; j++) {
                points += signature.weight(j * stride) > 0 ? 1 : 0;
            }
            float c = (float) (1 / Math.sqrt(points));
            for (int j = 0; j < dimension; j++) {
                v[j] = signature.weight(j * stride) > 0 ? c : 0;
            }
            return v;
        }
        for (int j = 0; j < dimension; j++) {
            v[j] = (float) (u[j] / norm);
        }
        return v;
    }
}
