package org.spectralsieve.store;

import org.spectralsieve.requirement.NominalThickness;
import org.spectralsieve.requirement.SampleEvaluator;
import org.spectralsieve.requirement.Standing;
import org.spectralsieve.requirement.ThicknessInterval;
import org.spectralsieve.requirement.ThicknessSpec;
import org.spectralsieve.store.StoreSearch.Keys;

/**
 * Which store results could still reach a given exact result, once the store model's error is allowed for
 * (docs/store.md, "The store's error at the cut").
 *
 * <p>The store picks materials by its own margins, which differ from the exact evaluator's by a little: codes
 * rounded to 2·10⁻⁴ decades, and where a reading is taken to another thickness the slab's multiple-reflection
 * term, which the store's straight-line thickness model leaves out. The service judges the store's first picks
 * exactly; the {@code limit}-th exact row is then a floor no material left out may reach. A material is left
 * out only when none of its results, raised by its error, reaches that floor. Only this upper side of the error
 * matters: the floor itself is an exact result, not an estimate. The claim needs the store's readings to be the
 * exact evaluator's judged numbers: a reading under the detection limit is held as its bound
 * ({@code SpectralStore.Builder.add}), and a block over a reading held at the code's ceiling is not picked by the store
 * at all ({@link StoreSearch#blocksAtTheCodeCeiling}).
 */
final class CutReach {

    /** Half a code step (2·10⁻⁴ decades), plus the float thickness (relative 6·10⁻⁸ times at most 6.6 decades). */
    static final double ROUNDING_DECADES = OdCode.STEP / 2 + 1e-6;

    private final double perStretch;
    private final double farMm;
    private final SpectralStore store;
    private final SearchPlan plan;

    private CutReach(SpectralStore store, SearchPlan plan, double perStretch, double farMm) {
        this.store = store;
        this.plan = plan;
        this.perStretch = perStretch;
        this.farMm = farMm;
    }

    /**
     * The error model of one search: the largest multiple-reflection term −log10(1 − R²) over every probe's
     * surface reflectance in the store's index models, and the farthest thickness any reading may be taken to
     * (the asked thickness, or the range's far end plus two nominal tolerances, as the solver may read there).
     */
    static CutReach of(SpectralStore store, SearchPlan plan) {
        double reflections = 0;
        for (double[][] model : plan.surfaceLoss) {
            for (double[] clause : model) {
                for (double loss : clause) {
                    double reflectance = 1 - Math.pow(10, -loss / 2);
                    reflections = Math.max(reflections, -Math.log10(1 - reflectance * reflectance));
                }
            }
        }
        ThicknessSpec thickness = plan.thickness;
        double farMm = thickness.kind() == ThicknessSpec.Kind.AS_MEASURED ? 0
                : thickness.kind() == ThicknessSpec.Kind.FIXED ? thickness.minMm() : farEnd(thickness.maxMm());
        return new CutReach(store, plan, ROUNDING_DECADES + reflections, farMm);
    }

    private static double farEnd(double mm) {
        return mm + 2 * NominalThickness.toleranceMm(mm);
    }

    /**
     * How far, in decades, the exact margin of this curve can lie above the store's: the rounding as measured or
     * for a curve never rescaled; otherwise (rounding + reflections) · max(1, d/d0), d0 the curve's own thickness
     * and d the farthest it is read at: the asked thickness, or over a range the far end of the thicknesses it
     * speaks for ({@code Plan.spanOf}: the asked range cut to the made thicknesses and the material's other
     * samples) plus two nominal tolerances. Why the stretch: the store takes the internal absorbance a0 = OD0 − s
     * from the rounded reading and scales it by d/d0, so both the rounding and the reflections left out of a0 are
     * scaled with it.
     */
    double errorOf(int curve) {
        ThicknessSpec thickness = plan.thickness;
        if (thickness.kind() == ThicknessSpec.Kind.AS_MEASURED || !store.isBulk(curve)) {
            return ROUNDING_DECADES;
        }
        double d;
        if (thickness.kind() == ThicknessSpec.Kind.FIXED) {
            if (!plan.rescaledAt(store, curve)) {
                return ROUNDING_DECADES;
            }
            d = farMm;
        } else {
            ThicknessInterval span = plan.spanOf(curve);
            if (span == null) {
                return ROUNDING_DECADES; // not judged: its result has no margin to raise
            }
            d = span == SampleEvaluator.WHOLE_AXIS ? farMm : Math.min(farMm, farEnd(span.hiMm()));
        }
        return perStretch * Math.max(1, d / store.thicknessMm(curve));
    }

    /** The largest {@link #errorOf} any curve of the store can have (its thinnest bulk curve sets it). */
    double largestError() {
        if (plan.thickness.kind() == ThicknessSpec.Kind.AS_MEASURED) {
            return ROUNDING_DECADES;
        }
        return perStretch * Math.max(1, farMm / store.thinnestBulkMm());
    }

    /**
     * Whether a store result could be, exactly, at least as good as {@code exactKey} when its margin may be up to
     * {@code error} decades higher. Within a group the margin rises by the error. A result may also change group
     * where a reading's margin crosses 0 within the error: a miss, or an unverified result whose margin is below 0
     * (a block judged on a reading below the detection limit), may then meet. A result without a margin (NaN, not
     * judged) stays as it is: no reading decides it.
     */
    static boolean reaches(int storeKey, double error, int exactKey) {
        return raised(storeKey, error) >= exactKey;
    }

    /** The highest key the exact result can have when the store's is {@code key} (see {@link #reaches}). */
    static int raised(int key, double error) {
        Standing standing = Keys.standingOf(key);
        if (Keys.marginUnknown(key) || standing == Standing.NOT_JUDGED) {
            return key;
        }
        int unit = Keys.unitOf(key);
        double highest = (unit + 1) * Keys.UNIT + error;
        return switch (standing) {
            case MEETS -> Keys.of(Standing.MEETS, highest);
            case UNVERIFIED -> Keys.of(unit < 0 && highest >= 0 ? Standing.MEETS : Standing.UNVERIFIED, highest);
            // a miss's worst margin is that of a reading that misses, below 0: only that much can be raised
            case MISSES, MISSES_ON_BOUND -> {
                double raisedMiss = Math.min(unit + 1, 0) * Keys.UNIT + error;
                yield Keys.of(raisedMiss >= 0 ? Standing.MEETS : Standing.MISSES, raisedMiss);
            }
            case NOT_JUDGED -> key;
        };
    }

    /**
     * The lowest first-pass bound whose curve could, raised by at most {@code error}, reach {@code exactKey}: every
     * curve whose bound is below it is left out unseen. Why a bound may stand for the curve: the bound is the
     * store's result over fewer readings (the point probes), so the exact result over all readings is at most the
     * exact result over those, which is at most the bound raised by the error. A bound is never "misses on a bound"
     * (the point probes alone give a plain miss, {@code CurveModel}), so that group is not searched: were it, its
     * key would sit below every plain miss and the cut would take them all.
     *
     * <p>Worked out group by group: a group ranked above the exact result reaches whole; its own group from the
     * margin {@code error} (and a unit) below; a lower group only by the change to "meets" near a margin of 0
     * ({@link #raised}).
     */
    static int lowestReachingKey(int exactKey, double error) {
        Standing target = Keys.standingOf(exactKey);
        double margin = Keys.marginUnknown(exactKey) ? Double.NaN : Keys.unitOf(exactKey) * Keys.UNIT;
        int lowest = Integer.MAX_VALUE;
        for (Standing group : new Standing[] {Standing.MEETS, Standing.UNVERIFIED, Standing.MISSES, Standing.NOT_JUDGED}) {
            int from = lowestReachingIn(group, target, margin, error);
            if (from != Integer.MAX_VALUE) {
                lowest = Math.min(lowest, from);
            }
        }
        return lowest;
    }

    private static int lowestReachingIn(Standing group, Standing target, double margin, double error) {
        int targetRank = Keys.of(target, Double.NaN);
        int nanKey = Keys.of(group, Double.NaN);
        int lowestWithMargin = nanKey + 1;
        int risesTo = nanKey;
        double below = error + 2 * Keys.UNIT; // the error, the key's unit, and a unit of floating-point room
        if (risesTo > targetRank) {
            // ranked above the exact result once raised: every result with a margin; the NaN one stays put
            return nanKey > targetRank || (nanKey == targetRank) ? nanKey : lowestWithMargin;
        }
        if (risesTo == targetRank) {
            if (Double.isNaN(margin)) {
                return nanKey >= targetRank ? nanKey : lowestWithMargin;
            }
            return Math.max(lowestWithMargin, Keys.of(group, margin - below));
        }
        // ranked below: reaches only by turning into "meets" where its margin crosses 0 within the error
        boolean mayMeet = group == Standing.UNVERIFIED || group == Standing.MISSES;
        double needed = target == Standing.MEETS && !Double.isNaN(margin) ? Math.max(0, margin) : 0;
        if (!mayMeet || needed - below >= 0) {
            return Integer.MAX_VALUE;
        }
        return Math.max(lowestWithMargin, Keys.of(group, needed - below));
    }
}
