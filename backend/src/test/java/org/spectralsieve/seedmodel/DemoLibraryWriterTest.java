package org.spectralsieve.seedmodel;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.SortedMap;
import java.util.TreeSet;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.spectralsieve.importers.DelimitedTextReader;
import org.spectralsieve.importers.ImportException;
import org.spectralsieve.importers.ParsedSpectrum;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/** The committed seed-materials/ folder is exactly what the generator writes, and has the agreed shape. */
class DemoLibraryWriterTest {

    private static final Set<String> CLASSES = Set.of("window glass", "optical glass", "fused silica",
            "plastic sheet", "film", "coating", "resin-tank sheet", "mask film", "laminate", "other");

    private static SortedMap<String, String> rendered;

    @BeforeAll
    static void render() throws IOException {
        rendered = DemoLibraryWriter.render();
        if (SeedLibraryFixture.REGENERATE) {
            DemoLibraryWriter.writeTo(SeedLibraryFixture.committedFolder(), rendered);
        }
    }

    @Test
    void committedFilesEqualAFreshRenderingByteForByte() throws IOException {
        Path folder = SeedLibraryFixture.committedFolder();
        for (Map.Entry<String, String> e : rendered.entrySet()) {
            Path file = folder.resolve(e.getKey());
            assertThat(file).as("committed file for %s (regenerate: see seed-materials/README.md)", e.getKey()).exists();
            assertThat(Files.readAllBytes(file)).as(e.getKey())
                    .isEqualTo(e.getValue().getBytes(StandardCharsets.UTF_8));
        }
    }

    @Test
    void curvesFolderHoldsNoFileTheGeneratorDoesNotWrite() throws IOException {
        Set<String> onDisk = new TreeSet<>();
        try (Stream<Path> files = Files.list(SeedLibraryFixture.committedFolder().resolve("curves"))) {
            files.forEach(p -> onDisk.add("curves/" + p.getFileName()));
        }
        Set<String> expected = new TreeSet<>(rendered.keySet());
        expected.remove(DemoLibraryWriter.CATALOGUE_FILE);
        assertThat(onDisk).isEqualTo(expected);
    }

    @Test
    void writingTwiceIntoAFolderGivesTheSameBytes(@TempDir Path tmp) throws IOException {
        DemoLibraryWriter.writeTo(tmp, DemoLibraryWriter.render());
        DemoLibraryWriter.writeTo(tmp, DemoLibraryWriter.render());
        assertThat(Files.readString(tmp.resolve("catalogue.json"))).isEqualTo(rendered.get("catalogue.json"));
    }

    @Test
    void catalogueHeaderNamesTheInventedScenarioAndTheNotice() {
        JsonNode root = catalogue();
        assertThat(root.get("scenario").asString()).contains("Workshop").contains("invented");
        assertThat(root.get("notice").asString()).isEqualTo("modelled, illustrative — not for design decisions");
    }

    @Test
    void catalogueHasAtLeastFortyMaterialsEachWithOneToThreeSamples() {
        JsonNode materials = catalogue().get("materials");
        assertThat(materials.size()).isGreaterThanOrEqualTo(40);
        for (JsonNode m : materials) {
            assertThat(m.get("samples").size()).as(m.get("slug").asString()).isBetween(1, 3);
        }
    }

    @Test
    void everyMaterialUsesAnAgreedClassScalingAndIndexKind() {
        for (JsonNode m : catalogue().get("materials")) {
            String slug = m.get("slug").asString();
            assertThat(CLASSES).as(slug).contains(m.get("class").asString());
            assertThat(m.get("scaling").asString()).as(slug).isIn("bulk", "fixed");
            assertThat(m.get("refractiveIndex").get("kind").asString()).as(slug).isIn("constant", "sellmeier", "table");
            assertThat(m.get("tags").isArray()).as(slug).isTrue();
        }
    }

    @Test
    void everySampleEntryPointsAtItsCurveFileAndIsMarkedModelled() {
        for (JsonNode m : catalogue().get("materials")) {
            for (JsonNode s : m.get("samples")) {
                String file = s.get("file").asString();
                assertThat(rendered).as(file).containsKey(file);
                assertThat(file).startsWith("curves/" + m.get("slug").asString() + "-").endsWith("mm.csv");
                assertThat(s.get("thicknessMm").asDouble()).isPositive();
                assertThat(s.get("geometry").asString()).isIn("regular", "total");
                assertThat(s.get("provenance").asString()).isEqualTo("modelled");
                assertThat(s.get("instrument").asString()).isEqualTo("modelled (seed generator)");
                assertThat(s.get("notes").asString()).isEqualTo("modelled, illustrative — not for design decisions");
                assertThat(s.get("detectionLimit").asDouble()).isPositive();
            }
        }
    }

    @Test
    void everyCurveFileReadsBackThroughTheImporterWithItsIllustrativeNote() throws IOException, ImportException {
        List<String> problems = new ArrayList<>();
        DelimitedTextReader reader = new DelimitedTextReader();
        for (JsonNode m : catalogue().get("materials")) {
            for (JsonNode s : m.get("samples")) {
                Path file = SeedLibraryFixture.committedFolder().resolve(s.get("file").asString());
                ParsedSpectrum parsed = reader.read(file);
                Map<String, String> meta = parsed.metadata();
                if (!"modelled, illustrative — not for design decisions".equals(meta.get("note"))
                        || !m.get("slug").asString().equals(meta.get("material"))
                        || !"modelled".equals(meta.get("provenance"))) {
                    problems.add(file + " metadata " + meta);
                }
                double first = parsed.wavelengthsNm()[0];
                if ((first != 190 && first != 250) || parsed.wavelengthsNm()[parsed.size() - 1] != 1100) {
                    problems.add(file + " covers " + first + "–" + parsed.wavelengthsNm()[parsed.size() - 1] + " nm");
                }
            }
        }
        assertThat(problems).isEmpty();
    }

    private static JsonNode catalogue() {
        return JsonMapper.builder().build().readTree(rendered.get(DemoLibraryWriter.CATALOGUE_FILE));
    }
}
