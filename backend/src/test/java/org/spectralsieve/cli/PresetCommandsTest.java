package org.spectralsieve.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.spectralsieve.weighting.SafetyCaution;

/** {@code search --preset} and {@code presets list/show/export/import} on the illustrative demo library. */
class PresetCommandsTest {

    private static final String DB_URL = "jdbc:h2:mem:cli-presets-test;DB_CLOSE_DELAY=-1";

    @TempDir
    Path folder;

    private static CliRun cli(String... args) {
        return CliRun.against(DB_URL, args);
    }

    @Test
    void searchWithAPresetRunsItsTextAndFindsWhatItsReasonPredicts() {
        // [S32]: only fused quartz or silica pass 254 nm well
        CliRun run = cli("search", "--preset", "germicidal-254-sleeve");
        assertThat(run.exitCode()).as(run.err()).isEqualTo(SieveCli.OK);
        assertThat(run.out()).contains("Preset germicidal-254-sleeve: passes over 80% at 254 nm")
                .contains("UV-grade synthetic fused silica");
        assertThat(run.out()).doesNotContain(SafetyCaution.TEXT);
    }

    @Test
    void aSafetyPresetCarriesTheCautionAndExtraSettingsAreAddedToItsText() {
        CliRun run = cli("search", "--preset", "uva-enclosure", "thickness 2 to 6 mm");
        assertThat(run.exitCode()).as(run.err()).isEqualTo(SieveCli.OK);
        assertThat(run.out()).contains("blocks under 1% from 290 to 380 nm, thickness 2 to 6 mm")
                .contains("thickness range mm").contains("Caution: " + SafetyCaution.TEXT);
    }

    @Test
    void anUnknownPresetIsAUsageErrorNamingIt() {
        CliRun run = cli("search", "--preset", "no-such-preset");
        assertThat(run.exitCode()).isEqualTo(SieveCli.USAGE);
        assertThat(run.err()).contains("no-such-preset").contains("presets list");
    }

    @Test
    void presetsExportAndImportMoveSavedPresetsThroughAFile() throws Exception {
        Path file = folder.resolve("larkspur-presets.json");
        Files.writeString(file, "{\"format\": \"spectral-sieve-presets\", \"version\": 1, \"presets\": ["
                + "{\"name\": \"Larkspur cover\", \"text\": \"passes over 85% from 380 to 410 nm\", \"note\": \"illustrative\"}]}");
        CliRun imported = cli("presets", "import", "--from", file.toString());
        assertThat(imported.exitCode()).as(imported.err()).isEqualTo(SieveCli.OK);
        assertThat(imported.out()).contains("imported 1 presets");

        CliRun again = cli("presets", "import", "--from", file.toString());
        assertThat(again.exitCode()).isEqualTo(SieveCli.USAGE);
        assertThat(again.err()).contains("nothing imported").contains("presets[0].name");

        CliRun list = cli("presets", "list");
        assertThat(list.out()).contains("led-395-window").contains("Larkspur cover");
        CliRun show = cli("presets", "show", "eyewear-405");
        assertThat(show.out()).contains("Source: [S14]").contains("Caution: " + SafetyCaution.TEXT);

        Path out = folder.resolve("out.json");
        CliRun export = cli("presets", "export", "--to", out.toString());
        assertThat(export.exitCode()).as(export.err()).isEqualTo(SieveCli.OK);
        assertThat(Files.readString(out)).contains("\"format\" : \"spectral-sieve-presets\"").contains("Larkspur cover");

        CliRun saved = cli("search", "--preset", "Larkspur cover");
        assertThat(saved.exitCode()).as(saved.err()).isEqualTo(SieveCli.OK);
        assertThat(saved.out()).contains("UV-transmitting cast acrylic");
    }
}
