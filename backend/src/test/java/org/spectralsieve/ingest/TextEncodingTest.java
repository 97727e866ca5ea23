package org.spectralsieve.ingest;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.charset.Charset;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.spectralsieve.importers.ImportException;

/**
 * UTF-16 text with a byte-order mark (the Unicode standard, ch. 3 and 23.8: FF FE is little-endian,
 * FE FF big-endian) reads to the same curve as its UTF-8 twin; Latin-1 keeps working. Generated,
 * illustrative files.
 */
class TextEncodingTest {

    private static final String CSV = """
            # sample: Fernhollow clear sheet (illustrative)
            wavelength_nm,transmittance_percent
            300,1.5
            320,12.25
            340,48.0
            360,81.75
            380,89.5
            """;

    private final FileImport files = new FileImport(100_000);

    @ParameterizedTest
    @ValueSource(strings = {"UTF-16LE", "UTF-16BE"})
    void aUtf16FileWithAByteOrderMarkImportsWithTheValuesOfItsUtf8Twin(String charsetName) throws Exception {
        Charset charset = Charset.forName(charsetName);
        byte[] mark = charsetName.endsWith("LE") ? new byte[] {(byte) 0xFF, (byte) 0xFE}
                : new byte[] {(byte) 0xFE, (byte) 0xFF};
        byte[] body = CSV.getBytes(charset);
        byte[] utf16 = new byte[mark.length + body.length];
        System.arraycopy(mark, 0, utf16, 0, mark.length);
        System.arraycopy(body, 0, utf16, mark.length, body.length);

        FilePreview twin = files.read("sheet.csv", CSV.getBytes(StandardCharsets.UTF_8), ImportOptions.defaults());
        FilePreview wide = files.read("sheet.csv", utf16, ImportOptions.defaults());

        assertThat(wide.curve().wavelengthsNm()).containsExactly(twin.curve().wavelengthsNm());
        assertThat(wide.curve().transmittance(2)).isEqualTo(twin.curve().transmittance(2));
        assertThat(wide.curve().transmittance(2)).isEqualTo(0.48);
        assertThat(wide.warnings()).isEqualTo(twin.warnings());
    }

    @Test
    void latin1TextIsStillReadWithAWarning() throws Exception {
        List<String> warnings = new ArrayList<>();
        String text = FileImport.decodeText("µ.csv", "# 25 °C\n".getBytes(StandardCharsets.ISO_8859_1), warnings);

        assertThat(text).isEqualTo("# 25 °C\n");
        assertThat(warnings).anyMatch(w -> w.contains("Latin-1"));
    }

    @Test
    void utf16WithoutAByteOrderMarkIsStillRefusedAsBinary() {
        byte[] bytes = "300,1\n".getBytes(StandardCharsets.UTF_16LE);

        ImportException e = org.assertj.core.api.Assertions.catchThrowableOfType(ImportException.class,
                () -> FileImport.decodeText("x.csv", bytes, new ArrayList<>()));

        assertThat(e.problem()).contains("NUL byte");
    }
}
