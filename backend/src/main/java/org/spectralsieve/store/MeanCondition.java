package org.spectralsieve.store;

/**
 * A mean-of-T clause on one curve: trapezoid mean over the band's probes, with each probe's OD following
 * the same thickness model as point conditions.
 */
final class MeanCondition {

    private final boolean pass;
    private final double thresholdOd;
    private final double[] surfaceLoss;
    private final double[] unresolvedOd;
    private final double[] od0;
    private final double[] weight;
    private final double d0;
    private final boolean anyBound;
    private final boolean unmeasured;

    private final double farMm;

    private MeanCondition(boolean pass, double thresholdOd, double[] surfaceLoss, double[] unresolvedOd, double[] od0,
                          double[] weight, double d0, boolean anyBound, boolean unmeasured) {
        this.pass = pass;
        this.thresholdOd = thresholdOd;
        this.surfaceLoss = surfaceLoss;
        this.unresolvedOd = unresolvedOd;
        this.od0 = od0;
        this.weight = weight;
        this.d0 = d0;
        this.anyBound = anyBound;
        this.unmeasured = unmeasured;
        double far = Double.POSITIVE_INFINITY;
        for (int p = 0; p < od0.length; p++) {
            if (od0[p] <= unresolvedOd[p]) {
                far = Math.min(far, SearchPlan.farMm(od0[p], surfaceLoss[p], d0));
            }
        }
        this.farMm = far;
    }

    static MeanCondition of(SpectralStore store, int curve, CompiledClause clause, double[] loss, double[] unresolvedOd,
                            double d0) {
        int n = clause.probes().size();
        double[] od = new double[n];
        double[] w = new double[n];
        boolean anyBound = false;
        boolean unmeasured = false;
        for (int p = 0; p < n; p++) {
            Probe probe = clause.probes().get(p);
            w[p] = probe.weight();
            if (!probe.onGrid()) {
                unmeasured = true;
                continue;
            }
            short lo = store.column(probe.lo())[curve];
            short hi = store.column(probe.hi())[curve];
            if (!OdCode.isMeasured(lo) || !OdCode.isMeasured(hi)) {
                unmeasured = true;
                continue;
            }
            double f = probe.fractionHi();
            od[p] = (1 - f) * OdCode.opticalDensity(lo) + f * OdCode.opticalDensity(hi);
            anyBound |= OdCode.isBound(lo) || (f > 0 && OdCode.isBound(hi));
        }
        return new MeanCondition(clause.kind() == CompiledClause.Kind.MEAN_PASS, clause.thresholdOd(), loss,
                unresolvedOd, od, w, d0, anyBound, unmeasured);
    }

    /** Margin in decades at thickness d; a fixed layer ({@code rescale} false) keeps its measured ODs. */
    double margin(double d, boolean rescale) {
        double sum = 0;
        double weights = 0;
        for (int p = 0; p < od0.length; p++) {
            boolean clear = od0[p] <= unresolvedOd[p]; // keeps its own OD (SlabReading)
            double od = rescale && !clear ? surfaceLoss[p] + Math.max(0, od0[p] - surfaceLoss[p]) * d / d0 : od0[p];
            sum += weight[p] * Math.pow(10, -od);
            weights += weight[p];
        }
        double logMean = Math.log10(sum / weights);
        return pass ? logMean + thresholdOd : -thresholdOd - logMean;
    }

    boolean pass() {
        return pass;
    }

    boolean anyBound() {
        return anyBound;
    }

    /** Whether a reading of the mean is a bound at thickness d: measured so, or a clear reading beyond its far thickness. */
    boolean anyBoundAt(double d, boolean rescale) {
        return anyBound || (rescale && d > farMm);
    }

    /** The thickness beyond which a reading of the mean is a bound (+∞ when never, or when not rescaled). */
    double farMm(boolean rescale) {
        return rescale ? farMm : Double.POSITIVE_INFINITY;
    }

    boolean unmeasured() {
        return unmeasured;
    }
}
