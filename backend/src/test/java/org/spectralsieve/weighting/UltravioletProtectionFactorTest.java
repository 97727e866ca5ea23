package org.spectralsieve.weighting;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.io.IOException;
import java.util.ArrayList;
import java.util.List;
import java.util.function.DoubleUnaryOperator;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.testsupport.ReadsSharedFolder;
import org.spectralsieve.weighting.Figure.Bound;
import org.spectralsieve.weighting.ReferenceTables.Table;

class UltravioletProtectionFactorTest {

    private static Curve curve(double from, double to, DoubleUnaryOperator t) {
        int n = (int) Math.round(to - from) + 1;
        double[] nm = new double[n];
        double[] tr = new double[n];
        for (int i = 0; i < n; i++) {
            nm[i] = from + i;
            tr[i] = t.applyAsDouble(nm[i]);
        }
        return Curve.of(nm, tr, 0);
    }

    /**
     * ASTM G173-03 reference spectra (NREL, SMARTS 2.9.2) as distributed by pvlib-python
     * (pvlib/data/ASTMG173.csv, BSD-3-Clause; reference-data SOURCES.md §6): the global-tilt column as a
     * tabulated emitter. Skipped where ../shared/reference-data is absent.
     */
    private static Emitter astmG173Global() throws IOException {
        Table t = ReferenceTables.referenceCsv("astm-g173-pvlib/ASTMG173.csv");
        return Emitter.tabulated("astm-g173-global", "ASTM G173-03 global tilt 37° (via pvlib), W m⁻² nm⁻¹",
                t.nm(), t.column(1));
    }

    static Stream<Arguments> emittersAndFlatTransmittances() {
        // Reference sheet §2, spectrum-independent check values [C]: flat T → UPF = 1/T for any E(λ)
        double[][] cases = {{0.1, 10}, {0.05, 20}, {0.04, 25}, {0.02, 50}, {0.0182, 54.95}};
        List<Arguments> all = new ArrayList<>();
        for (Emitter e : List.of(Emitter.d65(), Emitter.illuminantA(), Emitter.blackbody(5800), Emitter.flat(),
                Emitter.uvaTube(), EmitterCatalogue.named("mercury-low-pressure").orElseThrow(),
                Emitter.ledAsymmetric("led-test", 310, 8, 14))) {
            for (double[] c : cases) {
                all.add(Arguments.of(e, c[0], c[1]));
            }
        }
        return all.stream();
    }

    @ParameterizedTest(name = "{0}, T = {1}")
    @MethodSource("emittersAndFlatTransmittances")
    void flatTransmittanceGivesOneOverTWhateverTheSpectrum(Emitter solar, double t, double expected) {
        Figure upf = UltravioletProtectionFactor.of(curve(190, 1100, nm -> t), solar);
        assertThat(upf.value().getAsDouble()).isCloseTo(1 / t, within(1e-12 / t));
        assertThat(upf.value().getAsDouble()).isCloseTo(expected, within(0.005));
        assertThat(upf.note()).contains("solar spectrum " + solar.name()).contains("1.0 nm grid");
    }

    @Test
    @ReadsSharedFolder
    void flatTransmittanceUnderTheAstmG173GlobalSpectrum() throws IOException {
        Emitter solar = astmG173Global();
        for (double t : new double[] {0.1, 0.02, 0.0182}) {
            Figure upf = UltravioletProtectionFactor.of(curve(190, 1100, nm -> t), solar);
            assertThat(upf.value().getAsDouble()).isCloseTo(1 / t, within(1e-12 / t));
        }
    }

    /**
     * A filter with T = 0.01 below 320 nm and 1 from 320 nm. With a = the share of Σ E·s_er at and above
     * the step, UPF = 1 / (a + 0.01·(1 − a)), so 1 / (a + 0.01) < UPF < 1 / a. The 1 nm point at 320 nm
     * stands for 319.5-320.5 nm, so a is taken independently as ∫_{319.5}^{400} E·s_er / ∫_{290}^{400}
     * E·s_er by the trapezoid rule on the file's own 0.5 nm grid (s_er: ISO/CIE 17166 formula, sheet §1).
     * Every T is in [0.01, 1], so also 1 < UPF < 100.
     */
    @Test
    @ReadsSharedFolder
    void stepFilterUnderTheAstmG173GlobalSpectrumLiesBetweenTheHandDerivedBounds() throws IOException {
        Emitter solar = astmG173Global();
        Table t = ReferenceTables.referenceCsv("astm-g173-pvlib/ASTMG173.csv").between(290, 400);
        double total = 0;
        double above = 0;
        for (int i = 1; i < t.nm().length; i++) {
            double x0 = t.nm()[i - 1];
            double x1 = t.nm()[i];
            double area = (t.column(1)[i - 1] * Response.erythema(x0) + t.column(1)[i] * Response.erythema(x1))
                    / 2 * (x1 - x0);
            total += area;
            if (x0 >= 319.5) {
                above += area;
            }
        }
        double a = above / total;
        Figure upf = UltravioletProtectionFactor.of(curve(190, 1100, nm -> nm < 320 ? 0.01 : 1), solar);
        double value = upf.value().getAsDouble();
        assertThat(value).isGreaterThan(1).isLessThan(100);
        assertThat(value).isBetween(1 / (a + 0.01), 1 / a);
        assertThat(upf.bound()).isEqualTo(Bound.VALUE);
    }

    @Test
    void withoutASolarSpectrumTheFigureSaysOneMustBeNamed() {
        Figure upf = UltravioletProtectionFactor.withoutSolarSpectrum();
        assertThat(upf.available()).isFalse();
        assertThat(upf.note()).contains("reference solar spectrum must be named");
    }

    @Test
    void curveMissingPartOf290To400IsNotAvailable() {
        Figure upf = UltravioletProtectionFactor.of(curve(300, 1100, nm -> 0.1), Emitter.d65());
        assertThat(upf.available()).isFalse();
        assertThat(upf.note()).contains("needs 290.0-400.0 nm");
    }

    /** D65's table starts at 300 nm, so 290-299 nm carry no weight; a spectrum with none at all is refused. */
    @Test
    void spectrumWithoutUltravioletIsNotAvailable() {
        Figure upf = UltravioletProtectionFactor.of(curve(190, 1100, nm -> 0.1), Emitter.led("led-590", 590, 12));
        assertThat(upf.available()).isFalse();
        assertThat(upf.note()).contains("no power between 290.0 and 400.0 nm");
    }

    @Test
    void pointBelowDetectionMakesALowerBound() {
        Curve c = Curve.of(new double[] {280, 330, 331, 410}, new double[] {1e-4, 1e-4, 0.5, 0.5}, 1e-3);
        Figure upf = UltravioletProtectionFactor.of(c, Emitter.d65());
        assertThat(upf.bound()).isEqualTo(Bound.AT_LEAST);
        assertThat(upf.note()).contains("at least");
    }
}
