package org.spectralsieve.seedmodel;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.OptionalDouble;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.testsupport.ReadsSharedFolder;
import org.spectralsieve.testsupport.SharedFolder;
import org.spectralsieve.weighting.LuminousTransmittance;

/**
 * The demo plastics that have a measured counterpart in {@code ../shared/reference-data/measured-transmittance-…}
 * (open data, GPL ≥ 2, see its SOURCES.md §8: single samples on a diode-array spectrophotometer without an
 * integrating sphere, "reference values only") look like it: the tolerances below are what a practitioner
 * comparing a catalogue curve with a measured sheet of the same kind would accept. The measured files are
 * read in place and never copied into the repository; every check names its file. The tests skip, saying
 * why, when {@code ../shared} is absent.
 *
 * <p>Definitions (the same as SOURCES.md's table): the 50 % point is the first rising crossing of 50 % from
 * the short-wavelength side, linear in T between grid points; the 1 %→50 % width walks from the 50 % point
 * toward shorter wavelengths to the first crossing of 1 %. A demo curve cannot pass more than its index's
 * lossless slab, 2n/(n²+1) (Modern Optical Engineering, eq. 10.6); where a measured file reads
 * above that ceiling, the comparison uses the ceiling.
 */
class DemoVersusMeasuredTest {

    /** 50 % points within 3 nm: about the spread between sheets of one grade (common practice, no source). */
    private static final double FIFTY_PERCENT_POINT_TOLERANCE_NM = 3;
    /** Edge widths within a factor 1.5 either way. */
    private static final double WIDTH_FACTOR = 1.5;
    /** T at single lines and τv within 3 % absolute. */
    private static final double TRANSMITTANCE_TOLERANCE = 0.03;

    /**
     * The one table of demo material → measured file. {@code demoMm} is the demo sample compared; when the
     * demo has no sample at the measured thickness, the material's own body is modelled at the measured
     * thickness by the generator that writes the demo files.
     *
     * @param widthCompared false where the measured file has no 1 % foot on its edge
     */
    record Counterpart(String slug, String measuredFile, double measuredMm, boolean widthCompared) {
        @Override
        public String toString() {
            return slug + " vs " + measuredFile;
        }
    }

    static Stream<Counterpart> counterparts() {
        return Stream.of(
                // clear PMMA stays over 1 % from 255 nm up: its 1 % foot is the intrinsic edge, not the absorber's
                new Counterpart("cast-acrylic-clear", "acrylic-clear-3mm.csv", 3, false),
                new Counterpart("uv-filtering-acrylic", "acrylic-uv-absorbing-3mm.csv", 3, true),
                new Counterpart("polycarbonate-uv-stabilised", "polycarbonate-sheet-3mm.csv", 3, true),
                new Counterpart("clear-pet-film", "pet-film-125um.txt", 0.125, true));
    }

    static Stream<Counterpart> counterpartsWithAnEdgeWidth() {
        return counterparts().filter(Counterpart::widthCompared);
    }

    @ReadsSharedFolder
    @ParameterizedTest(name = "{0}")
    @MethodSource("counterparts")
    void fiftyPercentPointLiesWithinThreeNanometresOfTheMeasuredSheet(Counterpart c) throws IOException {
        Spectrum measured = measured(c);
        Spectrum demo = demo(c);
        assertThat(fiftyPercentPoint(demo).orElseThrow()).as("demo %s against %s", c.slug(), c.measuredFile())
                .isCloseTo(fiftyPercentPoint(measured).orElseThrow(), within(FIFTY_PERCENT_POINT_TOLERANCE_NM));
    }

    @ReadsSharedFolder
    @ParameterizedTest(name = "{0}")
    @MethodSource("counterpartsWithAnEdgeWidth")
    void absorberEdgeRisesFromOneToFiftyPercentOverTheMeasuredWidth(Counterpart c) throws IOException {
        double measuredWidth = oneToFiftyPercentWidth(measured(c)).orElseThrow();
        double demoWidth = oneToFiftyPercentWidth(demo(c)).orElseThrow();
        assertThat(demoWidth).as("1 %%→50 %% width of %s against %s (%.1f nm)", c.slug(), c.measuredFile(), measuredWidth)
                .isBetween(measuredWidth / WIDTH_FACTOR, measuredWidth * WIDTH_FACTOR);
    }

    @ReadsSharedFolder
    @ParameterizedTest(name = "{0}")
    @MethodSource("counterparts")
    void transmittanceAtTheMercuryLinesAndTheVioletLedMatchesTheMeasuredSheet(Counterpart c) throws IOException {
        // 313, 365 and 405 nm: mercury lines (PRACTICE.md §6 #40, common practice); 300 nm: the UV-B check
        // SOURCES.md tabulates; 405 nm is also the violet LED (PRACTICE.md §6 #21)
        Spectrum measured = capped(measured(c), c);
        Spectrum demo = demo(c);
        for (double nm : new double[] {300, 313, 365, 405}) {
            assertThat(demo.at(nm)).as("T(%s nm) of %s against %s", nm, c.slug(), c.measuredFile())
                    .isCloseTo(measured.at(nm), within(TRANSMITTANCE_TOLERANCE));
        }
    }

    @ReadsSharedFolder
    @ParameterizedTest(name = "{0}")
    @MethodSource("counterparts")
    void luminousTransmittanceMatchesTheMeasuredSheet(Counterpart c) throws IOException {
        // τv(D65) by the project's ISO 8980-3 rule; SOURCES.md §8 lists the measured files' τv computed independently
        double measured = luminous(capped(measured(c), c));
        assertThat(luminous(demo(c))).as("τv of %s against %s", c.slug(), c.measuredFile())
                .isCloseTo(measured, within(TRANSMITTANCE_TOLERANCE));
    }

    @Test
    void clearAcrylicStillPassesSomeUvbAndTheCommonPracticeFiftyPercentPoint() throws IOException {
        // acrylic-clear-3mm.csv passes 7.2 % at 300 nm and 12.2 % at 313 nm (SOURCES.md §8); [S27] puts the
        // acrylic cut at ~360 nm and another practitioner at ~375 nm (PRACTICE.md §6 #6)
        Counterpart c = counterparts().filter(x -> x.slug().equals("cast-acrylic-clear")).findFirst().orElseThrow();
        Spectrum demo = demo(c);
        assertThat(demo.at(300)).isGreaterThan(0.03);
        assertThat(demo.at(313)).isGreaterThan(0.05);
        assertThat(fiftyPercentPoint(demo).orElseThrow()).isBetween(360.0, 380.0);
    }

    // --- the curves ---------------------------------------------------------------------------------------

    /** A curve on its own grid, as fractions. */
    record Spectrum(double[] nm, double[] t) {
        double at(double wavelength) {
            for (int i = 0; i + 1 < nm.length; i++) {
                if (nm[i] <= wavelength && wavelength <= nm[i + 1]) {
                    return t[i] + (t[i + 1] - t[i]) * (wavelength - nm[i]) / (nm[i + 1] - nm[i]);
                }
            }
            throw new AssertionError(wavelength + " nm is outside " + nm[0] + "–" + nm[nm.length - 1] + " nm");
        }
    }

    private static Spectrum demo(Counterpart c) {
        MaterialSpec m = DemoCatalogue.materials().stream().filter(x -> x.slug().equals(c.slug())).findFirst()
                .orElseThrow(() -> new AssertionError("no demo material " + c.slug()));
        SampleSpec sample = m.samples().stream().filter(s -> Math.abs(s.thicknessMm() - c.measuredMm()) < 1e-9)
                .findFirst()
                .orElseGet(() -> {
                    assertThat(m.scaling()).as(c.slug() + " must be bulk to be modelled at another thickness")
                            .isEqualTo(Scaling.BULK);
                    return SampleSpec.bulk(c.measuredMm(), m.samples().get(0).layers().get(0).absorption(), "compare");
                });
        ModelledCurve curve = SampleModeller.model(m.index(), sample);
        return new Spectrum(curve.wavelengthsNm(), curve.transmittances());
    }

    private static Spectrum capped(Spectrum measured, Counterpart c) {
        IndexSpec index = DemoCatalogue.materials().stream().filter(x -> x.slug().equals(c.slug())).findFirst()
                .orElseThrow().index();
        double[] t = new double[measured.t().length];
        for (int i = 0; i < t.length; i++) {
            double n = index.nAt(measured.nm()[i]);
            t[i] = Math.min(measured.t()[i], 2 * n / (n * n + 1));
        }
        return new Spectrum(measured.nm(), t);
    }

    private static final Pattern SEPARATORS = Pattern.compile("[,;\\s]+");

    /** First two numeric columns of a measured file (comma, semicolon, tab or space separated), percent → fraction. */
    private static Spectrum measured(Counterpart c) throws IOException {
        Path file = SharedFolder.measuredSheet(c.measuredFile());
        List<double[]> rows = new ArrayList<>();
        for (String line : Files.readAllLines(file)) {
            String[] cells = SEPARATORS.split(line.strip());
            if (cells.length < 2 || !isNumber(cells[0]) || !isNumber(cells[1])) {
                continue; // comment, header or blank line
            }
            rows.add(new double[] {Double.parseDouble(cells[0]), Double.parseDouble(cells[1]) / 100});
        }
        double[] nm = rows.stream().mapToDouble(r -> r[0]).toArray();
        double[] t = rows.stream().mapToDouble(r -> r[1]).toArray();
        return new Spectrum(nm, t);
    }

    private static boolean isNumber(String s) {
        try {
            Double.parseDouble(s);
            return true;
        } catch (NumberFormatException e) {
            return false;
        }
    }

    // --- the figures compared -----------------------------------------------------------------------------

    static OptionalDouble fiftyPercentPoint(Spectrum s) {
        for (int i = 0; i + 1 < s.nm().length; i++) {
            if (s.t()[i] < 0.5 && s.t()[i + 1] >= 0.5) {
                return OptionalDouble.of(crossing(s, i, 0.5));
            }
        }
        return OptionalDouble.empty();
    }

    static OptionalDouble oneToFiftyPercentWidth(Spectrum s) {
        OptionalDouble fifty = fiftyPercentPoint(s);
        if (fifty.isEmpty()) {
            return OptionalDouble.empty();
        }
        for (int i = s.nm().length - 2; i >= 0; i--) {
            if (s.nm()[i] < fifty.getAsDouble() && s.t()[i] < 0.01 && s.t()[i + 1] >= 0.01) {
                return OptionalDouble.of(fifty.getAsDouble() - crossing(s, i, 0.01));
            }
        }
        return OptionalDouble.empty();
    }

    private static double crossing(Spectrum s, int i, double level) {
        double[] nm = s.nm();
        double[] t = s.t();
        return nm[i] + (level - t[i]) * (nm[i + 1] - nm[i]) / (t[i + 1] - t[i]);
    }

    private static double luminous(Spectrum s) {
        return LuminousTransmittance.of(Curve.of(s.nm(), s.t(), 1e-6)).value().orElseThrow();
    }
}
