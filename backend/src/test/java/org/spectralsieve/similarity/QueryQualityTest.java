package org.spectralsieve.similarity;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;
import org.spectralsieve.spectrum.Curve;

/**
 * The warnings a ranking carries about its query: a curve mostly at its detection floor, few resolved points,
 * little coverage of the compared range. Constructed curves; the counts follow from the 5 nm grid by hand.
 */
class QueryQualityTest {

    private static final double LIMIT = 0.001;

    /** T = LIMIT (a bound) below {@code edgeNm}, 0.5 above, measured 1 nm apart over {@code from}–{@code to}. */
    private static CurveSignature opaqueBelow(double edgeNm, double from, double to) {
        int n = (int) Math.round(to - from) + 1;
        double[] nm = new double[n];
        double[] t = new double[n];
        for (int i = 0; i < n; i++) {
            nm[i] = from + i;
            t[i] = nm[i] < edgeNm ? LIMIT : 0.5;
        }
        return CurveSignature.of(Curve.of(nm, t, LIMIT), 1, true);
    }

    @Test
    void aCurveMostlyAtItsFloorIsSaidToRestOnItsResolvedPoints() {
        // opaque up to 602 nm: 200…600 nm are bounds (81 points), 605…700 resolved (20 points)
        QueryQuality q = QueryQuality.of(opaqueBelow(602, 200, 700), ComparedBand.WHOLE_GRID);
        assertThat(q.coveredPoints()).isEqualTo(101);
        assertThat(q.resolvedPoints()).isEqualTo(20);
        assertThat(q.mostlyAtFloor()).isTrue();
        assertThat(q.warnings()).singleElement().asString()
                .startsWith("most of this curve is at the detection limit")
                .contains("the ranking rests on 20 resolved points");
    }

    @Test
    void aResolvedCurveCoveringTheGridCarriesNoWarning() {
        QueryQuality q = QueryQuality.of(opaqueBelow(250, 200, 700), ComparedBand.WHOLE_GRID);
        assertThat(q.mostlyAtFloor()).isFalse();
        assertThat(q.warnings()).isEmpty();
    }

    @Test
    void theFloorIsJudgedInsideTheComparedBandOnly() {
        // the same curve over 600–700 nm: 600 nm is the one bound among 21 points
        CurveSignature mostlyOpaque = opaqueBelow(602, 200, 700);
        QueryQuality q = QueryQuality.of(mostlyOpaque, new ComparedBand(600, 700));
        assertThat(q.bandPoints()).isEqualTo(21);
        assertThat(q.resolvedPoints()).isEqualTo(20);
        assertThat(q.warnings()).isEmpty();
    }

    @Test
    void fewResolvedPointsAreWarnedOfEvenWhenBoundsAreNotTheMajority() {
        // the band 355–400 nm holds 10 points; opaque below 372 nm → 355…370 are bounds (4), 375…400 resolved (6)
        QueryQuality q = QueryQuality.of(opaqueBelow(372, 200, 700), new ComparedBand(355, 400));
        assertThat(q.bandPoints()).isEqualTo(10);
        assertThat(q.resolvedPoints()).isEqualTo(6);
        assertThat(q.mostlyAtFloor()).isFalse();
        assertThat(q.warnings()).singleElement().asString().startsWith("only 6 of this curve's 10 points");
    }

    @Test
    void aCurveCoveringLittleOfTheGridIsWarnedOf() {
        // measured 350–450 nm only: 21 of the 101 grid points
        QueryQuality q = QueryQuality.of(opaqueBelow(250, 350, 450), ComparedBand.WHOLE_GRID);
        assertThat(q.coveredPoints()).isEqualTo(21);
        assertThat(q.warnings()).singleElement().asString().contains("covers only 21 of the 101 grid points");
    }

    @Test
    void aCurveWithTooFewPointsInTheBandCannotBeComparedAtAll() {
        QueryQuality q = QueryQuality.of(opaqueBelow(250, 350, 380), new ComparedBand(300, 500));
        assertThat(q.coveredPoints()).isEqualTo(7);
        assertThat(q.warnings()).singleElement().asString().contains("no stored curve can be compared");
    }
}
