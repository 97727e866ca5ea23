package org.spectralsieve.ingest;

import static java.nio.charset.StandardCharsets.UTF_8;
import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import org.junit.jupiter.api.Test;
import org.spectralsieve.importers.ImportException;

/**
 * A curve wholly beyond the near infrared (nothing at or below 3000 nm: ISO 20473 ends the near infrared at
 * 3 µm, from memory) imports with a warning; one reaching into it does not; an axis beyond 25,000 nm is refused.
 */
class InfraredOnlyTest {

    private final FileImport reader = new FileImport(ImportProperties.defaults().maxPoints());

    private FilePreview read(String csv) throws ImportException {
        return reader.read("illustrative-ir.csv", csv.getBytes(UTF_8), ImportOptions.defaults());
    }

    @Test
    void aCurveWhollyBeyondTheNearInfraredImportsWithAWarningAboutUltravioletAndVisibleVerdicts() throws Exception {
        FilePreview p = read("wavelength_nm,T\n3500,0.80\n5000,0.82\n8000,0.40\n12000,0.75\n");

        assertThat(p.pointCount()).isEqualTo(4);
        assertThat(p.warnings()).anySatisfy(w -> assertThat(w).contains("infrared only", "3500–12000 nm",
                "ultraviolet and visible light"));
    }

    @Test
    void aCurveReachingIntoTheNearInfraredHasNoSuchWarning() throws Exception {
        FilePreview p = read("wavelength_nm,T\n2500,0.80\n5000,0.82\n8000,0.40\n12000,0.75\n");

        assertThat(p.warnings()).noneSatisfy(w -> assertThat(w).contains("infrared only"));
    }

    @Test
    void keepingOnlyItsInfraredPartGivesTheWarningToo() throws Exception {
        FilePreview p = reader.read("illustrative-uv-ir.csv",
                "wavelength_nm,T\n400,0.8\n2000,0.85\n4000,0.6\n6000,0.7\n".getBytes(UTF_8),
                ImportOptions.defaults().withKeepRange(java.util.OptionalDouble.of(3500), java.util.OptionalDouble.empty()));

        assertThat(p.warnings()).anySatisfy(w -> assertThat(w).contains("infrared only", "4000–6000 nm"));
    }

    @Test
    void anAxisWhollyBeyond25000NmIsStillRefused() {
        assertThatThrownBy(() -> read("wavelength_nm,T\n30000,0.8\n40000,0.7\n50000,0.6\n"))
                .isInstanceOf(ImportException.class).hasMessageContaining("entirely outside the 100–25,000 nm");
    }
}
