package org.spectralsieve.weighting;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.io.IOException;
import java.util.function.DoubleUnaryOperator;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.ValueSource;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.testsupport.ReadsSharedFolder;
import org.spectralsieve.weighting.Figure.Bound;
import org.spectralsieve.weighting.ReferenceTables.Table;

class LuminousTransmittanceTest {

    /** A curve on a 1 nm grid, no point flagged below detection (an ideal T = 0 is a value here). */
    private static Curve curve(double from, double to, DoubleUnaryOperator t) {
        int n = (int) Math.round(to - from) + 1;
        double[] nm = new double[n];
        double[] tr = new double[n];
        for (int i = 0; i < n; i++) {
            nm[i] = from + i;
            tr[i] = t.applyAsDouble(nm[i]);
        }
        return Curve.of(nm, tr, new boolean[n], new double[n]);
    }

    /** Ideal long-pass as reference sheet §5 defines it: T = 1 at grid points λ >= edge, else 0. */
    private static Curve idealLongPass(double edgeNm) {
        return curve(300, 900, nm -> nm >= edgeNm ? 1 : 0);
    }

    /** Reference sheet §5: a flat T gives τv = T exactly (definition of a weighted mean). */
    @ParameterizedTest
    @ValueSource(doubles = {1.0, 0.8, 0.43, 0.1, 0.001})
    void flatFilterHasItsOwnLuminousTransmittance(double t) {
        Figure tv = LuminousTransmittance.of(curve(190, 1100, nm -> t));
        assertThat(tv.value().getAsDouble()).isCloseTo(t, within(t * 1e-14));
        assertThat(tv.bound()).isEqualTo(Bound.VALUE);
        assertThat(tv.name()).isEqualTo("luminousTransmittance");
    }

    /**
     * Reference sheet §5 check values [C]: ideal long-pass edges, plain sums over the CIE 1 nm D65 and ȳ
     * tables (cie-1nm/, CIE data via luxpy), 380-780 nm. The sheet's edge convention (T = 1 for λ >= edge
     * at the grid points) reproduces all six values.
     */
    @ParameterizedTest
    @CsvSource({"400, 0.99998", "450, 0.99457", "500, 0.92503", "550, 0.55757", "600, 0.15518", "650, 0.01357"})
    @ReadsSharedFolder
    void idealEdgeOnTheCieOneNanometreTables(double edge, double expected) throws IOException {
        Table d65 = ReferenceTables.referenceCsv("cie-1nm/d65.csv");
        Table cmf = ReferenceTables.referenceCsv("cie-1nm/cmf1931.csv");
        Figure tv = LuminousTransmittance.of(idealLongPass(edge), d65.nm(), d65.column(0), cmf.column(1));
        assertThat(tv.value().getAsDouble()).isCloseTo(expected, within(5e-5));
        assertThat(tv.note()).contains("401 rows");
    }

    /**
     * Reference sheet §5: the same edges on a 5 nm grid give 500 → 0.93141, 600 → 0.16616; here on the
     * shipped 5 nm tables, the grid the figure always uses.
     */
    @ParameterizedTest
    @CsvSource({"500, 0.93141", "600, 0.16616"})
    void idealEdgeOnTheShippedFiveNanometreTables(double edge, double expected) {
        Figure tv = LuminousTransmittance.of(idealLongPass(edge));
        assertThat(tv.value().getAsDouble()).isCloseTo(expected, within(5e-5));
        assertThat(tv.note()).contains("81 rows").contains("380.0 to 780.0 nm").contains("plain sums");
    }

    @Test
    void curveThatStopsShortOfTheVisibleIsNotAvailable() {
        Figure tv = LuminousTransmittance.of(curve(190, 700, nm -> 0.9));
        assertThat(tv.available()).isFalse();
        assertThat(tv.note()).contains("needs 380.0-780.0 nm").contains("never extrapolated");
    }

    @Test
    void pointBelowDetectionMakesAnUpperBound() {
        Curve c = Curve.of(new double[] {300, 500, 550, 900}, new double[] {0.5, 0.5, 0.0005, 0.0005}, 0.001);
        Figure tv = LuminousTransmittance.of(c);
        assertThat(tv.bound()).isEqualTo(Bound.AT_MOST);
        assertThat(tv.note()).contains("at most");
    }

    @Test
    void tablesWithoutTheVisibleEndsAreRefused() {
        assertThatThrownBy(() -> LuminousTransmittance.of(curve(300, 900, nm -> 1), new double[] {385, 780},
                new double[] {1, 1}, new double[] {1, 1})).hasMessageContaining("exactly 380.0 and 780.0 nm");
        assertThatThrownBy(() -> LuminousTransmittance.of(curve(300, 900, nm -> 1), new double[] {380, 780},
                new double[] {1}, new double[] {1, 1})).hasMessageContaining("they must match");
    }
}
