package org.spectralsieve.similarity;

import java.util.OptionalDouble;

/** Two signatures over their common grid points: the distance, the band differing most, the matching thickness. */
final class Comparison {

    /** Below this spread (in the compared unit, squared and weighted) a shape counts as flat. */
    private static final double FLAT = 1e-12;

    /**
     * The least spread (standard deviation over the fitted points) of a candidate's absorbance from which a
     * thickness is fitted: 0.01, about 2.3 % in T, roughly what a bench spectrophotometer repeats (common
     * practice, no source). A flatter curve shows no absorption the data can scale — its loss may be all surface.
     */
    static final double MIN_SPREAD = 0.01;

    private final CurveSignature query;
    private final CurveSignature candidate;
    private final double[] weight = new double[CurveSignature.DIMENSION];
    private final double[] x = new double[CurveSignature.DIMENSION];
    private final double[] y = new double[CurveSignature.DIMENSION];
    private final int common;
    private final int resolved;
    private final ComparedBand band;

    Comparison(CurveSignature query, CurveSignature candidate) {
        this(query, candidate, ComparedBand.WHOLE_GRID);
    }

    /** Compared only over the grid points inside {@code band}: every other point weighs 0, as a missing one does. */
    Comparison(CurveSignature query, CurveSignature candidate, ComparedBand band) {
        this.query = query;
        this.candidate = candidate;
        this.band = band;
        // one unit for every candidate of a ranking: absorbance at the query's thickness. A bulk candidate is
        // brought there by Beer–Lambert (its A per mm times the query's thickness); a fixed one stays as measured
        double candidateScale = candidate.bulk() ? query.thicknessMm() : 1;
        int n = 0;
        int both = 0;
        for (int i = 0; i < CurveSignature.DIMENSION; i++) {
            weight[i] = band.holds(i) ? query.weight(i) * candidate.weight(i) : 0;
            if (weight[i] == 1) {
                both++;
            }
            if (weight[i] > 0) {
                x[i] = query.absorbance(i);
                y[i] = candidate.bulk() ? candidate.shape(i) * candidateScale : candidate.absorbance(i);
                n++;
            }
        }
        common = n;
        resolved = both;
        centre(x);
        centre(y);
    }

    int commonPoints() {
        return common;
    }

    int resolvedPoints() {
        return resolved;
    }

    private void centre(double[] v) {
        double sum = 0;
        double total = 0;
        for (int i = 0; i < v.length; i++) {
            sum += weight[i] * v[i];
            total += weight[i];
        }
        double mean = sum / total;
        for (int i = 0; i < v.length; i++) {
            v[i] = weight[i] > 0 ? v[i] - mean : 0;
        }
    }

    double distance(ShapeMetric metric) {
        return switch (metric) {
            case CORRELATION -> correlationDistance();
            case CENTRED_EUCLIDEAN -> Math.sqrt(weightedMean(residuals(metric)));
        };
    }

    private double correlationDistance() {
        double sxx = sum(x, x);
        double syy = sum(y, y);
        if (sxx <= FLAT || syy <= FLAT) {
            return sxx <= FLAT && syy <= FLAT ? 0 : 1;
        }
        double r = sum(x, y) / Math.sqrt(sxx * syy);
        return Math.max(0, 1 - Math.min(1, r));
    }

    /** Squared difference per point in the metric's own units: z-scores for correlation, centred values otherwise. */
    private double[] residuals(ShapeMetric metric) {
        double fx = 1;
        double fy = 1;
        if (metric == ShapeMetric.CORRELATION) {
            double total = totalWeight();
            fx = scale(sum(x, x) / total);
            fy = scale(sum(y, y) / total);
        }
        double[] r = new double[x.length];
        for (int i = 0; i < x.length; i++) {
            double d = x[i] * fx - y[i] * fy;
            r[i] = d * d;
        }
        return r;
    }

    private static double scale(double variance) {
        return variance <= FLAT ? 0 : 1 / Math.sqrt(variance);
    }

    /**
     * The window of {@link SimilarCurves#BAND_POINTS} grid points with the largest weighted squared difference,
     * inside the compared band (a band holds at least {@link SimilarCurves#MIN_COMMON_POINTS} points, more than a window).
     */
    SimilarHit.Band bandDifferingMost(ShapeMetric metric) {
        double[] r = residuals(metric);
        int width = SimilarCurves.BAND_POINTS;
        int best = -1;
        double bestScore = -1;
        for (int start = 0; start + width <= r.length; start++) {
            if (!band.holds(start) || !band.holds(start + width - 1)) {
                continue;
            }
            double score = 0;
            for (int i = start; i < start + width; i++) {
                score += weight[i] * r[i];
            }
            if (score > bestScore) {
                bestScore = score;
                best = start;
            }
        }
        if (best < 0) {
            throw new IllegalStateException("the band " + band + " holds no window of " + width + " grid points");
        }
        double half = CurveSignature.STEP_NM / 2;
        return new SimilarHit.Band(CurveSignature.wavelengthNm(best) - half,
                CurveSignature.wavelengthNm(best + width - 1) + half);
    }

    /**
     * The thickness at which a bulk candidate best matches the query: the slope s of the query's absorbance on
     * the candidate's, fitted with an offset (the surface loss does not scale with thickness), times the
     * candidate's thickness — Beer–Lambert makes the internal absorbance proportional to the thickness. Only
     * points resolved in both curves (and inside the compared band) enter: a bound is no value to fit. Empty
     * when the candidate's absorbance is flatter than {@link #MIN_SPREAD} there.
     */
    OptionalDouble matchingThicknessMm() {
        if (!candidate.bulk()) {
            return OptionalDouble.empty();
        }
        double sw = 0;
        double sq = 0;
        double sc = 0;
        int n = 0;
        for (int i = 0; i < CurveSignature.DIMENSION; i++) {
            if (weight[i] == 1) {
                sw++;
                sq += query.absorbance(i);
                sc += candidate.absorbance(i);
                n++;
            }
        }
        if (n < 2) {
            return OptionalDouble.empty();
        }
        double mq = sq / sw;
        double mc = sc / sw;
        double cov = 0;
        double var = 0;
        for (int i = 0; i < CurveSignature.DIMENSION; i++) {
            if (weight[i] == 1) {
                double dc = candidate.absorbance(i) - mc;
                cov += (query.absorbance(i) - mq) * dc;
                var += dc * dc;
            }
        }
        if (var / sw < MIN_SPREAD * MIN_SPREAD || cov <= 0) {
            return OptionalDouble.empty();
        }
        return OptionalDouble.of(cov / var * candidate.thicknessMm());
    }

    private double sum(double[] a, double[] b) {
        double s = 0;
        for (int i = 0; i < a.length; i++) {
            s += weight[i] * a[i] * b[i];
        }
        return s;
    }

    private double totalWeight() {
        double s = 0;
        for (double w : weight) {
            s += w;
        }
        return s;
    }

    private double weightedMean(double[] v) {
        double s = 0;
        for (int i = 0; i < v.length; i++) {
            s += weight[i] * v[i];
        }
        return s / totalWeight();
    }
}
