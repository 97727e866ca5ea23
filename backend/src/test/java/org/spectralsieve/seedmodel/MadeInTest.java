package org.spectralsieve.seedmodel;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.spectralsieve.requirement.MadeThicknesses;

/** Every demo material states the thicknesses it exists in, and its own samples lie within them. */
class MadeInTest {

    @Test
    void everyDemoMaterialStatesItsMadeThicknessesAndItsSamplesLieWithinThem() {
        for (MaterialSpec m : DemoCatalogue.materials()) {
            MadeIn made = MadeIn.of(m.slug()).orElseThrow(() -> new AssertionError(m.slug() + " states no thicknesses"));
            double perMm = made.unit().equals("um") ? 1000 : 1;
            List<Double> stock = made.stock().stream().map(s -> s / perMm).toList();
            MadeThicknesses judged = made.range() == null
                    ? MadeThicknesses.of(stock, Double.NaN, Double.NaN, List.of())
                    : MadeThicknesses.of(stock, made.range()[0] / perMm, made.range()[1] / perMm, List.of());
            for (SampleSpec s : m.samples()) {
                assertThat(judged.makes(s.thicknessMm())).as(m.slug() + " at " + s.thicknessMm() + " mm").isTrue();
            }
        }
    }

    @Test
    void filmsAreStatedInMicrometresAndSheetsInMillimetres() {
        for (MaterialSpec m : DemoCatalogue.materials()) {
            MadeIn made = MadeIn.of(m.slug()).orElseThrow();
            boolean thin = m.samples().stream().allMatch(s -> s.thicknessMm() < 1);
            assertThat(made.unit()).as(m.slug()).isEqualTo(thin ? "um" : "mm");
        }
    }
}
