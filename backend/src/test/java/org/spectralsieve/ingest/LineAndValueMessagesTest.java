package org.spectralsieve.ingest;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.catchThrowableOfType;

import java.nio.charset.StandardCharsets;
import org.junit.jupiter.api.Test;
import org.spectralsieve.importers.ImportException;

/**
 * A refused value is named by its line in the file and by the value as the file writes it (percent stays
 * percent), never by an array index or a converted fraction; Latin-1 files read like UTF-8 ones. Generated
 * files with illustrative values (Fernhollow workshop bench readings, invented).
 */
class LineAndValueMessagesTest {

    private final FileImport files = new FileImport(100_000);

    private static String percentRows(int from, int to) {
        StringBuilder b = new StringBuilder();
        for (int nm = from; nm <= to; nm += 10) {
            b.append(nm).append(',').append(40 + (nm - from) / 10).append('\n');
        }
        return b.toString();
    }

    @Test
    void aReadingFarBelowZeroIsNamedByItsLineAndItsPercentAsWritten() {
        // line 1 comment, line 2 header, lines 3–7 rows 300–340 nm, line 8 the broken reading
        String file = "# Fernhollow bench reading (illustrative)\nwavelength_nm,transmittance_percent\n"
                + percentRows(300, 340) + "350,-7.3\n" + percentRows(360, 400);

        IngestException e = catchThrowableOfType(IngestException.class,
                () -> files.read("bench.csv", file.getBytes(StandardCharsets.UTF_8), ImportOptions.defaults()));

        assertThat(e.getMessage()).contains("the lowest is at line 8: transmittance -7.3 %T in the file ('350,-7.3')")
                .doesNotContain("index").doesNotContain("-0.073");
    }

    @Test
    void aFractionFileIsQuotedAsAFraction() {
        String file = "wavelength_nm,transmittance\n300,0.2\n310,-0.25\n320,0.5\n";

        IngestException e = catchThrowableOfType(IngestException.class,
                () -> files.read("bench.csv", file.getBytes(StandardCharsets.UTF_8), ImportOptions.defaults()));

        assertThat(e.getMessage()).contains("line 3: transmittance -0.25 (as a fraction) in the file ('310,-0.25')");
    }

    @Test
    void aValueThatIsNotANumberIsNamedByLineColumnAndTextAsWritten() {
        StringBuilder file = new StringBuilder("wavelength_nm;transmittance_percent\n");
        for (int nm = 300; nm < 355; nm++) {
            file.append(nm).append(";50\n"); // lines 2–56
        }
        file.append("355;1.2e\n"); // line 57

        ImportException e = catchThrowableOfType(ImportException.class,
                () -> files.read("bench.csv", file.toString().getBytes(StandardCharsets.UTF_8), ImportOptions.defaults()));

        assertThat(e.line()).isEqualTo(57);
        assertThat(e.field()).isEqualTo("transmittance_percent");
        assertThat(e.problem()).contains("'1.2e'");
    }

    @Test
    void aLatin1FileWithAMicroSignInItsHeaderReadsInMicrometres() throws ImportException {
        // ISO 8859-1 writes µ as the single byte B5 and ° as B0: not valid UTF-8
        String text = "# room 21 °C\nWavelength (µm),Transmittance (%)\n0.30,10\n0.35,50\n0.40,90\n";
        byte[] latin1 = text.getBytes(StandardCharsets.ISO_8859_1);

        FilePreview p = files.read("bench.csv", latin1, ImportOptions.defaults());

        assertThat(p.curve().wavelengthsNm()).containsExactly(300.0, 350.0, 400.0); // 1 µm = 1000 nm (SI)
        assertThat(p.curve().transmittance(1)).isEqualTo(0.5);
        assertThat(p.warnings()).anyMatch(w -> w.contains("Latin-1"));
    }

    @Test
    void aLatin1FilesRefusalQuotesItsLineDecoded() {
        String text = "# Messung bei 21 °C\nwavelength_nm;transmittance_percent\n300;10,0\n310;-12,5\n320;50,0\n";
        byte[] latin1 = text.getBytes(StandardCharsets.ISO_8859_1);

        IngestException e = catchThrowableOfType(IngestException.class,
                () -> files.read("bench.csv", latin1, ImportOptions.defaults()));

        assertThat(e.getMessage()).contains("line 4: transmittance -12.5 %T in the file ('310;-12,5')");
    }
}
