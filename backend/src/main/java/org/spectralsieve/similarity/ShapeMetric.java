package org.spectralsieve.similarity;

/**
 * How far apart two signatures' shapes are, over the grid points both have (weights multiplied, so a point
 * that is a bound in either counts a tenth or less). Both metrics first centre each shape on its weighted mean
 * over those common points, so a near-constant offset in absorbance (the surface reflection loss) never
 * counts.
 *
 * <p>Euclidean distance between z-scored vectors is not a third choice: with the same points and weights,
 * d² = 2(1 − r), the same ranking as {@link #CORRELATION}. The second metric therefore keeps the magnitude.
 */
public enum ShapeMetric {

    /**
     * 1 − r, r the weighted Pearson correlation of the centred shapes (cosine of the centred vectors), in [0, 2].
     * Blind to any scale and offset: recognises a material at any thickness, bulk or not, but also takes a
     * faint absorber for a strong one of the same shape. A flat curve has no shape: against another flat one
     * the distance is 0, against a curve with shape it is 1 (no evidence either way).
     */
    CORRELATION,

    /**
     * The weighted root-mean-square difference of the centred curves, in absorbance at the query's thickness:
     * a bulk candidate is brought to that thickness by Beer–Lambert (its A per mm times the query's thickness),
     * a fixed construction is compared as measured. One unit for every candidate keeps the distances of one
     * ranking comparable (per mm would inflate a thin film's numbers tenfold against a sheet's). Blind to the
     * offset only: a bulk material at another thickness still matches, while a paler or darker stock does not.
     */
    CENTRED_EUCLIDEAN
}
