package org.spectralsieve.weighting;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.weighting.Figure.Bound;

/**
 * Source: ISO 12312-1:2013 filter categories as quoted by the College of Optometrists' guidance
 * (reference sheet §5): 0 > 80-100 %, 1 > 43-80 %, 2 > 18-43 %, 3 > 8-18 %, 4 > 3-8 %.
 */
class SunglassCategoryTest {

    @ParameterizedTest(name = "τv {0} → category {1}")
    @CsvSource({
        "1.00, 0", "0.8001, 0", "0.80, 1",
        "0.4301, 1", "0.43, 2",
        "0.1801, 2", "0.18, 3",
        "0.0801, 3", "0.08, 4",
        "0.0301, 4", "0.03, -1", "0.001, -1",
        "1.02, 0"})
    void boundariesBelongToTheDarkerCategory(double tv, int expected) {
        Optional<SunglassCategory> c = SunglassCategory.of(tv);
        assertThat(c.map(SunglassCategory::number).orElse(-1)).isEqualTo(expected);
    }

    /** A flat 80 % filter, τv summed in floating point, still lands on the boundary: category 1. */
    @Test
    void flatEightyPercentFilterIsCategoryOne() {
        Curve flat = Curve.of(new double[] {300, 900}, new double[] {0.8, 0.8}, 0);
        SunglassCategory.Rating r = SunglassCategory.rate(LuminousTransmittance.of(flat));
        assertThat(r.category()).contains(SunglassCategory.CATEGORY_1);
        assertThat(r.note()).contains("> 43 % to 80 %").contains("not a certification");
        assertThat(r.bound()).isEqualTo(Bound.VALUE);
    }

    @Test
    void rangeTextNamesTheStandardAndTheRange() {
        assertThat(SunglassCategory.CATEGORY_3.rangeText())
                .isEqualTo("ISO 12312-1:2013 category 3 (dark tint): τv > 8 % to 18 %");
    }

    @Test
    void upperBoundOnTauMeansThisCategoryOrDarker() {
        Figure tv = Figure.of("luminousTransmittance", 0.5, "fraction", Bound.AT_MOST, "x");
        SunglassCategory.Rating r = SunglassCategory.rate(tv);
        assertThat(r.category()).contains(SunglassCategory.CATEGORY_1);
        assertThat(r.bound()).isEqualTo(Bound.AT_LEAST);
        assertThat(r.note()).contains("or a darker one");
    }

    @Test
    void unknownTauGivesNoCategoryAndSaysWhy() {
        SunglassCategory.Rating r = SunglassCategory.rate(Figure.unavailable("luminousTransmittance", "fraction",
                "curve covers 190-700 nm"));
        assertThat(r.category()).isEmpty();
        assertThat(r.note()).contains("curve covers 190-700 nm");
    }
}
