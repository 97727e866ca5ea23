package org.spectralsieve.requirement;

import java.util.ArrayList;
import java.util.List;
import java.util.stream.Collectors;

/**
 * The thicknesses a material exists in, which bound every rescaling: stock thicknesses (sizes kept on the
 * shelf or sold off the roll) and/or a continuous range it is made in. A rescaled curve is only a claim
 * about a part that can exist; outside these thicknesses a row is unverified with {@link #limitText()},
 * never met.
 *
 * <ul>
 *   <li>{@link Basis#STATED_RANGE}: a range was stated (perhaps with stock sizes inside it): any thickness
 *       in it can be had, the stock sizes are the ones recommended first.</li>
 *   <li>{@link Basis#STOCK_ONLY}: only stock sizes were stated: only those exist; the solver still reports
 *       its continuous interval, but a row is judged at a stock size.</li>
 *   <li>{@link Basis#ASSUMED}: nothing was stated: the measured thicknesses, widened by a factor of
 *       {@link #ASSUMED_FACTOR} each way. Rescaling by Beer–Lambert multiplies the measured absorbance by
 *       the thickness ratio, so a factor of 2 already turns a 1 % reading into 0.01 %; further out the
 *       answer rests more on the model than on the data, and nobody has said the part exists there.</li>
 *   <li>{@link Basis#UNLIMITED}: no material behind the curve (a curve judged on its own); nothing is
 *       limited.</li>
 * </ul>
 * Ends and stock sizes are compared with {@link NominalThickness}.
 */
public record MadeThicknesses(Basis basis, List<Double> stockMm, double loMm, double hiMm) {

    public enum Basis { STATED_RANGE, STOCK_ONLY, ASSUMED, UNLIMITED }

    /** How far beyond the measured thicknesses a material with no stated thicknesses is judged. */
    public static final double ASSUMED_FACTOR = 2;

    /** No limit: for a curve judged without a material's record. */
    public static final MadeThicknesses UNLIMITED =
            new MadeThicknesses(Basis.UNLIMITED, List.of(), Double.MIN_VALUE, Double.MAX_VALUE);

    public MadeThicknesses {
        if (basis == null) {
            throw new IllegalArgumentException("basis must be given");
        }
        stockMm = stockMm.stream().sorted().distinct().toList();
        for (double s : stockMm) {
            if (!(s > 0) || !Double.isFinite(s)) {
                throw new IllegalArgumentException("a stock thickness must be a finite thickness > 0 mm, was " + s);
            }
        }
        if (!(loMm > 0) || !(hiMm >= loMm) || !Double.isFinite(hiMm)) {
            throw new IllegalArgumentException("the made thicknesses must run from a thickness > 0 up to one not below it, got "
                    + loMm + " to " + hiMm + " mm");
        }
        for (double s : stockMm) {
            if (!NominalThickness.within(s, loMm, hiMm)) {
                throw new IllegalArgumentException("stock thickness " + s + " mm lies outside the made range "
                        + loMm + "–" + hiMm + " mm");
            }
        }
    }

    /**
     * What a material's record states, or the assumed rule when it states nothing.
     *
     * @param stockMm   stock thicknesses, possibly empty
     * @param minMm     the made range's thinnest end, NaN when no range is stated (then maxMm is NaN too)
     * @param measuredMm the material's measured thicknesses, for the assumed rule
     */
    public static MadeThicknesses of(List<Double> stockMm, double minMm, double maxMm, List<Double> measuredMm) {
        if (Double.isNaN(minMm) != Double.isNaN(maxMm)) {
            throw new IllegalArgumentException("a made range needs both ends, got " + minMm + " to " + maxMm + " mm");
        }
        if (!Double.isNaN(minMm)) {
            return new MadeThicknesses(Basis.STATED_RANGE, stockMm, minMm, maxMm);
        }
        if (!stockMm.isEmpty()) {
            double lo = stockMm.stream().mapToDouble(Double::doubleValue).min().orElseThrow();
            double hi = stockMm.stream().mapToDouble(Double::doubleValue).max().orElseThrow();
            return new MadeThicknesses(Basis.STOCK_ONLY, stockMm, lo, hi);
        }
        return assumed(measuredMm);
    }

    /** The assumed rule: the measured thicknesses widened by {@link #ASSUMED_FACTOR} each way. */
    public static MadeThicknesses assumed(List<Double> measuredMm) {
        List<Double> known = measuredMm.stream().filter(d -> d > 0 && Double.isFinite(d)).toList();
        if (known.isEmpty()) {
            return UNLIMITED;
        }
        double lo = known.stream().mapToDouble(Double::doubleValue).min().orElseThrow();
        double hi = known.stream().mapToDouble(Double::doubleValue).max().orElseThrow();
        return new MadeThicknesses(Basis.ASSUMED, List.of(), lo / ASSUMED_FACTOR, hi * ASSUMED_FACTOR);
    }

    /** Whether any thickness between the stated ends can be had (false: only the stock sizes). */
    public boolean continuous() {
        return basis != Basis.STOCK_ONLY;
    }

    /** Whether a part of thickness d exists (within {@link NominalThickness}). */
    public boolean makes(double d) {
        if (basis == Basis.UNLIMITED) {
            return true;
        }
        if (!continuous()) {
            return stockMm.stream().anyMatch(s -> NominalThickness.same(d, s));
        }
        return NominalThickness.within(d, loMm, hiMm);
    }

    /**
     * The part of [min, max] where parts exist, null when none; a range just beyond an end (within
     * {@link NominalThickness}) gives that end alone.
     */
    public ThicknessInterval within(double minMm, double maxMm) {
        if (basis == Basis.UNLIMITED) {
            return new ThicknessInterval(minMm, maxMm);
        }
        if (!continuous()) {
            List<Double> inside = stockWithin(minMm, maxMm);
            return inside.isEmpty() ? null : new ThicknessInterval(minMm, maxMm);
        }
        double lo = Math.max(minMm, loMm);
        double hi = Math.min(maxMm, hiMm);
        if (lo <= hi) {
            return new ThicknessInterval(lo, hi);
        }
        // an asked range just beyond an end, within the nominal tolerance, is that end
        if (maxMm < loMm && NominalThickness.same(maxMm, loMm)) {
            return new ThicknessInterval(loMm, loMm);
        }
        if (minMm > hiMm && NominalThickness.same(minMm, hiMm)) {
            return new ThicknessInterval(hiMm, hiMm);
        }
        return null;
    }

    /** The stock sizes inside [min, max] (ends with the tolerance), thinnest first. */
    public List<Double> stockWithin(double minMm, double maxMm) {
        List<Double> out = new ArrayList<>();
        for (double s : stockMm) {
            if (NominalThickness.within(s, minMm, maxMm)) {
                out.add(s);
            }
        }
        return out;
    }

    /** The reason a row outside these thicknesses gives: "made only 0.025–0.125 mm thick". */
    public String limitText() {
        return switch (basis) {
            case STATED_RANGE -> "made only " + Wording.mmSpan(loMm, hiMm) + " thick";
            case STOCK_ONLY -> "stocked only at " + stockList();
            case ASSUMED -> "no made thicknesses recorded, so judged only within a factor of "
                    + Wording.plain(ASSUMED_FACTOR) + " of the measured samples: " + Wording.mmSpan(loMm, hiMm);
            case UNLIMITED -> "any thickness";
        };
    }

    /** "0.025, 0.05, 0.125 mm". */
    public String stockList() {
        return stockMm.stream().map(Wording::plain).collect(Collectors.joining(", ")) + " mm";
    }

    /**
     * A short line for tables: "25–125 µm, stock 25, 50, 75, 125 µm", "stock 3 mm only", "1–12 mm assumed
     * (2× the measured)". Films (everything under 1 mm) in µm, sheets in mm.
     */
    public String summary() {
        boolean um = hiMm < 1;
        java.util.function.DoubleFunction<String> n = mm -> Wording.plain(um ? mm * 1000 : mm);
        String unit = um ? " µm" : " mm";
        String stock = stockMm.stream().map(n::apply).collect(Collectors.joining(", "));
        return switch (basis) {
            case STATED_RANGE -> n.apply(loMm) + "–" + n.apply(hiMm) + unit + (stockMm.isEmpty() ? "" : ", stock " + stock + unit);
            case STOCK_ONLY -> "stock " + stock + unit + " only";
            case ASSUMED -> n.apply(loMm) + "–" + n.apply(hiMm) + unit + " assumed (" + Wording.plain(ASSUMED_FACTOR)
                    + "× the measured)";
            case UNLIMITED -> "not limited";
        };
    }
}
