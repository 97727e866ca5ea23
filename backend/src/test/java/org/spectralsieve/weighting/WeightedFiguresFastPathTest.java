package org.spectralsieve.weighting;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Random;
import org.jooq.DSLContext;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.MigratedDatabase;
import org.spectralsieve.seed.DemoLibraryLoader;
import org.spectralsieve.spectrum.Curve;
import org.springframework.core.io.DefaultResourceLoader;

/**
 * The weighted figures read along cached integration points ({@link IntegrationNodes}, {@link SortedReading})
 * equal the figures computed as before, point by point with a binary search each
 * ({@link WeightedFigures#effectiveTransmittanceByLookup}, {@link LuminousTransmittance#ofByLookup}) on the
 * curve with its below-detection points raised or zeroed ({@link BoundedCurves}): the same value to the last
 * bit, the same bound, note and share left out. On every curve of the demo library and on random curves
 * (seeded, so a failure repeats) with random grids, gaps in coverage and points below detection, for every
 * emitter of the catalogue under every response.
 */
class WeightedFiguresFastPathTest {

    private static List<Curve> demoCurves;

    @BeforeAll
    static void loadDemoLibrary() {
        DSLContext db = MigratedDatabase.freshH2();
        JooqLibraryRepository library = new JooqLibraryRepository(db);
        new DemoLibraryLoader(library, db, new DefaultResourceLoader(), "classpath:seed-materials/").load();
        Map<Long, Curve> curves = library.findAllCurves();
        demoCurves = new ArrayList<>(curves.values());
    }

    @Test
    void effectiveTransmittanceOnDemoCurvesEqualsThePointByPointFigureAtBothEnds() {
        assertThat(demoCurves).hasSizeGreaterThan(50);
        int bounded = 0;
        for (Curve curve : demoCurves) {
            bounded += anyBelowDetection(curve) ? 1 : 0;
            assertSameFiguresEverywhere(curve);
        }
        // not vacuous: the demo library has curves whose floor is reached, where the two ends differ
        assertThat(bounded).isGreaterThan(5);
    }

    @Test
    void effectiveTransmittanceOnRandomCurvesEqualsThePointByPointFigureAtBothEnds() {
        Random random = new Random(20261204L);
        for (int trial = 0; trial < 300; trial++) {
            assertSameFiguresEverywhere(randomCurve(random));
        }
    }

    @Test
    void aCurveThatIsOneHalfEverywherePassesHalfOfAnyEmittersLight() {
        // a weighted mean of a constant is that constant (the definition of a normalised weighted mean)
        double[] nm = {150, 400, 700, 1100};
        Curve half = Curve.of(nm, new double[] {0.5, 0.5, 0.5, 0.5}, 0.001);
        for (Emitter emitter : EmitterCatalogue.all()) {
            Figure figure = WeightedFigures.effectiveTransmittance(half, emitter, Response.flat(), BelowDetectionAs.LIMIT);
            if (figure.available()) {
                assertThat(figure.value().getAsDouble()).as(emitter.name()).isCloseTo(0.5, org.assertj.core.data.Offset.offset(1e-12));
            }
        }
    }

    private static void assertSameFiguresEverywhere(Curve curve) {
        Curve upper = BoundedCurves.upperBounds(curve);
        Curve lower = BoundedCurves.lowerBounds(curve);
        for (Emitter emitter : EmitterCatalogue.all()) {
            for (Response response : responses()) {
                assertSame(WeightedFigures.effectiveTransmittance(curve, emitter, response, BelowDetectionAs.STORED),
                        WeightedFigures.effectiveTransmittanceByLookup(curve, emitter, response), curve, emitter, response);
                assertSame(WeightedFigures.effectiveTransmittance(curve, emitter, response, BelowDetectionAs.LIMIT),
                        WeightedFigures.effectiveTransmittanceByLookup(upper, emitter, response), curve, emitter, response);
                assertSame(WeightedFigures.effectiveTransmittance(curve, emitter, response, BelowDetectionAs.ZERO),
                        WeightedFigures.effectiveTransmittanceByLookup(lower, emitter, response), curve, emitter, response);
            }
        }
        assertThat(LuminousTransmittance.of(curve, BelowDetectionAs.STORED)).isEqualTo(LuminousTransmittance.ofByLookup(curve));
        assertThat(LuminousTransmittance.of(curve, BelowDetectionAs.LIMIT)).isEqualTo(LuminousTransmittance.ofByLookup(upper));
        assertThat(LuminousTransmittance.of(curve, BelowDetectionAs.ZERO)).isEqualTo(LuminousTransmittance.ofByLookup(lower));
    }

    private static void assertSame(Figure fast, Figure reference, Curve curve, Emitter emitter, Response response) {
        // Figure is a record of value, bound, note and share: equal means equal to the last bit
        assertThat(fast).as(curve + " " + emitter.name() + " × " + response.name()).isEqualTo(reference);
    }

    private static List<Response> responses() {
        List<Response> all = new ArrayList<>(Response.catalogue());
        all.add(Response.flat());
        all.add(Response.flat(300, 420));
        // an imported-style table that merely ends: the share beyond it is estimated, not dropped
        all.add(Response.tabulated("test-initiator", "illustrative", new double[] {340, 380, 420}, new double[] {0.2, 1, 0.1}));
        return all;
    }

    /**
     * A curve on a random grid (0.5-5 nm steps, sometimes uneven) over a random part of 180-1100 nm, with
     * absorption edges, plateaus, exact zeros and points at or below a random detection limit.
     */
    private static Curve randomCurve(Random random) {
        double start = 180 + random.nextDouble() * 300;
        double end = Math.min(1100, start + 40 + random.nextDouble() * 800);
        List<Double> points = new ArrayList<>();
        for (double x = start; x < end; x += 0.5 + random.nextDouble() * (random.nextBoolean() ? 1 : 4.5)) {
            points.add(random.nextInt(4) == 0 ? Math.rint(x) : x);
        }
        points.add(end);
        double[] nm = points.stream().mapToDouble(Double::doubleValue).distinct().sorted().toArray();
        double limit = random.nextBoolean() ? 0 : Math.pow(10, -1 - 4 * random.nextDouble());
        double edge = start + random.nextDouble() * (end - start);
        double width = 2 + random.nextDouble() * 40;
        double top = 0.3 + random.nextDouble() * 0.65;
        double[] t = new double[nm.length];
        boolean[] below = new boolean[nm.length];
        double[] limits = new double[nm.length];
        for (int i = 0; i < nm.length; i++) {
            double v = top / (1 + Math.exp(-(nm[i] - edge) / width));
            v = random.nextInt(30) == 0 ? 0 : Math.min(Curve.MAX_TRANSMITTANCE, v * (1 + 0.02 * random.nextGaussian()));
            t[i] = Math.max(0, v);
            limits[i] = limit;
            below[i] = t[i] <= limit || random.nextInt(40) == 0;
        }
        return Curve.of(nm, t, below, limits);
    }

    private static boolean anyBelowDetection(Curve curve) {
        for (int i = 0; i < curve.size(); i++) {
            if (curve.belowDetection(i)) {
                return true;
            }
        }
        return false;
    }
}
