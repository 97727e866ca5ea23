package org.spectralsieve.weighting;

import java.util.Arrays;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.PointReadings;
import org.spectralsieve.weighting.Figure.Bound;

/**
 * Luminous transmittance τv: the share of daylight, as the eye weights it, that passes a filter
 * (ISO 8980-3, ISO 12312-1; reference sheet §5):
 * <pre>τv = Σ T(λ)·S_D65(λ)·V(λ) / Σ S_D65(λ)·V(λ), λ = 380, 385, …, 780 nm</pre>
 * Plain sums over the 81 rows of the shipped 5 nm CIE tables, no trapezoid end weights and no
 * interpolation of S or V. The grid is fixed because it is part of the result: a sharp edge at 600 nm
 * gives 0.1662 on this grid and 0.1552 on the 1 nm tables. T is read by {@link Curve#transmittanceAt} at
 * the grid points.
 */
public final class LuminousTransmittance {

    public static final String NAME = "luminousTransmittance";
    public static final double FROM_NM = 380;
    public static final double TO_NM = 780;

    private static final WeightingTable D65 = WeightingTable.resource(Emitter.D65_TABLE);
    private static final WeightingTable V = WeightingTable.resource(Response.PHOTOPIC_TABLE);
    private static final Tables SHIPPED = shipped();

    private LuminousTransmittance() {
    }

    /** τv on the shipped 5 nm D65 and V(λ) tables; an upper bound if any grid point is below detection. */
    public static Figure of(Curve curve) {
        return SHIPPED.apply(curve, BelowDetectionAs.STORED);
    }

    /**
     * τv of the curve with its below-detection points read as {@code as} says: the same figure as on
     * {@link BoundedCurves#upperBounds} ({@code LIMIT}) or {@link BoundedCurves#lowerBounds} ({@code ZERO})
     * of the curve, without building that curve ({@link SortedReading}).
     */
    public static Figure of(PointReadings curve, BelowDetectionAs as) {
        if (FigurePath.byLookup() && curve instanceof Curve built) {
            return SHIPPED.applyByLookup(FigurePath.bounded(built, as));
        }
        return SHIPPED.apply(curve, as);
    }

    /**
     * τv as it was computed before {@link SortedReading}: T looked up at every row by
     * {@link Curve#transmittanceAt}. The reference the fast figure is tested against; not used by answers.
     */
    static Figure ofByLookup(Curve curve) {
        return SHIPPED.applyByLookup(curve);
    }

    /**
     * The same rule on other tables (e.g. the CIE 1 nm tables): plain sums over the given wavelengths that
     * lie in 380-780 nm. The wavelengths must strictly increase and include 380 and 780 nm; S and V must be
     * finite and not negative, with Σ S·V &gt; 0.
     */
    public static Figure of(Curve curve, double[] nm, double[] d65, double[] v) {
        return new Tables(nm, d65, v, "the given tables").apply(curve, BelowDetectionAs.STORED);
    }

    /**
     * The rows {@link #of(Curve)} sums over and their weights S·V: {nm[], weight[]} (copies), for bounds on
     * τv that never read the curve (store/WeightedScreen).
     */
    public static double[][] integrationNodes() {
        return new double[][] {SHIPPED.nm.clone(), SHIPPED.weight.clone()};
    }

    private static Tables shipped() {
        double[] nm = V.wavelengthsNm();
        double[] s = new double[nm.length];
        for (int i = 0; i < nm.length; i++) {
            s[i] = D65.valueAt(nm[i]);
        }
        return new Tables(nm, s, V.values(), "the shipped 5 nm CIE tables (D65, V = CIE 1931 ȳ)");
    }

    /** The grid points in 380-780 nm and their weights S·V, checked once. */
    private static final class Tables {

        private final double[] nm;
        private final double[] weight;
        private final double total;
        private final String note;

        Tables(double[] nm, double[] d65, double[] v, String what) {
            if (nm.length != d65.length || nm.length != v.length) {
                throw new IllegalArgumentException("luminous transmittance tables: " + nm.length + " wavelengths, "
                        + d65.length + " D65 values, " + v.length + " V values; they must match");
            }
            int first = -1;
            int last = -1;
            for (int i = 0; i < nm.length; i++) {
                if (i > 0 && !(nm[i] > nm[i - 1])) {
                    throw new IllegalArgumentException("luminous transmittance tables: wavelength " + nm[i]
                            + " nm at index " + i + " is not greater than the previous " + nm[i - 1] + " nm");
                }
                if (!(d65[i] >= 0 && Double.isFinite(d65[i]) && v[i] >= 0 && Double.isFinite(v[i]))) {
                    throw new IllegalArgumentException("luminous transmittance tables: at " + nm[i] + " nm D65 = "
                            + d65[i] + ", V = " + v[i] + "; both must be finite and >= 0");
                }
                if (nm[i] == FROM_NM) {
                    first = i;
                }
                if (nm[i] == TO_NM) {
                    last = i;
                }
            }
            if (first < 0 || last < 0) {
                throw new IllegalArgumentException("luminous transmittance tables must have rows at exactly "
                        + FROM_NM + " and " + TO_NM + " nm");
            }
            this.nm = Arrays.copyOfRange(nm, first, last + 1);
            this.weight = new double[this.nm.length];
            double sum = 0;
            for (int i = first; i <= last; i++) {
                weight[i - first] = d65[i] * v[i];
                sum += weight[i - first];
            }
            if (!(sum > 0)) {
                throw new IllegalArgumentException("luminous transmittance tables: Σ D65·V over 380-780 nm is 0");
            }
            this.total = sum;
            this.note = "Σ T·D65·V / Σ D65·V, plain sums over the " + this.nm.length + " rows of " + what
                    + " from " + FROM_NM + " to " + TO_NM + " nm, T read at the rows";
        }

        Figure apply(PointReadings curve, BelowDetectionAs as) {
            Figure gap = coverageGap(curve);
            if (gap != null) {
                return gap;
            }
            SortedReading.Sum sum = SortedReading.weightedSum(curve, nm, weight, nm.length, as);
            return figure(sum.passed(), sum.bound());
        }

        Figure applyByLookup(Curve curve) {
            Figure gap = coverageGap(curve);
            if (gap != null) {
                return gap;
            }
            double passed = 0;
            boolean bound = false;
            for (int i = 0; i < nm.length; i++) {
                passed += weight[i] * curve.transmittanceAt(nm[i]).orElseThrow();
                bound |= curve.belowDetectionAt(nm[i]);
            }
            return figure(passed, bound);
        }

        private Figure figure(double passed, boolean bound) {
            String text = note + (bound ? "; points below the detection limit enter with their stored T, so τv"
                    + " is at most this" : "");
            return Figure.of(NAME, passed / total, "fraction", bound ? Bound.AT_MOST : Bound.VALUE, text);
        }

        private static Figure coverageGap(PointReadings curve) {
            if (!(curve.covers(FROM_NM) && curve.covers(TO_NM))) {
                return Figure.unavailable(NAME, "fraction", "curve covers " + curve.minWavelengthNm() + "-"
                        + curve.maxWavelengthNm() + " nm; luminous transmittance needs " + FROM_NM + "-" + TO_NM
                        + " nm and curves are never extrapolated");
            }
            return null;
        }
    }
}
