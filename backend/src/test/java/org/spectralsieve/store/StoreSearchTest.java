package org.spectralsieve.store;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.optics.Fresnel;
import org.spectralsieve.optics.SlabReading;
import org.spectralsieve.optics.Slab;
import org.spectralsieve.requirement.Aggregate;
import org.spectralsieve.requirement.Band;
import org.spectralsieve.requirement.Candidate;
import org.spectralsieve.requirement.SampleEvaluation;
import org.spectralsieve.requirement.SampleEvaluator;
import org.spectralsieve.requirement.Clause;
import org.spectralsieve.requirement.CutoffClause;
import org.spectralsieve.requirement.Direction;
import org.spectralsieve.requirement.MadeThicknesses;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.ThicknessSpec;
import org.spectralsieve.requirement.ThresholdUnit;
import org.spectralsieve.requirement.TransmittanceClause;
import org.spectralsieve.requirement.Verdict;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.WavelengthGrid;

class StoreSearchTest {

    private static final WavelengthGrid GRID = SpectralStore.DEFAULT_GRID;

    @Test
    void boundedSearchReturnsExactlyWhatEvaluatingEveryCurveReturns() {
        SpectralStore store = randomStore(3000, 700, 42);
        List<Requirement> requirements = List.of(
                requirement(ThicknessSpec.AS_MEASURED, pass(0.8, 365), block(0.01, 405), passBand(0.7, 380, 400)),
                requirement(ThicknessSpec.at(3), pass(0.8, 365), block(0.01, 405)),
                requirement(ThicknessSpec.range(1, 6), pass(0.8, 365), block(0.01, 405), passBand(0.7, 380, 400)),
                requirement(ThicknessSpec.range(0.5, 12), block(0.001, 250, 320), pass(0.85, 450)),
                requirement(ThicknessSpec.range(1, 6), mean(Direction.PASS, 0.85, 360, 370), block(0.001, 300)),
                requirement(ThicknessSpec.AS_MEASURED, new CutoffClause(0.5, new Band(380, 395), "cutoff")),
                requirement(ThicknessSpec.range(1, 10), new CutoffClause(0.1, new Band(300, 330), "cutoff 10%")));
        for (Requirement r : requirements) {
            StoreResult bounded = StoreSearch.search(store, r, 20);
            StoreResult exhaustive = StoreSearch.searchExhaustively(store, r, 20);

            assertThat(bounded.hits()).as(r.text()).usingRecursiveFieldByFieldElementComparator()
                    .containsExactlyElementsOf(exhaustive.hits());
            assertThat(bounded.evaluatedSamples()).isEqualTo(store.size());
            assertThat(bounded.refinedSamples()).isLessThanOrEqualTo(exhaustive.refinedSamples());
        }
    }

    @Test
    void pointClauseMarginIsTheRatioToTheThresholdInDecades() {
        // T(365) = 0.9 against "over 80 %": margin log10(0.9 / 0.8) = 0.05115 decades (definition of the margin)
        SpectralStore store = storeOf(flat(0.9), 2.0);
        StoreHit hit = StoreSearch.search(store, requirement(ThicknessSpec.AS_MEASURED, pass(0.8, 365)), 5).hits().get(0);

        assertThat(hit.verdict()).isEqualTo(Verdict.MEETS);
        assertThat(hit.worstMarginDecades()).isCloseTo(Math.log10(0.9 / 0.8), within(2e-4));
    }

    @Test
    void readingAtTheDetectionFloorCannotProveABlockBelowIt() {
        // T stored as "< 0.1 %": proves under 1 %, cannot prove under 0.01 % (REFERENCE §11, detection limit)
        Curve floor = Curve.of(GRID.points(), constant(0.001), 0.001);
        SpectralStore store = storeOf(floor, 2.0);

        assertThat(StoreSearch.search(store, requirement(ThicknessSpec.AS_MEASURED, block(0.01, 405)), 1).hits().get(0)
                .verdict()).isEqualTo(Verdict.MEETS);
        assertThat(StoreSearch.search(store, requirement(ThicknessSpec.AS_MEASURED, block(0.0001, 405)), 1).hits().get(0)
                .verdict()).isEqualTo(Verdict.UNVERIFIED);
        assertThat(StoreSearch.search(store, requirement(ThicknessSpec.AS_MEASURED, pass(0.0005, 405)), 1).hits().get(0)
                .verdict()).isEqualTo(Verdict.UNVERIFIED);
    }

    @Test
    void bandOutsideTheMeasuredRangeIsUnverified() {
        double[] nm = {250, 600, 1100};
        Curve curve = Curve.of(nm, new double[] {0.9, 0.9, 0.9}, 0.001);
        SpectralStore store = storeOf(curve, 2.0);

        StoreHit hit = StoreSearch.search(store, requirement(ThicknessSpec.AS_MEASURED, passBand(0.5, 200, 300)), 1)
                .hits().get(0);

        assertThat(hit.verdict()).isEqualTo(Verdict.UNVERIFIED);
    }

    @Test
    void solvesTheThicknessThatBlocksUnderOnePercent() {
        // Internal transmittance 0.5 at 2 mm, R = 0.04 (n = 1.5): T(2 mm) = (1-R)^2 K / (1 - R^2 K^2) = 0.460984
        // (Modern Optical Engineering, eq. 10.5). Exact: K* = 0.010851 for T = 0.01, so
        // d = 2 mm x ln K* / ln 0.5 = 13.05 mm. The store drops the multiple-reflection term, which moves
        // the answer by about 0.01 mm here.
        double t0 = Slab.transmittance(0.5, 0.04);
        SpectralStore store = storeOf(flat(t0), 2.0);
        StoreHit hit = StoreSearch.search(store, requirement(ThicknessSpec.range(1, 20), block(0.01, 405)), 1)
                .hits().get(0);

        assertThat(hit.verdict()).isEqualTo(Verdict.MEETS);
        assertThat(hit.thicknessRangeMm()[0]).isCloseTo(13.05, within(0.03));
        assertThat(hit.thicknessRangeMm()[1]).isEqualTo(20.0);
        assertThat(hit.thicknessMm()).isEqualTo(20.0); // only a block clause: thicker is always better
    }

    @Test
    void recommendsTheThicknessWhereThePassAndBlockMarginsAreEqual() {
        // n = 1.5, s = -2 log10(0.96) = 0.035458 decades surface loss. Internal absorbance per mm:
        // a365 = 0.01, a405 = 0.5 (built below). Pass "over 80 % at 365": margin 0.096910 - s - 0.01 d;
        // block "under 1 % at 405": margin s + 0.5 d - 2. Equal where 0.51 d = 2.061452 - 2 s + ... solved below.
        double s = -2 * Math.log10(0.96);
        double[] nm = GRID.points();
        double[] t = new double[nm.length];
        for (int i = 0; i < nm.length; i++) {
            double perMm = nm[i] < 385 ? 0.01 : 0.5;
            t[i] = Math.pow(10, -(s + perMm * 1.0)); // measured at 1 mm
        }
        SpectralStore store = storeOf(Curve.of(nm, t, 1e-6), 1.0);
        StoreHit hit = StoreSearch.search(store, requirement(ThicknessSpec.range(1, 10), pass(0.8, 365), block(0.01, 405)), 1)
                .hits().get(0);

        double passIntercept = -Math.log10(0.8) - s;
        double blockIntercept = s - 2;
        double expected = (passIntercept - blockIntercept) / (0.5 + 0.01);
        assertThat(hit.thicknessMm()).isCloseTo(expected, within(0.01));
        assertThat(hit.verdict()).isEqualTo(Verdict.MEETS);
        assertThat(hit.thicknessRangeMm()[0]).isCloseTo((2 - s) / 0.5, within(0.01));
        assertThat(hit.thicknessRangeMm()[1]).isCloseTo(passIntercept / 0.01, within(0.05));
    }

    @Test
    void aClearReadingKeepsItsValueNearItsThicknessAndIsOnlyABoundFarBeyondItAsInTheExactModel() {
        // T = 0.95 on n = 1.5 (ceiling 2n/(n² + 1) = 0.9231, Modern Optical Engineering eq. 10.6): no absorption the data can show,
        // so the store keeps the reading (SlabReading) and, like the exact evaluator, calls a pass proven only
        // up to the far thickness, where the hidden absorption reaches 0.01 decades
        Curve clear = flat(0.95);
        SpectralStore store = storeOf(clear, 2.0);
        Candidate exact = new Candidate(1, 1, "Sample", clear, 2.0, true, new ConstantIndex(1.5));
        double far = SlabReading.of(0.95, Fresnel.reflectanceInAir(1.5)).farMm(2.0);
        assertThat(far).isBetween(6.0, 12.0); // about 4.4 times: u/T/ln 10 = 0.0023 decades per 2 mm

        for (ThicknessSpec spec : List.of(ThicknessSpec.at(4), ThicknessSpec.at(far * 1.01), ThicknessSpec.at(40),
                ThicknessSpec.range(1, 40))) {
            Requirement r = requirement(spec, pass(0.9, 450), block(0.99, 600));
            StoreHit hit = StoreSearch.search(store, r, 1).hits().get(0);
            SampleEvaluation e = SampleEvaluator.evaluate(exact, r);

            assertThat(hit.verdict()).as(spec.toString()).isEqualTo(e.verdict());
            assertThat(hit.worstMarginDecades()).as(spec.toString()).isCloseTo(e.worstMarginDecades(), within(2e-3));
        }
        StoreHit range = StoreSearch.search(store, requirement(ThicknessSpec.range(1, 40), pass(0.9, 450)), 1)
                .hits().get(0);
        assertThat(range.verdict()).isEqualTo(Verdict.MEETS);
        // the stored OD is quantized (OdCode): the far thickness follows to a few parts in 10⁴
        assertThat(range.thicknessRangeMm()[1]).isCloseTo(far, within(far * 1e-3));
        assertThat(StoreSearch.search(store, requirement(ThicknessSpec.at(40), pass(0.9, 450)), 1).hits().get(0)
                .verdict()).isEqualTo(Verdict.UNVERIFIED);
    }

    @Test
    void oneRowPerMaterialInTheExactOrdersGroups() {
        // groups as RankingOrder (our own definition): meets, unverified on data, misses, nothing judged
        SpectralStore.Builder b = SpectralStore.builder(GRID, 5);
        StoredMaterial good = new StoredMaterial(1, "Good", "film");
        StoredMaterial bad = new StoredMaterial(2, "Bad", "film");
        StoredMaterial unknown = new StoredMaterial(3, "Unknown", "film");
        StoredMaterial outside = new StoredMaterial(4, "Outside", "film");
        b.add(10, good, 1, true, false, new ConstantIndex(1.5), flat(0.9));
        b.add(11, good, 2, true, false, new ConstantIndex(1.5), flat(0.85));
        b.add(20, bad, 1, true, false, new ConstantIndex(1.5), flat(0.1));
        // below a detection limit of 90 %: a bound over the 80 % asked cannot show that light passes
        b.add(30, unknown, 1, true, false, new ConstantIndex(1.5), Curve.of(GRID.points(), constant(0.85), 0.9));
        b.add(40, outside, 1, true, false, new ConstantIndex(1.5),
                Curve.of(new double[] {500, 600}, new double[] {0.9, 0.9}, 0.001));
        List<StoreHit> hits = StoreSearch.search(b.build(), requirement(ThicknessSpec.AS_MEASURED, pass(0.8, 365)), 10).hits();

        assertThat(hits).extracting(StoreHit::sampleId).containsExactly(10L, 30L, 20L, 40L);
        assertThat(hits).extracting(StoreHit::verdict)
                .containsExactly(Verdict.MEETS, Verdict.UNVERIFIED, Verdict.MISSES, Verdict.UNVERIFIED);
    }

    @Test
    void aMissShownOnlyByABoundRanksAfterAMissReadFromAValue() {
        // T below a detection limit of 8.94 % at 365 nm (margin at most log10(0.0894 / 0.8) = -0.95 decades)
        // against a measured 1 % (margin log10(0.01 / 0.8) = -1.90): the measured miss comes first
        SpectralStore.Builder b = SpectralStore.builder(GRID, 2);
        b.add(1, new StoredMaterial(1, "Amber lid", "plastic sheet"), 3, true, false, new ConstantIndex(1.5),
                Curve.of(GRID.points(), constant(0.0001), 0.0894));
        b.add(2, new StoredMaterial(2, "Dark sheet", "plastic sheet"), 3, true, false, new ConstantIndex(1.5), flat(0.01));
        List<StoreHit> hits = StoreSearch.search(b.build(), requirement(ThicknessSpec.AS_MEASURED, pass(0.8, 365)), 2).hits();

        assertThat(hits).extracting(StoreHit::sampleId).containsExactly(2L, 1L);
        assertThat(hits.get(0).worstMarginDecades()).isCloseTo(Math.log10(0.01 / 0.8), within(2e-4));
    }

    @Test
    void aFixedPartAskedAtAnotherThicknessComesAfterEveryMissInBothPasses() {
        // a coating (not rescaled) measured at 1 mm, asked at 3 mm: nothing can be judged, so it ranks last
        // (RankingOrder, our own definition), in the first pass over one thickness as in the full model
        SpectralStore.Builder b = SpectralStore.builder(GRID, 2);
        b.add(1, new StoredMaterial(1, "Coated film", "film"), 1, false, false, new ConstantIndex(1.5), flat(0.9));
        b.add(2, new StoredMaterial(2, "Dark sheet", "plastic sheet"), 3, true, false, new ConstantIndex(1.5), flat(0.01));
        SpectralStore store = b.build();
        Requirement r = requirement(ThicknessSpec.at(3), pass(0.8, 365));

        assertThat(StoreSearch.search(store, r, 1).hits()).extracting(StoreHit::sampleId).containsExactly(2L);
        assertThat(StoreSearch.search(store, r, 2).hits()).extracting(StoreHit::sampleId).containsExactly(2L, 1L);
        assertThat(StoreSearch.search(store, r, 2).hits()).extracting(StoreHit::sampleId, StoreHit::verdict)
                .containsExactlyElementsOf(StoreSearch.searchExhaustively(store, r, 2).hits().stream()
                        .map(h -> org.assertj.core.groups.Tuple.tuple(h.sampleId(), h.verdict())).toList());
    }

    @Test
    void theStoreJudgesAtTheAskedThicknessOnlyWhereTheMaterialIsMadeAndOnTheNearestSample() {
        SpectralStore.Builder b = SpectralStore.builder(GRID, 3);
        StoredMaterial film = new StoredMaterial(1, "Illustrative amber film", "film",
                MadeThicknesses.of(List.of(), 0.025, 0.125, List.of()));
        StoredMaterial sheet = new StoredMaterial(2, "Illustrative sheet", "plastic sheet",
                MadeThicknesses.of(List.of(), 1, 12, List.of()));
        b.add(10, film, 0.025, true, false, new ConstantIndex(1.5), flat(0.5));
        b.add(20, sheet, 2, true, false, new ConstantIndex(1.5), flat(0.5));
        b.add(21, sheet, 6, true, false, new ConstantIndex(1.5), flat(0.3));
        List<StoreHit> hits = StoreSearch.search(b.build(), requirement(ThicknessSpec.at(6), block(0.0001, 405)), 10).hits();

        // the film is not rescaled ×240: unverified, not met; the sheet is judged on its own 6 mm sample
        assertThat(hits).extracting(StoreHit::sampleId).containsExactlyInAnyOrder(10L, 21L);
        assertThat(hits).filteredOn(h -> h.sampleId() == 10L).extracting(StoreHit::verdict).containsExactly(Verdict.UNVERIFIED);
    }

    // ---- fixtures

    static SpectralStore randomStore(int curves, int materials, long seed) {
        SyntheticCurves synthetic = new SyntheticCurves(seed, GRID);
        SpectralStore.Builder b = SpectralStore.builder(GRID, curves);
        for (int i = 0; i < curves; i++) {
            SyntheticCurves.Spec spec = synthetic.next();
            int m = i % materials;
            // every third material is made only 0.5–4 mm thick, so the bounded search meets the made limits too
            MadeThicknesses made = m % 3 == 0 ? MadeThicknesses.of(List.of(1.0, 3.0), 0.5, 4, List.of())
                    : MadeThicknesses.UNLIMITED;
            b.addEncoded(i + 1, new StoredMaterial(m + 1, "material " + m, m % 2 == 0 ? "film" : "plastic sheet", made),
                    spec.thicknessMm(), m % 5 != 0, false, SyntheticCurves.INDICES[spec.index()], synthetic.codes(spec));
        }
        return b.build();
    }

    private static SpectralStore storeOf(Curve curve, double thicknessMm) {
        return SpectralStore.builder(GRID, 1)
                .add(1, new StoredMaterial(1, "Sample", "plastic sheet"), thicknessMm, true, false, new ConstantIndex(1.5), curve)
                .build();
    }

    private static Curve flat(double t) {
        return Curve.of(GRID.points(), constant(t), 1e-6);
    }

    private static double[] constant(double t) {
        double[] values = new double[GRID.size()];
        java.util.Arrays.fill(values, t);
        return values;
    }

    static Requirement requirement(ThicknessSpec thickness, Clause... clauses) {
        return new Requirement(List.of(clauses), thickness, Optional.empty(), Optional.empty(), List.of(clauses).toString());
    }

    static TransmittanceClause pass(double t, double nm) {
        return new TransmittanceClause(Direction.PASS, Aggregate.EVERY_POINT, Band.at(nm), t, ThresholdUnit.PERCENT, "pass");
    }

    static TransmittanceClause passBand(double t, double from, double to) {
        return new TransmittanceClause(Direction.PASS, Aggregate.EVERY_POINT, new Band(from, to), t, ThresholdUnit.PERCENT, "band");
    }

    static TransmittanceClause block(double t, double nm) {
        return new TransmittanceClause(Direction.BLOCK, Aggregate.EVERY_POINT, Band.at(nm), t, ThresholdUnit.PERCENT, "block");
    }

    static TransmittanceClause block(double t, double from, double to) {
        return new TransmittanceClause(Direction.BLOCK, Aggregate.EVERY_POINT, new Band(from, to), t, ThresholdUnit.PERCENT, "block band");
    }

    static TransmittanceClause mean(Direction direction, double t, double from, double to) {
        return new TransmittanceClause(direction, Aggregate.MEAN, new Band(from, to), t, ThresholdUnit.PERCENT, "mean");
    }
}
