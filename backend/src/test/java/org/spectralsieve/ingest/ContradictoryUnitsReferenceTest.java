package org.spectralsieve.ingest;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.catchThrowableOfType;
import static org.assertj.core.api.Assertions.within;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Optional;
import java.util.OptionalInt;
import org.junit.jupiter.api.Test;
import org.spectralsieve.importers.ImportException;
import org.spectralsieve.importers.XUnit;
import org.spectralsieve.importers.YKind;
import org.spectralsieve.testsupport.ReadsSharedFolder;
import org.spectralsieve.testsupport.SharedFolder;

/**
 * The real JCAMP-DX file whose header contradicts its data (../shared/reference-data, SOURCES.md §2
 * uv_ACD.jdx: DATA TYPE=INFRARED SPECTRUM, XUNITS=1/CM, YUNITS=ARBITRARY UNITS, but x = 210–650 really in nm,
 * an absorbance curve, 881 points, decoded y(210) = 2.925, y(650) = 0.003, max 3.076). Skipped with a message
 * where ../shared is absent.
 */
@ReadsSharedFolder
class ContradictoryUnitsReferenceTest {

    private final FileImport reader = new FileImport(ImportProperties.defaults().maxPoints());

    private FilePreview preview(ImportOptions options) throws Exception {
        return preview(uvFile(), options);
    }

    /** Resolved outside any assertion's lambda, so that a missing ../shared skips the test instead of failing it. */
    private static Path uvFile() {
        return SharedFolder.referenceFile("jcamp-cheminfo/uv_ACD.jdx");
    }

    private FilePreview preview(Path f, ImportOptions options) throws Exception {
        return reader.read(f.getFileName().toString(), Files.readAllBytes(f), options);
    }

    private static ImportOptions absorbance() {
        return new ImportOptions(null, Optional.of(YKind.ABSORBANCE), null, null, false, null, null, null);
    }

    @Test
    void withoutOverridesTheRefusalSaysWhatContradictsWhatAndNamesBothOverrides() {
        Path f = uvFile();
        ImportException e = catchThrowableOfType(ImportException.class, () -> preview(f, ImportOptions.defaults()));

        assertThat(e.field()).isEqualTo("##YUNITS");
        assertThat(e.problem()).contains("'ARBITRARY UNITS'", "yKind", "XUNITS=1/CM contradicts the x values",
                "210–650", "xUnit=nm", "INFRARED SPECTRUM");
    }

    @Test
    void withTheYKindAloneItReadsAsFarInfraredAndWarnsNamingTheXUnitOverride() throws Exception {
        FilePreview p = preview(absorbance());

        // 10⁷ / 650 cm⁻¹ = 15385 nm, 10⁷ / 210 cm⁻¹ = 47619 nm (λ = 10⁷/ν̃, SI)
        assertThat(p.curve().minWavelengthNm()).isCloseTo(15384.6, within(0.1));
        assertThat(p.warnings()).anyMatch(w -> w.contains("XUNITS=1/CM contradicts") && w.contains("xUnit=nm"));
    }

    @Test
    void withTheXUnitOverriddenToNanometresItImportsAsTheUltravioletCurveItIs() throws Exception {
        FilePreview p = preview(absorbance().withAxes(Optional.of(XUnit.NANOMETRE), OptionalInt.empty(),
                OptionalInt.empty()));

        assertThat(p.pointCount()).isEqualTo(881);
        assertThat(p.curve().minWavelengthNm()).isEqualTo(210.0);
        assertThat(p.curve().maxWavelengthNm()).isEqualTo(650.0);
        // the block list shows the range the import reads, not the one the contradictory label implies
        assertThat(p.blocks()).singleElement().satisfies(b -> {
            assertThat(b.fromNm()).isEqualTo(210.0);
            assertThat(b.toNm()).isEqualTo(650.0);
        });
        // A = 2.925 at 210 nm and 0.003 at 650 nm (SOURCES.md, rounded to 3 decimals); T = 10^−A (IUPAC Gold Book A00028)
        assertThat(p.curve().transmittance(0)).isCloseTo(Math.pow(10, -2.925), within(Math.pow(10, -2.925) * 0.0012));
        assertThat(p.curve().transmittance(880)).isCloseTo(Math.pow(10, -0.003), within(0.0012));
        assertThat(p.warnings()).anyMatch(w -> w.contains("XUNITS=1/CM overridden"))
                .noneMatch(w -> w.contains("contradicts"));
    }
}
