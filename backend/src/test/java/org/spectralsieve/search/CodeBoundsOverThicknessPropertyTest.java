package org.spectralsieve.search;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.optics.RefractiveIndex;
import org.spectralsieve.optics.ThicknessRescaler;
import org.spectralsieve.requirement.Direction;
import org.spectralsieve.requirement.MadeThicknesses;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.RequirementParser;
import org.spectralsieve.requirement.ThresholdUnit;
import org.spectralsieve.requirement.WeightedClause;
import org.spectralsieve.requirement.Weighting;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.RandomEdgeCurves;
import org.spectralsieve.store.SpectralStore;
import org.spectralsieve.store.StoredMaterial;
import org.spectralsieve.store.WeightedScreen;
import org.spectralsieve.weighting.BelowDetectionAs;
import org.spectralsieve.weighting.EmitterCatalogue;
import org.spectralsieve.weighting.Figure;
import org.spectralsieve.weighting.SpectrumLookup;

/**
 * Property (docs/weighted-screening.md, "Bounds over thickness from the figure codes"): the bounds a solve reads from
 * the store's figure codes — a pass at any thickness at or above x ({@code Query.thinnedFromCode}), a block at any
 * thickness at or below x ({@code Query.thickenedFromCode}) — are at least the exact margin of the curve rescaled to
 * every such thickness; and a sample's bound over a solved range ({@code WeightedMisses}, first stage and second stage,
 * with the splits around the crossing) is at least its exact worst margin at every thickness in the range. The exact
 * rescaling is {@link ThicknessRescaler} (Fresnel surfaces and Beer–Lambert, checked against REFERENCE §7 in its own
 * tests; readings at the ceiling per SlabReading), the exact figure the judgement's own
 * {@code Weighting.figureForMargin} (weighted means checked against ISO/CIE worked values in the weighting package);
 * the bound is arithmetic on them (Jensen's inequality, no source needed). A met or missed clause's margin is at most
 * log10(U/t) for a pass and log10(t/L) for a block (L ≤ U), which is what is compared. Random curves with a fixed seed
 * (jqwik is not available offline): long-pass edges from random starts and steps, stretches below detection at limits
 * up to 5 %, points at 0, readings up to 1.5, clear sheets at the lossless ceiling (readings the data cannot resolve),
 * indices 1.45–1.6, measured at 0.5–8 mm.
 */
class CodeBoundsOverThicknessPropertyTest {

    /** The seven figures the store keeps codes of, built as the store's catalogue builds them (the same objects). */
    private static final List<Weighting> KEPT = List.of(
            Weighting.of(EmitterCatalogue.named("led-365").orElseThrow(), Optional.empty()),
            Weighting.of(EmitterCatalogue.named("led-385").orElseThrow(), Optional.empty()),
            Weighting.of(EmitterCatalogue.named("led-395").orElseThrow(), Optional.empty()),
            Weighting.of(EmitterCatalogue.named("led-405").orElseThrow(), Optional.empty()),
            Weighting.erythemal(SpectrumLookup.builtIn()),
            Weighting.uvHazard(SpectrumLookup.builtIn()),
            Weighting.luminous());

    private record Stock(SpectralStore store, List<Curve> curves, List<RefractiveIndex> indices, List<Double> thicknesses) {
    }

    private static Stock randomStock(Random random, int n) {
        SpectralStore.Builder builder = SpectralStore.builder(SpectralStore.DEFAULT_GRID, n);
        StoredMaterial material = new StoredMaterial(1, "illustrative sheet", "plastic sheet", MadeThicknesses.of(
                List.of(), 0.1, 30, List.of()));
        List<Curve> curves = new ArrayList<>();
        List<RefractiveIndex> indices = new ArrayList<>();
        List<Double> thicknesses = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            Curve curve = i % 7 == 6 ? clearSheet(random) : randomCurve(random);
            RefractiveIndex index = new ConstantIndex(1.45 + 0.15 * random.nextDouble());
            double d0 = 0.5 + 7.5 * random.nextDouble();
            builder.add(i + 1, material, d0, true, false, index, curve);
            curves.add(curve);
            indices.add(index);
            thicknesses.add(d0);
        }
        return new Stock(builder.build(), curves, indices, thicknesses);
    }

    @Test
    void eachClauseBoundFromTheCodeHoldsTheExactMarginAtEveryThicknessItCovers() {
        Random random = new Random(20261211L);
        Stock stock = randomStock(random, 180);
        SpectralStore store = stock.store();
        int checked = 0;
        int passBounded = 0;
        int blockBounded = 0;
        int passTighter = 0;
        int blockTighter = 0;
        for (Weighting weighting : KEPT) {
            for (int trial = 0; trial < 3; trial++) {
                double passT = 0.05 + 0.9 * random.nextDouble();
                double blockT = Math.pow(10, -3.5 * random.nextDouble());
                WeightedScreen.Query pass = store.weightedScreen().query(store, new WeightedClause(Direction.PASS, passT,
                        ThresholdUnit.FRACTION, weighting, "pass"), Optional.empty());
                WeightedScreen.Query block = store.weightedScreen().query(store, new WeightedClause(Direction.BLOCK, blockT,
                        ThresholdUnit.FRACTION, weighting, "block"), Optional.empty());
                assertThat(pass.solvesFromCode()).as(weighting + " is kept").isTrue();
                for (int c = 0; c < stock.curves().size(); c++) {
                    double d0 = stock.thicknesses().get(c);
                    // x from a fifth of the measured thickness to three times it
                    double x = d0 * Math.pow(15, random.nextDouble()) / 5;
                    double passBound = pass.thinnedFromCode(c, x);
                    double blockBound = block.thickenedFromCode(c, x);
                    if (Double.isFinite(passBound)) {
                        passBounded++;
                        passTighter += passBound < pass.thinned(c, x) && x < d0 ? 1 : 0;
                        // every judged thickness at or above x
                        for (double d : new double[] {x, x * 1.01, x * 1.3, Math.max(x, d0), x * 2.5}) {
                            double margin = exactMargin(stock, c, d, Direction.PASS, passT, weighting);
                            if (!Double.isNaN(margin)) {
                                assertThat(passBound).as(weighting + " pass curve " + c + " x " + x + " d " + d + " d0 " + d0)
                                        .isGreaterThanOrEqualTo(margin);
                                checked++;
                            }
                        }
                    }
                    if (Double.isFinite(blockBound)) {
                        blockBounded++;
                        blockTighter += blockBound < block.thickened(c, x) ? 1 : 0;
                        // every judged thickness at or below x
                        for (double d : new double[] {x, x / 1.01, x / 1.3, Math.min(x, d0), x / 2.5}) {
                            double margin = exactMargin(stock, c, d, Direction.BLOCK, blockT, weighting);
                            if (!Double.isNaN(margin)) {
                                assertThat(blockBound).as(weighting + " block curve " + c + " x " + x + " d " + d + " d0 " + d0)
                                        .isGreaterThanOrEqualTo(margin);
                                checked++;
                            }
                        }
                    }
                }
            }
        }
        // not vacuous: many bounds of both kinds, many tighter than the bins' at the same thickness
        assertThat(passBounded).isGreaterThan(KEPT.size() * 3 * 180 / 2);
        assertThat(blockBounded).isGreaterThan(KEPT.size() * 3 * 180 / 8);
        assertThat(passTighter).isGreaterThan(KEPT.size() * 3 * 180 / 5);
        assertThat(blockTighter).isGreaterThan(KEPT.size() * 3 * 180 / 10);
        assertThat(checked).isGreaterThan(10_000);
    }

    /** A random requirement solved over a random range from 0.3–3.3 mm up to nine times its lower end. */
    private static Requirement randomSolvedRequirement(Random random) {
        double lo = 0.3 + 3 * random.nextDouble();
        double hi = lo * (1 + 8 * random.nextDouble());
        return RequirementParser.parse(randomRequirement(random)
                + String.format(Locale.ROOT, ", thickness %.3f to %.3f mm", lo, hi));
    }

    @Test
    void aSolvedSampleBoundHoldsItsExactWorstMarginAtEveryThicknessOfTheRange() {
        Random random = new Random(20261212L);
        Stock stock = randomStock(random, 150);
        SpectralStore store = stock.store();
        int checked = 0;
        int tighter = 0;
        for (int trial = 0; trial < 14; trial++) {
            Requirement requirement = randomSolvedRequirement(random);
            double[] first = WeightedMisses.marginBounds(store, requirement, Optional.empty(), false);
            double[] before = withoutCodes(() -> WeightedMisses.marginBounds(store, requirement, Optional.empty(), false));
            WeightedMisses.SecondStage second = WeightedMisses.secondStage(store, requirement, Optional.empty(), false, true);
            for (int c = 0; c < stock.curves().size(); c++) {
                double secondBound = second.bound(c, stock.curves().get(c));
                tighter += first[c] < before[c] - 1e-3 ? 1 : 0;
                double lnLo = Math.log(requirement.thickness().minMm());
                double lnHi = Math.log(requirement.thickness().maxMm());
                for (int j = 0; j <= 24; j++) {
                    double d = Math.exp(lnLo + (lnHi - lnLo) * j / 24);
                    double worst = exactWorstMargin(stock, c, d, requirement);
                    if (Double.isNaN(worst)) {
                        continue; // a clause unverified there: no bound need hold
                    }
                    String what = requirement + " curve " + c + " at " + d + " mm (measured " + stock.thicknesses().get(c) + ")";
                    assertThat(first[c]).as("first stage, " + what).isGreaterThanOrEqualTo(worst);
                    assertThat(secondBound).as("second stage, " + what).isGreaterThanOrEqualTo(worst);
                    checked++;
                }
            }
        }
        assertThat(checked).isGreaterThan(10_000);
        // not vacuous: the codes' bounds over thickness tighten first bounds by more than 10⁻³ decades
        assertThat(tighter).isGreaterThan(10);
    }

    /**
     * The twelfth pass (docs/weighted-screening.md, "The solve at a million curves"): a solve's first stage that leaves
     * the bins unread where the codes prove no miss ({@code WeightedMisses.screenWithBinsDeferred}) gives, on every
     * deferred curve, a bound never below the full one and still at least the exact worst margin at every thickness of
     * the range (the codes' P(lo) and Q(hi) alone, Jensen's inequality as above), and the very full bound elsewhere;
     * read in full it gives back the screen's bounds bit for bit.
     */
    @Test
    void aSolveWithItsBinsDeferredIsSoundAndReadInFullGivesTheScreensBoundsBitForBit() {
        Random random = new Random(20261205L);
        Stock stock = randomStock(random, 150);
        SpectralStore store = stock.store();
        int deferred = 0;
        int looser = 0;
        int checked = 0;
        for (int trial = 0; trial < 10; trial++) {
            Requirement requirement = randomSolvedRequirement(random);
            double[] full = WeightedMisses.marginBounds(store, requirement, Optional.empty(), false);
            WeightedMisses.DeferredBins lazy = WeightedMisses.screenWithBinsDeferred(store, requirement);
            double[] codesOnly = lazy.bounds().clone();
            boolean[] wasDeferred = lazy.deferred().clone();
            for (int c = 0; c < stock.curves().size(); c++) {
                String what = requirement + " curve " + c + " (measured " + stock.thicknesses().get(c) + ")";
                if (!wasDeferred[c]) {
                    assertThat(Double.compare(codesOnly[c], full[c])).as("not deferred, " + what).isZero();
                    continue;
                }
                deferred++;
                looser += codesOnly[c] > full[c] + 1e-3 ? 1 : 0;
                assertThat(codesOnly[c]).as("deferred, never below the full bound, " + what).isGreaterThanOrEqualTo(full[c]);
                double lnLo = Math.log(requirement.thickness().minMm());
                double lnHi = Math.log(requirement.thickness().maxMm());
                for (int j = 0; j <= 12; j++) {
                    double d = Math.exp(lnLo + (lnHi - lnLo) * j / 12);
                    double worst = exactWorstMargin(stock, c, d, requirement);
                    if (!Double.isNaN(worst)) {
                        assertThat(codesOnly[c]).as("deferred, at " + d + " mm, " + what).isGreaterThanOrEqualTo(worst);
                        checked++;
                    }
                }
            }
            int[] every = java.util.stream.IntStream.range(0, store.size()).toArray();
            lazy.readInFull(every, every.length);
            for (int c = 0; c < stock.curves().size(); c++) {
                assertThat(Double.compare(lazy.bounds()[c], full[c])).as("read in full, curve " + c + ", " + requirement).isZero();
                assertThat(lazy.deferred()[c]).isFalse();
            }
        }
        // not vacuous: curves were deferred, the bins tighten some of them, and the exact margins were compared
        assertThat(deferred).isGreaterThan(100);
        assertThat(looser).isGreaterThan(10);
        assertThat(checked).isGreaterThan(1_000);
    }

    private static double[] withoutCodes(java.util.function.Supplier<double[]> bounds) {
        System.setProperty("sieve.store.solve-from-codes", "false");
        try {
            return bounds.get();
        } finally {
            System.clearProperty("sieve.store.solve-from-codes");
        }
    }

    /**
     * The smallest over the requirement's weighted clauses of each clause's exact margin at thickness d where it meets
     * or misses ({@link #exactMargin}); NaN where a clause is unverified (no bound speaks of such a row's margin).
     */
    private static double exactWorstMargin(Stock stock, int c, double d, Requirement requirement) {
        double worst = Double.POSITIVE_INFINITY;
        for (var clause : requirement.clauses()) {
            if (clause instanceof WeightedClause w) {
                double margin = exactMargin(stock, c, d, w.direction(), w.thresholdT(), w.weighting());
                if (Double.isNaN(margin)) {
                    return Double.NaN;
                }
                worst = Math.min(worst, margin);
            }
        }
        return worst;
    }

    /**
     * A clause's exact margin on the curve rescaled to d, as the judgement forms it from the figure's two ends
     * ({@code FigureClauses.weighted}): a pass meets on L ≥ t (margin on L) and misses on U &lt; t (on U); a block meets
     * on U ≤ t (on U) and misses on L &gt; t (on L); floors as the margins take them. NaN where the figure is unavailable
     * or the clause unverified.
     */
    private static double exactMargin(Stock stock, int c, double d, Direction direction, double t, Weighting weighting) {
        double u = upperFigure(stock, c, d, weighting);
        if (Double.isNaN(u)) {
            return Double.NaN;
        }
        double l = lowerFigure(stock, c, d, weighting);
        double floor = Math.min(Curve.ABSORBANCE_FLOOR_T, t);
        if (direction == Direction.PASS) {
            return l >= t ? Math.log10(Math.max(l, floor) / t) : u < t ? Math.log10(Math.max(u, floor) / t) : Double.NaN;
        }
        return u <= t ? Math.log10(t / Math.max(u, floor)) : l > t ? Math.log10(t / Math.max(l, floor)) : Double.NaN;
    }

    private static Curve rescaled(Stock stock, int c, double d) {
        return ThicknessRescaler.rescale(stock.curves().get(c), stock.thicknesses().get(c), d, stock.indices().get(c));
    }

    /** The exact upper figure U (points below detection at their limit) of the curve rescaled to d; NaN if unavailable. */
    private static double upperFigure(Stock stock, int c, double d, Weighting weighting) {
        Figure upper = weighting.figureForMargin(rescaled(stock, c, d), BelowDetectionAs.LIMIT);
        return upper.available() ? upper.value().getAsDouble() : Double.NaN;
    }

    /** The exact lower figure L (points below detection at 0) of the curve rescaled to d; NaN if unavailable. */
    private static double lowerFigure(Stock stock, int c, double d, Weighting weighting) {
        Curve curve = rescaled(stock, c, d);
        Figure upper = weighting.figureForMargin(curve, BelowDetectionAs.LIMIT);
        if (!upper.available()) {
            return Double.NaN;
        }
        double u = upper.value().getAsDouble();
        return upper.bound() != Figure.Bound.AT_MOST ? u
                : Math.min(u, weighting.figureForMargin(curve, BelowDetectionAs.ZERO).value().orElse(0));
    }

    /** Random requirement wordings on the kept figures (common practice, no source), some with a figure no code keeps. */
    private static String randomRequirement(Random random) {
        String clauses = "passes over " + percent(30 + 60 * random.nextDouble()) + " of led "
                + new String[] {"365", "385", "395", "405"}[random.nextInt(4)];
        if (random.nextInt(3) > 0) {
            clauses += " and uv hazard under " + percent(Math.pow(10, 1 - 3 * random.nextDouble()));
        }
        if (random.nextBoolean()) {
            clauses += " and luminous over " + percent(20 + 60 * random.nextDouble());
        }
        if (random.nextInt(3) == 0) {
            clauses += " and erythemal under " + percent(Math.pow(10, 1.5 - 3 * random.nextDouble()));
        }
        if (random.nextInt(6) == 0) {
            clauses += " and passes over " + percent(20 + 40 * random.nextDouble()) + " of led 395 weighted by blue-light";
        }
        return clauses;
    }

    private static String percent(double p) {
        return String.format(Locale.ROOT, "%.4f%%", p);
    }

    /** A clear sheet: readings at and around the lossless ceiling of n ≈ 1.5 (0.92), some above 1 (noise). */
    private static Curve clearSheet(Random random) {
        int n = 611;
        double[] nm = new double[n];
        double[] t = new double[n];
        double start = 190 + random.nextInt(40);
        for (int i = 0; i < n; i++) {
            nm[i] = start + i;
            t[i] = 0.88 + 0.14 * random.nextDouble();
        }
        return Curve.of(nm, t, 0);
    }

    /** A long-pass edge with ripple from a random start on a random step; stretches below detection, zeros, readings up to 1.5. */
    private static Curve randomCurve(Random random) {
        double step = new double[] {0.5, 1, 2, 5}[random.nextInt(4)];
        double start = 190 + random.nextInt(200);
        double end = 700 + random.nextInt(400);
        int n = (int) ((end - start) / step) + 1;
        double edge = 230 + 250 * random.nextDouble();
        double width = 2 + 30 * random.nextDouble();
        double top = 0.4 + 0.7 * random.nextDouble();
        double limit = new double[] {0, 0, 1e-4, 1e-3, 0.05}[random.nextInt(5)];
        return RandomEdgeCurves.edge(random, start, step, n, edge, width, top, limit, 1.5, 300);
    }
}
