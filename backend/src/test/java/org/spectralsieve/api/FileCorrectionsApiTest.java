package org.spectralsieve.api;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.TestPropertySource;
import tools.jackson.databind.JsonNode;

/**
 * Corrections of what a file gets wrong, through a real server: the axis form fields (xUnit, xColumn,
 * yColumn), the decimal mark, the file's own thickness and date lines, and the same corrections as manifest
 * columns of a batch. Generated files with illustrative values (invented Fernhollow workshop readings).
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "spring.datasource.url=jdbc:h2:mem:file-corrections-api-test;DB_CLOSE_DELAY=-1")
class FileCorrectionsApiTest {


    /** Column 1 a pixel number, column 2 the wavelength in µm under a name the reader does not know. */
    private static final String DETECTOR_EXPORT = "pixel;cal;reading\n0;0,30;10,0\n1;0,35;50,0\n2;0,40;90,0\n";

    @LocalServerPort
    int port;

    private JsonNode post(Multipart form, String path, int status) throws Exception {
        return form.postExpecting(port, path, status);
    }

    @Test
    void previewTakesTheXUnitAndColumnFields() throws Exception {
        Multipart form = Multipart.file("detector.csv", DETECTOR_EXPORT).field("xUnit", "um").field("xColumn", 2)
                .field("yColumn", 3).field("yKind", "percent").field("decimalMark", "comma");

        JsonNode p = post(form, "/api/imports/preview", 200);

        // 1 µm = 1000 nm (SI); 50 %T = 0.5
        assertThat(p.path("rangeNm").get(0).asDouble()).isEqualTo(300.0);
        assertThat(p.path("rangeNm").get(1).asDouble()).isEqualTo(400.0);
        assertThat(p.path("curve").path("transmittance").get(1).asDouble()).isEqualTo(0.5);
        assertThat(p.path("warnings").toString()).contains("wavelength = column 2 ('cal')");
    }

    @Test
    void aColumnThatIsNotANumberIsRefusedNamingItsField() throws Exception {
        JsonNode problem = post(Multipart.file("detector.csv", DETECTOR_EXPORT).field("xColumn", "second"),
                "/api/imports/preview", 400);

        assertThat(problem.path("parameter").asString()).isEqualTo("xColumn");
    }

    @Test
    void anUnknownXUnitIsRefusedNamingItsField() throws Exception {
        JsonNode problem = post(Multipart.file("detector.csv", DETECTOR_EXPORT).field("xUnit", "furlong"),
                "/api/imports/preview", 400);

        assertThat(problem.path("parameter").asString()).isEqualTo("xUnit");
    }

    @Test
    void storeTakesTheThicknessAndDateTheFileGivesWhenTheFormGivesNone() throws Exception {
        String file = "# thickness: 3.0 mm\n# date: 2026-03-09\nwavelength_nm,T\n300,0.2\n400,0.6\n500,0.9\n";
        Multipart form = Multipart.file("sheet.csv", file).field("materialName", "Fernhollow corrections sheet")
                .field("materialClass", "plastic sheet").field("scaling", "bulk");

        JsonNode stored = post(form, "/api/imports", 201);

        assertThat(stored.path("sample").path("thicknessMm").asDouble()).isEqualTo(3.0);
        assertThat(stored.path("sample").path("measuredOn").asString()).isEqualTo("2026-03-09");
    }

    @Test
    void batchManifestTakesTheAxisAndDecimalMarkColumns() throws Exception {
        byte[] zip = Zips.of("manifest.csv", """
                        file,material,thickness,class,scaling,x_unit,x_column,y_column,y_kind,decimal_mark
                        detector.csv,Fernhollow batch corrections sheet,3,plastic sheet,bulk,um,2,3,percent,comma
                        """,
                "detector.csv", DETECTOR_EXPORT);

        JsonNode report = post(Multipart.file("batch.zip", zip), "/api/imports/batch", 200);

        JsonNode row = report.path("files").get(0);
        assertThat(row.path("outcome").asString()).as(row.toString()).isEqualTo("STORED");
        assertThat(row.path("warnings").toString()).contains("wavelength = column 2");
    }

    @Test
    void aBadManifestColumnCellRefusesThatRowNamingTheColumn() throws Exception {
        byte[] zip = Zips.of("manifest.csv", """
                        file,material,thickness,class,scaling,x_column
                        detector.csv,Fernhollow batch bad column sheet,3,plastic sheet,bulk,0
                        """,
                "detector.csv", DETECTOR_EXPORT);

        JsonNode row = post(Multipart.file("batch.zip", zip), "/api/imports/batch", 200).path("files").get(0);

        assertThat(row.path("outcome").asString()).isEqualTo("REFUSED");
        assertThat(row.path("message").asString()).contains("x_column");
    }
}
