package org.spectralsieve.api;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;
import static org.spectralsieve.library.db.Tables.REFERENCE_SPECTRUM;

import java.net.URI;
import java.net.URLEncoder;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import org.jooq.DSLContext;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.spectralsieve.library.SampleCurves;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.testsupport.ReadsSharedFolder;
import org.spectralsieve.testsupport.SharedFolder;
import org.spectralsieve.weighting.Emitter;
import org.spectralsieve.weighting.Response;
import org.spectralsieve.weighting.WeightedFigures;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.TestPropertySource;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * Imported emitters and responses through a real server over the (illustrative) demo library: import,
 * list, use in the figures, retire (DELETE), and every refusal. Spectra written here are made up, except the
 * solar reference read from the shared reference data.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "spring.datasource.url=jdbc:h2:mem:reference-spectrum-api-test;DB_CLOSE_DELAY=-1")
class ReferenceSpectrumApiTest {

    private static final HttpClient HTTP = HttpClient.newHttpClient();
    private static final JsonMapper JSON = JsonMapper.builder().build();

    @LocalServerPort
    int port;

    @Autowired
    DSLContext db;

    @Autowired
    SampleCurves curves;

    // ---------------------------------------------------------------- import and use

    @Test
    void anImportedResponseIsAnsweredWith201AndItsSummary() throws Exception {
        HttpResponse<String> response = Multipart.file("resist-a.csv", "# source: illustrative datasheet graph\n"
                        + "wavelength_nm,sensitivity\n350,0.2\n365,1\n405,0.4\n")
                .field("name", "Resist-A").field("description", "illustrative resist").post(port, "/api/responses");

        assertThat(response.statusCode()).as(response.body()).isEqualTo(201);
        assertThat(response.headers().firstValue("Location")).contains("/api/responses/resist-a");
        JsonNode s = JSON.readTree(response.body());
        assertThat(s.path("name").asString()).isEqualTo("resist-a");
        assertThat(s.path("kind").asString()).isEqualTo("response");
        assertThat(s.path("origin").asString()).isEqualTo("imported");
        assertThat(s.path("points").asInt()).isEqualTo(3);
        assertThat(s.path("rangeNm").get(0).asDouble()).isEqualTo(350.0);
        assertThat(s.path("rangeNm").get(1).asDouble()).isEqualTo(405.0);
        assertThat(s.path("description").asString()).isEqualTo("illustrative resist");
        assertThat(s.path("provenance").asString()).isEqualTo("illustrative datasheet graph"); // from # source:
        assertThat(s.path("valueColumn").asString()).isEqualTo("sensitivity");
        assertThat(s.path("sourceFileName").asString()).isEqualTo("resist-a.csv");
        assertThat(s.path("sha256").asString()).hasSize(64);
    }

    /**
     * A response of weight 1 over 300–400 nm is a flat weight restricted to that range. Under led-365 (a
     * Gaussian cut at 329–401 nm, all but a 7σ tail inside the table) it gives the figure of the built-in
     * flat weight over 300–400 nm (same grid, same weights, so equal to rounding: 1e-12). Under the flat
     * source, which has power from 100 to 1100 nm, the imported table is silent about most of that power:
     * its data merely ends at 300 and 400 nm, so the figure is not available and says what lies outside,
     * instead of quietly becoming the mean T over 300–400 nm.
     */
    @Test
    void anImportedBandResponseGivesTheBuiltInBandFigureAndRefusesASourceReachingFarBeyondIt() throws Exception {
        StringBuilder csv = new StringBuilder("wavelength_nm,weight\n");
        for (int nm = 300; nm <= 400; nm += 5) {
            csv.append(nm).append(",1\n");
        }
        importSpectrum("responses", "flat-300-400.csv", csv.toString(), "flat-300-400", 201);
        long id = sampleId("Clear cast acrylic sheet");
        Curve curve = curves.get(id, null, null).curve();

        double imported = figures(id, "led-365", "flat-300-400").path("effectiveTransmittance").path("value")
                .asDouble();
        double builtIn = WeightedFigures.effectiveTransmittance(curve, Emitter.led("led-365", 365, 12),
                Response.flat(300, 400)).value().getAsDouble();
        assertThat(imported).isCloseTo(builtIn, within(1e-12));
        assertThat(imported).isBetween(0.0, 1.0);

        JsonNode refused = figures(id, "flat", "flat-300-400").path("effectiveTransmittance");
        assertThat(refused.path("available").asBoolean()).isFalse();
        assertThat(refused.path("note").asString()).contains("outside the table of response flat-300-400");
    }

    /**
     * The built-in led-365 is a Gaussian (peak 365 nm, FWHM 12 nm) cut at ±3 FWHM and integrated on a 1 nm
     * step; the same Gaussian imported as points 0.1 nm apart is integrated on 0.1 nm steps at those very
     * points. The figures differ only by the trapezoid rule's step h. Tolerance, from the Euler–Maclaurin
     * formula applied piece by piece: for E·W smooth (a Gaussian times the erythema exponential, or times
     * 1) the rule's error is exponentially small at either step and the end terms vanish with E at ±3 FWHM;
     * what remains is T's kinks at the curve's 1-nm points, where T' jumps by Δ²T/h, giving a relative
     * error of the numerator of at most h²/12 · max|Δ²T|/h² = max|Δ²T|/12 for h = 1 nm (1/100 of that at
     * 0.1 nm). The test takes twice that, for the absorbance (not linear) interpolation of T between points
     * and higher-order terms, with max|Δ²T| read from the stored curve over 329–401 nm.
     */
    @Test
    void anImportedGaussianLedGivesTheBuiltInLedFigure() throws Exception {
        double peak = 365;
        double sigma = 12 / (2 * Math.sqrt(2 * Math.log(2)));
        StringBuilder csv = new StringBuilder("wavelength_nm,relative_power\n");
        for (int i = 0; i <= 720; i++) {
            double nm = 329 + i * 0.1;
            double z = (nm - peak) / sigma;
            csv.append(nm).append(',').append(Math.exp(-0.5 * z * z)).append('\n');
        }
        importSpectrum("emitters", "gaussian-365.csv", csv.toString(), "gaussian-365", 201);
        long id = sampleId("Clear cast acrylic sheet");
        Curve curve = curves.get(id, null, null).curve();
        double maxSecondDifference = 0;
        for (int nm = 330; nm <= 400; nm++) {
            maxSecondDifference = Math.max(maxSecondDifference, Math.abs(curve.transmittanceAt(nm + 1).orElseThrow()
                    - 2 * curve.transmittanceAt(nm).orElseThrow() + curve.transmittanceAt(nm - 1).orElseThrow()));
        }
        double tolerance = 2 * maxSecondDifference / 12;
        assertThat(tolerance).as("the sheet has an edge here, so the check is not vacuous").isGreaterThan(1e-4);

        for (String response : new String[] {"flat", "erythema"}) {
            double imported = figures(id, "gaussian-365", response).path("effectiveTransmittance").path("value").asDouble();
            double builtIn = figures(id, "led-365", response).path("effectiveTransmittance").path("value").asDouble();
            System.out.printf(Locale.ROOT, "imported Gaussian vs led-365 (%s): %.6f vs %.6f, difference %.2e,"
                    + " tolerance %.2e%n", response, imported, builtIn, imported - builtIn, tolerance);
            assertThat(imported).isCloseTo(builtIn, within(tolerance));
        }
    }

    @Test
    void listingsMarkBuiltInAndImportedSpectra() throws Exception {
        importSpectrum("emitters", "shop-uv.csv", "nm,power\n380,0.5\n385,1\n390,0.5\n", "shop-uv", 201);

        JsonNode emitters = getJson("/api/emitters", 200).path("emitters");

        assertThat(emitters.get(0).path("name").asString()).isEqualTo("led-365");
        assertThat(emitters.get(0).path("origin").asString()).isEqualTo("built-in");
        JsonNode shop = find(emitters, "shop-uv").orElseThrow();
        assertThat(shop.path("origin").asString()).isEqualTo("imported");
        assertThat(shop.path("kind").asString()).isEqualTo("tabulated");
        assertThat(shop.path("description").asString()).contains("imported from shop-uv.csv, column 'power'");
        assertThat(find(getJson("/api/responses", 200).path("responses"), "erythema").orElseThrow()
                .path("origin").asString()).isEqualTo("built-in");
    }

    @Test
    void pointsAndSourceFileGiveBackWhatWasImported() throws Exception {
        String csv = "wavelength_nm,power\n400,0.1\n400.5,0.30000000000000004\n401,1e-3\n";
        importSpectrum("emitters", "exact.csv", csv, "exact-points", 201);

        JsonNode p = getJson("/api/emitters/exact-points/points", 200);
        assertThat(p.path("sampled").asBoolean()).isFalse();
        assertThat(p.path("values").get(1).asDouble()).isEqualTo(0.30000000000000004);
        assertThat(p.path("wavelengthsNm").get(1).asDouble()).isEqualTo(400.5);
        HttpResponse<String> file = send(HttpRequest.newBuilder(uri("/api/emitters/exact-points/source-file")).GET());
        assertThat(file.statusCode()).isEqualTo(200);
        assertThat(file.body()).isEqualTo(csv);
        assertThat(file.headers().firstValue("X-Checksum-SHA256")).isPresent();

        JsonNode led = getJson("/api/emitters/led-365/points", 200);
        assertThat(led.path("sampled").asBoolean()).isTrue();
        assertThat(led.path("origin").asString()).isEqualTo("built-in");
        assertThat(getJson("/api/emitters/led-365", 200).path("rangeNm").get(0).asDouble()).isEqualTo(329.0);
        assertThat(getJson("/api/emitters/led-365/source-file", 404).path("detail").asString()).contains("built in");
    }

    @Test
    void deleteRetiresAnImportedSpectrumAndRefusesBuiltInOrUnknownNames() throws Exception {
        importSpectrum("emitters", "spare.csv", "nm,power\n380,1\n390,1\n", "spare-lamp", 201);
        long id = sampleId("UV-grade synthetic fused silica");
        figures(id, "spare-lamp", "flat");

        assertThat(send(HttpRequest.newBuilder(uri("/api/emitters/spare-lamp")).DELETE()).statusCode()).isEqualTo(204);

        assertThat(getJson("/api/samples/" + id + "/figures?emitter=spare-lamp", 400).path("parameter").asString())
                .isEqualTo("emitter");
        // retired, not deleted (docs/undo.md): the row is kept, out of every lookup, and restorable
        assertThat(db.fetchCount(REFERENCE_SPECTRUM, REFERENCE_SPECTRUM.NAME.eq("spare-lamp")
                .and(REFERENCE_SPECTRUM.RETIRED_AT.isNotNull()))).isOne();
        JsonNode builtIn = json(send(HttpRequest.newBuilder(uri("/api/emitters/led-365")).DELETE()), 400);
        assertThat(builtIn.path("parameter").asString()).isEqualTo("name");
        JsonNode unknown = json(send(HttpRequest.newBuilder(uri("/api/emitters/spare-lamp")).DELETE()), 404);
        assertThat(unknown.path("name").asString()).isEqualTo("spare-lamp");
        assertThat(getJson("/api/responses/no-such-weighting", 404).path("resource").asString()).isEqualTo("response");
    }

    @Test
    void aNameIsPerKindSoAnEmitterAndAResponseMayShareIt() throws Exception {
        importSpectrum("emitters", "twin.csv", "nm,power\n380,1\n390,1\n", "twin", 201);
        importSpectrum("responses", "twin.csv", "nm,weight\n380,1\n390,1\n", "twin", 201);

        assertThat(db.fetchCount(REFERENCE_SPECTRUM, REFERENCE_SPECTRUM.NAME.eq("twin"))).isEqualTo(2);
    }

    // ---------------------------------------------------------------- the solar reference spectrum

    /**
     * ASTM G173-03 as the emitter, global-tilt column chosen with {@code valueColumn=global} (the file has
     * three: extraterrestrial, global, direct). SOURCES.md §6: 2002 rows, 280–4000 nm; trapezoid of the
     * global column 1000.37 W m⁻², 280–400 nm 46.10 W m⁻². Stored whole (the points endpoint gives back the
     * integrals), used only within the tool's 100–1100 nm.
     */
    @Test
    @ReadsSharedFolder
    void theSolarReferenceSpectrumImportsWholeAndCountsWithinTheToolRange() throws Exception {
        Path g173 = SharedFolder.referenceFile("astm-g173-pvlib/ASTMG173.csv");
        JsonNode s = importFile("emitters", g173, "solar-global", Optional.of("global"), 201);

        assertThat(s.path("points").asInt()).isEqualTo(2002);
        assertThat(s.path("storedRangeNm").get(0).asDouble()).isEqualTo(280.0);
        assertThat(s.path("storedRangeNm").get(1).asDouble()).isEqualTo(4000.0);
        assertThat(s.path("rangeNm").get(0).asDouble()).isEqualTo(280.0);
        assertThat(s.path("rangeNm").get(1).asDouble()).isEqualTo(1100.0);
        assertThat(s.path("valueColumn").asString()).isEqualTo("global");
        assertThat(s.path("warnings").toString()).contains("280.0–1100.0 nm is used");
        JsonNode p = getJson("/api/emitters/solar-global/points", 200);
        assertThat(trapezoid(p, 280, 4000)).isCloseTo(1000.37, within(0.005));
        assertThat(trapezoid(p, 280, 400)).isCloseTo(46.10, within(0.005));
        JsonNode listed = find(getJson("/api/emitters", 200).path("emitters"), "solar-global").orElseThrow();
        assertThat(listed.path("rangeNm").get(1).asDouble()).isEqualTo(1100.0);
        assertThat(listed.path("integrationStepNm").asDouble()).isEqualTo(0.5); // the file's finest step
    }

    /**
     * The solar-weighted UV transmittance of a measured 3 mm clear acrylic sheet: SOURCES.md §8 gives
     * "UV (G173)" = 0.219 for {@code acrylic-clear-3mm.csv}, the global-spectrum-weighted mean T over
     * 280–380 nm. That number is reproduced by Σ T·E / Σ E over the whole nanometres 280…380 with every
     * term at full weight (a plain sum on G173's 1-nm points: 0.21897), not by a trapezoid. So the test
     * feeds the figure the same sum: the emitter is G173 global at its whole-nanometre rows only (written
     * to a temporary file from the reference data at run time), and the response weighs 1 from 280 to
     * 380 nm and falls to 0 at 279 and 381 nm, so the trapezoid gives 380 nm (and 280 nm, where E is
     * 5·10⁻²³) full weight. Tolerance 5e-4: the value is given to 3 digits. The same sheet under the
     * whole file (0.5 nm steps) with a plain 280–380 nm response is the trapezoid of the full data, 0.2130;
     * the 3 % between the two is the quadrature, not the data.
     */
    @Test
    @ReadsSharedFolder
    void solarWeightedUvTransmittanceOfAMeasuredAcrylicSheetMatchesTheSourcesValue(@TempDir Path dir) throws Exception {
        Path g173 = SharedFolder.referenceFile("astm-g173-pvlib/ASTMG173.csv");
        Path acrylic = SharedFolder.measuredSheet("acrylic-clear-3mm.csv");
        Path wholeNanometres = dir.resolve("ASTMG173-1nm.csv");
        List<String> lines = Files.readAllLines(g173);
        List<String> kept = new ArrayList<>(lines.subList(0, 2));
        lines.subList(2, lines.size()).stream().filter(l -> !l.split(",")[0].contains(".")).forEach(kept::add);
        Files.write(wholeNanometres, kept);
        importFile("emitters", wholeNanometres, "solar-global-1nm", Optional.of("global"), 201);
        importFile("emitters", g173, "solar-global-full", Optional.of("global"), 201);
        importSpectrum("responses", "uv-sum.csv", "wavelength_nm,weight\n279,0\n280,1\n380,1\n381,0\n", "uv-sum-280-380", 201);
        importSpectrum("responses", "uv.csv", "wavelength_nm,weight\n280,1\n380,1\n", "uv-280-380", 201);
        HttpResponse<String> stored = Multipart.file("acrylic-clear-3mm.csv", Files.readAllBytes(acrylic))
                .field("materialName", "Measured clear acrylic (reference data)").field("materialClass", "plastic sheet")
                .field("scaling", "bulk").field("thicknessMm", 3).field("yKind", "percent").post(port, "/api/imports");
        assertThat(stored.statusCode()).as(stored.body()).isEqualTo(201);
        long id = JSON.readTree(stored.body()).path("sampleId").asLong();

        double sum = figures(id, "solar-global-1nm", "uv-sum-280-380").path("effectiveTransmittance").path("value").asDouble();
        double full = figures(id, "solar-global-full", "uv-280-380").path("effectiveTransmittance").path("value").asDouble();
        System.out.printf(Locale.ROOT, "acrylic 3 mm under G173 global, 280-380 nm: %.5f (1-nm sum), %.5f (trapezoid of"
                + " the full file)%n", sum, full);

        assertThat(sum).isCloseTo(0.219, within(5e-4));
        assertThat(full).isLessThan(sum);
    }

    /**
     * The imported solar spectrum serves as the UPF's reference spectrum ({@code solar=}). A flat T gives
     * UPF = 1/T for any E(λ) (reference sheet §2: T = 0.02 → 50), so a film stored with T = 2 % over
     * 250–450 nm must give 50 under G173 global.
     */
    @Test
    @ReadsSharedFolder
    void anImportedSolarSpectrumServesAsTheUpfReference() throws Exception {
        Path g173 = SharedFolder.referenceFile("astm-g173-pvlib/ASTMG173.csv");
        importFile("emitters", g173, "solar-global-upf", Optional.of("global"), 201);
        StringBuilder flat = new StringBuilder("wavelength_nm,transmittance\n");
        for (int nm = 250; nm <= 450; nm += 10) {
            flat.append(nm).append(",0.02\n");
        }
        HttpResponse<String> stored = Multipart.file("grey-film.csv", flat.toString())
                .field("materialName", "Illustrative flat grey film").field("materialClass", "film")
                .field("scaling", "fixed").field("thicknessMm", 0.1).post(port, "/api/imports");
        assertThat(stored.statusCode()).as(stored.body()).isEqualTo(201);
        long id = JSON.readTree(stored.body()).path("sampleId").asLong();

        JsonNode f = getJson("/api/samples/" + id + "/figures?solar=solar-global-upf", 200);

        assertThat(f.path("solar").asString()).isEqualTo("solar-global-upf");
        assertThat(f.path("upf").path("value").asDouble()).isCloseTo(50.0, within(1e-9));
    }

    // ---------------------------------------------------------------- refusals: 400 naming where, nothing stored

    @Test
    void aBadNumberIsRefusedNamingFileLineAndField() throws Exception {
        JsonNode p = refused("emitters", "lamp.csv", "nm,power\n380,1\n385,bright\n", "bad-number-lamp");
        assertWhere(p, "lamp.csv", 3, "power");
        assertThat(p.path("problem").asString()).contains("not a number: 'bright'");
    }

    @Test
    void wavelengthsThatTurnAreRefused() throws Exception {
        JsonNode p = refused("responses", "turns.csv", "nm,weight\n380,1\n390,1\n385,1\n", "turning-response");
        assertWhere(p, "turns.csv", 4, "nm");
        assertThat(p.path("problem").asString()).contains("not monotonic");
    }

    @Test
    void aNegativeValueIsRefusedNotClamped() throws Exception {
        JsonNode p = refused("emitters", "dark-subtracted.csv", "nm,counts\n380,12\n381,-0.4\n382,9\n", "negative-lamp");
        assertWhere(p, "dark-subtracted.csv", 3, "counts");
        assertThat(p.path("problem").asString()).contains("negative value -0.4");
    }

    @Test
    void allZeroValuesAreRefused() throws Exception {
        JsonNode p = refused("responses", "zeros.csv", "nm,weight\n380,0\n390,0\n", "zero-response");
        assertThat(p.path("field").asString()).isEqualTo("weight");
        assertThat(p.path("problem").asString()).contains("every value is 0");
    }

    @Test
    void oneRowIsTooFew() throws Exception {
        JsonNode p = refused("emitters", "single.csv", "nm,power\n380,1\n", "single-lamp");
        assertWhere(p, "single.csv", 2, "power");
    }

    @Test
    void anEmptyFileIsRefused() throws Exception {
        JsonNode p = refused("emitters", "empty.csv", "", "empty-lamp");
        assertThat(p.path("file").asString()).isEqualTo("empty.csv");
        assertThat(p.path("problem").asString()).contains("empty");
    }

    @Test
    void aBinaryFileIsRefused() throws Exception {
        int before = db.fetchCount(REFERENCE_SPECTRUM);
        HttpResponse<String> r = Multipart.file("capture.bin", new byte[] {'3', '8', '0', 0, 1, 2}).field("name", "bin-lamp")
                .post(port, "/api/emitters");
        assertThat(json(r, 400).path("problem").asString()).contains("NUL byte");
        assertThat(db.fetchCount(REFERENCE_SPECTRUM)).isEqualTo(before);
    }

    @Test
    void severalValueColumnsNeedTheValueColumnOption() throws Exception {
        String csv = "wavelength,extraterrestrial,global,direct\n300,1,2,3\n301,1,2,3\n";
        JsonNode p = refused("emitters", "three.csv", csv, "three-columns");
        assertThat(p.path("line").asInt()).isEqualTo(1);
        assertThat(p.path("problem").asString()).contains("value column option");

        JsonNode q = json(Multipart.file("three.csv", csv).field("name", "three-columns").field("valueColumn", "diffuse")
                .post(port, "/api/emitters"), 400);
        assertThat(q.path("problem").asString()).contains("'diffuse'");
    }

    @Test
    void aSpectrumOutsideTheToolRangeIsRefused() throws Exception {
        JsonNode p = refused("emitters", "infrared.csv", "nm,power\n1200,1\n2000,1\n", "infrared-lamp");
        assertThat(p.path("file").asString()).isEqualTo("infrared.csv");
        assertThat(p.path("field").asString()).isEqualTo("power");
        assertThat(p.path("detail").asString()).contains("no power between 100.0 and 1100.0 nm");
    }

    @Test
    void aTakenNameIsRefusedNamingTheParameter() throws Exception {
        importSpectrum("emitters", "first.csv", "nm,power\n380,1\n390,1\n", "taken-lamp", 201);
        int before = db.fetchCount(REFERENCE_SPECTRUM);

        JsonNode p = importSpectrum("emitters", "second.csv", "nm,power\n380,2\n390,2\n", "Taken-Lamp", 400);

        assertThat(p.path("parameter").asString()).isEqualTo("name");
        assertThat(p.path("detail").asString()).contains("already exists");
        assertThat(db.fetchCount(REFERENCE_SPECTRUM)).isEqualTo(before);
        assertThat(getJson("/api/emitters/taken-lamp/points", 200).path("values").get(0).asDouble()).isEqualTo(1.0);
    }

    @Test
    void aBuiltInNameIsRefusedForEitherKind() throws Exception {
        int before = db.fetchCount(REFERENCE_SPECTRUM);
        assertThat(importSpectrum("emitters", "x.csv", "nm,power\n380,1\n390,1\n", "led-365", 400)
                .path("parameter").asString()).isEqualTo("name");
        assertThat(importSpectrum("responses", "x.csv", "nm,weight\n380,1\n390,1\n", "FLAT", 400)
                .path("detail").asString()).contains("built-in");
        assertThat(importSpectrum("emitters", "x.csv", "nm,power\n380,1\n390,1\n", "erythema", 400)
                .path("detail").asString()).contains("built-in response");
        assertThat(db.fetchCount(REFERENCE_SPECTRUM)).isEqualTo(before);
    }

    @Test
    void aNameThatIsNoSlugIsRefusedWithASuggestion() throws Exception {
        JsonNode p = importSpectrum("emitters", "x.csv", "nm,power\n380,1\n390,1\n", "Bench lamp (365)", 400);
        assertThat(p.path("parameter").asString()).isEqualTo("name");
        assertThat(p.path("detail").asString()).contains("try 'bench-lamp-365'");
    }

    @Test
    void missingNameOrFileIsRefusedNamingThePart() throws Exception {
        JsonNode noName = json(Multipart.file("x.csv", "nm,power\n380,1\n390,1\n").post(port, "/api/emitters"), 400);
        assertThat(noName.path("parameter").asString()).isEqualTo("name");

        HttpRequest noFile = HttpRequest.newBuilder(uri("/api/emitters"))
                .header("Content-Type", "multipart/form-data; boundary=b")
                .POST(HttpRequest.BodyPublishers.ofString("--b\r\nContent-Disposition: form-data; name=\"name\"\r\n\r\n"
                        + "no-file\r\n--b--\r\n")).build();
        assertThat(json(HTTP.send(noFile, HttpResponse.BodyHandlers.ofString()), 400).path("parameter").asString())
                .isEqualTo("file");
    }

    @Test
    void badOptionsAreRefusedNamingTheParameter() throws Exception {
        String csv = "nm,power\n380,1\n390,1\n";
        assertThat(json(Multipart.file("x.csv", csv).field("name", "opt-lamp").field("xUnit", "furlong")
                .post(port, "/api/emitters"), 400).path("parameter").asString()).isEqualTo("xUnit");
        assertThat(json(Multipart.file("x.csv", csv).field("name", "opt-lamp").field("format", "raw-counts")
                .post(port, "/api/emitters"), 400).path("parameter").asString()).isEqualTo("format");
        assertThat(json(Multipart.file("x.csv", csv).field("name", "opt-lamp").field("description", "d".repeat(4001))
                .post(port, "/api/emitters"), 400).path("parameter").asString()).isEqualTo("description");
        assertThat(db.fetchCount(REFERENCE_SPECTRUM, REFERENCE_SPECTRUM.NAME.eq("opt-lamp"))).isZero();
    }

    @Test
    void aJcampAbsorbanceFileImportsAsWeightsUnconverted() throws Exception {
        String jdx = "##TITLE= illustrative photoinitiator\n##JCAMP-DX= 4.24\n##XUNITS= NANOMETERS\n"
                + "##YUNITS= ABSORBANCE\n##XYPOINTS= (XY..XY)\n350, 2.0\n380, 1.0\n405, 0.2\n##END=\n";
        JsonNode s = importSpectrum("responses", "initiator.jdx", jdx, "initiator-a", 201);

        assertThat(s.path("sourceFormat").asString()).isEqualTo("jcamp-dx");
        // A = 2 stays the weight 2 (read as a transmittance it would be 10^-2; IUPAC Gold Book A00028)
        assertThat(getJson("/api/responses/initiator-a/points", 200).path("values").get(0).asDouble()).isEqualTo(2.0);
        assertThat(s.path("warnings").toString()).contains("not converted to transmittance");
    }

    // ---------------------------------------------------------------- helpers

    private JsonNode refused(String kinds, String file, String text, String name) throws Exception {
        int before = db.fetchCount(REFERENCE_SPECTRUM);
        JsonNode problem = importSpectrum(kinds, file, text, name, 400);
        assertThat(problem.path("status").asInt()).isEqualTo(400);
        assertThat(db.fetchCount(REFERENCE_SPECTRUM)).as("nothing stored").isEqualTo(before);
        return problem;
    }

    private static void assertWhere(JsonNode problem, String file, int line, String field) {
        assertThat(problem.path("file").asString()).isEqualTo(file);
        assertThat(problem.path("line").asInt()).isEqualTo(line);
        assertThat(problem.path("field").asString()).isEqualTo(field);
        assertThat(problem.path("detail").asString()).startsWith(file + " line " + line + ", field '" + field + "'");
    }

    private JsonNode importSpectrum(String kinds, String file, String text, String name, int status) throws Exception {
        return json(Multipart.file(file, text).field("name", name).post(port, "/api/" + kinds), status);
    }

    private JsonNode importFile(String kinds, Path file, String name, Optional<String> valueColumn, int status)
            throws Exception {
        Multipart form = Multipart.file(file.getFileName().toString(), Files.readAllBytes(file)).field("name", name);
        valueColumn.ifPresent(c -> form.field("valueColumn", c));
        return json(form.post(port, "/api/" + kinds), status);
    }

    private JsonNode figures(long sampleId, String emitter, String response) throws Exception {
        return getJson("/api/samples/" + sampleId + "/figures?emitter=" + emitter + "&response=" + response, 200);
    }

    private long sampleId(String nameStart) throws Exception {
        JsonNode materials = getJson("/api/materials?q=" + URLEncoder.encode(nameStart, StandardCharsets.UTF_8), 200);
        for (JsonNode m : materials) {
            if (m.path("name").asString().startsWith(nameStart)) {
                return m.path("samples").get(0).path("id").asLong();
            }
        }
        throw new AssertionError("demo library has no material named " + nameStart + "…");
    }

    private static Optional<JsonNode> find(JsonNode list, String name) {
        for (JsonNode n : list) {
            if (n.path("name").asString().equals(name)) {
                return Optional.of(n);
            }
        }
        return Optional.empty();
    }

    /** Mean of T over [from, to] by the trapezoid rule on 1 nm steps, from the curve itself. */
    /** ∫ over the stored points that lie inside [from, to], trapezoid rule. */
    private static double trapezoid(JsonNode points, double from, double to) {
        JsonNode x = points.path("wavelengthsNm");
        JsonNode y = points.path("values");
        double sum = 0;
        for (int i = 1; i < x.size(); i++) {
            double a = x.get(i - 1).asDouble();
            double b = x.get(i).asDouble();
            if (a >= from && b <= to) {
                sum += (b - a) * (y.get(i - 1).asDouble() + y.get(i).asDouble()) / 2;
            }
        }
        return sum;
    }

    private URI uri(String path) {
        return URI.create("http://localhost:" + port + path);
    }

    private HttpResponse<String> send(HttpRequest.Builder request) throws Exception {
        return HTTP.send(request.build(), HttpResponse.BodyHandlers.ofString());
    }

    private JsonNode getJson(String path, int status) throws Exception {
        return json(send(HttpRequest.newBuilder(uri(path)).GET()), status);
    }

    private static JsonNode json(HttpResponse<String> response, int status) throws Exception {
        assertThat(response.statusCode()).as(response.uri() + " → " + response.body()).isEqualTo(status);
        return JSON.readTree(response.body());
    }
}
