package org.spectralsieve.importers.jcamp;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.spectralsieve.importers.ImportException;
import org.spectralsieve.importers.ParsedSpectrum;
import org.spectralsieve.importers.XUnit;
import org.spectralsieve.importers.YKind;

/**
 * Writer → reader restores every double bit for bit: Double.toString writes the shortest decimal
 * that reads back to the same double (Java SE API specification of Double.toString / parseDouble).
 */
class JcampRoundTripTest {

    private static final int POINTS = 5_000;

    @Test
    void fiveThousandIrregularPointsWithUpperBoundsReadBackBitIdentical() throws ImportException {
        Random random = new Random(19880301L);
        double[] x = new double[POINTS];
        double[] t = new double[POINTS];
        boolean[] bounds = new boolean[POINTS];
        double wavelength = 190.0;
        for (int i = 0; i < POINTS; i++) {
            wavelength += 1e-9 + random.nextDouble() * 0.37; // irregular steps, down to a nanometre's billionth
            x[i] = wavelength;
            t[i] = random.nextDouble() * Math.pow(10, -random.nextInt(12)); // exercises the E notation
            bounds[i] = random.nextInt(23) == 0;
        }
        t[7] = 0.0;
        t[8] = 1.0;
        Map<String, String> metadata = new LinkedHashMap<>();
        metadata.put("title", "illustrative film, 125 µm");
        metadata.put("sample description", "made-up sheet\nsecond line");
        metadata.put("path length", "0.125 mm");

        String text = JcampWriter.write(metadata, x, t, bounds);
        ParsedSpectrum s = Jdx.read(text);

        assertThat(s.wavelengthsNm()).containsExactly(x);
        assertThat(s.values()).containsExactly(t);
        assertThat(s.upperBounds()).containsExactly(bounds);
        assertThat(s.yKind()).isEqualTo(YKind.TRANSMITTANCE_FRACTION);
        assertThat(s.xUnit()).isEqualTo(XUnit.NANOMETRE);
        assertThat(s.metadata()).containsEntry("title", "illustrative film, 125 µm")
                .containsEntry("sample description", "made-up sheet\nsecond line")
                .containsEntry("path length", "0.125 mm")
                .containsEntry("jcamp-dx", "5.01");
        assertThat(s.warnings()).isEmpty();
    }

    @Test
    void savedAsUtf8OrLatin1TheTitleReadsBackFromAFile(@TempDir Path dir) throws Exception {
        Map<String, String> metadata = Map.of("title", "illustrative film, 125 µm, 20 °C");
        String text = JcampWriter.write(metadata, new double[] {300, 301}, new double[] {0.5, 0.6}, null);
        Path utf8 = Files.writeString(dir.resolve("utf8.jdx"), text, StandardCharsets.UTF_8);
        Path latin1 = Files.writeString(dir.resolve("latin1.jdx"), text, StandardCharsets.ISO_8859_1);

        assertThat(new JcampReader().read(utf8).metadata()).containsEntry("title", "illustrative film, 125 µm, 20 °C");
        assertThat(new JcampReader().read(latin1).metadata()).containsEntry("title", "illustrative film, 125 µm, 20 °C");
    }

    @Test
    void writtenFileDeclaresJcamp501TransmittanceInNanometres() {
        String text = JcampWriter.write(null, new double[] {300, 400.5}, new double[] {0.1, 0.9}, null);

        assertThat(text).startsWith("##TITLE= untitled curve\n##JCAMP-DX= 5.01\n")
                .contains("##XUNITS= NANOMETERS\n", "##YUNITS= TRANSMITTANCE\n", "##NPOINTS= 2\n",
                        "##XYPOINTS= (XY..XY)\n300.0, 0.1\n400.5, 0.9\n")
                .endsWith("##END=\n");
    }

    @Test
    void writerRefusesWavelengthsThatDoNotIncreaseNamingTheIndex() {
        assertThatThrownBy(() -> JcampWriter.write(Map.of(), new double[] {300, 300}, new double[] {0.1, 0.2}, null))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("index 1");
        assertThatThrownBy(() -> JcampWriter.write(Map.of(), new double[] {300, 301}, new double[] {0.1, Double.NaN},
                null)).isInstanceOf(IllegalArgumentException.class).hasMessageContaining("index 1");
    }

    @Test
    void writerRefusesMetadataThatWouldReadBackAsALabelOrAComment() {
        double[] x = {300, 301};
        double[] t = {0.5, 0.5};
        assertThatThrownBy(() -> JcampWriter.write(Map.of("note", "a\n##END="), x, t, null))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("note");
        assertThatThrownBy(() -> JcampWriter.write(Map.of("note", "cost $$ 5"), x, t, null))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("note");
    }
}
