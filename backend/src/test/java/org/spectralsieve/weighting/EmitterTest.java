package org.spectralsieve.weighting;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.spectralsieve.testsupport.ReadsSharedFolder;
import org.spectralsieve.testsupport.SharedFolder;

class EmitterTest {

    /** Definition of the model: the peak and the half-maximum points found numerically (0.001 nm scan). */
    @Test
    void ledModelRecoversItsPeakAndFullWidthAtHalfMaximum() {
        Emitter led = Emitter.led("led-test", 385, 12);
        double peakNm = 0;
        double peak = 0;
        for (double nm = 350; nm <= 420; nm += 0.001) {
            if (led.powerAt(nm) > peak) {
                peak = led.powerAt(nm);
                peakNm = nm;
            }
        }
        double left = halfPoint(led, peak, 350, peakNm);
        double right = halfPoint(led, peak, 420, peakNm);
        assertThat(peakNm).isCloseTo(385, within(0.001));
        assertThat(right - left).isCloseTo(12, within(0.002));
    }

    /**
     * Definition of the asymmetric model (two half-Gaussians joined at the peak): the peak sits at peakNm,
     * the half-maximum points lie fwhmShort/2 below and fwhmLong/2 above it, so the measured FWHM is
     * (fwhmShort + fwhmLong) / 2. Found numerically by a 0.001 nm scan and bisection.
     */
    @Test
    void asymmetricLedRecoversItsPeakAndBothHalfWidths() {
        Emitter led = Emitter.ledAsymmetric("led-skew", 365, 9, 15);
        double peakNm = 0;
        double peak = 0;
        for (double nm = 330; nm <= 410; nm += 0.001) {
            if (led.powerAt(nm) > peak) {
                peak = led.powerAt(nm);
                peakNm = nm;
            }
        }
        double left = halfPoint(led, peak, 330, peakNm);
        double right = halfPoint(led, peak, 410, peakNm);
        assertThat(peakNm).isCloseTo(365, within(0.001));
        assertThat(peak).isCloseTo(1, within(1e-9));
        assertThat(365 - left).isCloseTo(4.5, within(0.002));
        assertThat(right - 365).isCloseTo(7.5, within(0.002));
        assertThat(right - left).isCloseTo(12, within(0.002));
        assertThat(led.parameters()).containsEntry("fwhmNm", 12.0);
        assertThat(led.minNm()).isEqualTo(365 - 27.0);
        assertThat(led.maxNm()).isEqualTo(365 + 45.0);
    }

    /** Equal widths give the symmetric model back (the definition's limiting case). */
    @Test
    void asymmetricLedWithEqualWidthsIsTheGaussianLed() {
        Emitter skew = Emitter.ledAsymmetric("a", 395, 12, 12);
        Emitter gauss = Emitter.led("b", 395, 12);
        for (double nm = 360; nm <= 430; nm += 0.7) {
            assertThat(skew.powerAt(nm)).isCloseTo(gauss.powerAt(nm), within(1e-15));
        }
        assertThatThrownBy(() -> Emitter.ledAsymmetric("x", 365, 10, -1)).hasMessageContaining("fwhmLongNm is -1.0");
    }

    private static double halfPoint(Emitter e, double peak, double outside, double inside) {
        double lo = outside;
        double hi = inside;
        for (int i = 0; i < 60; i++) {
            double mid = (lo + hi) / 2;
            if (e.powerAt(mid) < peak / 2) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return (lo + hi) / 2;
    }

    /**
     * Each mercury line is modelled with unit area times its strength, so integrating around a line gives
     * back the strength (the model's definition; line positions from NIST atomic spectra, from memory).
     */
    @Test
    void mercuryLineIntegratesToItsRelativeStrength() {
        Emitter hg = Emitter.mercury("hg", 1.0, 0.25, 0, 0);
        assertThat(integrate(hg, 248, 260, 0.01)).isCloseTo(1.0, within(1e-6));
        assertThat(integrate(hg, 360, 370, 0.01)).isCloseTo(0.25, within(1e-6));
        assertThat(integrate(hg, 400, 440, 0.01)).isCloseTo(0, within(1e-12));
    }

    private static double integrate(Emitter e, double from, double to, double step) {
        double sum = 0;
        for (double nm = from; nm < to; nm += step) {
            sum += (e.powerAt(nm) + e.powerAt(nm + step)) / 2 * step;
        }
        return sum;
    }

    /** Wien's displacement law, λmax·T = 2.897771955·10⁶ nm·K (CODATA 2018): a 5000 K peak is 579.55 nm. */
    @Test
    void blackbodyPeaksWhereWiensLawSays() {
        Emitter bb = Emitter.blackbody(5000);
        double best = 0;
        double bestNm = 0;
        for (double nm = 500; nm <= 700; nm += 0.01) {
            if (bb.powerAt(nm) > best) {
                best = bb.powerAt(nm);
                bestNm = nm;
            }
        }
        assertThat(bestNm).isCloseTo(2.897771955e6 / 5000, within(0.01));
        assertThat(bb.powerAt(560)).isCloseTo(100, within(1e-9));
    }

    /**
     * CIE illuminant A is 100 at 560 nm by definition (CIE 15:2004), and the analytic form agrees with the
     * CIE 1-nm table within 5e-4 at every nm (reference sheet §9; table read from ../shared/reference-data,
     * skipped where absent).
     */
    @Test
    @ReadsSharedFolder
    void illuminantAMatchesTheCieOneNanometreTable() throws IOException {
        Emitter a = Emitter.illuminantA();
        assertThat(a.powerAt(560)).isCloseTo(100, within(1e-9));
        Path table = SharedFolder.referenceFile("cie-1nm/a.csv");
        List<String> lines = Files.readAllLines(table);
        int checked = 0;
        for (String line : lines) {
            String[] f = line.split(",");
            double nm = Double.parseDouble(f[0]);
            if (nm >= 300 && nm <= 830) {
                double expected = Double.parseDouble(f[1]);
                assertThat(a.powerAt(nm)).as("A at %s nm", nm).isCloseTo(expected, within(Math.max(5e-4, expected * 5e-6)));
                checked++;
            }
        }
        assertThat(checked).isEqualTo(471);
    }

    @Test
    void catalogueHoldsTheSeededEmitters() {
        assertThat(EmitterCatalogue.all()).extracting(Emitter::name).containsExactly("led-365", "led-385",
                "led-395", "led-405", "mercury-low-pressure", "uva-tube", "illuminant-a", "d65", "flat");
        assertThat(EmitterCatalogue.named("LED-365")).get().extracting(Emitter::kind).isEqualTo("led");
    }

    @Test
    void ledWithNonPositiveWidthIsRefusedNamingTheParameter() {
        assertThatThrownBy(() -> Emitter.led("x", 365, 0)).hasMessageContaining("fwhmNm is 0.0");
        assertThatThrownBy(() -> Emitter.mercury("x", 1, -1, 0, 0)).hasMessageContaining("365.0 nm line is -1.0");
    }
}
