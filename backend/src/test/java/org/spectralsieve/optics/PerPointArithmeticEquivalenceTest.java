package org.spectralsieve.optics;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;
import java.util.Random;
import java.util.function.Supplier;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.PerPointArithmetic;
import org.spectralsieve.spectrum.PointReadings;

/**
 * The lean per-point arithmetic ({@link PerPointArithmetic}, the default) gives the numbers of the earlier
 * arithmetic, kept as the reference, bit for bit ({@code Curve.equals} and {@code ==} on the raw bits of every
 * double): a curve resampled by one walk against a binary search per wavelength; a stack combined in plain
 * numbers ({@link StackArithmetic}) against the element records ({@link LightPath#combineByElements}); a
 * rescaled point with its slab formula reused across thicknesses against {@link SlabReading#transmittance}.
 * Random cases from fixed seeds (jqwik is not available offline): uneven grids, dark points, tiny readings,
 * clear readings at and above the lossless ceiling, uniform and varying detection limits, uncertainties,
 * constant and dispersive indices. The reference is the code kept, so no value here is from memory; the
 * physics is checked against handbook values in {@link LightPathTest}, {@link SlabTest} and
 * {@link ThicknessRescalerTest}.
 */
class PerPointArithmeticEquivalenceTest {

    @AfterEach
    void backToTheDefault() {
        PerPointArithmetic.useEarlier(false);
    }

    @Test
    void resamplingByOneWalkGivesTheNumbersOfABinarySearchPerWavelength() {
        Random random = new Random(20261205L);
        int interpolated = 0;
        for (int trial = 0; trial < 400; trial++) {
            Curve curve = withUncertainty(random, ThicknessSweepTest.randomCurve(random, 250 + 50 * random.nextDouble()));
            double[] at = readingWavelengths(random, curve);
            Curve earlier = both(() -> curve.resampleAt(at), true);
            Curve lean = both(() -> curve.resampleAt(at), false);
            assertThat(lean).as("trial %d", trial).isEqualTo(earlier);
            for (double nm : at) {
                interpolated += java.util.Arrays.binarySearch(curve.wavelengthsNm(), nm) < 0 ? 1 : 0;
            }
        }
        // not vacuous: most wavelengths fall between stored points
        assertThat(interpolated).isGreaterThan(5_000);
    }

    @Test
    void aStackInPlainNumbersGivesTheNumbersOfTheElementRecords() {
        Random random = new Random(20261206L);
        for (int trial = 0; trial < 600; trial++) {
            Stack stack = randomStack(random);
            Curve expected = LightPath.combineByElements(stack.nm.clone(), stack.onGrid, stack.reflectances,
                    new OpticalElement[stack.onGrid.length][][]);
            Curve lean = StackArithmetic.combine(stack.nm.clone(), stack.onGrid, stack.reflectances, stack.known);
            assertThat(lean).as("trial %d", trial).isNotNull().isEqualTo(expected);
            assertThat(LightPath.combine(stack.nm.clone(), stack.onGrid, stack.reflectances, stack.known))
                    .as("trial %d through LightPath", trial).isEqualTo(expected);
        }
    }

    @Test
    void aStackBehindFixedPartsGivesTheNumbersOfTheStraightforwardRoute() {
        Random random = new Random(20261207L);
        for (int trial = 0; trial < 150; trial++) {
            Curve front = ThicknessSweepTest.randomCurve(random, 300 + 20 * random.nextDouble());
            Curve layer = ThicknessSweepTest.randomCurve(random, 280 + 40 * random.nextDouble());
            RefractiveIndex frontIndex = ThicknessSweepTest.randomIndex(random);
            RefractiveIndex layerIndex = ThicknessSweepTest.randomIndex(random);
            Supplier<Curve> route = () -> {
                try {
                    return LightPath.of(Layer.fixed(front, frontIndex), Layer.fixed(layer, layerIndex)).transmittance();
                } catch (org.spectralsieve.spectrum.CurveException e) {
                    return null; // ranges that do not overlap: refused both ways
                }
            };
            assertThat(both(route, false)).as("trial %d", trial).isEqualTo(both(route, true));
            double d0 = 0.5 + 5 * random.nextDouble();
            for (double d : ThicknessSweepTest.thicknesses(random, d0)) {
                Supplier<Curve> swept = () -> {
                    try {
                        return new ThicknessSweep(front, d0, frontIndex, List.of(Layer.fixed(layer, layerIndex)), true)
                                .path(d);
                    } catch (org.spectralsieve.spectrum.CurveException e) {
                        return null;
                    }
                };
                assertThat(both(swept, false)).as("trial %d at %s mm", trial, d).isEqualTo(both(swept, true));
            }
        }
    }

    @Test
    void stackedPointsFormedWhenReadAreThePointsOfTheBuiltStack() {
        Random random = new Random(20261209L);
        int formed = 0;
        for (int trial = 0; trial < 200; trial++) {
            Curve layer = ThicknessSweepTest.randomCurve(random, 280 + 40 * random.nextDouble());
            RefractiveIndex layerIndex = ThicknessSweepTest.randomIndex(random);
            FixedParts parts = FixedParts.of(layer, layerIndex);
            Curve first = ThicknessSweepTest.randomCurve(random, 300 + 20 * random.nextDouble());
            for (int front = 0; front < 3; front++) {
                // the same grid with other readings: the first is built (and its grid remembered), the others formed
                Curve curve = front == 0 ? first : sameGrid(random, first);
                Layer part = Layer.fixed(curve, ThicknessSweepTest.randomIndex(random));
                Curve expected;
                try {
                    expected = LightPath.of(part, Layer.fixed(layer, layerIndex)).transmittance();
                    parts.behind(part);
                } catch (org.spectralsieve.spectrum.CurveException e) {
                    break; // ranges that do not overlap: nothing to form
                }
                PointReadings points = parts.pointsBehind(part);
                if (front == 0 && points == null) {
                    continue;
                }
                assertThat(points).as("trial %d, front %d", trial, front).isNotNull();
                assertThat(points.size()).isEqualTo(expected.size());
                for (int read = 0; read < 2 * expected.size(); read++) {
                    int i = random.nextInt(expected.size());
                    assertThat(points.wavelengthNm(i)).isEqualTo(expected.wavelengthNm(i));
                    assertSame(points.transmittance(i), expected.transmittance(i), trial, front, i);
                    assertThat(points.belowDetection(i)).isEqualTo(expected.belowDetection(i));
                    assertSame(points.detectionLimit(i), expected.detectionLimit(i), trial, front, i);
                    formed++;
                }
            }
        }
        assertThat(formed).isGreaterThan(5_000);
    }

    /** Another curve on {@code like}'s wavelengths: its own readings and flags. */
    private static Curve sameGrid(Random random, Curve like) {
        Curve other = ThicknessSweepTest.randomCurve(random, 300);
        double[] t = new double[like.size()];
        boolean[] below = new boolean[like.size()];
        double[] limits = new double[like.size()];
        for (int i = 0; i < t.length; i++) {
            int k = random.nextInt(other.size());
            t[i] = other.transmittance(k);
            below[i] = other.belowDetection(k);
            limits[i] = other.detectionLimit(k);
        }
        return Curve.of(like.wavelengthsNm(), t, below, limits);
    }

    @Test
    void rescaledPointsWithTheSlabFormulaReusedGiveTheEarlierNumbers() {
        Random random = new Random(20261208L);
        int clear = 0;
        for (int trial = 0; trial < 300; trial++) {
            Curve measured = ThicknessSweepTest.randomCurve(random, 300 + 200 * random.nextDouble());
            RefractiveIndex index = ThicknessSweepTest.randomIndex(random);
            double d0 = 0.2 + 8 * random.nextDouble();
            // one sweep per way, read at many thicknesses in turn, so the lean one reuses what it kept
            ThicknessSweep earlier = both(() -> new ThicknessSweep(measured, d0, index, List.of(), true), true);
            ThicknessSweep lean = new ThicknessSweep(measured, d0, index, List.of(), true);
            for (int step = 0; step < 12; step++) {
                double d = step % 4 == 3 ? d0 : 0.1 + 12 * random.nextDouble();
                PointReadings expected = both(() -> earlier.rescaledPoints(d), true);
                PointReadings points = lean.rescaledPoints(d);
                for (int read = 0; read < measured.size(); read++) {
                    int i = random.nextInt(measured.size());
                    assertSame(points.transmittance(i), expected.transmittance(i), trial, d, i);
                    assertThat(points.belowDetection(i)).isEqualTo(expected.belowDetection(i));
                    if (random.nextBoolean()) {
                        assertSame(points.detectionLimit(i), expected.detectionLimit(i), trial, d, i);
                    }
                    clear += lean.reading(i).internal() == 1 ? 1 : 0;
                }
            }
        }
        // not vacuous: clear readings (K0 = 1, the slab formula reused) are read
        assertThat(clear).isGreaterThan(10_000);
    }

    @Test
    void theComparisonSeesAReflectanceMovedByOnePartInAMillion() {
        // the same stacks with one part's reflectance at one point moved by 1e-6 (relative): the equality above must fail
        Random random = new Random(20261206L);
        int differ = 0;
        for (int trial = 0; trial < 100; trial++) {
            Stack stack = randomStack(random);
            Curve expected = LightPath.combineByElements(stack.nm.clone(), stack.onGrid, stack.reflectances,
                    new OpticalElement[stack.onGrid.length][][]);
            double[][] moved = new double[stack.reflectances.length][];
            for (int j = 0; j < moved.length; j++) {
                moved[j] = stack.reflectances[j].clone();
            }
            int point = random.nextInt(stack.nm.length);
            moved[0][point] *= 1 + 1e-6;
            Curve lean = StackArithmetic.combine(stack.nm.clone(), stack.onGrid, moved,
                    new OpticalElement[stack.onGrid.length][][]);
            differ += expected.equals(lean) ? 0 : 1;
        }
        // a dark point passes nothing either way, so not every move shows; most do
        assertThat(differ).isGreaterThan(50);
    }

    private record Stack(double[] nm, Curve[] onGrid, double[][] reflectances, OpticalElement[][][] known) {
    }

    /** One to three parts on uneven shared points; constant reflectances in half (the element formed once reused). */
    private static Stack randomStack(Random random) {
        int parts = 1 + random.nextInt(3);
        int n = 2 + random.nextInt(80);
        double[] nm = new double[n];
        for (int i = 0; i < n; i++) {
            nm[i] = 250 + 3 * i + random.nextDouble();
        }
        Curve[] onGrid = new Curve[parts];
        double[][] reflectances = new double[parts][n];
        OpticalElement[][][] known = new OpticalElement[parts][][];
        for (int j = 0; j < parts; j++) {
            onGrid[j] = withUncertainty(random, randomCurve(random, nm));
            boolean constant = random.nextBoolean();
            double r = 0.02 + 0.1 * random.nextDouble();
            for (int i = 0; i < n; i++) {
                reflectances[j][i] = constant ? r : 0.02 + 0.1 * random.nextDouble();
            }
            if (j > 0 && random.nextBoolean()) {
                known[j] = LightPath.elements(onGrid[j], reflectances[j]);
            }
        }
        return new Stack(nm, onGrid, reflectances, known);
    }

    /** T dark, tiny, resolved, at and above the lossless ceiling; limits uniform or varying. */
    private static Curve randomCurve(Random random, double[] nm) {
        double[] t = new double[nm.length];
        boolean[] below = new boolean[nm.length];
        double[] limits = new double[nm.length];
        boolean uniform = random.nextBoolean();
        double limit = random.nextBoolean() ? 0 : Math.pow(10, -1 - 4 * random.nextDouble());
        for (int i = 0; i < nm.length; i++) {
            t[i] = switch (random.nextInt(7)) {
                case 0 -> 0;
                case 1 -> 1e-6 * random.nextDouble();
                case 2 -> 0.9 + 0.12 * random.nextDouble();
                case 3 -> 1 - 2 * 0.04 / 1.04 * random.nextDouble(); // around the lossless ceiling of R = 0.04
                default -> random.nextDouble() * 0.95;
            };
            limits[i] = uniform ? limit : Math.pow(10, -1 - 4 * random.nextDouble());
            below[i] = t[i] <= limits[i];
        }
        return Curve.of(nm, t, below, limits);
    }

    private static Curve withUncertainty(Random random, Curve curve) {
        if (random.nextBoolean()) {
            return curve;
        }
        double[] sigma = new double[curve.size()];
        for (int i = 0; i < sigma.length; i++) {
            sigma[i] = random.nextInt(8) == 0 ? Double.NaN : 0.05 * random.nextDouble();
        }
        return curve.withAbsorbanceUncertainty(sigma);
    }

    /** Increasing wavelengths inside the curve's range: its ends, some stored points, many between. */
    private static double[] readingWavelengths(Random random, Curve curve) {
        double lo = curve.minWavelengthNm();
        double hi = curve.maxWavelengthNm();
        java.util.TreeSet<Double> at = new java.util.TreeSet<>(List.of(lo, hi));
        for (int i = 0; i < curve.size(); i++) {
            if (random.nextInt(3) == 0) {
                at.add(curve.wavelengthNm(i));
            }
        }
        int between = 2 + random.nextInt(120);
        for (int k = 0; k < between; k++) {
            at.add(lo + (hi - lo) * random.nextDouble());
        }
        return at.stream().mapToDouble(Double::doubleValue).toArray();
    }

    private static void assertSame(double actual, double expected, int trial, double d, int i) {
        assertThat(Double.doubleToRawLongBits(actual)).as("trial %d at %s mm, point %d", trial, d, i)
                .isEqualTo(Double.doubleToRawLongBits(expected));
    }

    private static <T> T both(Supplier<T> work, boolean earlier) {
        PerPointArithmetic.useEarlier(earlier);
        try {
            return work.get();
        } finally {
            PerPointArithmetic.useEarlier(false);
        }
    }
}
