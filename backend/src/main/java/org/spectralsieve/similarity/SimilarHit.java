package org.spectralsieve.similarity;

import java.util.OptionalDouble;

/**
 * One candidate's place in a ranking, explaining itself.
 *
 * @param id                  the candidate's id, as given
 * @param distance            by the ranking's {@link ShapeMetric}, 0 for the same shape
 * @param pointsCompared      grid points both curves have
 * @param resolvedPointsCompared of those, the points resolved in both (not a bound in either): a hit resting on
 *                            few of them compares mostly "opaque here" with "opaque here" and says little
 * @param differingMost       the {@link SimilarCurves#BAND_NM} nm band where the curves differ most
 * @param matchingThicknessMm the thickness at which a bulk candidate would best match the query (least squares
 *                            on absorbance, offset free); empty for a fixed construction or when the resolved
 *                            points cannot tell
 */
public record SimilarHit(String id, double distance, int pointsCompared, int resolvedPointsCompared, Band differingMost,
        OptionalDouble matchingThicknessMm) {

    public SimilarHit {
        if (resolvedPointsCompared < 0 || resolvedPointsCompared > pointsCompared) {
            throw new IllegalArgumentException("resolved points " + resolvedPointsCompared + " must lie in [0, "
                    + pointsCompared + "]");
        }
        if (id == null || Double.isNaN(distance) || distance < 0 || differingMost == null || matchingThicknessMm == null) {
            throw new IllegalArgumentException("a hit needs an id, a distance >= 0, a band and a thickness (or empty)");
        }
    }

    /** A wavelength band, nm. */
    public record Band(double fromNm, double toNm) {
        public Band {
            if (!(fromNm < toNm)) {
                throw new IllegalArgumentException("band " + fromNm + "–" + toNm + " nm is empty");
            }
        }

        @Override
        public String toString() {
            return fromNm + "–" + toNm + " nm";
        }
    }
}
