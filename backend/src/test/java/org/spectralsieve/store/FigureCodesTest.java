package org.spectralsieve.store;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Optional;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.requirement.Direction;
import org.spectralsieve.requirement.RequirementParser;
import org.spectralsieve.requirement.ThresholdUnit;
import org.spectralsieve.requirement.WeightedClause;
import org.spectralsieve.requirement.Weighting;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.RandomEdgeCurves;
import org.spectralsieve.weighting.BelowDetectionAs;
import org.spectralsieve.weighting.Emitter;
import org.spectralsieve.weighting.Figure;

/**
 * The store's per-curve figure codes (docs/weighted-screening.md, "Figures in the store"): each code holds the exact
 * figure the judgement computes as measured, both ways, within one code step either side; a clause reads a code only
 * for the very built-in figure it was computed for; and the margin bound a query forms from it is never below the
 * exact clause margin of a row that meets or misses, and within two steps of it where both ends are known.
 */
class FigureCodesTest {

    private static final StoredMaterial STOCK = new StoredMaterial(1, "Illustrative Quillby sheet", "plastic sheet");

    /**
     * Outside check: every kept figure is a weighted mean Σ a·T / Σ a with a ≥ 0 (the emitter's flat share, the CIE
     * erythema and actinic UV hazard weightings, ISO/CIE 17166 and ICNIRP; τv with D65·V, ISO 8980-3), so on a curve
     * T = c over 190–1100 nm it is c itself. The code must hold c, and its two ends lie two steps of 2·10⁻⁴ decades
     * apart.
     */
    @Test
    void aFlatCurveHasEveryKeptFigureHeldByItsCode() {
        double[] levels = {1.2, 0.9, 0.5, 1e-3, 1e-9};
        SpectralStore.Builder builder = SpectralStore.builder(SpectralStore.DEFAULT_GRID, levels.length);
        for (int i = 0; i < levels.length; i++) {
            builder.add(i + 1, STOCK, 2, true, false, new ConstantIndex(1.5),
                    Curve.of(new double[] {190, 1100}, new double[] {levels[i], levels[i]}, 0));
        }
        FigureCodes codes = builder.build().weightedScreen().figureCodes();
        for (int i = 0; i < levels.length; i++) {
            for (int f = 0; f < FigureCodes.FIGURES.size(); f++) {
                int code = codes.code(f, i);
                assertThat(FigureCodes.lowerOf(code)).as("figure %d of T = %s", f, levels[i]).isLessThanOrEqualTo(levels[i]);
                assertThat(FigureCodes.upperOf(code)).as("figure %d of T = %s", f, levels[i]).isGreaterThanOrEqualTo(levels[i]);
                assertThat(Math.log10(FigureCodes.upperOf(code) / FigureCodes.lowerOf(code))).isCloseTo(2 * FigureCodes.STEP,
                        org.assertj.core.data.Offset.offset(1e-12));
                assertThat(codes.endsEqual(f, i)).isTrue();
            }
        }
    }

    /**
     * On random curves (start 190–430 nm, end 600–1100 nm, steps 0.5–5 nm, stretches below detection at limits up to
     * 5 %, points at 0, readings up to 1.5): where the exact figure is available, the code's two ends hold U (points
     * below detection at their limit); where the ends are said equal, L (at 0) equals U; where it is not available
     * (the curve misses the figure's span, or τv on a curve not spanning 380–780 nm), no bound.
     */
    @Test
    void theCodeHoldsTheExactFigureOfEveryRandomCurveBothWays() {
        Random random = new Random(20261205L);
        int n = 400;
        Curve[] curves = new Curve[n];
        SpectralStore.Builder builder = SpectralStore.builder(SpectralStore.DEFAULT_GRID, 16);
        for (int i = 0; i < n; i++) {
            curves[i] = randomCurve(random);
            builder.add(i + 1, STOCK, 2, true, false, new ConstantIndex(1.5), curves[i]);
        }
        FigureCodes codes = builder.build().weightedScreen().figureCodes();
        int unavailable = 0;
        int unequal = 0;
        int bounded = 0;
        for (int i = 0; i < n; i++) {
            for (int f = 0; f < FigureCodes.FIGURES.size(); f++) {
                Weighting w = FigureCodes.FIGURES.get(f);
                Figure upper = w.figure(curves[i], BelowDetectionAs.LIMIT);
                int code = codes.code(f, i);
                if (!upper.available()) {
                    assertThat(code).as("curve %d figure %d unavailable", i, f).isEqualTo(FigureCodes.NONE);
                    unavailable++;
                    continue;
                }
                double u = upper.value().getAsDouble();
                assertThat(FigureCodes.lowerOf(code)).as("curve %d figure %d", i, f).isLessThanOrEqualTo(u);
                assertThat(FigureCodes.upperOf(code)).as("curve %d figure %d", i, f).isGreaterThanOrEqualTo(u);
                double l = w.figure(curves[i], BelowDetectionAs.ZERO).value().orElse(0);
                if (codes.endsEqual(f, i)) {
                    assertThat(l).as("curve %d figure %d: ends said equal", i, f).isEqualTo(u);
                } else {
                    assertThat(l).isLessThan(u);
                    unequal++;
                }
                bounded++;
            }
        }
        assertThat(unavailable).as("figures not available").isGreaterThan(100);
        assertThat(unequal).as("figures whose lower end differs").isGreaterThan(100);
        assertThat(bounded).isGreaterThan(1000);
    }

    /**
     * The query's bound from a code, for a row that meets or misses the clause, is at least the exact margin the
     * judgement reads (FigureClauses.weighted: a pass meets on L ≥ t with margin on L, misses on U &lt; t on U; a
     * block meets on U ≤ t on U, misses on L &gt; t on L), and within two code steps and the slack of it for a pass,
     * and for a block whose ends are equal.
     */
    @Test
    void theBoundFromACodeHoldsTheExactMarginAndIsWithinTwoSteps() {
        Random random = new Random(20261206L);
        int n = 300;
        Curve[] curves = new Curve[n];
        SpectralStore.Builder builder = SpectralStore.builder(SpectralStore.DEFAULT_GRID, 16);
        for (int i = 0; i < n; i++) {
            curves[i] = randomCurve(random);
            builder.add(i + 1, STOCK, 2, true, false, new ConstantIndex(1.5), curves[i]);
        }
        SpectralStore store = builder.build();
        WeightedScreen screen = store.weightedScreen();
        int checked = 0;
        int tight = 0;
        for (int trial = 0; trial < 60; trial++) {
            Weighting w = FigureCodes.FIGURES.get(trial % FigureCodes.FIGURES.size());
            Direction direction = random.nextBoolean() ? Direction.PASS : Direction.BLOCK;
            double t = Math.pow(10, -3 * random.nextDouble());
            WeightedClause clause = new WeightedClause(direction, t, ThresholdUnit.FRACTION, w, "random");
            WeightedScreen.Query q = screen.query(store, clause, Optional.empty());
            assertThat(q.readsFigureCodes()).isTrue();
            for (int i = 0; i < n; i++) {
                Figure upper = w.figureForMargin(curves[i], BelowDetectionAs.LIMIT);
                if (!upper.available()) {
                    assertThat(screen.figureCodes().code(trial % FigureCodes.FIGURES.size(), i)).isEqualTo(FigureCodes.NONE);
                    continue;
                }
                double u = upper.value().getAsDouble();
                double l = upper.bound() != Figure.Bound.AT_MOST ? u
                        : Math.min(u, w.figureForMargin(curves[i], BelowDetectionAs.ZERO).value().orElse(0));
                double exact;
                if (direction == Direction.PASS) {
                    exact = l >= t ? Math.log10(l / t) : u < t ? Math.log10(Math.max(u, 1e-12) / t) : Double.NaN;
                } else {
                    exact = u <= t ? Math.log10(t / Math.max(u, 1e-12)) : l > t ? Math.log10(t / l) : Double.NaN;
                }
                if (Double.isNaN(exact)) {
                    continue; // unverified: no bound of a met or missed row speaks for it
                }
                double bound = q.asMeasured(i);
                assertThat(bound).as("curve %d, %s %s %.4g", i, w, direction, t).isGreaterThanOrEqualTo(exact);
                checked++;
                boolean bothEnds = direction == Direction.PASS ? l == u : screen.figureCodes().endsEqual(trial % FigureCodes.FIGURES.size(), i);
                if (bothEnds && u > 1e-11) {
                    assertThat(bound - exact).as("curve %d, %s %s", i, w, direction).isLessThanOrEqualTo(2 * FigureCodes.STEP + 1e-6);
                    tight++;
                }
            }
        }
        assertThat(checked).isGreaterThan(5000);
        assertThat(tight).isGreaterThan(3000);
    }

    /**
     * A clause reads a code only for the very figure computed at build: the built-in catalogues' emitter and
     * response objects. A parametric LED of the same peak and width, a response-weighted LED, or another emitter
     * computes its own figure, which no code bounds.
     */
    @Test
    void aClauseReadsACodeOnlyForTheVeryBuiltInFigure() {
        assertThat(figureOf("passes over 85% of led 365")).isEqualTo(0);
        assertThat(figureOf("passes over 85% of led 385")).isEqualTo(1);
        assertThat(figureOf("passes over 85% of led 395")).isEqualTo(2);
        assertThat(figureOf("passes over 85% of led 405")).isEqualTo(3);
        assertThat(figureOf("erythemal under 1%")).isEqualTo(4);
        assertThat(figureOf("uv hazard under 0.1%")).isEqualTo(5);
        assertThat(figureOf("luminous over 70%")).isEqualTo(6);
        assertThat(figureOf("passes over 60% of led 395 weighted by blue-light")).isEqualTo(-1);
        assertThat(figureOf("passes over 60% of led-365-12")).isEqualTo(-1);
        assertThat(figureOf("passes over 60% of d65")).isEqualTo(-1);
        // the same name and shape, another object: its figure is not the one computed at build
        assertThat(FigureCodes.figureOf(Weighting.of(Emitter.led("led-365", 365, 12), Optional.empty()))).isEqualTo(-1);
    }

    /** A row carried into a rebuilt store keeps the codes computed for its curve. */
    @Test
    void aCarriedRowKeepsItsCodes() {
        Random random = new Random(7);
        SpectralStore.Builder builder = SpectralStore.builder(SpectralStore.DEFAULT_GRID, 4);
        for (int i = 0; i < 20; i++) {
            builder.add(i + 1, STOCK, 2, true, false, new ConstantIndex(1.5), randomCurve(random));
        }
        SpectralStore first = builder.build();
        SpectralStore.Builder again = SpectralStore.builder(SpectralStore.DEFAULT_GRID, 4);
        for (int i = 19; i >= 0; i--) {
            again.addCarried(i + 1, STOCK, 2, true, false, new ConstantIndex(1.5), first, i);
        }
        SpectralStore second = again.build();
        FigureCodes before = first.weightedScreen().figureCodes();
        FigureCodes after = second.weightedScreen().figureCodes();
        for (int i = 0; i < 20; i++) {
            for (int f = 0; f < FigureCodes.FIGURES.size(); f++) {
                assertThat(after.code(f, 19 - i)).isEqualTo(before.code(f, i));
                assertThat(after.endsEqual(f, 19 - i)).isEqualTo(before.endsEqual(f, i));
            }
        }
    }

    private static int figureOf(String text) {
        return FigureCodes.figureOf(((WeightedClause) RequirementParser.parse(text).clauses().get(0)).weighting());
    }

    /** An edge with ripple from a random start to a random end; stretches below detection, zeros, readings above 1. */
    static Curve randomCurve(Random random) {
        double step = new double[] {0.5, 1, 2, 5}[random.nextInt(4)];
        double start = 190 + random.nextInt(240) + (random.nextBoolean() ? 0.25 : 0);
        double end = 600 + random.nextInt(500);
        int n = (int) ((end - start) / step) + 1;
        double edge = 250 + 300 * random.nextDouble();
        double width = 2 + 30 * random.nextDouble();
        double top = 0.3 + 0.8 * random.nextDouble();
        double limit = new double[] {0, 1e-4, 1e-3, 0.05}[random.nextInt(4)];
        return RandomEdgeCurves.edge(random, start, step, n, edge, width, top, limit, 1.5, 300);
    }
}
