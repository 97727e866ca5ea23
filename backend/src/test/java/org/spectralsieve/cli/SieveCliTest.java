package org.spectralsieve.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.StringReader;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.spectralsieve.importers.DelimitedTextReader;
import org.spectralsieve.importers.ParsedSpectrum;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.TestPropertySource;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * The command line run in-process against an in-memory library. The web service runs beside it on the
 * same in-memory database (one JVM shares it), so export can be compared with the API's curve.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "spring.datasource.url=" + SieveCliTest.DB_URL)
class SieveCliTest {

    static final String DB_URL = "jdbc:h2:mem:cli-test;DB_CLOSE_DELAY=-1";
    private static final String FUSED_SILICA_AT_254 = "passes over 80% at 254 nm, at 3 mm";
    private static final JsonMapper JSON = JsonMapper.builder().build();

    @LocalServerPort
    int port;

    private static CliRun cli(String... args) {
        List<String> all = new ArrayList<>(Arrays.asList(args));
        if (!all.isEmpty() && !all.get(0).equals("help")) {
            all.add("--db-url");
            all.add(DB_URL);
        }
        return CliRun.of(all.toArray(String[]::new));
    }

    @Test
    void uvGradeFusedSilicaHeadsTheTableForPassingAt254nmAt3mm() {
        // common practice, no source: UV-grade fused silica passes 254 nm
        CliRun run = cli("search", FUSED_SILICA_AT_254, "--limit", "5");

        assertThat(run.exitCode()).as(run.err()).isZero();
        List<String> lines = run.outLines();
        assertThat(lines.get(0)).startsWith("rank").contains("material", "sample", "geometry", "verdict", "worst margin",
                "binding clause");
        // the rows come in groups, each under the heading the page shows too
        assertThat(lines.get(1)).isEqualTo("-- Meets: the data prove every clause");
        String[] first = lines.get(2).trim().split(" {2,}");
        assertThat(first[0]).isEqualTo("1");
        assertThat(first[1].toLowerCase()).contains("fused silica").contains("uv");
        assertThat(first[3]).isEqualTo("regular");
        assertThat(first[5]).isEqualTo("meets");
        assertThat(first[6]).matches("\\+\\d\\.\\d{3}");
        // the clause's explanation sits indented under its row, its confidence beside the verdict (the demo
        // library's curves carry no measurement uncertainty, so it is unknown, never invented)
        assertThat(lines.get(3)).startsWith("      meets · confidence unknown: ").contains("254 nm");
    }

    @Test
    void wordsBeforeTheClausesNarrowTheTableAndSayHowManyTheyAdmitted() {
        CliRun run = cli("search", "acrylic passes over 80% at 400 nm", "--limit", "50");

        assertThat(run.exitCode()).as(run.err()).isZero();
        List<String> rows = run.outLines().stream().filter(l -> l.matches("\\s*\\d+ {2,}.*")).toList();
        assertThat(rows).isNotEmpty().anySatisfy(l -> assertThat(l.toLowerCase()).contains("acrylic"));
        assertThat(run.out()).containsPattern("Words: “acrylic” admitted \\d+ materials; the clauses were judged on those alone.");
    }

    @Test
    void misspeltRequirementExitsTwoWithTheSuggestionAndACaretOnStderr() {
        CliRun run = cli("search", "passes ovr 80% at 365 nm");

        assertThat(run.exitCode()).isEqualTo(SieveCli.USAGE);
        assertThat(run.out()).isEmpty();
        List<String> err = run.err().lines().toList();
        assertThat(err.get(0)).contains("position 7").contains("did you mean 'over'");
        assertThat(err.get(1)).isEqualTo("  passes ovr 80% at 365 nm");
        assertThat(err.get(2)).isEqualTo("  " + " ".repeat(7) + "^");
    }

    @Test
    void requirementBeyondTheLengthCapExitsTwoBeforeOpeningTheLibrary() {
        String text = "passes over 80% at 365 nm and ".repeat(100) + "blocks under 1% at 405 nm";

        CliRun run = cli("search", text);

        assertThat(run.exitCode()).isEqualTo(SieveCli.USAGE);
        assertThat(run.out()).isEmpty();
        assertThat(run.err()).contains(text.length() + " characters").contains("at most "
                + org.spectralsieve.requirement.RequirementLimits.MAX_TEXT_LENGTH);
    }

    @Test
    void unknownOptionExitsTwoWithPicocliMessage() {
        CliRun run = cli("search", FUSED_SILICA_AT_254, "--limti", "3");

        assertThat(run.exitCode()).isEqualTo(SieveCli.USAGE);
        assertThat(run.err()).contains("--limti").contains("--limit");
    }

    @Test
    void limitOutsideItsRangeExitsTwoNamingTheOption() {
        CliRun run = cli("search", FUSED_SILICA_AT_254, "--limit", "0");

        assertThat(run.exitCode()).isEqualTo(SieveCli.USAGE);
        assertThat(run.err()).contains("--limit must be from 1 to 500, got 0");
    }

    @Test
    void aStackSearchPrintsTheLayerSampleAndTheCautionUnderTheTable() {
        CliRun run = cli("search", "blocks under 1% at 405 nm and luminous over 70%, behind 4 mm clear float glass",
                "--limit", "3");

        assertThat(run.exitCode()).as(run.err()).isZero();
        List<String> lines = run.outLines();
        assertThat(lines.get(0)).startsWith("rank");
        assertThat(lines.get(1)).startsWith("-- Meets");
        // columns: rank, material, sample, geometry, mm, verdict
        assertThat(lines.get(2).trim().split(" {2,}")[5]).isEqualTo("meets");
        assertThat(run.out()).contains("Light path: every result is judged as a stack, behind 4 mm Clear float glass")
                .contains("clear-float-glass, sample ");
        assertThat(lines.get(lines.size() - 1)).startsWith("Caution: ").contains("not a certification");
    }

    @Test
    void anAmbiguousLayerExitsTwoListingTheChoices() {
        CliRun run = cli("search", "blocks under 1% at 405 nm, behind 4 mm glass");

        assertThat(run.exitCode()).isEqualTo(SieveCli.USAGE);
        assertThat(run.err()).contains("layer not resolved").contains("write the slug")
                .contains("  clear-float-glass  Clear float glass, glazier offcuts");
    }

    @Test
    void aMisspeltEmitterExitsTwoWithTheClosestName() {
        CliRun run = cli("search", "passes over 85% of led 356");

        assertThat(run.exitCode()).isEqualTo(SieveCli.USAGE);
        assertThat(run.err()).contains("position 19").contains("did you mean 'led-365'");
    }

    @Test
    void anUnknownClassExitsTwoListingTheLibrarysClasses() {
        CliRun run = cli("search", "blocks under 1% at 405 nm, class plastic");

        assertThat(run.exitCode()).isEqualTo(SieveCli.USAGE);
        assertThat(run.out()).isEmpty();
        List<String> err = run.err().lines().toList();
        assertThat(err.get(0)).contains("position 33").contains("a material class of the library (")
                .contains("window glass").contains("did you mean 'plastic sheet'");
        assertThat(err.get(2)).isEqualTo("  " + " ".repeat(33) + "^");
    }

    @Test
    void anAmbiguousBlockingLevelExitsTwoShowingBothReadings() {
        CliRun run = cli("search", "blocks 1% at 405 nm");

        assertThat(run.exitCode()).isEqualTo(SieveCli.USAGE);
        assertThat(run.err()).contains("'blocks under 1%'").contains("'transmits under 99%'");
    }

    @Test
    void jsonOutputParsesWithAResultsArrayLikeTheApi() {
        CliRun run = cli("search", FUSED_SILICA_AT_254, "--limit", "3", "--json");

        assertThat(run.exitCode()).as(run.err()).isZero();
        JsonNode json = JSON.readTree(run.out());
        assertThat(json.path("results").isArray()).isTrue();
        assertThat(json.path("results").size()).isBetween(1, 3);
        assertThat(json.path("results").get(0).path("verdict").asString()).isEqualTo("meets");
        assertThat(json.path("requirement").path("thickness").path("kind").asString()).isEqualTo("fixed");
    }

    @Test
    void exportedCsvReadsBackWithAsManyPointsAsTheApiCurve() throws Exception {
        long sampleId = JSON.readTree(cli("search", FUSED_SILICA_AT_254, "--limit", "1", "--json").out())
                .path("results").get(0).path("sampleId").asLong();

        CliRun run = cli("export", "--sample", String.valueOf(sampleId), "--thickness-mm", "5");

        assertThat(run.exitCode()).as(run.err()).isZero();
        ParsedSpectrum parsed = new DelimitedTextReader().read("export.csv", new StringReader(run.out()));
        JsonNode apiCurve = get("/api/samples/" + sampleId + "/curve?thicknessMm=5");
        assertThat(parsed.wavelengthsNm()).hasSize(apiCurve.path("wavelengthsNm").size());
        assertThat(parsed.metadata()).containsEntry("sample_id", String.valueOf(sampleId)).containsEntry("rescaled", "true");
    }

    @Test
    void exportedJcampDxReadsBackWithTheApisTransmittances() throws Exception {
        long sampleId = JSON.readTree(cli("search", FUSED_SILICA_AT_254, "--limit", "1", "--json").out())
                .path("results").get(0).path("sampleId").asLong();

        CliRun run = cli("export", "--sample", String.valueOf(sampleId), "--format", "jdx");

        assertThat(run.exitCode()).as(run.err()).isZero();
        ParsedSpectrum parsed = new org.spectralsieve.importers.jcamp.JcampReader().read("export.jdx",
                new StringReader(run.out()));
        JsonNode apiCurve = get("/api/samples/" + sampleId + "/curve");
        assertThat(parsed.size()).isEqualTo(apiCurve.path("transmittance").size());
        assertThat(parsed.transmittanceFractions()[0]).isEqualTo(apiCurve.path("transmittance").get(0).asDouble());
        assertThat(run.out()).contains("##$SIEVE SAMPLE ID= " + sampleId);
    }

    @Test
    void figuresPrintTheApisNumbersForTheChosenPairWithTheCaution() throws Exception {
        long sampleId = JSON.readTree(cli("search", FUSED_SILICA_AT_254, "--limit", "1", "--json").out())
                .path("results").get(0).path("sampleId").asLong();

        CliRun run = cli("figures", "--sample", String.valueOf(sampleId), "--thickness-mm", "5",
                "--emitter", "led-365", "--response", "flat", "--bands", "dermatology");

        assertThat(run.exitCode()).as(run.err()).isZero();
        JsonNode api = get("/api/samples/" + sampleId
                + "/figures?thicknessMm=5&emitter=led-365&response=flat&convention=dermatology");
        double effective = api.path("effectiveTransmittance").path("value").asDouble();
        String expected = String.format(java.util.Locale.ROOT, "%.3g %%", 100 * effective);
        assertThat(run.outLines()).anySatisfy(line -> assertThat(line).startsWith("effectiveTransmittance")
                .contains(expected));
        assertThat(run.out()).contains("meanTransmittanceUVB(290-320 nm)").contains("luminousTransmittance")
                .contains("sunglassCategory").contains("(rescaled, regular geometry)");
        // the named edges: fused silica is long-pass, so a UV absorption edge and no pass-band end
        assertThat(run.out()).contains("cutoffAt50Percent").doesNotContain("passBandEndAt50Percent");
        assertThat(run.outLines().get(run.outLines().size() - 1)).startsWith("Caution: ").contains("not a certification");
    }

    @Test
    void figuresRefuseToRescaleADiffuseSampleAndSayWhy() throws Exception {
        // PTFE sheet is measured in total geometry: rescaling it would treat scatter as absorption ([S47])
        long sampleId = JSON.readTree(cli("search", "passes over 20% at 254 nm, geometry total", "--limit", "1", "--json")
                .out()).path("results").get(0).path("sampleId").asLong();

        CliRun run = cli("figures", "--sample", String.valueOf(sampleId), "--thickness-mm", "7");

        assertThat(run.exitCode()).isEqualTo(SieveCli.FAILED);
        assertThat(run.err()).contains("scatter is not absorption");
    }

    @Test
    void figuresBehindAPartNameTheStackAndMatchTheApi() throws Exception {
        long sampleId = JSON.readTree(cli("search", FUSED_SILICA_AT_254, "--limit", "1", "--json").out())
                .path("results").get(0).path("sampleId").asLong();

        CliRun run = cli("figures", "--sample", String.valueOf(sampleId), "--behind", "float glass", "--behind-mm", "4");

        assertThat(run.exitCode()).as(run.err()).isZero();
        JsonNode api = get("/api/samples/" + sampleId + "/figures?behind=float%20glass&behindMm=4");
        assertThat(run.outLines().get(1)).isEqualTo(api.path("layer").asString());
        String expected = String.format(java.util.Locale.ROOT, "%.3g %%",
                100 * api.path("luminousTransmittance").path("value").asDouble());
        assertThat(run.outLines()).anySatisfy(line -> assertThat(line).startsWith("luminousTransmittance")
                .contains(expected));
        CliRun missing = cli("figures", "--sample", String.valueOf(sampleId), "--behind", "float glass");
        assertThat(missing.exitCode()).isEqualTo(SieveCli.USAGE);
        assertThat(missing.err()).contains("--behind-mm");
    }

    @Test
    void figuresUnderAnLedMatchTheApiAndNameTheLight() throws Exception {
        long sampleId = JSON.readTree(cli("search", FUSED_SILICA_AT_254, "--limit", "1", "--json").out())
                .path("results").get(0).path("sampleId").asLong();

        CliRun run = cli("figures", "--sample", String.valueOf(sampleId), "--emitter", "led-365", "--response", "flat",
                "--light", "under an LED with 120° beam angle");

        assertThat(run.exitCode()).as(run.err()).isZero();
        JsonNode api = get("/api/samples/" + sampleId + "/figures?emitter=led-365&response=flat&light="
                + java.net.URLEncoder.encode("under an LED with 120° beam angle", java.nio.charset.StandardCharsets.UTF_8));
        String expected = String.format(java.util.Locale.ROOT, "%.3g %%",
                100 * api.path("effectiveTransmittance").path("value").asDouble());
        assertThat(run.outLines()).anySatisfy(line -> assertThat(line).startsWith("effectiveTransmittance").contains(expected));
        assertThat(run.out()).contains("Light: an LED with 120° beam angle").contains("48 angles");
        assertThat(cli("figures", "--sample", String.valueOf(sampleId)).out()).contains("Light: normal incidence");

        CliRun bad = cli("figures", "--sample", String.valueOf(sampleId), "--light", "sideways");
        assertThat(bad.exitCode()).isEqualTo(SieveCli.USAGE);
        assertThat(bad.err()).contains("--light").contains("at 30° incidence");
    }

    @Test
    void figuresAtAnAngleRefuseAScatteringSampleAndSayWhy() throws Exception {
        long sampleId = JSON.readTree(cli("search", "passes over 20% at 254 nm, geometry total", "--limit", "1", "--json")
                .out()).path("results").get(0).path("sampleId").asLong();

        CliRun run = cli("figures", "--sample", String.valueOf(sampleId), "--light", "at 30° incidence");

        assertThat(run.exitCode()).isEqualTo(SieveCli.FAILED);
        assertThat(run.err()).contains("scattered light does not follow").contains("30° incidence");
    }

    @Test
    void figuresWithAnUnknownResponseExitTwoListingTheKnownOnes() {
        CliRun run = cli("figures", "--sample", "1", "--response", "erythemma");

        assertThat(run.exitCode()).isEqualTo(SieveCli.USAGE);
        assertThat(run.err()).contains("--response").contains("erythemma").contains("erythema");
        assertThat(run.out()).isEmpty();
    }

    @Test
    void exportOfAnUnknownSampleExitsOneNamingIt() {
        CliRun run = cli("export", "--sample", "987654");

        assertThat(run.exitCode()).isEqualTo(SieveCli.FAILED);
        assertThat(run.err()).contains("987654");
        assertThat(run.out()).isEmpty();
    }

    @Test
    void materialsListsTheWholeDemoLibrary() {
        CliRun run = cli("materials");

        assertThat(run.exitCode()).as(run.err()).isZero();
        List<String> lines = run.outLines();
        assertThat(lines.get(0)).startsWith("id").contains("name", "class", "measured mm", "made in");
        assertThat(lines.size() - 1).isGreaterThanOrEqualTo(40);
    }

    @Test
    void materialsFilteredByClassShowOnlyThatClass() {
        CliRun run = cli("materials", "--class", "plastic sheet");

        assertThat(run.exitCode()).as(run.err()).isZero();
        List<String> rows = run.outLines().subList(1, run.outLines().size());
        assertThat(rows).isNotEmpty().allSatisfy(row -> assertThat(row).contains("  plastic sheet  "));
    }

    @Test
    void entryWordsDecideBetweenCommandLineAndWebService() {
        assertThat(SieveCli.handles(new String[] {"search", "x"})).isTrue();
        assertThat(SieveCli.handles(new String[] {"--help"})).isTrue();
        assertThat(SieveCli.handles(new String[] {"--spring.profiles.active=postgres"})).isFalse();
        assertThat(SieveCli.handles(new String[0])).isFalse();
    }

    @Test
    void theSearchHelpPrintsItsPercentExamplesAsWritten() {
        // picocli reads a description as a format string: a bare "%" once printed a "Could not format" warning
        // warning, which picocli's tracer writes to the process's own standard error
        java.io.PrintStream processErr = System.err;
        java.io.ByteArrayOutputStream traced = new java.io.ByteArrayOutputStream();
        CliRun run;
        try {
            System.setErr(new java.io.PrintStream(traced, true, java.nio.charset.StandardCharsets.UTF_8));
            run = CliRun.of("search", "--help");
        } finally {
            System.setErr(processErr);
        }
        assertThat(run.out().replaceAll("\\s+", " "))
                .contains("'acrylic passes over 80% at 400 nm'", "passes over 80% at 365 nm").doesNotContain("%%");
        assertThat(traced.toString(java.nio.charset.StandardCharsets.UTF_8) + run.err()).doesNotContain("Could not format");
    }

    @Test
    void noCommandsHelpLeavesAPercentSignUnformatted() {
        // an option's description such as "0.5%T" is a format string to picocli: every command's help is
        // printed here, and a bare "%" anywhere shows up as picocli's "Could not format" warning
        java.io.PrintStream processErr = System.err;
        java.io.ByteArrayOutputStream traced = new java.io.ByteArrayOutputStream();
        StringBuilder printed = new StringBuilder();
        try {
            System.setErr(new java.io.PrintStream(traced, true, java.nio.charset.StandardCharsets.UTF_8));
            for (String command : new java.util.TreeSet<>(SieveCli.commandNames())) {
                CliRun run = CliRun.of(command, "--help");
                printed.append(run.out()).append(run.err());
            }
        } finally {
            System.setErr(processErr);
        }
        assertThat(printed.toString()).contains("0.5%T").doesNotContain("%%");
        assertThat(traced.toString(java.nio.charset.StandardCharsets.UTF_8) + printed).doesNotContain("Could not format");
    }

    @Test
    void everyCommandRunsAsACommandNotAsTheWebService() {
        // a command left off a hand-kept list once started the web service instead of printing its preview
        assertThat(SieveCli.commandNames()).contains("preview", "import", "export", "backup", "restore-backup");
        for (String name : SieveCli.commandNames()) {
            assertThat(SieveCli.handles(new String[] {name, "x"})).as(name).isTrue();
        }
    }

    @Test
    void theQuickCommandOrServerDecisionKnowsTheSameNamesAsPicocliItself() {
        // handles() reads the annotations instead of building picocli's model (start-up): the two must agree
        assertThat(SieveCli.declaredCommandNames()).isEqualTo(SieveCli.commandNames());
    }

    @Test
    void eachRowSaysWhetherItsSampleWasMeasuredAtTheThicknessOrRescaledFromAnother() {
        // the same facts as the JSON's measuredMm and rescaled, in the page's words (docs/result-rows.md)
        JsonNode json = JSON.readTree(cli("search", "passes over 50% at 365 nm, at 4 mm", "--limit", "5", "--json").out());
        CliRun run = cli("search", "passes over 50% at 365 nm, at 4 mm", "--limit", "5");

        assertThat(run.exitCode()).as(run.err()).isZero();
        List<String> sampleLines = run.outLines().stream().filter(l -> l.trim().startsWith("sample: ")).toList();
        assertThat(sampleLines).hasSize(json.path("results").size());
        for (int i = 0; i < sampleLines.size(); i++) {
            JsonNode row = json.path("results").get(i);
            String measured = java.math.BigDecimal.valueOf(row.path("measuredMm").asDouble()).stripTrailingZeros()
                    .toPlainString();
            assertThat(sampleLines.get(i).trim()).isEqualTo("sample: "
                    + (row.path("rescaled").asBoolean() ? "rescaled from " : "measured at ") + measured + " mm");
        }
    }

    private JsonNode get(String path) throws Exception {
        HttpResponse<String> response = HttpClient.newHttpClient().send(
                HttpRequest.newBuilder(URI.create("http://localhost:" + port + path)).GET().build(),
                HttpResponse.BodyHandlers.ofString());
        assertThat(response.statusCode()).as(response.body()).isEqualTo(200);
        return JSON.readTree(response.body());
    }
}
