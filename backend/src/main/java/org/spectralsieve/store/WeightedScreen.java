package org.spectralsieve.store;

import static org.spectralsieve.store.BinCodes.LN_T_OF_CODE;
import static org.spectralsieve.store.BinCodes.T_OF_CODE;

import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.function.IntPredicate;
import org.spectralsieve.optics.Fresnel;
import org.spectralsieve.optics.RefractiveIndex;
import org.spectralsieve.store.BinCodes.Powers;
import org.spectralsieve.store.SurfaceBounds.Surfaces;
import org.spectralsieve.requirement.Direction;
import org.spectralsieve.requirement.WeightedClause;
import org.spectralsieve.requirement.Weighting;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.weighting.BelowDetectionAs;

/**
 * What the store can prove about weighted figures (an emitter's share that passes, erythemal, UV hazard,
 * luminous τv) without reading a curve: bounds on the exact figure of every curve as measured, for any
 * emitter × response, from 102 bytes per curve. See docs/weighted-screening.md.
 *
 * <p>Why it holds: every weighted figure the requirement judges is a ratio Σ aₙ·T(λₙ) / Σ aₙ with weights
 * aₙ ≥ 0 at fixed wavelengths λₙ (the figure's integration points, which depend only on the weighting and
 * on where the curve starts and ends), so it is a weighted mean of T and lies between the means of any
 * lower and upper envelopes of T. The store keeps, per curve and per 12 nm bin, the highest T of the curve
 * with points below detection at their upper bounds and the lowest T with those points at 0 — over the
 * whole closed bin (the curve's own points inside it and its interpolated values at the bin's ends: between
 * points T is monotone, being linear in absorbance), so every integration point is covered, however finely
 * the curve was sampled. The exact judgement reads a pass on its upper end U and a block on its lower end L
 * when it calls them missed, so Σ share_b · highest_b &lt; threshold proves a pass missed and
 * Σ share_b · lowest_b &gt; threshold a block, with a margin no better than the bound's.
 *
 * <p>Each bin value is one byte of optical density in steps of {@link #STEP} decades, rounded towards the
 * safe side (the highest T up, the lowest down), and the sums carry a relative slack of {@link #SLACK} for
 * the exact figure's own rounding. Code 0 means "no bound": for the highest T a value above T = 1.45 (or no
 * curve, as for curves added already on the grid), for the lowest T a value that may be 0.
 */
public final class WeightedScreen {

    /** The bins: 12 nm each over 190–790 nm (curves start at 190 nm at the earliest; τv ends at 780 nm). */
    public static final double FIRST_NM = 190;
    public static final double BIN_NM = 12;
    public static final int BINS = 50;
    /** Optical density per code step; code c stands for OD (c − {@link #OFFSET}) · STEP. */
    public static final double STEP = 0.02;
    static final int OFFSET = 9;
    /** Relative room for the exact figure's floating-point rounding, on the safe side of every bound. */
    static final double SLACK = 1e-6;
    /** log10(1 + SLACK) and log10(1 − SLACK): the slack in decades, for bounds formed from logarithms. */
    private static final double LOG10_UP = Math.log10(1 + 1e-6);
    private static final double LOG10_DOWN = Math.log10(1 - 1e-6);
    /** Decades added to a bound formed from logarithms ({@code Query.fromFigureCode}): far above their rounding. */
    private static final double LOG_ROOM = 1e-9;
    private static final double LN_10 = Math.log(10);
    /** log10(1 ± POWER_ROOM): the room of a power formed from logarithms, in decades. */
    private static final double LOG10_POWER_UP = Math.log10(1 + 1e-12);
    private static final double LOG10_POWER_DOWN = Math.log10(1 - 1e-12);
    /** Bytes per curve: two bin codes per bin and a short naming the curve's wavelength range. */
    public static final int BYTES_PER_CURVE = 2 * BINS + Short.BYTES + FigureCodes.BYTES_PER_CURVE;

    /**
     * Relative room for the rounding of a power of a bin value formed from {@link Powers} (a few dozen
     * roundings, under 1e-14) instead of one {@code Math.exp}: the power is moved this far to the safe side, so
     * the bound is never tighter than the one formed with {@code exp} (checked by WeightedScreenTest).
     */
    static final double POWER_ROOM = 1e-12;
    /**
     * Relative room for a stacked value below the product of its parts' readings: each slab element's inversion
     * and re-forming, and the chain's arithmetic (10⁻⁶, far above the few roundings involved).
     */
    static final double STACK_ROUNDING = 1e-6;

    final byte[][] brightest;
    final byte[][] darkest;
    final short[] rangeOfCurve;
    final List<double[]> ranges;
    /** Per range: whether its curves are regular ({@code WeightedBinsBuilder.regular}), read from an array, not the list. */
    private final boolean[] regularOfRange;
    /** Per range: the bins its wavelengths meet ({@code Query.lnBrightestOfCurve}). */
    private final int[][] binsOfRange;
    private static final int[] ALL_BINS = java.util.stream.IntStream.range(0, BINS).toArray();

    /** Per curve, the exact figures of a few built-in weightings as codes (docs/weighted-screening.md, "Figures in the store"). */
    final FigureCodes figures;

    WeightedScreen(byte[][] brightest, byte[][] darkest, short[] rangeOfCurve, List<double[]> ranges,
                           FigureCodes figures) {
        this.figures = figures;
        this.brightest = brightest;
        this.darkest = darkest;
        this.rangeOfCurve = rangeOfCurve;
        this.ranges = ranges;
        this.regularOfRange = new boolean[ranges.size()];
        this.binsOfRange = new int[ranges.size()][];
        for (int i = 0; i < ranges.size(); i++) {
            double[] r = ranges.get(i);
            regularOfRange[i] = r[2] == 1;
            binsOfRange[i] = java.util.stream.IntStream.range(0, BINS)
                    .filter(b -> !(FIRST_NM + b * BIN_NM > r[1] || FIRST_NM + b * BIN_NM + BIN_NM < r[0])).toArray();
        }
    }

    /**
     * Whether queries read the store's figure codes: {@code -Dsieve.store.figure-codes=false} reads the bins alone,
     * the screen before them (benchmarks only; read per query, so a benchmark can alternate both in one JVM).
     */
    static boolean figureCodesOn() {
        return !"false".equals(System.getProperty("sieve.store.figure-codes"));
    }

    /**
     * Whether a solve's P(x) and Q(x) also read the bounds over thickness from the figure codes
     * ({@link Query#thinnedFromCode}, {@link Query#thickenedFromCode}; docs/weighted-screening.md, "Bounds over
     * thickness from the figure codes"): {@code -Dsieve.store.solve-from-codes=false} reads the bins alone there
     * (benchmarks and tests; read per query, so a benchmark can alternate both in one JVM).
     */
    public static boolean solveFromCodesOn() {
        return !"false".equals(System.getProperty("sieve.store.solve-from-codes"));
    }

    /** The store's figure codes (tests). */
    FigureCodes figureCodes() {
        return figures;
    }

    static WeightedBinsBuilder builder(int capacity) {
        return new WeightedBinsBuilder(capacity);
    }

    /**
     * An upper bound on the exact clause margin (decades) of every curve as measured, or +∞ where the screen
     * can say nothing; negative only where the exact judgement of that curve, as measured, is a miss of the
     * clause (pass: U below the threshold; block: L above it).
     *
     * @param layerRange with a fixed layer, {from, to} of the layer's curve: a curve is bounded only where
     *                   the layer covers the part of the weighting's range the curve covers, so the stack
     *                   integrates over the same points (a pass only: the stack's T is at most the curve's)
     */
    public double[] marginBounds(WeightedClause clause, Optional<double[]> layerRange) {
        Query query = new Query(null, clause, layerRange);
        double[] out = new double[rangeOfCurve.length];
        for (int curve = 0; curve < out.length; curve++) {
            out[curve] = query.asMeasured(curve);
        }
        return out;
    }

    /**
     * An upper bound on the exact pass margin of every bulk curve judged at or above {@code thinnestMm}, for
     * curves measured thicker than that (the others: +∞; {@link #marginBounds} serves them); see
     * {@link Query#thinned}.
     */
    public double[] marginBoundsThinned(SpectralStore store, WeightedClause clause, Optional<double[]> layerRange,
                                        double thinnestMm) {
        Query query = new Query(store, clause, layerRange);
        double[] out = new double[rangeOfCurve.length];
        for (int curve = 0; curve < out.length; curve++) {
            out[curve] = query.thinned(curve, thinnestMm);
        }
        return out;
    }

    /**
     * An upper bound on the exact block margin of every bulk curve judged on its rescaled curve at or below
     * {@code thickestMm} (other curves: +∞); see
     * {@link Query#thickened}.
     */
    public double[] marginBoundsThickened(SpectralStore store, WeightedClause clause, double thickestMm) {
        Query query = new Query(store, clause, Optional.empty());
        double[] out = new double[rangeOfCurve.length];
        for (int curve = 0; curve < out.length; curve++) {
            out[curve] = query.thickened(curve, thickestMm);
        }
        return out;
    }

    /** One weighted clause prepared for screening curve by curve: bin shares per curve range, surfaces per index. */
    public Query query(SpectralStore store, WeightedClause clause, Optional<double[]> layerRange) {
        return new Query(store, clause, layerRange);
    }

    /** The same with the fixed layer's own bins, for {@link Query#behindLayer}. */
    public Query query(SpectralStore store, WeightedClause clause, LayerBins layer) {
        Query q = new Query(store, clause, Optional.of(new double[] {layer.fromNm, layer.toNm}));
        q.layer = layer;
        return q;
    }

    /**
     * A fixed layer's brightest per bin, computed once per search from its curve as used: for each bin, the
     * largest of max(T, limit) over both ends of every pair of neighbouring layer points whose interval meets
     * the bin (NaN where none does), so every value the stack reads from the layer inside the bin — T
     * interpolated in absorbance, limits linearly — is at most it; and the largest total reflectance the
     * layer's slab elements can have.
     */
    public static final class LayerBins {
        final double fromNm;
        final double toNm;
        final double[] brightest;
        /**
         * Per bin, the smallest T at both ends of every layer interval meeting it, so every value the stack reads
         * from the layer inside the bin (T interpolated in absorbance) is at least it; 0 (no bound) where an end is
         * below detection (the stack is then below detection there, read as 0 by the lower end L) or has T outside
         * [ε, 1], or where no interval meets the bin ({@link Query#behindLayer} of a block).
         */
        final double[] darkest;
        final double reflectance;
        final Curve curve;

        private LayerBins(Curve curve, double fromNm, double toNm, double[] brightest, double[] darkest, double reflectance) {
            this.curve = curve;
            this.fromNm = fromNm;
            this.toNm = toNm;
            this.brightest = brightest;
            this.darkest = darkest;
            this.reflectance = reflectance;
        }

        public static LayerBins of(Curve layer, RefractiveIndex index) {
            double[] brightest = new double[BINS];
            double[] darkest = new double[BINS];
            Arrays.fill(brightest, Double.NaN);
            Arrays.fill(darkest, Double.POSITIVE_INFINITY);
            for (int i = 0; i + 1 < layer.size(); i++) {
                double hi = Math.max(Math.max(layer.transmittance(i), layer.detectionLimit(i)),
                        Math.max(layer.transmittance(i + 1), layer.detectionLimit(i + 1)));
                double lo = usableForBlock(layer, i) && usableForBlock(layer, i + 1)
                        ? Math.min(layer.transmittance(i), layer.transmittance(i + 1)) : 0;
                int first = Math.max(0, binOfClamped(layer.wavelengthNm(i)));
                int last = Math.min(BINS - 1, binOfClamped(layer.wavelengthNm(i + 1)));
                for (int b = first; b <= last; b++) {
                    brightest[b] = Double.isNaN(brightest[b]) ? hi : Math.max(brightest[b], hi);
                    darkest[b] = Math.min(darkest[b], lo);
                }
            }
            for (int b = 0; b < BINS; b++) {
                if (darkest[b] == Double.POSITIVE_INFINITY) {
                    darkest[b] = 0; // no layer interval meets the bin
                }
            }
            double r = SurfaceBounds.largestReflectance(index, new double[] {layer.minWavelengthNm(), layer.maxWavelengthNm()});
            return new LayerBins(layer, layer.minWavelengthNm(), layer.maxWavelengthNm(), brightest, darkest, SurfaceBounds.elementReflectance(r));
        }

        /** A layer point that may stand in the block bound: above detection, T in [ε, 1] (so min(T, 1) = T). */
        private static boolean usableForBlock(Curve layer, int i) {
            double t = layer.transmittance(i);
            return !layer.belowDetection(i) && t >= Curve.ABSORBANCE_FLOOR_T && t <= 1;
        }

        /** The layer's smallest T per bin ({@link #darkest}), for tests. */
        double darkest(int bin) {
            return darkest[bin];
        }
    }

    /** The bin of a wavelength, below 0 or above the last bin allowed (callers clamp). */
    private static int binOfClamped(double nm) {
        double x = Math.floor((nm - FIRST_NM) / BIN_NM);
        return x < -1 ? -1 : x > BINS ? BINS : (int) x;
    }

    /**
     * Bounds on one weighted clause's exact margin, curve by curve (docs/weighted-screening.md, "Why a bound is
     * a proof"). Each method returns an upper bound on the exact margin, or +∞ where it can say nothing.
     * Not thread-safe (it caches per range); one per search and clause.
     */
    public final class Query {

        private static final double[] NOT_AVAILABLE = new double[0];

        private final SpectralStore store;
        private final WeightedClause clause;
        private final Optional<double[]> layerRange;
        private final boolean pass;
        private final double threshold;
        private final double floor;
        private final double[][] sharesOfRange;
        /** Per range: the bins of positive share, in order (the sums skip the rest, as they did by testing). */
        private final int[][] usedBinsOfRange;
        private final Map<Long, Double> largestR = new HashMap<>();
        /** Per range, per index model: the surfaces' figures, formed once (no boxed cache on the hot path). */
        private final Surfaces[][] surfacesOf;
        private final Powers powers = new Powers();
        private LayerBins layer;
        private boolean layerBlocks = true;
        private boolean layerPoints = true;
        private final double[][] layerSharesOfRange = new double[ranges.size()][];
        /** Per range: {nm, weight, layerUp} of the figure's integration points ({@link #behindLayerOnCurve}). */
        private final double[][][] layerNodesOfRange = new double[ranges.size()][][];
        /** Per range: {nm, weight} of the figure's integration points ({@link #thinnedOnCurve}). */
        private final double[][][] nodesOfRange = new double[ranges.size()][][];
        private boolean unverifiedOnCurve;
        private double unverifiedMarginBound = Double.POSITIVE_INFINITY;
        private boolean reference;
        /** The column of the clause's figure among the store's figure codes, or −1 (none kept, or codes switched off). */
        private final int figure;
        private final double log10Threshold;
        /** Codes from this one on can meet a block (u̲·(1 − SLACK) ≤ t). */
        private final int canMeetFrom;
        /** Codes below this one can miss a block (ū·(1 + SLACK) &gt; t). */
        private final int canMissBelow;
        private final double log10Floor;
        private int lnBCurve = -1;
        private double lnBOfCurve;
        /** Whether P(x) and Q(x) read the figure code's bounds over thickness ({@link #solveFromCodesOn}). */
        private final boolean solveFromCodes;
        private int lnFCurve = -1;
        /** ln of the code's upper (pass) or lower (block, both ends equal) figure of {@link #lnFCurve}, slack included; NaN: none. */
        private double lnFOfCurve;

        private Query(SpectralStore store, WeightedClause clause, Optional<double[]> layerRange) {
            this.store = store;
            this.clause = clause;
            this.layerRange = layerRange;
            this.pass = clause.direction() == Direction.PASS;
            this.threshold = clause.thresholdT();
            this.floor = Math.min(Curve.ABSORBANCE_FLOOR_T, threshold);
            this.sharesOfRange = new double[ranges.size()][];
            this.usedBinsOfRange = new int[ranges.size()][];
            this.surfacesOf = new Surfaces[ranges.size()][];
            this.figure = figureCodesOn() && layerRange.isEmpty() ? FigureCodes.figureOf(clause.weighting()) : -1;
            this.log10Threshold = Math.log10(threshold);
            this.log10Floor = Math.log10(floor);
            // the first code whose u̲ can meet a block, and the first whose ū cannot miss it (the ends fall as codes rise)
            this.canMeetFrom = firstCode(c -> FigureCodes.lowerOf(c) * (1 - SLACK) <= threshold);
            this.canMissBelow = firstCode(c -> !(FigureCodes.upperOf(c) * (1 + SLACK) > threshold));
            this.solveFromCodes = figure >= 0 && solveFromCodesOn();
        }

        /**
         * The clause's margin bound as measured from the curve's figure code (no layer), for a row that meets or misses
         * (docs/weighted-screening.md, "Figures in the store"); NaN where the code says nothing. With U in [u̲, ū]:
         * <ul>
         * <li>a pass meets on L ≥ t with margin log10(L/t) ≤ log10(ū/t) (L ≤ U), and misses on U &lt; t with margin
         * log10(U/t) ≤ log10(ū/t): one bound for both;</li>
         * <li>a block meets on U ≤ t with margin log10(t/U) ≤ log10(t/u̲), possible only where u̲ ≤ t; it misses on
         * L &gt; t with a negative margin log10(t/L), possible only where ū &gt; t: at most log10(t/u̲) when both ends
         * are equal (L = U), else at most 0 and at most the bins' bound on L. The bound is the larger of the two
         * cases that can happen; so a block that cannot meet (u̲ above t) is bounded by 0 even where points below
         * detection leave L unknown — a row that is unverified or misses, never above a met row.</li>
         * </ul>
         * Each end moved by {@link #SLACK} to the safe side, as the bins' are.
         */
        private double fromFigureCode(int curve) {
            return fromFigureCode(curve, true);
        }

        /**
         * {@link #fromFigureCode(int)}; without the bins ({@code withBins} false) a block that may miss on an unknown L
         * takes 0 for the bins' bound on that miss: looser, as sound (a missed block's margin is negative).
         */
        private double fromFigureCode(int curve, boolean withBins) {
            int code = figures.code(figure, curve);
            if (code == FigureCodes.NONE) {
                return Double.NaN;
            }
            // in decades: passMargin(ū) and blockMargin(u̲) without a logarithm per curve; the same numbers to a few
            // 1e-15 decades, so LOG_ROOM is added: at the floor, where the exact margin is the same number formed
            // another way, the bound must not fall an ulp below it (a tie with the last row is judged)
            if (pass) {
                return Math.max(FigureCodes.log10UpperOf(code) + LOG10_UP, log10Floor) - log10Threshold + LOG_ROOM;
            }
            double downMargin = log10Threshold - Math.max(FigureCodes.log10LowerOf(code) + LOG10_DOWN, log10Floor) + LOG_ROOM;
            if (figures.endsEqual(figure, curve)) {
                return downMargin;
            }
            // u̲·(1 − SLACK) ≤ t exactly for the codes from canMeetFrom on, ū·(1 + SLACK) > t below canMissBelow
            // (both ends fall as the code rises): no table read per curve
            double meets = code >= canMeetFrom ? downMargin : Double.NEGATIVE_INFINITY;
            if (code >= canMissBelow) {
                return meets; // L ≤ U ≤ t: it cannot miss
            }
            double misses = withBins ? Math.min(0, binsAsMeasured(curve)) : 0;
            return Math.max(meets, misses);
        }

        /**
         * {@link #asMeasured} of one curve, without the bins where a block may miss on an unknown L (0 for that case, a
         * looser bound as sound: a missed block's margin is negative): what the screen's pass over every clause reads.
         */
        public double asMeasuredWithoutBinsForL(int curve) {
            double b = figure >= 0 ? fromFigureCode(curve, false) : Double.NaN;
            return Double.isNaN(b) ? binsAsMeasured(curve) : b;
        }

        /**
         * After {@link #asMeasuredWithoutBinsForL} for every clause: the bins' bound of a block whose code leaves L unknown,
         * only on curves whose bound is not yet negative (a curve already proven to miss keeps a sound, if looser,
         * bound on its margin: the bins could only lower it further).
         */
        public void binsForUnknownLowerEnds(double[] out, int from, int to, boolean skipTotal) {
            if (figure < 0 || pass) {
                return;
            }
            for (int c = from; c < to; c++) {
                out[c] = binsForUnknownLowerEnd(c, out[c], skipTotal);
            }
        }

        /**
         * Each curve's bound in {@code out[from, to)} lowered to this clause's {@link #asMeasuredWithoutBinsForL} where that
         * is smaller (skipped on curves in total geometry when {@code skipTotal}): one clause over a block of curves, in a
         * loop of its own so its fields and column are read once per block.
         */
        public void lowerToCodeBounds(double[] out, int from, int to, boolean skipTotal) {
            for (int c = from; c < to; c++) {
                if (!(skipTotal && store.isTotalGeometry(c))) {
                    double b = asMeasuredWithoutBinsForL(c);
                    if (b < out[c]) {
                        out[c] = b;
                    }
                }
            }
        }

        /** Whether {@link #binsForUnknownLowerEnd} can read bins at all: a block whose figure codes are read. */
        public boolean readsBinsForUnknownLowerEnds() {
            return figure >= 0 && !pass;
        }

        /**
         * {@link #binsForUnknownLowerEnds} for one curve whose bound so far is {@code bound}: the bound after it, so the
         * screen's pass over the curves can apply it in the same pass, clause after clause (the same numbers).
         */
        public double binsForUnknownLowerEnd(int c, double bound, boolean skipTotal) {
            // only a block that cannot meet but may miss reads its bins: where it can meet, its bound is the met
            // case's, at least 0, which the bins' part (at most 0) cannot lower
            if (bound >= 0) {
                int code = figures.code(figure, c);
                if (code != FigureCodes.NONE && code < canMeetFrom && code < canMissBelow
                        && !figures.endsEqual(figure, c) && !(skipTotal && store.isTotalGeometry(c))) {
                    double b = fromFigureCode(c, true);
                    if (b < bound) {
                        return b;
                    }
                }
            }
            return bound;
        }

        /** The first code in 1…{@link FigureCodes#BELOW} for which a property that holds from some code on holds (BELOW + 1: none). */
        private static int firstCode(IntPredicate holds) {
            int lo = 1;
            int hi = FigureCodes.BELOW + 1;
            while (lo < hi) {
                int mid = (lo + hi) >>> 1;
                if (holds.test(mid)) {
                    hi = mid;
                } else {
                    lo = mid + 1;
                }
            }
            return lo;
        }

        /** Whether this query reads the store's figure codes (the clause's figure is kept, no layer, not switched off). */
        public boolean readsFigureCodes() {
            return figure >= 0;
        }

        /** A pass clause's margin bound from an upper bound on the weighted mean, moved by SLACK to the safe side. */
        private double passMargin(double meanUp) {
            return Math.log10(Math.max(meanUp * (1 + SLACK), floor) / threshold);
        }

        /** A block clause's margin bound from a lower bound on the weighted mean, moved by SLACK to the safe side. */
        private double blockMargin(double meanDown) {
            return Math.log10(threshold / Math.max(meanDown * (1 - SLACK), floor));
        }

        /**
         * The arithmetic before the per-curve power tables: one {@code Math.exp} per bin and the reflectances
         * from a boxed map, kept so a benchmark can time both side by side ({@code WeightedMisses}).
         */
        public Query withReferenceArithmetic() {
            reference = true;
            return this;
        }

        public boolean passes() {
            return pass;
        }

        /** The bin shares of the figure for the curve's range; empty when the curve is not screened or the figure not bounded. */
        private double[] shares(int curve) {
            int range = rangeOfCurve[curve];
            if (range < 0) {
                return NOT_AVAILABLE;
            }
            double[] shares = sharesOfRange[range];
            if (shares == null) {
                shares = BinShares.binShares(clause.weighting(), ranges.get(range), layerRange);
                double[] formed = shares;
                usedBinsOfRange[range] = java.util.stream.IntStream.range(0, formed.length).filter(b -> formed[b] > 0).toArray();
                sharesOfRange[range] = shares;
            }
            return shares;
        }

        /** The bins a sum over the curve's shares visits (after {@link #shares}): those of positive share, or all before. */
        private int[] usedBins(int curve) {
            return reference ? ALL_BINS : usedBinsOfRange[rangeOfCurve[curve]];
        }

        /**
         * The curve as measured. Behind a layer a block has no bound (the layer may do the blocking). Pass:
         * Σ share·brightest bounds U; block: Σ share·darkest bounds L.
         */
        public double asMeasured(int curve) {
            if (layerRange.isPresent() && !pass) {
                return Double.POSITIVE_INFINITY;
            }
            if (figure >= 0) {
                // the exact figure to within two code steps: no bin can be tighter by more than that
                double fromCode = fromFigureCode(curve);
                if (!Double.isNaN(fromCode)) {
                    return fromCode;
                }
            }
            return binsAsMeasured(curve);
        }

        /** {@link #asMeasured} from the bins alone. */
        private double binsAsMeasured(int curve) {
            if (layerRange.isPresent() && !pass) {
                return Double.POSITIVE_INFINITY;
            }
            double[] shares = shares(curve);
            if (shares.length == 0 || layerRange.isPresent() && !regular(curve)) {
                return Double.POSITIVE_INFINITY;
            }
            byte[][] codes = pass ? brightest : darkest;
            double mean = 0;
            for (int b : usedBins(curve)) {
                if (shares[b] > 0) {
                    int code = codes[b][curve] & 0xFF;
                    if (code == 0 && pass) {
                        return Double.POSITIVE_INFINITY;
                    }
                    mean += shares[b] * T_OF_CODE[code];
                }
            }
            return pass ? passMargin(mean) : blockMargin(mean);
        }

        /**
         * A pass behind the fixed layer ({@link #query(SpectralStore, WeightedClause, LayerBins)}), the candidate
         * judged as measured or thicker (others: +∞). Why: at each wavelength p the stack combines (light path,
         * incoherent reflections across the air gap) T = T₁T₂/(1 − ρ₁ρ₂), and its detection limit chains one
         * part at a time at its limit, so the stack's upper reading is at most
         * max(T₁, lim₁)·max(T₂, lim₂)/(1 − ρ₁ρ₂), ρ ≤ {@link SurfaceBounds#elementReflectance} of each part's largest Fresnel
         * R (the candidate's index, or the n = 1.5 assumed for a part stored without one, whichever is larger).
         * A value of the stack inside a bin is interpolated between two neighbouring stack points lying in one
         * candidate interval and one layer interval that meet the bin, so it is at most the larger end, floored
         * at the absorbance floor; for a regular curve ({@code WeightedBinsBuilder.regular}) the candidate's factor is at
         * most the bin's brightest, the layer's at most its {@link LayerBins} value. The candidate thicker than
         * measured only lowers every T and limit.
         */
        public double behindLayer(int curve, double judgedMm) {
            if (!pass) {
                return blockBehindLayer(curve);
            }
            double d0 = store.thicknessMm(curve);
            if (layer == null || store.isBulk(curve) && !(judgedMm >= d0)) {
                return Double.POSITIVE_INFINITY;
            }
            double[] shares = shares(curve);
            if (shares.length == 0 || !regular(curve)) {
                return Double.POSITIVE_INFINITY;
            }
            double r = Math.max(largestReflectance(curve), Fresnel.reflectanceInAir(1.52));
            double rho = SurfaceBounds.elementReflectance(r);
            if (!(rho < 1) || !(layer.reflectance < 1)) {
                return Double.POSITIVE_INFINITY;
            }
            double gain = (1 + SLACK) / (1 - rho * layer.reflectance);
            double[] byPoint = layerPoints ? layerShares(curve) : NOT_AVAILABLE;
            double mean = 0;
            double meanByPoint = 0;
            for (int b = 0; b < BINS; b++) {
                if (shares[b] > 0) {
                    int code = brightest[b][curve] & 0xFF;
                    double second = layer.brightest[b];
                    if (code == 0 || Double.isNaN(second)) {
                        return Double.POSITIVE_INFINITY;
                    }
                    mean += shares[b] * Math.max(T_OF_CODE[code] * second * gain, Curve.ABSORBANCE_FLOOR_T);
                    if (byPoint.length > 0) {
                        meanByPoint += byPoint[b] * T_OF_CODE[code] * gain;
                    }
                }
            }
            if (byPoint.length > 0) {
                // the layer read at each integration point, not at its bin's largest: the smaller bound holds too
                mean = Math.min(mean, meanByPoint + Curve.ABSORBANCE_FLOOR_T);
            }
            return passMargin(mean);
        }

        /**
         * Per bin, Σ aₙ·layerUp(λₙ) / Σ aₙ over the figure's integration points λₙ in the bin, where layerUp(λ)
         * is the largest max(T, limit) at the ends of the layer's intervals holding λ: the stack points a value at
         * λ is interpolated from lie in one such interval, so the layer's factor there is at most layerUp(λ). Then
         * Σₙ aₙ·max(Bₙ·layerUp(λₙ)·gain, ε)/Σ aₙ ≤ Σ_b brightest_b·gain·this_b + ε. Empty where a point has no
         * layer value (outside the layer: {@link BinShares#binShares} gives no shares then either).
         */
        private double[] layerShares(int curve) {
            int range = rangeOfCurve[curve];
            double[] out = layerSharesOfRange[range];
            if (out == null) {
                out = BinShares.layerShares(clause.weighting(), ranges.get(range), layer.curve);
                layerSharesOfRange[range] = out;
            }
            return out;
        }

        /**
         * {@link #behindLayer} of a pass read on the candidate's own decoded curve instead of its bins: the second
         * stage for a contender about to be judged (docs/weighted-screening.md, "A second, exact-curve stage").
         * The proof is the one of {@link #behindLayer} with the bin's brightest replaced by candUp(λ), the largest
         * max(T, limit) at the ends of the candidate's intervals holding λ (both around a stored point): the stack
         * points a value at λ is read from lie in one candidate interval holding λ, and on a regular curve every
         * upper reading inside that interval (T interpolated in absorbance, a limit linearly) is at most the
         * larger end's. So U ≤ Σₙ aₙ·max(candUp(λₙ)·layerUp(λₙ)·gain, ε)/Σ aₙ. No rounding to codes, no 12 nm
         * bin: the slack of the bins is gone, the preconditions are the same. {@code measured} must be the curve
         * the store holds for {@code curve} (the one the judgement reads); +∞ wherever the bin bound is +∞, where
         * the curve's range is not the stored one, or where the curve is not regular.
         */
        public double behindLayerOnCurve(int curve, Curve measured, double judgedMm) {
            if (!pass || !layerPoints || !Double.isFinite(behindLayer(curve, judgedMm))) {
                return Double.POSITIVE_INFINITY;
            }
            int range = rangeOfCurve[curve];
            double[] r = ranges.get(range);
            if (measured.minWavelengthNm() != r[0] || measured.maxWavelengthNm() != r[1] || !WeightedBinsBuilder.regular(measured)) {
                return Double.POSITIVE_INFINITY;
            }
            double[][] nodes = layerNodes(range);
            if (nodes == null) {
                return Double.POSITIVE_INFINITY;
            }
            double rMax = Math.max(largestReflectance(curve), Fresnel.reflectanceInAir(1.52));
            double gain = (1 + SLACK) / (1 - SurfaceBounds.elementReflectance(rMax) * layer.reflectance);
            double[] nm = nodes[0];
            double[] weight = nodes[1];
            double[] layerUp = nodes[2];
            double[] wavelengths = measured.wavelengthsNm();
            double sum = 0;
            double total = 0;
            int at = 0; // the walk along the candidate's points: the nodes increase
            for (int i = 0; i < nm.length; i++) {
                while (at + 1 < wavelengths.length && wavelengths[at + 1] <= nm[i]) {
                    at++;
                }
                // the intervals holding the node: both around a stored point, else the one it lies in
                int lo = wavelengths[at] == nm[i] ? Math.max(0, at - 1) : at;
                int hi = Math.min(wavelengths.length - 1, at + 1);
                double up = 0;
                for (int j = lo; j <= hi; j++) {
                    up = Math.max(up, Math.max(measured.transmittance(j), measured.detectionLimit(j)));
                }
                sum += weight[i] * Math.max(up * layerUp[i] * gain, Curve.ABSORBANCE_FLOOR_T);
                total += weight[i];
            }
            if (!(total > 0)) {
                return Double.POSITIVE_INFINITY;
            }
            return passMargin(sum / total);
        }

        /** The range's integration points {nm, weight, layerUp}, formed once per range; null where not available. */
        private double[][] layerNodes(int range) {
            double[][] out = layerNodesOfRange[range];
            if (out == null) {
                out = BinShares.layerNodes(clause.weighting(), ranges.get(range), layer.curve);
                layerNodesOfRange[range] = out == null ? new double[0][] : out;
            }
            return out == null || out.length == 0 ? null : out;
        }

        /** Whether {@link #behindLayer} of a pass reads the layer per integration point (on by default; off for the rule before). */
        public Query layerByPoint(boolean on) {
            layerPoints = on;
            return this;
        }

        /**
         * A block behind the fixed layer, the candidate judged on its measured curve (the caller's rule:
         * {@code SearchService.keepsProof}, which routes only samples the judgement stacks as measured here), and
         * only when {@link #blockBehindLayer(boolean) enabled}; +∞ otherwise. A lower bound on the stack's lower
         * end L (docs/weighted-screening.md, "Weighted blocks behind a fixed layer"):
         * Σ share_b · D_b · layer_b / max(1, B_b) · (1 − rounding), where D_b is the darkest of bins b − 1, b and
         * b + 1 (0 when any is 0: a point below detection, a zero, or darker than the code, in the candidate
         * interval around a value of bin b), B_b the bin's brightest (it holds both ends of that interval on a
         * regular curve) and layer_b {@link LayerBins#darkest}.
         */
        private double blockBehindLayer(int curve) {
            if (!layerBlocks || layer == null) {
                return Double.POSITIVE_INFINITY;
            }
            double[] shares = shares(curve);
            if (shares.length == 0 || !regular(curve) || !(layer.reflectance < 1) || !(surfaces(curve).largest < 1)) {
                return Double.POSITIVE_INFINITY; // no stack the bound can follow, or none at all (an unverified row)
            }
            double[] range = ranges.get(rangeOfCurve[curve]);
            double mean = 0;
            for (int b : usedBins(curve)) {
                if (!(shares[b] > 0)) {
                    continue;
                }
                double second = layer.darkest[b];
                int dark = darkestAround(curve, b, range);
                if (dark == 0 || !(second > 0)) {
                    continue; // this bin may read 0: it adds nothing to a lower bound
                }
                int bright = brightest[b][curve] & 0xFF;
                double b1 = bright == 0 ? Curve.MAX_TRANSMITTANCE : Math.max(1, T_OF_CODE[bright]);
                mean += shares[b] * (T_OF_CODE[dark] * second / b1) * (1 - STACK_ROUNDING);
            }
            return blockMargin(mean);
        }

        /**
         * The largest darkest code of bins b − 1, b and b + 1 (the darkest T of the three), or 0 (no bound) when
         * one of them has none. A neighbour bin the curve's range does not meet holds no point and is skipped;
         * past the first or last bin, the curve must not reach (its points there are in no bin).
         */
        private int darkestAround(int curve, int b, double[] range) {
            int code = 0;
            for (int n = b - 1; n <= b + 1; n++) {
                if (n < 0 || n >= BINS) {
                    if (n < 0 ? range[0] < FIRST_NM : range[1] > FIRST_NM + BINS * BIN_NM) {
                        return 0;
                    }
                    continue;
                }
                if (FIRST_NM + n * BIN_NM > range[1] || FIRST_NM + n * BIN_NM + BIN_NM < range[0]) {
                    continue;
                }
                int c = darkest[n][curve] & 0xFF;
                if (c == 0) {
                    return 0;
                }
                code = Math.max(code, c);
            }
            return code;
        }

        /** Whether {@link #behindLayer} bounds blocks too (on by default; off only to time the rule before). */
        public Query blockBehindLayer(boolean on) {
            layerBlocks = on;
            return this;
        }

        /**
         * {@link #asMeasured} read on the curve itself: the exact figure's ends U (points below detection at their
         * limit) and L (at 0), as the judgement computes them, and the margin the clause's verdict reads from them
         * ({@code Weighting.figureForMargin}, the same arithmetic as the answer's figure), moved by {@link #SLACK}
         * to the safe side. The second stage for a contender about to be judged (docs/weighted-screening.md, "A
         * second, exact-curve stage"); its use at other thicknesses follows the same rules as {@link #asMeasured}
         * (a weighted figure is a weighted mean of T and falls wherever T falls pointwise). +∞ behind a layer (the
         * stack is judged, not the curve: {@link #behindLayerOnCurve}) and where the figure is not available (the
         * judgement then says unverified, which no bound may call a miss).
         */
        public double asMeasuredOnCurve(Curve measured) {
            unverifiedOnCurve = false;
            unverifiedMarginBound = Double.POSITIVE_INFINITY;
            if (layerRange.isPresent()) {
                return Double.POSITIVE_INFINITY;
            }
            Weighting weighting = clause.weighting();
            org.spectralsieve.weighting.Figure upper = weighting.figureForMargin(measured, BelowDetectionAs.LIMIT);
            if (!upper.available()) {
                return Double.POSITIVE_INFINITY;
            }
            double u = upper.value().getAsDouble();
            double l = upper.bound() != org.spectralsieve.weighting.Figure.Bound.AT_MOST ? u
                    : Math.min(u, weighting.figureForMargin(measured, BelowDetectionAs.ZERO).value().orElse(0));
            // the clause's verdict as the judgement forms it (FigureClauses.weighted): a pass meets on L ≥ threshold
            // (margin on L), misses on U < threshold (margin on U), else unverified; a block meets on U ≤ threshold
            // (margin on U), misses on L > threshold (margin on L). Each case used only where the slack cannot flip it.
            double up = 1 + SLACK;
            double down = 1 - SLACK;
            // an unverified clause reads its margin on U, as a pass that misses and a block that meets do
            if (pass) {
                if (l * down >= threshold) {
                    unverifiedMarginBound = Math.log10(Math.max(l * up, floor) / threshold);
                    return unverifiedMarginBound; // meets, on L
                }
                unverifiedOnCurve = l * up < threshold && u * down >= threshold;
                double onU = Math.log10(Math.max(u * up, floor) / threshold);
                unverifiedMarginBound = u * up < threshold ? Double.NEGATIVE_INFINITY : onU; // a sure miss: no unverified row
                return onU;
            }
            double onU = Math.log10(threshold / Math.max(u * down, floor));
            if (u * up <= threshold) {
                unverifiedMarginBound = onU;
                return onU; // meets, on U
            }
            unverifiedOnCurve = u * down > threshold && l * up <= threshold;
            unverifiedMarginBound = l * down > threshold ? Double.NEGATIVE_INFINITY : onU; // met or unverified: on U
            return Math.log10(threshold / Math.max(l * down, floor));
        }

        /**
         * After {@link #asMeasuredOnCurve}: a bound on the clause's margin when the clause meets or is unverified
         * (both read a block's margin on U; a pass's on L when it meets, on U when unverified), −∞ when it surely
         * misses (the row is then a miss, never unverified), +∞ where nothing was read. An unverified row's worst
         * margin is the smallest of its clauses' margins, so the smallest of these bounds it.
         */
        public double unverifiedMarginBound() {
            return unverifiedMarginBound;
        }

        /**
         * Whether the last {@link #asMeasuredOnCurve} found the clause unverified on the curve (L below a pass's
         * threshold and U at or above it; U above a block's and L at or below it, each beyond the slack): the
         * sample's row judged on that curve cannot meet, whatever its margin.
         */
        public boolean unverifiedOnCurve() {
            return unverifiedOnCurve;
        }

        /** {@link #asMeasured} for a pass judged at or above {@code thinnestMm} where that is not thinner than measured (else +∞). */
        public double asMeasuredIfNotThinner(int curve, double thinnestMm) {
            return thinnestMm >= store.thicknessMm(curve) ? asMeasured(curve) : Double.POSITIVE_INFINITY;
        }

        /**
         * A pass of a bulk curve judged at or above {@code thinnestMm}, for curves measured thicker than that
         * (others: +∞). Why: a thinner cut passes more, but a slab's T is at most its internal transmittance K
         * ((1 − R)²K / (1 − R²K²) ≤ K), K0 ≤ T0 / (1 − R)² at the measured thickness, and K = K0^(d/d0); a
         * reading the data cannot resolve keeps its T0 (flat in d), which is below that too. So each point
         * thinned to d has T ≤ min(1, (T0 / (1 − R)²)^(d/d0)), rising in T0 and R; the map is a power of T0, so
         * it commutes with the absorbance interpolation between points: the bin's brightest bounds every value
         * of the thinned curve in the bin.
         */
        public double thinned(int curve, double thinnestMm) {
            if (reference) {
                return thinnedReference(curve, thinnestMm);
            }
            double d0 = store.thicknessMm(curve);
            if (!pass || !(thinnestMm > 0) || !store.isBulk(curve) || !(d0 > thinnestMm)) {
                return Double.POSITIVE_INFINITY;
            }
            double[] shares = shares(curve);
            if (shares.length == 0 || layerRange.isPresent() && !regular(curve)) {
                return Double.POSITIVE_INFINITY;
            }
            Surfaces surfaces = surfaces(curve);
            double r = surfaces.largest;
            if (!(r < 1)) {
                return Double.POSITIVE_INFINITY;
            }
            double k = thinnestMm / d0;
            // T0^k of every code from two small tables (Powers) and one exp per factor, not one exp per bin
            powers.of(k);
            double lossFactor = Math.exp(-k * surfaces.logLoss) * (1 + POWER_ROOM) * (1 + SLACK);
            boolean withSurfaces = regular(curve) && surfaces.smallest >= 0;
            double ceiling = withSurfaces ? surfaces.ceiling : Double.NaN;
            double surfaceFactor = withSurfaces
                    ? Math.exp(Math.max(surfaces.lnSmallestFactor(k), surfaces.lnLargestFactor(k))) * (1 + POWER_ROOM)
                    : Double.NaN;
            double mean = 0;
            for (int b : usedBins(curve)) {
                if (shares[b] > 0) {
                    int code = brightest[b][curve] & 0xFF;
                    if (code == 0) {
                        return Double.POSITIVE_INFINITY;
                    }
                    double power = powers.at(code);
                    double t = Math.min(1, power * lossFactor);
                    if (withSurfaces) {
                        double resolved = Math.min(ceiling, power * surfaceFactor);
                        t = Math.min(t, Math.max(resolved, Math.min(1, T_OF_CODE[code])) * (1 + SLACK));
                    }
                    mean += shares[b] * Math.max(t, Curve.ABSORBANCE_FLOOR_T);
                }
            }
            return passMargin(mean);
        }

        /**
         * {@link #thinned} read on the curve itself (the second stage, docs/weighted-screening.md, "A second,
         * exact-curve stage"): the same map f of a measured upper reading, T(d) ≤ f(T0) (f rising in T0), applied
         * at each integration point λ to candUp(λ), the largest max(T, limit) at the ends of the curve's intervals
         * holding λ, instead of the bin's brightest: a value of the thinned curve at λ is interpolated between two
         * thinned points, at most the larger, and each is at most f of its measured upper reading, whichever way
         * its flag goes (a limit rescales like a reading). +∞ wherever {@link #thinned} is, or where the curve's
         * range is not the stored one. {@code measured} must be the curve the store holds for {@code curve}.
         */
        public double thinnedOnCurve(int curve, Curve measured, double thinnestMm) {
            if (!Double.isFinite(thinned(curve, thinnestMm))) {
                return Double.POSITIVE_INFINITY;
            }
            int range = rangeOfCurve[curve];
            double[] r = ranges.get(range);
            if (measured.minWavelengthNm() != r[0] || measured.maxWavelengthNm() != r[1]) {
                return Double.POSITIVE_INFINITY;
            }
            double[][] nodes = nodes(range);
            if (nodes == null) {
                return Double.POSITIVE_INFINITY;
            }
            Surfaces surfaces = surfaces(curve);
            double k = thinnestMm / store.thicknessMm(curve);
            double logLoss = surfaces.logLoss;
            boolean withSurfaces = regular(curve) && surfaces.smallest >= 0;
            double ceiling = withSurfaces ? surfaces.ceiling : Double.NaN;
            double lnH = withSurfaces ? Math.max(surfaces.lnSmallestFactor(k), surfaces.lnLargestFactor(k)) : Double.NaN;
            double[] nm = nodes[0];
            double[] weight = nodes[1];
            double[] wavelengths = measured.wavelengthsNm();
            double sum = 0;
            double total = 0;
            int at = 0;
            double lastUp = Double.NaN;
            double lastT = 0;
            for (int i = 0; i < nm.length; i++) {
                while (at + 1 < wavelengths.length && wavelengths[at + 1] <= nm[i]) {
                    at++;
                }
                int lo = wavelengths[at] == nm[i] ? Math.max(0, at - 1) : at;
                int hi = Math.min(wavelengths.length - 1, at + 1);
                double up = 0;
                for (int j = lo; j <= hi; j++) {
                    up = Math.max(up, Math.max(measured.transmittance(j), measured.detectionLimit(j)));
                }
                if (up != lastUp) { // neighbouring nodes mostly share their interval: one power per interval
                    double ln = Math.log(Math.max(up, Double.MIN_NORMAL));
                    double t = Math.min(1, Math.exp(-k * logLoss + k * ln) * (1 + POWER_ROOM) * (1 + SLACK));
                    if (withSurfaces) {
                        double resolved = Math.min(ceiling, Math.exp(lnH + k * ln) * (1 + POWER_ROOM));
                        t = Math.min(t, Math.max(resolved, Math.min(1, up)) * (1 + SLACK));
                    }
                    lastUp = up;
                    lastT = Math.max(t, Curve.ABSORBANCE_FLOOR_T);
                }
                sum += weight[i] * lastT;
                total += weight[i];
            }
            if (!(total > 0)) {
                return Double.POSITIVE_INFINITY;
            }
            return passMargin(sum / total);
        }

        /** The range's integration points {nm, weight}, formed once per range; null where not available. */
        private double[][] nodes(int range) {
            double[][] out = nodesOfRange[range];
            if (out == null) {
                out = BinShares.integrationNodes(clause.weighting(), ranges.get(range));
                nodesOfRange[range] = out == null || out[0].length == 0 ? new double[0][] : out;
            }
            return out == null || out.length == 0 || out[0].length == 0 ? null : out;
        }

        /** {@link #thinned} with one exp per bin and the boxed reflectance cache: the arithmetic before. */
        private double thinnedReference(int curve, double thinnestMm) {
            double d0 = store.thicknessMm(curve);
            if (!pass || !(thinnestMm > 0) || !store.isBulk(curve) || !(d0 > thinnestMm)) {
                return Double.POSITIVE_INFINITY;
            }
            double[] shares = shares(curve);
            double r = shares.length == 0 || layerRange.isPresent() && !regular(curve) ? 1 : largestReflectance(curve);
            if (!(r < 1)) {
                return Double.POSITIVE_INFINITY;
            }
            double k = thinnestMm / d0;
            double logLoss = Math.log(((1 - r) * (1 - r)) / (1 + SLACK));
            // on a regular curve also the surfaces' own loss (see withSurfaces)
            double rMin = regular(curve) ? smallestReflectance(curve) : Double.NaN;
            double ceiling = (1 - rMin) / (1 + rMin);
            double lnH = Math.max(lnSurfaceFactor(rMin, k), lnSurfaceFactor(r, k));
            double mean = 0;
            for (int b = 0; b < BINS; b++) {
                if (shares[b] > 0) {
                    int code = brightest[b][curve] & 0xFF;
                    if (code == 0) {
                        return Double.POSITIVE_INFINITY;
                    }
                    double t = Math.min(1, Math.exp(k * (LN_T_OF_CODE[code] - logLoss)) * (1 + SLACK));
                    if (rMin >= 0) {
                        double resolved = Math.min(ceiling, Math.exp(lnH + k * LN_T_OF_CODE[code]));
                        t = Math.min(t, Math.max(resolved, Math.min(1, T_OF_CODE[code])) * (1 + SLACK));
                    }
                    mean += shares[b] * Math.max(t, Curve.ABSORBANCE_FLOOR_T);
                }
            }
            return passMargin(mean);
        }

        /*
         * withSurfaces — the tighter thinned bound of a regular curve: a resolved reading thinned to d has
         * T(d) = (1 − R)²K/(1 − R²K²) ≤ (1 − R)²K/(1 − R²) = K(1 − R)/(1 + R) with K = K0^k ≤ (T0/(1 − R)²)^k, so
         * T(d) ≤ h(R)·T0^k, h(R) = (1 − R)^(1 − 2k)/(1 + R), whose logarithm is convex in R (decreasing for
         * k ≤ 1/2), so its largest value over [R_min, R_max] is at an end; and T(d) ≤ (1 − R)/(1 + R) ≤ the
         * ceiling at R_min. An unresolved reading keeps min(T0, 1). The larger of the two bounds every point
         * (f rises with T0, for a point below detection read at its limit too), and a value of the thinned
         * curve inside a bin is interpolated between two neighbours, at most the larger; on a regular curve both
         * are the bin's points or the neighbours just outside it, which the bin's brightest holds.
         */

        /** ln h(R) = (1 − 2k)·ln(1 − R) − ln(1 + R); −∞ for NaN R (no surface bound). */
        private static double lnSurfaceFactor(double r, double k) {
            return Double.isNaN(r) ? Double.NEGATIVE_INFINITY : (1 - 2 * k) * Math.log(1 - r) - Math.log(1 + r);
        }

        private double smallestReflectance(int curve) {
            int model = store.indexModelOf(curve);
            int range = rangeOfCurve[curve];
            long key = ~(((long) model << 32) | range);
            Double hit = largestR.get(key);
            if (hit == null) {
                hit = SurfaceBounds.smallestReflectance(store.indexModel(model), ranges.get(range));
                largestR.put(key, hit);
            }
            return hit;
        }

        /**
         * A block of a bulk curve judged on its rescaled curve (the judgement always rescales a bulk sample it
         * judges at an asked thickness, even at the measured one) at or below {@code thickestMm}, alone (no
         * layer); below the measured thickness as at it (k = 1). Why, with k = d/d0 ≥ 1 and R ≤ R_max the surfaces' Fresnel
         * reflectance: a resolved reading has T0 = (1 − R)²K0/(1 − R²K0²) ≤ K0(1 − R)/(1 + R), so
         * K0 ≥ T0(1 + R)/(1 − R), and T(d) ≥ (1 − R)²K0^k ≥ (1 − R)²((1 + R)/(1 − R))^k·T0^k ≥ (1 − R²)·T0^k;
         * a reading the data cannot resolve keeps min(T0, 1) while d stays within its far thickness, which is
         * at least d0·{@link SurfaceBounds#leastFarFactor}(R_max) (beyond it the rescaled point is a bound, read as 0 by L).
         * With B ≥ 1 and at least every reading involved ({@link #lnBrightestOfCurve}, so T0/B ≤ 1): T(d) ≥ c·(T0/B)^k,
         * c = 1 − R_max², at every point, and as a power of T0 it commutes with the absorbance interpolation
         * (floors included: c·(ε/B)^k ≤ ε), so every value of L at d in the bin is at least c·(darkest/B)^k.
         * L only falls as d grows, so the bound holds for every thinner judged thickness too.
         */
        public double thickened(int curve, double thickestMm) {
            if (reference) {
                return thickenedReference(curve, thickestMm);
            }
            double d0 = store.thicknessMm(curve);
            if (pass || layerRange.isPresent() || !store.isBulk(curve) || !(d0 > 0) || !(thickestMm > 0)) {
                return Double.POSITIVE_INFINITY;
            }
            double[] shares = shares(curve);
            double r = shares.length == 0 ? 1 : surfaces(curve).largest;
            if (!(r < 1)) {
                return Double.POSITIVE_INFINITY; // the exact rescaling fails on this index: unverified, never a miss
            }
            double k = Math.max(1, thickestMm / d0);
            if (!(k <= surfaces(curve).leastFarFactor * (1 - 1e-9))) {
                return Double.POSITIVE_INFINITY; // a clear reading may have turned into a bound (L reads it as 0)
            }
            if (lnBCurve != curve) {
                lnBOfCurve = lnBrightestOfCurve(curve); // the same for every thickness the splits try
                lnBCurve = curve;
            }
            double lnB = lnBOfCurve;
            if (Double.isNaN(lnB)) {
                return Double.POSITIVE_INFINITY;
            }
            double c = k > 1 ? 1 - r * r : 1;
            // (T/B)^k = T^k·e^(−k ln B), T^k from the tables: a lower bound, so moved down by the power's room
            powers.of(k);
            double factor = c * Math.exp(-k * lnB) * (1 - POWER_ROOM);
            double mean = 0;
            for (int b : usedBins(curve)) {
                if (shares[b] > 0) {
                    int dark = darkest[b][curve] & 0xFF;
                    if (dark != 0) {
                        mean += shares[b] * (powers.at(dark) * factor);
                    }
                }
            }
            return blockMargin(mean);
        }

        /**
         * {@link #thickened} read on the curve itself (the second stage, docs/weighted-screening.md, "A second,
         * exact-curve stage"): the same map g(t) = c·(max(t, ε)/B)^k, which every value of the lower end L at the
         * judged thickness is at least (a power, so it commutes with the absorbance interpolation), applied at each
         * integration point to L0(λ), the measured curve's own lower end there (points below detection at 0,
         * absorbance interpolated between the two points around λ), instead of the bin's darkest, which is at most
         * L0(λ). A stored point read at exactly 0 adds nothing. +∞ wherever {@link #thickened} is, or where the
         * curve's range is not the stored one. {@code measured} must be the curve the store holds for {@code curve}.
         */
        public double thickenedOnCurve(int curve, Curve measured, double thickestMm) {
            if (!Double.isFinite(thickened(curve, thickestMm))) {
                return Double.POSITIVE_INFINITY;
            }
            int range = rangeOfCurve[curve];
            double[] r = ranges.get(range);
            if (measured.minWavelengthNm() != r[0] || measured.maxWavelengthNm() != r[1]) {
                return Double.POSITIVE_INFINITY;
            }
            double[][] nodes = nodes(range);
            if (nodes == null) {
                return Double.POSITIVE_INFINITY;
            }
            double k = Math.max(1, thickestMm / store.thicknessMm(curve));
            double c = k > 1 ? 1 - surfaces(curve).largest * surfaces(curve).largest : 1;
            double lnFactor = Math.log(c) - k * lnBOfCurve; // thickened() formed lnBOfCurve for this curve
            double[] nm = nodes[0];
            double[] weight = nodes[1];
            double[] wavelengths = measured.wavelengthsNm();
            double sum = 0;
            double total = 0;
            int at = 0;
            for (int i = 0; i < nm.length; i++) {
                while (at + 1 < wavelengths.length && wavelengths[at + 1] <= nm[i]) {
                    at++;
                }
                double lower = lowerAt(measured, at, nm[i]);
                if (lower > 0) {
                    double ln = Math.log(Math.max(lower, Curve.ABSORBANCE_FLOOR_T));
                    sum += weight[i] * Math.exp(lnFactor + k * ln) * (1 - POWER_ROOM);
                }
                total += weight[i];
            }
            if (!(total > 0)) {
                return Double.POSITIVE_INFINITY;
            }
            return blockMargin(sum / total);
        }

        /**
         * Whether {@link #thinnedFromCode} or {@link #thickenedFromCode} can say anything on this query (the clause's
         * figure is kept, no layer, not switched off): the split rule of a solve then looks for the crossing.
         */
        public boolean solvesFromCode() {
            return solveFromCodes;
        }

        /**
         * A pass of a bulk curve judged at any thickness ≥ {@code thinnestMm} (docs/weighted-screening.md, "Bounds over
         * thickness from the figure codes"), from the curve's figure code alone: +∞ where {@link #thinned} is, where the
         * code says nothing, or with the codes switched off. For x ≥ d0 the code's as-measured bound (T only falls as
         * the sample thickens). For x &lt; d0, k = x/d0: at every integration point λ the thinned curve's upper value is
         * at most A·max(U0(λ), ε)^k (A = (1 − R_max)^(−2k), or on a regular curve with a smallest reflectance the
         * smaller max(1, h_max(k)) of {@link #thinned}'s surface bound; both powers of the measured upper value, so
         * they commute with the absorbance interpolation, and an unresolved reading min(T0, 1) lies below them); the
         * figure is a weighted mean Σ ŵ·U(λ) with ŵ ≥ 0, Σ ŵ = 1, and x ↦ x^k is concave for k ≤ 1, so
         * Σ ŵ·A·max(U0, ε)^k ≤ A·(Σ ŵ·max(U0, ε))^k ≤ A·(U0 figure + ε)^k, with the figure at most the code's
         * {@link FigureCodes#upperOf}. In decades the bound is linear in k: no curve read, no power formed.
         */
        public double thinnedFromCode(int curve, double thinnestMm) {
            if (!solveFromCodes || !pass || !(thinnestMm > 0) || !store.isBulk(curve) || layerRange.isPresent()) {
                return Double.POSITIVE_INFINITY;
            }
            double d0 = store.thicknessMm(curve);
            if (!(d0 > 0)) {
                return Double.POSITIVE_INFINITY;
            }
            if (thinnestMm >= d0) {
                double b = fromFigureCode(curve);
                return Double.isNaN(b) ? Double.POSITIVE_INFINITY : b;
            }
            double lnF = lnFigureOf(curve);
            if (Double.isNaN(lnF) || shares(curve).length == 0) {
                return Double.POSITIVE_INFINITY;
            }
            Surfaces surfaces = surfaces(curve);
            if (!(surfaces.largest < 1)) {
                return Double.POSITIVE_INFINITY;
            }
            double k = thinnestMm / d0;
            double lnA = -k * surfaces.logLoss; // (1 − R_max)^(−2k), the slack once more
            if (regular(curve) && surfaces.smallest >= 0) {
                lnA = Math.min(lnA, Math.max(0, Math.max(surfaces.lnSmallestFactor(k), surfaces.lnLargestFactor(k))));
            }
            // log10 of A·F^k·(1 + POWER_ROOM)(1 + SLACK)², the floor as passMargin takes it
            // every thinned value is at most 1 (a slab's T is below its lossless ceiling, an unresolved reading keeps
            // min(T0, 1)), so the figure is too
            double log10Mean = Math.min(0, (lnA + k * lnF) / LN_10) + LOG10_POWER_UP + 2 * LOG10_UP;
            return Math.max(log10Mean, log10Floor) - log10Threshold + LOG_ROOM;
        }

        /**
         * A block of a bulk curve judged at any thickness ≤ {@code thickestMm} (docs/weighted-screening.md, "Bounds over
         * thickness from the figure codes"), from the curve's figure code alone where its two ends are equal (the code
         * then bounds the lower figure L0 from below): +∞ where {@link #thickened} is, where the ends differ or the code
         * says nothing, or with the codes switched off. With k = max(1, x/d0), c and B as in {@link #thickened}: every
         * value of the thickened lower end at an integration point is at least c·(L0(λ)/B)^k (the pointwise bound
         * {@link #thickenedOnCurve} reads), and x ↦ x^k is convex for k ≥ 1, so the figure Σ ŵ·L(λ) is at least
         * c·(Σ ŵ·L0(λ)/B)^k = c·(L0 figure/B)^k, the figure at least the code's {@link FigureCodes#lowerOf}. Linear
         * in k in decades.
         */
        public double thickenedFromCode(int curve, double thickestMm) {
            if (!solveFromCodes || !thickenable(curve, thickestMm)) {
                return Double.POSITIVE_INFINITY;
            }
            int code = figures.code(figure, curve);
            if (code == FigureCodes.NONE || code == FigureCodes.BELOW) {
                return Double.POSITIVE_INFINITY;
            }
            double lnF = lnFigureOf(curve);
            double k = Math.max(1, thickestMm / store.thicknessMm(curve));
            double lnC = k > 1 ? surfaces(curve).lnContrast : 0;
            // log10 of c·(F/B)^k·(1 − POWER_ROOM)(1 − SLACK)², the floor as blockMargin takes it
            double log10Mean = (lnC + k * (lnF - lnBOfCurve)) / LN_10 + LOG10_POWER_DOWN + LOG10_DOWN;
            double bound = log10Threshold - Math.max(log10Mean, log10Floor) + LOG_ROOM;
            if (figures.endsEqual(figure, curve)) {
                return bound; // L0 = U0: a met block's margin (on U) and a missed one's (on L) are both at most this
            }
            // L0 unknown: the same bound holds the upper figure U at d (points below detection read at their limit,
            // which rescales like a reading), so a met block's margin log10(t/U) is at most it; a missed one's is
            // negative. Where it is negative the block cannot meet at any d ≤ x: 0 bounds a met or missed row's margin
            return Math.max(0, bound);
        }

        /**
         * {@link #thickened}'s preconditions without its bins' sum: a bulk block without a layer, an index that gives
         * R_max &lt; 1, k within the least far factor, and B known (formed into {@link #lnBOfCurve}).
         */
        private boolean thickenable(int curve, double thickestMm) {
            double d0 = store.thicknessMm(curve);
            if (pass || layerRange.isPresent() || !store.isBulk(curve) || !(d0 > 0) || !(thickestMm > 0)
                    || shares(curve).length == 0) {
                return false;
            }
            Surfaces surfaces = surfaces(curve);
            double k = Math.max(1, thickestMm / d0);
            if (!(surfaces.largest < 1) || !(k <= surfaces.leastFarFactor * (1 - 1e-9))) {
                return false;
            }
            if (lnBCurve != curve) {
                lnBOfCurve = lnBrightestOfCurve(curve);
                lnBCurve = curve;
            }
            return !Double.isNaN(lnBOfCurve);
        }

        /**
         * ln of the code's figure bound for the curve, formed once per curve: for a pass ln(ū·(1 + SLACK) + ε) (ε the
         * absorbance floor, for the floored values the pointwise bound reads), for a block ln(u̲·(1 − SLACK)); NaN
         * where the code says nothing.
         */
        private double lnFigureOf(int curve) {
            if (lnFCurve != curve) {
                int code = figures.code(figure, curve);
                if (code == FigureCodes.NONE) {
                    lnFOfCurve = Double.NaN;
                } else if (pass) {
                    lnFOfCurve = Math.log(FigureCodes.upperOf(code) * (1 + SLACK) + Curve.ABSORBANCE_FLOOR_T);
                } else {
                    lnFOfCurve = Math.log(FigureCodes.lowerOf(code) * (1 - SLACK));
                }
                lnFCurve = curve;
            }
            return lnFOfCurve;
        }

        /** The measured lower end at nm (points below detection at 0), point {@code at} the last at or before it. */
        private static double lowerAt(Curve measured, int at, double nm) {
            double t0 = measured.belowDetection(at) ? 0 : measured.transmittance(at);
            if (measured.wavelengthNm(at) == nm || at + 1 >= measured.size()) {
                return t0;
            }
            double t1 = measured.belowDetection(at + 1) ? 0 : measured.transmittance(at + 1);
            double f = (nm - measured.wavelengthNm(at)) / (measured.wavelengthNm(at + 1) - measured.wavelengthNm(at));
            double a0 = -Math.log10(Math.max(t0, Curve.ABSORBANCE_FLOOR_T));
            double a1 = -Math.log10(Math.max(t1, Curve.ABSORBANCE_FLOOR_T));
            return Math.pow(10, -(a0 * (1 - f) + a1 * f));
        }

        /** {@link #thickened} with one exp per bin and the boxed reflectance cache: the arithmetic before. */
        private double thickenedReference(int curve, double thickestMm) {
            double d0 = store.thicknessMm(curve);
            if (pass || layerRange.isPresent() || !store.isBulk(curve) || !(d0 > 0) || !(thickestMm > 0)) {
                return Double.POSITIVE_INFINITY;
            }
            double[] shares = shares(curve);
            double r = shares.length == 0 ? 1 : largestReflectance(curve);
            if (!(r < 1)) {
                return Double.POSITIVE_INFINITY; // the exact rescaling fails on this index: unverified, never a miss
            }
            double k = Math.max(1, thickestMm / d0);
            if (!(k <= SurfaceBounds.leastFarFactor(r) * (1 - 1e-9))) {
                return Double.POSITIVE_INFINITY; // a clear reading may have turned into a bound (L reads it as 0)
            }
            double lnB = lnBrightestOfCurve(curve);
            if (Double.isNaN(lnB)) {
                return Double.POSITIVE_INFINITY;
            }
            // at or below the measured thickness a resolved reading keeps T0 (the rescaled curve at d0 is the
            // measured one, to rounding), so no surface factor; an unresolved one keeps min(T0, 1) ≥ T0/B
            double c = k > 1 ? 1 - r * r : 1;
            double mean = 0;
            for (int b = 0; b < BINS; b++) {
                if (shares[b] > 0) {
                    int dark = darkest[b][curve] & 0xFF;
                    if (dark != 0) {
                        mean += shares[b] * c * Math.exp(k * (LN_T_OF_CODE[dark] - lnB));
                    }
                }
            }
            return blockMargin(mean);
        }

        /**
         * ln B, B = max(1, the brightest of every bin the curve's range meets): at least every reading of the
         * curve a value inside the bins interpolates from (each such point lies in a bin or is the neighbour
         * just outside the bin of the point next to it, which the brightest holds); NaN when a bin in range
         * has no bound (a reading above the code's top).
         */
        private double lnBrightestOfCurve(int curve) {
            double[] r = ranges.get(rangeOfCurve[curve]);
            double ln = 0;
            for (int b : reference ? ALL_BINS : binsOfRange[rangeOfCurve[curve]]) {
                double from = FIRST_NM + b * BIN_NM;
                if (from > r[1] || from + BIN_NM < r[0]) {
                    continue;
                }
                int code = brightest[b][curve] & 0xFF;
                if (code == 0) {
                    return Double.NaN;
                }
                ln = Math.max(ln, LN_T_OF_CODE[code]);
            }
            return ln;
        }

        /**
         * Whether the curve is regular ({@code WeightedBinsBuilder.regular}). Behind a layer only a regular curve is bounded:
         * the stack's upper reading at a point between two of the candidate's points chains the candidate's
         * limit interpolated linearly, which only a regular curve's bin brightest is sure to hold (the stack is
         * at most each part, T₁T₂/(1 − ρ₁ρ₂) ≤ T₁ since T₂ + ρ₂ ≤ 1, and so is each chain of a limit).
         */
        private boolean regular(int curve) {
            return reference ? ranges.get(rangeOfCurve[curve])[2] == 1 : regularOfRange[rangeOfCurve[curve]];
        }

        /** The surfaces' figures for the curve's index model over its range, formed once per pair. */
        private Surfaces surfaces(int curve) {
            int range = rangeOfCurve[curve];
            Surfaces[] ofModel = surfacesOf[range];
            int model = store.indexModelOf(curve);
            if (ofModel == null || ofModel.length <= model) {
                ofModel = ofModel == null ? new Surfaces[store.indexModelCount()]
                        : Arrays.copyOf(ofModel, store.indexModelCount());
                surfacesOf[range] = ofModel;
            }
            Surfaces s = ofModel[model];
            if (s == null) {
                RefractiveIndex index = store.indexModel(model);
                s = new Surfaces(SurfaceBounds.largestReflectance(index, ranges.get(range)),
                        SurfaceBounds.smallestReflectance(index, ranges.get(range)));
                ofModel[model] = s;
            }
            return s;
        }

        private double largestReflectance(int curve) {
            int model = store.indexModelOf(curve);
            int range = rangeOfCurve[curve];
            long key = ((long) model << 32) | range;
            Double hit = largestR.get(key);
            if (hit == null) {
                hit = SurfaceBounds.largestReflectance(store.indexModel(model), ranges.get(range));
                largestR.put(key, hit);
            }
            return hit;
        }
    }

    /**
     * An upper bound on T at the curve's own points that a value at {@code nm} is interpolated from (for
     * {@link LayerBlockScreen}): the brightest of the bin holding {@code nm}, which on a regular curve holds both
     * neighbours of any value inside the bin (see {@link Query#behindLayer}); {@link Curve#MAX_TRANSMITTANCE}
     * (no tighter bound) for a curve not screened or not regular, outside the bins, or a bin without a bound.
     */
    double brightestAround(int curve, double nm) {
        int range = rangeOfCurve[curve];
        int bin = binOf(nm);
        if (range < 0 || bin < 0 || ranges.get(range)[2] != 1) {
            return Curve.MAX_TRANSMITTANCE;
        }
        int code = brightest[bin][curve] & 0xFF;
        return code == 0 ? Curve.MAX_TRANSMITTANCE : Math.min(Curve.MAX_TRANSMITTANCE, T_OF_CODE[code]);
    }

    /** The bin whose closed interval holds the wavelength (the upper one on a shared edge, the last bin at the range's end); −1 outside. */
    static int binOf(double nm) {
        if (!(nm >= FIRST_NM && nm <= FIRST_NM + BINS * BIN_NM)) {
            return -1;
        }
        return Math.min(BINS - 1, (int) Math.floor((nm - FIRST_NM) / BIN_NM));
    }

}
