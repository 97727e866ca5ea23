package org.spectralsieve.store;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.optics.RefractiveIndex;
import org.spectralsieve.optics.ThicknessRescaler;
import org.spectralsieve.requirement.Direction;
import org.spectralsieve.requirement.ThresholdUnit;
import org.spectralsieve.requirement.WeightedClause;
import org.spectralsieve.requirement.Weighting;
import org.spectralsieve.requirement.MadeThicknesses;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.RandomEdgeCurves;
import org.spectralsieve.weighting.BoundedCurves;
import org.spectralsieve.weighting.EmitterCatalogue;
import org.spectralsieve.weighting.Emitter;
import org.spectralsieve.weighting.Figure;
import org.spectralsieve.weighting.Response;
import org.spectralsieve.weighting.SpectrumLookup;

/**
 * The weighted screen's bounds hold the exact figures: a weighted mean of T lies between the means of any
 * envelopes of T (arithmetic, no source needed), so for every curve the store's bound on a pass margin is
 * at least the exact margin on the figure's upper end U, and on a block margin at least the exact margin on
 * its lower end L. The exact figures come from the weighting package ({@code WeightedFigures},
 * {@code LuminousTransmittance}, checked there against ISO/CIE worked values). Random curves with a fixed
 * seed: samplings finer and coarser than the store's grid and off it, points below detection, readings
 * above T = 1 (noise) and at T = 0.
 */
class WeightedScreenTest {

    private static final List<Weighting> WEIGHTINGS = weightings();

    @Test
    void boundsOnWeightedFiguresHoldTheExactFigureOfEveryCurve() {
        // the bins' bounds: with the figure codes a block that cannot meet is bounded by 0 (a row that meets or
        // misses, not an unverified one: FigureCodesTest), so they are read alone here
        System.setProperty("sieve.store.figure-codes", "false");
        try {
            binsHoldTheExactFigureOfEveryCurve();
        } finally {
            System.clearProperty("sieve.store.figure-codes");
        }
    }

    private void binsHoldTheExactFigureOfEveryCurve() {
        Random random = new Random(20261204L);
        List<Curve> curves = new ArrayList<>();
        SpectralStore.Builder builder = SpectralStore.builder(SpectralStore.DEFAULT_GRID, 8);
        StoredMaterial material = new StoredMaterial(1, "illustrative sheet", "plastic sheet", MadeThicknesses.of(
                List.of(), Double.NaN, Double.NaN, List.of(2.0)));
        for (int i = 0; i < 300; i++) {
            Curve curve = randomCurve(random);
            curves.add(curve);
            builder.add(i + 1, material, 2.0, true, false, ConstantIndex.WHEN_UNRECORDED, curve);
        }
        WeightedScreen screen = builder.build().weightedScreen();
        int bounded = 0;
        int proven = 0;
        for (Weighting weighting : WEIGHTINGS) {
            double[] pass = screen.marginBounds(new WeightedClause(Direction.PASS, 1, ThresholdUnit.FRACTION, weighting,
                    "pass"), Optional.empty());
            double[] block = screen.marginBounds(new WeightedClause(Direction.BLOCK, 1e-6, ThresholdUnit.FRACTION,
                    weighting, "block"), Optional.empty());
            double[] passAtHalf = screen.marginBounds(new WeightedClause(Direction.PASS, 0.5, ThresholdUnit.FRACTION,
                    weighting, "pass half"), Optional.empty());
            for (int i = 0; i < curves.size(); i++) {
                Figure upper = weighting.figure(BoundedCurves.upperBounds(curves.get(i)));
                if (!upper.available()) {
                    assertThat(pass[i]).as(weighting + " curve " + i).isInfinite();
                    continue;
                }
                double u = upper.value().getAsDouble();
                double l = weighting.figure(BoundedCurves.lowerBounds(curves.get(i))).value().orElse(0);
                double floor = Curve.ABSORBANCE_FLOOR_T;
                assertThat(pass[i]).as(weighting + " curve " + i + " pass").isGreaterThanOrEqualTo(
                        Math.log10(Math.max(u, floor)));
                assertThat(block[i]).as(weighting + " curve " + i + " block").isGreaterThanOrEqualTo(
                        Math.log10(1e-6 / Math.max(l, Math.min(floor, 1e-6))));
                bounded += Double.isFinite(pass[i]) ? 1 : 0;
                proven += passAtHalf[i] < 0 ? 1 : 0;
                if (passAtHalf[i] < 0) {
                    assertThat(u).isLessThan(0.5);
                }
            }
        }
        // not vacuous: most figures are bounded, and many passes at 50 % are proven missed
        assertThat(bounded).isGreaterThan(WEIGHTINGS.size() * curves.size() / 2);
        assertThat(proven).isGreaterThan(WEIGHTINGS.size() * curves.size() / 10);
    }

    @Test
    void thinnedBoundsHoldTheExactFigureOfTheRescaledCurve() {
        // the exact rescaling is ThicknessRescaler (Fresnel surfaces and Beer–Lambert, checked against
        // REFERENCE §7 in its own tests); the bound is only arithmetic on it
        Random random = new Random(20261206L);
        List<Curve> curves = new ArrayList<>();
        List<RefractiveIndex> indices = List.of(new ConstantIndex(1.49), new ConstantIndex(1.585), new ConstantIndex(1.46));
        SpectralStore.Builder builder = SpectralStore.builder(SpectralStore.DEFAULT_GRID, 8);
        StoredMaterial material = new StoredMaterial(1, "illustrative sheet", "plastic sheet", MadeThicknesses.of(
                List.of(), Double.NaN, Double.NaN, List.of(4.0)));
        for (int i = 0; i < 150; i++) {
            Curve curve = randomCurve(random);
            curves.add(curve);
            builder.add(i + 1, material, 4.0, true, false, indices.get(i % 3), curve);
        }
        SpectralStore store = builder.build();
        int proven = 0;
        for (Weighting weighting : WEIGHTINGS) {
            for (double thinnest : new double[] {0.5, 1, 3}) {
                double[] pass = store.weightedScreen().marginBoundsThinned(store, new WeightedClause(Direction.PASS, 1,
                        ThresholdUnit.FRACTION, weighting, "pass"), Optional.empty(), thinnest);
                double[] passAtHalf = store.weightedScreen().marginBoundsThinned(store, new WeightedClause(Direction.PASS,
                        0.5, ThresholdUnit.FRACTION, weighting, "pass half"), Optional.empty(), thinnest);
                for (int i = 0; i < curves.size(); i++) {
                    Curve thinned = ThicknessRescaler.rescale(curves.get(i), 4.0, thinnest, indices.get(i % 3));
                    Figure upper = weighting.figure(BoundedCurves.upperBounds(thinned));
                    if (!upper.available()) {
                        continue;
                    }
                    double u = upper.value().getAsDouble();
                    assertThat(pass[i]).as(weighting + " curve " + i + " at " + thinnest + " mm")
                            .isGreaterThanOrEqualTo(Math.log10(Math.max(u, Curve.ABSORBANCE_FLOOR_T)));
                    if (passAtHalf[i] < 0) {
                        proven++;
                        assertThat(u).isLessThan(0.5);
                    }
                }
            }
        }
        assertThat(proven).as("not vacuous").isGreaterThan(WEIGHTINGS.size() * curves.size() / 10);
    }

    @Test
    void thickenedBlockBoundsHoldTheExactLowerFigureOfTheRescaledCurve() {
        // the exact rescaling is ThicknessRescaler (Fresnel surfaces and Beer–Lambert, checked against
        // REFERENCE §7 in its own tests; readings at the ceiling per SlabReading); the bound is arithmetic on it.
        // Random curves with zeros, points below detection and readings above 1, and clear curves at the
        // lossless ceiling, which turn into bounds beyond their far thickness (read as 0 by the lower end)
        Random random = new Random(20261207L);
        List<Curve> curves = new ArrayList<>();
        List<RefractiveIndex> indices = List.of(new ConstantIndex(1.49), new ConstantIndex(1.585), new ConstantIndex(1.46));
        SpectralStore.Builder builder = SpectralStore.builder(SpectralStore.DEFAULT_GRID, 8);
        StoredMaterial material = new StoredMaterial(1, "illustrative sheet", "plastic sheet", MadeThicknesses.of(
                List.of(), Double.NaN, Double.NaN, List.of(2.0)));
        for (int i = 0; i < 150; i++) {
            Curve curve = i % 5 == 4 ? clearCurve(random) : randomCurve(random);
            curves.add(curve);
            builder.add(i + 1, material, 2.0, true, false, indices.get(i % 3), curve);
        }
        SpectralStore store = builder.build();
        int proven = 0;
        int bounded = 0;
        for (Weighting weighting : WEIGHTINGS) {
            for (double thickest : new double[] {1, 2, 3, 5, 8, 12}) {
                double[] block = store.weightedScreen().marginBoundsThickened(store, new WeightedClause(Direction.BLOCK,
                        1e-6, ThresholdUnit.FRACTION, weighting, "block"), thickest);
                double[] blockAtTenth = store.weightedScreen().marginBoundsThickened(store, new WeightedClause(
                        Direction.BLOCK, 0.1, ThresholdUnit.FRACTION, weighting, "block tenth"), thickest);
                for (int i = 0; i < curves.size(); i++) {
                    Curve rescaled = ThicknessRescaler.rescale(curves.get(i), 2.0, thickest, indices.get(i % 3));
                    Figure upper = weighting.figure(BoundedCurves.upperBounds(rescaled));
                    if (!upper.available()) {
                        continue;
                    }
                    double l = weighting.figure(BoundedCurves.lowerBounds(rescaled)).value().orElse(0);
                    assertThat(block[i]).as(weighting + " curve " + i + " at " + thickest + " mm")
                            .isGreaterThanOrEqualTo(Math.log10(1e-6 / Math.max(l, Math.min(Curve.ABSORBANCE_FLOOR_T, 1e-6))));
                    bounded += Double.isFinite(block[i]) ? 1 : 0;
                    if (blockAtTenth[i] < 0) {
                        proven++;
                        assertThat(l).isGreaterThan(0.1);
                    }
                }
            }
        }
        assertThat(bounded).as("not vacuous").isGreaterThan(WEIGHTINGS.size() * curves.size() * 3);
        assertThat(proven).as("not vacuous").isGreaterThan(WEIGHTINGS.size() * curves.size() / 2);
    }

    @Test
    void layerBoundsHoldTheExactFigureOfTheStack() {
        // the exact stack is optics.LightPath (Smith, Modern Optical Engineering, eq. 10.5 for each air gap,
        // checked in its own tests); the bound is arithmetic on it. Candidates and layers are random curves
        // (zeros, points below detection, readings above 1), clear sheets at the ceiling, and curves sampled
        // coarser than a bin (no product bound for those)
        Random random = new Random(20261210L);
        List<Curve> curves = new ArrayList<>();
        List<RefractiveIndex> indices = List.of(new ConstantIndex(1.49), new ConstantIndex(1.585), new ConstantIndex(1.46));
        SpectralStore.Builder builder = SpectralStore.builder(SpectralStore.DEFAULT_GRID, 8);
        StoredMaterial material = new StoredMaterial(1, "illustrative sheet", "plastic sheet", MadeThicknesses.of(
                List.of(), Double.NaN, Double.NaN, List.of(2.0)));
        for (int i = 0; i < 120; i++) {
            Curve curve = i % 6 == 5 ? clearCurve(random) : i % 6 == 4 ? coarse(randomCurve(random)) : randomCurve(random);
            curves.add(curve);
            builder.add(i + 1, material, 2.0, i % 2 == 0, false, indices.get(i % 3), curve);
        }
        SpectralStore store = builder.build();
        int proven = 0;
        int bounded = 0;
        for (int l = 0; l < 6; l++) {
            Curve layerCurve = l % 3 == 2 ? clearCurve(random) : randomCurve(random);
            RefractiveIndex layerIndex = indices.get(l % 3);
            WeightedScreen.LayerBins bins = WeightedScreen.LayerBins.of(layerCurve, layerIndex);
            for (Weighting weighting : WEIGHTINGS) {
                WeightedScreen.Query pass = store.weightedScreen().query(store, new WeightedClause(Direction.PASS, 1,
                        ThresholdUnit.FRACTION, weighting, "pass"), bins);
                WeightedScreen.Query passAtHalf = store.weightedScreen().query(store, new WeightedClause(Direction.PASS,
                        0.5, ThresholdUnit.FRACTION, weighting, "pass half"), bins);
                for (int i = 0; i < curves.size(); i++) {
                    double bound = pass.behindLayer(i, 2.0);
                    Curve stack;
                    try {
                        stack = org.spectralsieve.optics.LightPath.of(
                                org.spectralsieve.optics.Layer.fixed(curves.get(i), indices.get(i % 3)),
                                org.spectralsieve.optics.Layer.fixed(layerCurve, layerIndex)).transmittance();
                    } catch (org.spectralsieve.spectrum.CurveException e) {
                        assertThat(bound).isInfinite(); // the ranges do not overlap: nothing to bound
                        continue;
                    }
                    Figure upper = weighting.figure(BoundedCurves.upperBounds(stack));
                    if (!upper.available()) {
                        continue;
                    }
                    double u = upper.value().getAsDouble();
                    assertThat(bound).as(weighting + " curve " + i + " behind layer " + l)
                            .isGreaterThanOrEqualTo(Math.log10(Math.max(u, Curve.ABSORBANCE_FLOOR_T)));
                    bounded += Double.isFinite(bound) ? 1 : 0;
                    if (passAtHalf.behindLayer(i, 2.0) < 0) {
                        proven++;
                        assertThat(u).isLessThan(0.5);
                    }
                }
            }
        }
        assertThat(bounded).as("not vacuous").isGreaterThan(WEIGHTINGS.size() * curves.size());
        assertThat(proven).as("not vacuous").isGreaterThan(WEIGHTINGS.size() * curves.size() / 2);
    }

    @Test
    void layerBlockBoundsHoldTheExactLowerFigureOfTheStack() {
        // a weighted block behind a fixed layer, the candidate as measured: the bound must stay at or above the
        // exact margin log10(threshold / L) of the lower end L of optics.LightPath's stack (Smith, Modern Optical
        // Engineering, eq. 10.5 for each air gap, checked in its own tests), for every weighting. Candidates and
        // layers are random curves (zeros, points below detection, edges), clear sheets at the ceiling (some
        // reading above 1), plain clear plates, and curves sampled coarser than a bin (no bound for those)
        Random random = new Random(20261214L);
        List<Curve> curves = new ArrayList<>();
        List<RefractiveIndex> indices = List.of(new ConstantIndex(1.49), new ConstantIndex(1.585), new ConstantIndex(1.46));
        SpectralStore.Builder builder = SpectralStore.builder(SpectralStore.DEFAULT_GRID, 8);
        StoredMaterial material = new StoredMaterial(1, "illustrative sheet", "plastic sheet", MadeThicknesses.of(
                List.of(), Double.NaN, Double.NaN, List.of(2.0)));
        for (int i = 0; i < 150; i++) {
            Curve curve = i % 6 == 5 ? clearCurve(random) : i % 6 == 4 ? coarse(randomCurve(random))
                    : i % 6 == 3 ? clearPlate(random) : i % 6 == 2 ? withGap(clearPlate(random), random) : randomCurve(random);
            curves.add(curve);
            builder.add(i + 1, material, 2.0, i % 2 == 0, false, indices.get(i % 3), curve);
        }
        SpectralStore store = builder.build();
        int proven = 0;
        int bounded = 0;
        int checked = 0;
        for (int l = 0; l < 8; l++) {
            Curve layerCurve = l % 4 == 3 ? clearCurve(random) : l % 4 == 2 ? clearPlate(random)
                    : l % 4 == 1 ? withGap(clearPlate(random), random) : randomCurve(random);
            RefractiveIndex layerIndex = indices.get(l % 3);
            WeightedScreen.LayerBins bins = WeightedScreen.LayerBins.of(layerCurve, layerIndex);
            double[] thresholds = {1e-4, 0.01, 0.3};
            WeightedScreen.Query[][] blocks = new WeightedScreen.Query[WEIGHTINGS.size()][thresholds.length];
            for (int w = 0; w < WEIGHTINGS.size(); w++) {
                for (int t = 0; t < thresholds.length; t++) {
                    blocks[w][t] = store.weightedScreen().query(store, new WeightedClause(Direction.BLOCK,
                            thresholds[t], ThresholdUnit.FRACTION, WEIGHTINGS.get(w), "block"), bins);
                }
            }
            for (int i = 0; i < curves.size(); i++) {
                Curve stack;
                try {
                    stack = org.spectralsieve.optics.LightPath.of(
                            org.spectralsieve.optics.Layer.fixed(curves.get(i), indices.get(i % 3)),
                            org.spectralsieve.optics.Layer.fixed(layerCurve, layerIndex)).transmittance();
                } catch (org.spectralsieve.spectrum.CurveException e) {
                    stack = null; // the ranges do not overlap: nothing to bound
                }
                for (int w = 0; w < WEIGHTINGS.size(); w++) {
                    Weighting weighting = WEIGHTINGS.get(w);
                    Figure lower = stack == null ? null : weighting.figure(BoundedCurves.lowerBounds(stack));
                    for (int t = 0; t < thresholds.length; t++) {
                        double threshold = thresholds[t];
                        double bound = blocks[w][t].behindLayer(i, 2.0);
                        if (stack == null) {
                            assertThat(bound).isInfinite();
                            continue;
                        }
                        if (!lower.available()) {
                            assertThat(bound).as("an unavailable figure is unverified, never a miss").isNotNegative();
                            continue;
                        }
                        double exactMargin = Math.log10(threshold
                                / Math.max(lower.value().getAsDouble(), Math.min(Curve.ABSORBANCE_FLOOR_T, threshold)));
                        checked++;
                        assertThat(bound).as(weighting + " at " + threshold + ", curve " + i + " behind layer " + l)
                                .isGreaterThanOrEqualTo(exactMargin - 1e-12);
                        bounded += Double.isFinite(bound) ? 1 : 0;
                        proven += bound < 0 ? 1 : 0;
                    }
                }
            }
        }
        assertThat(checked).as("not vacuous").isGreaterThan(WEIGHTINGS.size() * curves.size() * 8);
        assertThat(bounded).as("not vacuous").isGreaterThan(checked / 3);
        assertThat(proven).as("not vacuous").isGreaterThan(checked / 10);
        // off (the rule before): no block behind a layer is bounded
        WeightedScreen.Query off = store.weightedScreen().query(store, new WeightedClause(Direction.BLOCK, 1e-4,
                ThresholdUnit.FRACTION, WEIGHTINGS.get(0), "block"), WeightedScreen.LayerBins.of(clearPlate(random),
                indices.get(0))).blockBehindLayer(false);
        for (int i = 0; i < curves.size(); i++) {
            assertThat(off.behindLayer(i, 2.0)).isInfinite();
        }
    }

    /**
     * The curve with a stretch of 40–200 points below detection at a high limit (a saturated detector, a gap in the
     * data): the lower end L reads them at 0, though their stored T is large, so a bound that took them at T fails.
     */
    private static Curve withGap(Curve curve, Random random) {
        int n = curve.size();
        double[] t = curve.transmittances();
        boolean[] below = new boolean[n];
        double[] limits = new double[n];
        int from = n / 4 + random.nextInt(n / 3);
        int to = Math.min(n - 1, from + 40 + random.nextInt(160));
        for (int i = from; i <= to; i++) {
            below[i] = true;
            limits[i] = 0.5;
            t[i] = Math.min(t[i], 0.45);
        }
        return Curve.of(curve.wavelengthsNm(), t, below, limits);
    }

    /** A clear plate below the ceiling, every 1 nm over 200–900 nm (as a window glass is measured). */
    private static Curve clearPlate(Random random) {
        int n = 701;
        double[] nm = new double[n];
        double[] t = new double[n];
        double edge = 290 + 40 * random.nextDouble();
        for (int i = 0; i < n; i++) {
            nm[i] = 200 + i;
            t[i] = 0.9 / (1 + Math.exp(-(nm[i] - edge) / 6)) * (1 - 0.02 * random.nextDouble());
        }
        return Curve.of(nm, t, 0);
    }

    /** Points of the curve kept 15 nm or more apart: coarser than a bin. */
    private static Curve coarse(Curve curve) {
        int n = 0;
        List<Integer> kept = new ArrayList<>();
        double last = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < curve.size(); i++) {
            if (curve.wavelengthNm(i) - last >= 15 || i == curve.size() - 1) {
                kept.add(i);
                last = curve.wavelengthNm(i);
            }
        }
        n = kept.size();
        double[] nm = new double[n];
        double[] t = new double[n];
        boolean[] below = new boolean[n];
        double[] limits = new double[n];
        for (int k = 0; k < n; k++) {
            int i = kept.get(k);
            nm[k] = curve.wavelengthNm(i);
            t[k] = curve.transmittance(i);
            below[k] = curve.belowDetection(i);
            limits[k] = curve.detectionLimit(i);
        }
        return Curve.of(nm, t, below, limits);
    }

    @Test
    void thickenedBoundsSayNothingOfPartsThatAreNeverRescaled() {
        // films, coated parts and diffuse samples are judged only as measured (docs/geometry-and-edges.md)
        SpectralStore.Builder builder = SpectralStore.builder(SpectralStore.DEFAULT_GRID, 2);
        StoredMaterial material = new StoredMaterial(1, "illustrative film", "film", MadeThicknesses.of(
                List.of(), Double.NaN, Double.NaN, List.of(0.1)));
        Curve clear = clearCurve(new Random(3));
        builder.add(1, material, 0.1, false, false, ConstantIndex.WHEN_UNRECORDED, clear);
        builder.add(2, material, 0.1, false, true, ConstantIndex.WHEN_UNRECORDED, clear);
        SpectralStore store = builder.build();
        double[] block = store.weightedScreen().marginBoundsThickened(store, new WeightedClause(Direction.BLOCK, 0.01,
                ThresholdUnit.FRACTION, Weighting.luminous(), "luminous under 1%"), 0.3);
        assertThat(block).containsOnly(Double.POSITIVE_INFINITY);
    }

    @Test
    void everyReadingTheDataCannotResolveStaysAValueUpToTheLeastFarFactor() {
        // SlabReading's rule (docs/rescaling-model.md) on readings from just under the ceiling to 1.2 (noise)
        Random random = new Random(20261208L);
        for (int i = 0; i < 20_000; i++) {
            double rMax = 0.02 + 0.1 * random.nextDouble();
            double r = rMax * random.nextDouble();
            double ceiling = (1 - r) / (1 + r) - org.spectralsieve.optics.SlabReading.READING_UNCERTAINTY;
            double t = ceiling + (1.2 - ceiling) * random.nextDouble();
            var reading = org.spectralsieve.optics.SlabReading.of(t, r);
            assertThat(reading.farFactor()).as("t " + t + " r " + r).isGreaterThanOrEqualTo(SurfaceBounds.leastFarFactor(rMax));
        }
        assertThat(SurfaceBounds.leastFarFactor(0.04)).as("about four times the thickness (SlabReading's note)")
                .isBetween(3.0, 6.0);
    }

    /** A clear sheet: readings at and around the lossless ceiling of n ≈ 1.5 (0.92), some above 1. */
    private static Curve clearCurve(Random random) {
        int n = 601;
        double[] nm = new double[n];
        double[] t = new double[n];
        for (int i = 0; i < n; i++) {
            nm[i] = 200 + i;
            t[i] = 0.9 + 0.12 * random.nextDouble();
        }
        return Curve.of(nm, t, 0);
    }

    @Test
    void codesRoundTowardsTheSafeSide() {
        for (double t : new double[] {1.2, 1.0, 0.85, 0.5, 0.01, 1e-4, 1e-5}) {
            assertThat(BinCodes.transmittanceOf(BinCodes.codeAtMost(t))).isGreaterThanOrEqualTo(t);
            assertThat(BinCodes.transmittanceOf(BinCodes.codeAtLeast(t))).isLessThanOrEqualTo(t);
        }
        assertThat(BinCodes.codeAtMost(2.0)).as("above the code's range: no bound").isZero();
        assertThat(BinCodes.codeAtLeast(0)).as("T may be 0").isZero();
    }

    @Test
    void curvesAddedOnTheGridAreNotScreened() {
        SpectralStore.Builder builder = SpectralStore.builder(SpectralStore.DEFAULT_GRID, 1);
        short[] codes = new short[SpectralStore.DEFAULT_GRID.size()];
        StoredMaterial material = new StoredMaterial(1, "illustrative sheet", "plastic sheet", MadeThicknesses.of(
                List.of(), Double.NaN, Double.NaN, List.of(2.0)));
        java.util.Arrays.fill(codes, OdCode.encode(0.01, false));
        builder.addEncoded(1, material, 2.0, true, false, ConstantIndex.WHEN_UNRECORDED, codes);
        double[] bounds = builder.build().weightedScreen().marginBounds(new WeightedClause(Direction.PASS, 0.9,
                ThresholdUnit.FRACTION, Weighting.luminous(), "luminous over 90%"), Optional.empty());
        assertThat(bounds[0]).isInfinite();
    }

    private static List<Weighting> weightings() {
        SpectrumLookup lookup = SpectrumLookup.builtIn();
        List<Weighting> out = new ArrayList<>();
        out.add(Weighting.luminous());
        out.add(Weighting.erythemal(lookup));
        out.add(Weighting.uvHazard(lookup));
        for (Emitter emitter : EmitterCatalogue.all()) {
            out.add(Weighting.of(emitter, Optional.empty()));
            out.add(Weighting.of(emitter, Optional.of(Response.blueLight())));
        }
        return out;
    }

    /** A long-pass edge with ripple, sampled on a random step from a random start; some points bounded. */
    private static Curve randomCurve(Random random) {
        double step = new double[] {0.37, 0.5, 1, 2, 5}[random.nextInt(5)];
        double start = 190 + random.nextInt(80) + (random.nextBoolean() ? 0.25 : 0);
        double end = 700 + random.nextInt(400);
        int n = (int) ((end - start) / step) + 1;
        double edge = 250 + 300 * random.nextDouble();
        double width = 2 + 30 * random.nextDouble();
        double top = 0.3 + 0.75 * random.nextDouble();
        double limit = random.nextBoolean() ? 1e-4 : 0;
        return RandomEdgeCurves.edge(random, start, step, n, edge, width, top, limit, Double.POSITIVE_INFINITY, 200);
    }
}
