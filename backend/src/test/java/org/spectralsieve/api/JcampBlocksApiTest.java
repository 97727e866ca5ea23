package org.spectralsieve.api;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.net.http.HttpResponse;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.spectralsieve.ingest.JcampSeries;
import org.spectralsieve.testsupport.ReadsSharedFolder;
import org.spectralsieve.testsupport.SharedFolder;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.TestPropertySource;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/** The block list, block choice and each-block import through a real server; generated files unless marked. */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "spring.datasource.url=jdbc:h2:mem:jcamp-blocks-api-test;DB_CLOSE_DELAY=-1")
class JcampBlocksApiTest {

    private static final JsonMapper JSON = JsonMapper.builder().build();

    @LocalServerPort
    int port;

    private JsonNode post(Multipart form, String path, int status) throws Exception {
        return form.postExpecting(port, path, status);
    }

    private static Multipart newFilm(String fileName, String text, String name) {
        return Multipart.file(fileName, text).field("materialName", name).field("materialClass", "film")
                .field("scaling", "fixed").field("thicknessMm", 0.1);
    }

    @Test
    void thePreviewJsonListsEveryBlockAndWhichTheImportTakes() throws Exception {
        JsonNode p = post(Multipart.file("series.jdx", JcampSeries.twoBlocks()).field("block", 2),
                "/api/imports/preview", 200);

        JsonNode blocks = p.path("blocks");
        assertThat(blocks.size()).isEqualTo(2);
        assertThat(blocks.get(0).path("number").asInt()).isEqualTo(1);
        assertThat(blocks.get(0).path("title").asString()).isEqualTo("amber film, unexposed");
        assertThat(blocks.get(0).path("points").asInt()).isEqualTo(3);
        assertThat(blocks.get(0).path("taken").asBoolean()).isFalse();
        assertThat(blocks.get(1).path("rangeNm").get(0).asDouble()).isEqualTo(300.0);
        assertThat(blocks.get(1).path("rangeNm").get(1).asDouble()).isEqualTo(500.0);
        assertThat(blocks.get(1).path("xUnits").asString()).isEqualTo("NANOMETERS");
        assertThat(blocks.get(1).path("yUnits").asString()).isEqualTo("ABSORBANCE");
        assertThat(blocks.get(1).path("taken").asBoolean()).isTrue();
        assertThat(blocks.get(1).path("problem").isNull()).isTrue();
        assertThat(p.path("pointCount").asInt()).isEqualTo(4);
        assertThat(p.path("warnings").toString()).contains("Imported block 2 only");
    }

    @Test
    void aCsvPreviewHasAnEmptyBlockList() throws Exception {
        JsonNode p = post(Multipart.file("sheet.csv", "wavelength_nm,T\n300,0.3\n400,0.7\n"), "/api/imports/preview", 200);

        assertThat(p.path("blocks").isArray()).isTrue();
        assertThat(p.path("blocks").size()).isZero();
    }

    @Test
    void anUnknownBlockIsAProblemNamingTheParameterAndTheBlocks() throws Exception {
        JsonNode problem = post(Multipart.file("series.jdx", JcampSeries.twoBlocks()).field("block", 9),
                "/api/imports/preview", 400);

        assertThat(problem.path("parameter").asString()).isEqualTo("block");
        assertThat(problem.path("detail").asString()).contains("block 9 is not a spectrum of series.jdx",
                "block 1 'amber film, unexposed'", "block 2 'amber film, 10 min under the 365 nm lamp'");
    }

    @Test
    void aBlockThatIsNotANumberAndBlockWithEachBlockAreProblemsNamingTheParameter() throws Exception {
        JsonNode word = post(Multipart.file("series.jdx", JcampSeries.twoBlocks()).field("block", "second"),
                "/api/imports/preview", 400);
        JsonNode both = post(Multipart.file("series.jdx", JcampSeries.twoBlocks()).field("block", 1)
                .field("eachBlock", "true"), "/api/imports/preview", 400);

        assertThat(word.path("parameter").asString()).isEqualTo("block");
        assertThat(both.path("parameter").asString()).isEqualTo("block");
        assertThat(both.path("detail").asString()).contains("not both");
    }

    @Test
    void eachBlockStoresOneSamplePerBlockAndTheResponseListsThemAll() throws Exception {
        JsonNode r = post(newFilm("series.jdx", JcampSeries.twoBlocks(), "Illustrative amber film API")
                .field("eachBlock", "true").field("notes", "bench 2"), "/api/imports", 201);

        JsonNode samples = r.path("samples");
        assertThat(samples.size()).isEqualTo(2);
        assertThat(samples.get(0).path("block").asInt()).isEqualTo(1);
        assertThat(samples.get(1).path("block").asInt()).isEqualTo(2);
        assertThat(samples.get(1).path("blockTitle").asString()).isEqualTo("amber film, 10 min under the 365 nm lamp");
        assertThat(samples.get(1).path("pointCount").asInt()).isEqualTo(4);
        assertThat(samples.get(0).path("sample").path("id").asLong())
                .isNotEqualTo(samples.get(1).path("sample").path("id").asLong());
        assertThat(samples.get(1).path("sample").path("notes").asString())
                .startsWith("JCAMP-DX block 2 of the 2 spectra in series.jdx").endsWith("\nbench 2");
        assertThat(r.path("sampleId").asLong()).isEqualTo(samples.get(0).path("sample").path("id").asLong());

        JsonNode curve = JSON.readTree(java.net.http.HttpClient.newHttpClient().send(java.net.http.HttpRequest
                .newBuilder(java.net.URI.create("http://localhost:" + port + "/api/materials/" + r.path("materialId").asLong()))
                .build(), HttpResponse.BodyHandlers.ofString()).body());
        assertThat(curve.toString()).contains("\"id\":" + samples.get(1).path("sample").path("id").asLong());
    }

    @Test
    void anEachBlockImportWithAVarianceBlockIsRefusedAndStoresNothing() throws Exception {
        String file = JcampSeries.link(java.util.List.of(JcampSeries.unexposed(), JcampSeries.variance()));

        JsonNode problem = post(newFilm("series.jdx", file, "Illustrative refused film").field("eachBlock", "true"),
                "/api/imports", 400);

        assertThat(problem.path("detail").asString()).contains("eachBlock stores every block or none",
                "block 2 'amber film, variance of the scans' cannot be read as a transmittance curve");
        JsonNode materials = JSON.readTree(java.net.http.HttpClient.newHttpClient().send(java.net.http.HttpRequest
                .newBuilder(java.net.URI.create("http://localhost:" + port + "/api/materials")).build(),
                HttpResponse.BodyHandlers.ofString()).body());
        assertThat(materials.toString()).doesNotContain("Illustrative refused film");
    }

    @Test
    void aManifestTakesBlockAndEachBlockColumnsAndReportsEverySampleAndTheLeftOutWarning() throws Exception {
        byte[] zip = Zips.of(
                "manifest.csv", """
                        file,material,thickness,class,scaling,block,each_block
                        series.jdx,Illustrative batch amber film,0.1,film,fixed,,
                        series.jdx,illustrative-batch-amber-film,0.2,,,,true
                        series.jdx,illustrative-batch-amber-film,0.3,,,7,
                        """,
                "series.jdx", JcampSeries.twoBlocks());

        JsonNode files = post(Multipart.file("blocks.zip", zip), "/api/imports/batch", 200).path("files");

        assertThat(files.get(0).path("outcome").asString()).isEqualTo("STORED");
        assertThat(files.get(0).path("sampleIds").size()).isEqualTo(1);
        assertThat(files.get(0).path("warnings").toString()).contains("Imported block 1 only", "left out");
        assertThat(files.get(1).path("outcome").asString()).isEqualTo("STORED");
        assertThat(files.get(1).path("sampleIds").size()).isEqualTo(2);
        assertThat(files.get(1).path("warnings").toString()).doesNotContain("left out");
        assertThat(files.get(2).path("outcome").asString()).isEqualTo("REFUSED");
        assertThat(files.get(2).path("message").asString()).contains("manifest line 4", "'block'", "block 7 is not a spectrum");
    }

    @Test
    @ReadsSharedFolder
    void theFiveBlockTimeSeriesImportsAsFiveSamples() throws Exception {
        Path f = SharedFolder.referenceFile("jcamp-lancashire/blckpac1.jdx");
        String text = Files.readString(f);

        JsonNode r = post(newFilm("blckpac1.jdx", text, "Illustrative time series sample").field("eachBlock", "true"),
                "/api/imports", 201);

        // SOURCES.md §1 blckpac1: five blocks t1..t5 of 176 points each
        JsonNode samples = r.path("samples");
        assertThat(samples.size()).isEqualTo(5);
        for (int i = 0; i < 5; i++) {
            assertThat(samples.get(i).path("block").asInt()).isEqualTo(i + 1);
            assertThat(samples.get(i).path("pointCount").asInt()).isEqualTo(176);
            assertThat(samples.get(i).path("blockTitle").asString()).endsWith("(t" + (i + 1) + ")");
        }
        assertThat(r.path("warnings").toString()).doesNotContain("left out");
        assertThat(r.path("sample").path("detectionLimit").asDouble()).isCloseTo(0, within(1e-12));
    }
}
