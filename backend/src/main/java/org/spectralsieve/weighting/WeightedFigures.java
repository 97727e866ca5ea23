package org.spectralsieve.weighting;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;
import java.util.function.DoubleUnaryOperator;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.PointReadings;
import org.spectralsieve.weighting.Figure.Bound;

/**
 * Figures of a transmittance curve under a source and a response. All integrals: trapezoid rule on a
 * uniform grid (1 nm, or the emitter's finer {@link Emitter#stepNm()}), T read by
 * {@link Curve#transmittanceAt} (interpolated in absorbance), never extrapolated.
 */
public final class WeightedFigures {

    /** Lines a UV designer asks about: Hg 254 nm, Hg 313 nm, Hg/LED 365 nm, LED 405 nm. */
    public static final double[] NAMED_LINES_NM = {254, 313, 365, 405};

    /** Diffey's critical-wavelength integration range, nm (reference sheet §3). */
    public static final double CRITICAL_FROM_NM = 290;
    public static final double CRITICAL_TO_NM = 400;
    public static final double CRITICAL_FRACTION = 0.9;

    /** Largest share of ∫E·W dλ that may fall outside the curve before a weighted figure is refused. */
    public static final double MAX_UNCOVERED_SHARE = 0.01;

    private static final double ABSORBANCE_FLOOR_T = Curve.ABSORBANCE_FLOOR_T;

    private WeightedFigures() {
    }

    /** Everything the figures endpoint reports, for one emitter × response. */
    public record Report(Figure effectiveTransmittance, Figure protectionFactor, Figure erythemalProtectionFactor,
            Figure actinicUvProtectionFactor, List<Figure> bandMeans, Figure criticalWavelength,
            List<Figure> opticalDensities) {

        public Report {
            bandMeans = List.copyOf(bandMeans);
            opticalDensities = List.copyOf(opticalDensities);
        }
    }

    /** The report with band means in the CIE convention. */
    public static Report report(Curve curve, Emitter emitter, Response response) {
        return report(curve, emitter, response, UvBand.Convention.CIE);
    }

    /**
     * The report as answers state it. Every figure is computed on the curve with points below the detection
     * limit at their limit ({@link BoundedCurves#upperBounds}, as the requirement judges), and a bounded
     * transmittance or factor also carries its other end (those points at 0), so answers state both ends
     * ({@link FigureText}); values beyond OD 12 are capped ({@link StatedLimits}).
     */
    public static Report report(Curve curve, Emitter emitter, Response response, UvBand.Convention convention) {
        Curve upper = BoundedCurves.upperBounds(curve);
        Curve lower = BoundedCurves.lowerBounds(curve);
        List<Figure> bands = new ArrayList<>();
        List<Figure> lowerBands = bandMeans(lower, convention);
        List<Figure> upperBands = bandMeans(upper, convention);
        for (int i = 0; i < upperBands.size(); i++) {
            bands.add(StatedLimits.transmittance(withEnd(upperBands.get(i), lowerBands.get(i))));
        }
        List<Figure> ods = new ArrayList<>();
        for (double nm : NAMED_LINES_NM) {
            ods.add(StatedLimits.opticalDensity(opticalDensityAt(upper, nm), upper.transmittanceAt(nm).orElse(1)));
        }
        return new Report(
                StatedLimits.transmittance(withEnd(effectiveTransmittance(upper, emitter, response),
                        effectiveTransmittance(lower, emitter, response))),
                factorWithEnd(upper, lower, emitter, response),
                factorWithEnd(upper, lower, Emitter.flat(), Response.erythema()),
                factorWithEnd(upper, lower, Emitter.flat(), Response.actinicUv()),
                bands, criticalWavelength(upper), ods);
    }

    /** The figure on the upper-bound curve with the lower-bound curve's value as its other end. */
    static Figure withEnd(Figure upper, Figure lower) {
        return upper.bound() == Bound.VALUE || !lower.available() ? upper
                : upper.withOtherEnd(lower.value().getAsDouble());
    }

    private static Figure factorWithEnd(Curve upper, Curve lower, Emitter emitter, Response response) {
        Figure factor = protectionFactor(upper, emitter, response);
        Figure lowerT = effectiveTransmittance(lower, emitter, response);
        if (factor.bound() != Bound.VALUE && lowerT.available() && lowerT.value().getAsDouble() > 0) {
            factor = factor.withOtherEnd(1 / lowerT.value().getAsDouble());
        }
        return StatedLimits.factor(factor);
    }

    /**
     * ∫E·W·T dλ / ∫E·W dλ over the response's defined range (cut to where the emitter has power).
     * An upper bound when any weighted point is below the detection limit.
     *
     * <p>Nothing is truncated silently. Two parts of the weighted power can lie where the figure cannot
     * see them: beyond the curve (curves are never extrapolated), and, for a response whose data merely
     * ends ({@link Response#zeroOutsideByDefinition()} false: an imported table), where the emitter has power
     * outside the response's range; that part is estimated with W held at the table's nearer end. When
     * together they hold at most {@link #MAX_UNCOVERED_SHARE} of all the weighted power (the actinic S(λ)
     * starts at 180 nm, curves at 190 nm: 0.3 % of its flat-source weight), the ratio is taken over the
     * covered interval alone, numerator and normaliser on the same interval with their own trapezoid ends,
     * and the figure carries the share left out ({@link Figure#outsideShare()}, and in its note); above
     * that the figure is not available and says why.
     */
    public static Figure effectiveTransmittance(Curve curve, Emitter emitter, Response response) {
        return effectiveTransmittance(curve, emitter, response, BelowDetectionAs.STORED);
    }

    /**
     * {@link #effectiveTransmittance(Curve, Emitter, Response)} of the curve with its below-detection points
     * read as {@code as} says: the same figure as on {@link BoundedCurves#upperBounds} ({@code LIMIT}) or
     * {@link BoundedCurves#lowerBounds} ({@code ZERO}) of the curve, without building that curve. The
     * integration points and their weights are computed once per emitter, response and covered range
     * ({@link IntegrationNodes}); T is read along them by one walk ({@link SortedReading}).
     */
    public static Figure effectiveTransmittance(PointReadings curve, Emitter emitter, Response response,
                                                BelowDetectionAs as) {
        if (FigurePath.byLookup() && curve instanceof Curve built) {
            return effectiveTransmittanceByLookup(FigurePath.bounded(built, as), emitter, response);
        }
        return effectiveTransmittance(curve, emitter, response,
                (from, to) -> IntegrationNodes.covered(emitter, response, from, to).read(curve, as), true);
    }

    /**
     * {@link #effectiveTransmittance(PointReadings, Emitter, Response, BelowDetectionAs)} without its note
     * (empty, also when the figure is not available): the same value, bound and share left out, for a thickness
     * solver's margins, read dozens of times per sample, where writing the note (three formatted percentages
     * when a share is left out) cost more than the figure itself. Answers show figures with their notes.
     */
    public static Figure effectiveTransmittanceUnexplained(PointReadings curve, Emitter emitter, Response response,
                                                           BelowDetectionAs as) {
        if (FigurePath.byLookup() && curve instanceof Curve built) {
            return effectiveTransmittanceByLookup(FigurePath.bounded(built, as), emitter, response);
        }
        return effectiveTransmittance(curve, emitter, response,
                (from, to) -> IntegrationNodes.covered(emitter, response, from, to).read(curve, as), false);
    }

    /**
     * The figure as it was computed before {@link SortedReading}: every integration point's E·W and T looked
     * up anew ({@link Curve#transmittanceAt}, a binary search each). Kept as the reference the fast figure
     * is tested against (WeightedFiguresFastPathTest); not used by answers.
     */
    static Figure effectiveTransmittanceByLookup(Curve curve, Emitter emitter, Response response) {
        return effectiveTransmittance(curve, emitter, response, (from, to) -> covered(curve, emitter, response, from, to),
                true);
    }

    /** The covered part of the integral over [from, to], which lies inside the curve. */
    private interface Coverage {
        Covered over(double from, double to);
    }

    /** @param explained whether the figure carries its note (else an empty one: the numbers are the same) */
    private static Figure effectiveTransmittance(PointReadings curve, Emitter emitter, Response response,
                                                 Coverage coverage, boolean explained) {
        String name = "effectiveTransmittance";
        double lo = Math.max(response.minNm(), emitter.minNm());
        double hi = Math.min(response.maxNm(), emitter.maxNm());
        if (!(hi > lo)) {
            return Figure.unavailable(name, "fraction", "emitter " + emitter.name() + " (" + emitter.minNm() + "-"
                    + emitter.maxNm() + " nm) has no power inside the range of response " + response.name() + " ("
                    + response.minNm() + "-" + response.maxNm() + " nm)");
        }
        double[] totals = IntegrationNodes.totals(emitter, response, lo, hi);
        double inside = totals[0];
        double beyondResponse = totals[1];
        double total = inside + beyondResponse;
        if (!(total > 0)) {
            return Figure.unavailable(name, "fraction", "emitter " + emitter.name() + " × response "
                    + response.name() + " integrates to 0 over " + lo + "-" + hi + " nm");
        }
        double from = Math.max(lo, curve.minWavelengthNm());
        double to = Math.min(hi, curve.maxWavelengthNm());
        Covered covered = to > from ? coverage.over(from, to) : Covered.NONE;
        double beyondCurve = Math.max(0, inside - covered.weight());
        // below 1e-12 the two integrals differ by rounding only: the same grid, the same terms
        double curveShare = beyondCurve / total < 1e-12 ? 0 : beyondCurve / total;
        double responseShare = beyondResponse / total;
        double share = curveShare + responseShare;
        if (share > MAX_UNCOVERED_SHARE || !(covered.weight() > 0)) {
            return Figure.unavailable(name, "fraction", !explained ? "" : String.join("; ", gaps(curve, response,
                    emitter, lo, hi, curveShare, responseShare)) + " (at most " + percent(MAX_UNCOVERED_SHARE)
                    + " may be left out)");
        }
        if (!explained) {
            Figure figure = Figure.of(name, covered.passed() / covered.weight(), "fraction",
                    covered.bound() ? Bound.AT_MOST : Bound.VALUE, "");
            return share > 0 ? figure.withOutsideShare(Math.min(1, share)) : figure;
        }
        String note = emitter.name() + " × " + response.name() + ", " + from + "-" + to + " nm, trapezoid, step "
                + covered.stepNm() + " nm";
        if (share > 0) {
            note += "; leaving out " + percent(share) + " of the weighted power ("
                    + String.join("; ", gaps(curve, response, emitter, lo, hi, curveShare, responseShare))
                    + "; not extrapolated)";
        }
        Figure figure = Figure.of(name, covered.passed() / covered.weight(), "fraction",
                covered.bound() ? Bound.AT_MOST : Bound.VALUE, note);
        return share > 0 ? figure.withOutsideShare(Math.min(1, share)) : figure;
    }

    /**
     * ∫E·W dλ over the response's range and the estimate of what lies beyond it ({@link #effectiveTransmittance}):
     * {inside, beyondResponse}, computed by the same arithmetic wherever they are cached.
     */
    static double[] totals(Emitter emitter, Response response, double lo, double hi) {
        double step = emitter.stepNm();
        double inside = integrate(lo, hi, step, nm -> emitter.powerAt(nm) * response.weightAt(nm));
        double beyondResponse = response.zeroOutsideByDefinition() ? 0
                : integrate(emitter.minNm(), lo, step, nm -> emitter.powerAt(nm) * response.weightAtNearestEnd(nm))
                        + integrate(hi, emitter.maxNm(), step, nm -> emitter.powerAt(nm) * response.weightAtNearestEnd(nm));
        return new double[] {inside, beyondResponse};
    }

    /** ∫E·W dλ, ∫E·W·T dλ and whether a weighted point is below detection, over [from, to] inside the curve. */
    record Covered(double weight, double passed, boolean bound, double stepNm) {
        static final Covered NONE = new Covered(0, 0, false, 0);
    }

    private static Covered covered(Curve curve, Emitter emitter, Response response, double from, double to) {
        int n = intervals(from, to, emitter.stepNm());
        double step = (to - from) / n;
        double weight = 0;
        double passed = 0;
        boolean bound = false;
        for (int i = 0; i <= n; i++) {
            double nm = i == n ? to : from + i * step;
            double ew = emitter.powerAt(nm) * response.weightAt(nm) * trapezoidWeight(i, n);
            if (!(ew > 0)) {
                continue;
            }
            weight += ew;
            passed += ew * curve.transmittanceAt(nm).orElseThrow();
            bound |= curve.belowDetectionAt(nm);
        }
        return new Covered(weight * step, passed * step, bound, step);
    }

    /**
     * The wavelengths at which {@link #effectiveTransmittance} reads T when the curve covers [from, to], and
     * the weight of each (E·W times the trapezoid end weight; the common step cancels in the ratio), by the
     * same arithmetic as the figure: {nm[], weight[]}, points of zero weight left out as the figure leaves
     * them out. For bounds on the figure that never read the curve (store/WeightedScreen).
     */
    public static double[][] integrationNodes(Emitter emitter, Response response, double from, double to) {
        int n = intervals(from, to, emitter.stepNm());
        double step = (to - from) / n;
        double[] nm = new double[n + 1];
        double[] w = new double[n + 1];
        int k = 0;
        for (int i = 0; i <= n; i++) {
            double at = i == n ? to : from + i * step;
            double ew = emitter.powerAt(at) * response.weightAt(at) * trapezoidWeight(i, n);
            if (ew > 0) {
                nm[k] = at;
                w[k++] = ew;
            }
        }
        return new double[][] {Arrays.copyOf(nm, k), Arrays.copyOf(w, k)};
    }

    /** Trapezoid ∫f over [from, to] on the largest uniform step not above maxStep; 0 for an empty interval. */
    private static double integrate(double from, double to, double maxStep, DoubleUnaryOperator f) {
        if (!(to > from)) {
            return 0;
        }
        int n = intervals(from, to, maxStep);
        double step = (to - from) / n;
        double sum = 0;
        for (int i = 0; i <= n; i++) {
            double nm = i == n ? to : from + i * step;
            sum += f.applyAsDouble(nm) * trapezoidWeight(i, n);
        }
        return sum * step;
    }

    /** What lies where the figure cannot see, each with its share of the weighted power. */
    private static List<String> gaps(PointReadings curve, Response response, Emitter emitter, double lo, double hi,
            double curveShare, double responseShare) {
        List<String> gaps = new ArrayList<>();
        if (curveShare > 0) {
            gaps.add(percent(curveShare) + " of the weighted power lies outside the curve (curve "
                    + curve.minWavelengthNm() + "-" + curve.maxWavelengthNm() + " nm, weighted range " + lo + "-" + hi
                    + " nm; curves are never extrapolated)");
        }
        if (responseShare > 0) {
            gaps.add("about " + percent(responseShare) + " lies where emitter " + emitter.name() + " ("
                    + emitter.minNm() + "-" + emitter.maxNm() + " nm) has power outside the table of response "
                    + response.name() + " (" + response.minNm() + "-" + response.maxNm()
                    + " nm; estimated with W held at the table's ends; a table that ends with zeros where the"
                    + " response has no weight leaves nothing out)");
        }
        if (gaps.isEmpty()) {
            gaps.add("the curve (" + curve.minWavelengthNm() + "-" + curve.maxWavelengthNm()
                    + " nm) holds none of the weighted power over " + lo + "-" + hi + " nm");
        }
        return gaps;
    }

    /**
     * Shares already written as text, by the share's bits. Why: a solved candidate's figures are explained at
     * every thickness it is judged at, and the share of the weighted power a figure leaves out depends on the
     * curve's wavelengths, the emitter and the response, not on the thickness, so the same few shares are written
     * again and again; the formatter was about a tenth of a weighted solve (docs/exact-judgement-speed.md, "Margins
     * read once per thickness"). The text is a function of the share alone, so a kept one is the one written anew.
     * Bounded: emptied when full.
     */
    private static final Map<Long, String> PERCENT_TEXTS = new ConcurrentHashMap<>();
    private static final int PERCENT_TEXTS_LIMIT = 1024;
    /** Off with {@code -Dsieve.solve.reuse-margins=false}, as the solve's reuse (requirement.MarginReuse). */
    private static volatile boolean keepPercentTexts = !"false".equals(System.getProperty("sieve.solve.reuse-margins"));

    /** For benchmarks and tests: false writes every share anew, as before (the same text). */
    public static void keepPercentTexts(boolean keep) {
        keepPercentTexts = keep;
    }

    private static String percent(double share) {
        if (!keepPercentTexts) {
            return percentText(share);
        }
        Long key = Double.doubleToRawLongBits(share);
        String kept = PERCENT_TEXTS.get(key);
        if (kept == null) {
            if (PERCENT_TEXTS.size() >= PERCENT_TEXTS_LIMIT) {
                PERCENT_TEXTS.clear();
            }
            kept = percentText(share);
            PERCENT_TEXTS.put(key, kept);
        }
        return kept;
    }

    private static String percentText(double share) {
        return String.format(Locale.ROOT, "%.2g %%", 100 * share);
    }

    /** 1 / effective transmittance; a lower bound when the transmittance is an upper bound. */
    public static Figure protectionFactor(Curve curve, Emitter emitter, Response response) {
        String name = "protectionFactor(" + emitter.name() + " × " + response.name() + ")";
        Figure t = effectiveTransmittance(curve, emitter, response);
        if (!t.available()) {
            return Figure.unavailable(name, "1", t.note());
        }
        double value = t.value().getAsDouble();
        if (value <= 0) {
            // unbounded in arithmetic, but no measurement states more than OD 12 (StatedLimits)
            return Figure.of(name, StatedLimits.MAX_STATED_FACTOR, "1", Bound.AT_LEAST, "effective transmittance"
                    + " is 0; stated as at least 1e12 (OD 12), since no transmittance measurement states more; "
                    + t.note()).withOutsideShare(t.outsideShare());
        }
        return Figure.of(name, 1 / value, "1", t.bound() == Bound.AT_MOST ? Bound.AT_LEAST : Bound.VALUE,
                "1 / effective transmittance; " + t.note()).withOutsideShare(t.outsideShare());
    }

    /** Mean T in UVC, UVB and UVA of one convention, in that order. */
    public static List<Figure> bandMeans(Curve curve, UvBand.Convention convention) {
        List<Figure> means = new ArrayList<>();
        for (UvBand band : convention.bands()) {
            means.add(meanTransmittance(curve, band));
        }
        return means;
    }

    /**
     * Mean T over a band on a 1 nm trapezoid grid. UVC reaches down to 100 nm (CIE) or 200 nm where few
     * curves start, so it is averaged over the covered part, which the note names; UVB and UVA need the
     * whole band. The name carries the numeric band, e.g. {@code meanTransmittanceUVB(280-315 nm)},
     * because the label alone means different wavelengths in the two conventions.
     */
    public static Figure meanTransmittance(Curve curve, UvBand band) {
        String name = "meanTransmittance" + band.label() + "(" + band.wavelengthText() + ")";
        double lo = band.fromNm();
        double hi = band.toNm();
        String note = band.rangeText() + " (" + band.convention().key() + " convention)";
        if (band.averagedOverCoveredPart()) {
            lo = Math.max(lo, curve.minWavelengthNm());
            hi = Math.min(hi, curve.maxWavelengthNm());
            if (hi - lo < 1) {
                return Figure.unavailable(name, "fraction", "curve (" + curve.minWavelengthNm() + "-"
                        + curve.maxWavelengthNm() + " nm) covers less than 1 nm of " + note);
            }
            if (lo > band.fromNm() || hi < band.toNm()) {
                note += ", averaged over the covered part " + lo + "-" + hi + " nm only";
            }
        } else {
            String gap = coverageGap(curve, lo, hi);
            if (gap != null) {
                return Figure.unavailable(name, "fraction", gap);
            }
        }
        int n = intervals(lo, hi, 1.0);
        double step = (hi - lo) / n;
        double sum = 0;
        boolean bound = false;
        for (int i = 0; i <= n; i++) {
            double nm = i == n ? hi : lo + i * step;
            sum += curve.transmittanceAt(nm).orElseThrow() * trapezoidWeight(i, n);
            bound |= curve.belowDetectionAt(nm);
        }
        return Figure.of(name, sum / n, "fraction", bound ? Bound.AT_MOST : Bound.VALUE,
                note + ", trapezoid, step " + step + " nm");
    }

    /**
     * Diffey's λc: where ∫A dλ from 290 nm reaches 90 % of ∫A dλ over 290-400 nm, A = −log10 T. Trapezoid
     * on a 1 nm grid, linear interpolation of the running integral inside the crossing interval (reference
     * sheet §3). A negative A (T read above 1 from noise) counts as 0; T = 0 counts as A = 12.
     */
    public static Figure criticalWavelength(Curve curve) {
        String name = "criticalWavelength";
        String gap = coverageGap(curve, CRITICAL_FROM_NM, CRITICAL_TO_NM);
        if (gap != null) {
            return Figure.unavailable(name, "nm", gap);
        }
        int n = (int) Math.round(CRITICAL_TO_NM - CRITICAL_FROM_NM);
        double[] running = new double[n + 1];
        double previousA = absorbanceAt(curve, CRITICAL_FROM_NM);
        boolean bound = curve.belowDetectionAt(CRITICAL_FROM_NM);
        for (int i = 1; i <= n; i++) {
            double nm = CRITICAL_FROM_NM + i;
            double a = absorbanceAt(curve, nm);
            bound |= curve.belowDetectionAt(nm);
            running[i] = running[i - 1] + (previousA + a) / 2;
            previousA = a;
        }
        if (!(running[n] > 0)) {
            return Figure.unavailable(name, "nm", "no absorbance between 290 and 400 nm: λc is undefined");
        }
        double target = CRITICAL_FRACTION * running[n];
        int i = 1;
        while (running[i] < target) {
            i++;
        }
        double lambda = CRITICAL_FROM_NM + i - 1 + (target - running[i - 1]) / (running[i] - running[i - 1]);
        String note = "Diffey: ∫A from 290 nm reaches 90 % of ∫A over 290-400 nm; trapezoid, 1 nm";
        if (bound) {
            note += "; points below the detection limit enter with their stored (upper-bound) T, so their"
                    + " absorbance is a lower bound and λc is approximate";
        }
        return Figure.of(name, lambda, "nm", Bound.VALUE, note);
    }

    /** OD = −log10 T at one wavelength; a lower bound when the point is below the detection limit. */
    public static Figure opticalDensityAt(Curve curve, double nm) {
        String name = "opticalDensity" + (nm == Math.rint(nm) ? String.valueOf((long) nm) : String.valueOf(nm));
        var t = curve.transmittanceAt(nm);
        if (t.isEmpty()) {
            return Figure.unavailable(name, "OD", "curve (" + curve.minWavelengthNm() + "-" + curve.maxWavelengthNm()
                    + " nm) does not reach " + nm + " nm; curves are never extrapolated");
        }
        double od = -Math.log10(Math.max(t.getAsDouble(), ABSORBANCE_FLOOR_T));
        boolean below = curve.belowDetectionAt(nm);
        return Figure.of(name, od, "OD", below ? Bound.AT_LEAST : Bound.VALUE,
                "OD = -log10 T at " + nm + " nm" + (below ? ", below the detection limit" : ""));
    }

    private static double absorbanceAt(Curve curve, double nm) {
        double t = curve.transmittanceAt(nm).orElseThrow();
        return Math.max(0, -Math.log10(Math.max(t, ABSORBANCE_FLOOR_T)));
    }

    /** Null when the curve covers [lo, hi], else the reason. */
    private static String coverageGap(Curve curve, double lo, double hi) {
        if (curve.covers(lo) && curve.covers(hi)) {
            return null;
        }
        return "curve covers " + curve.minWavelengthNm() + "-" + curve.maxWavelengthNm() + " nm; the figure needs "
                + lo + "-" + hi + " nm and curves are never extrapolated";
    }

    static int intervals(double lo, double hi, double maxStep) {
        return Math.max(1, (int) Math.ceil((hi - lo) / maxStep - 1e-9));
    }

    static double trapezoidWeight(int i, int n) {
        return i == 0 || i == n ? 0.5 : 1.0;
    }
}
