package org.spectralsieve.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.ResultSet;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** {@code import-state} run in-process against an in-memory copy of the illustrative demo library. */
class ImportStateCommandTest {

    private static final String DB_URL = "jdbc:h2:mem:cli-import-state-test;DB_CLOSE_DELAY=-1";

    private static CliRun cli(String... args) {
        return CliRun.against(DB_URL, args);
    }

    @Test
    void agedCurveIsStoredPrintedAndListedWithTheSamplesDetails(@TempDir Path dir) throws Exception {
        assertThat(cli("materials", "--q", "orange").exitCode()).isEqualTo(SieveCli.OK); // seeds the demo library
        long sampleId = thinnestSampleOf("resin-lid-orange");
        Path file = dir.resolve("lid-aged.csv");
        Files.writeString(file, "wavelength_nm,transmittance\n400,0.001\n450,0.002\n500,0.05\n550,0.6\n600,0.8\n");

        CliRun stored = cli("import-state", "--sample", String.valueOf(sampleId), "--state", "aged", "--hours", "2000",
                "--source", "lamp bank B", file.toString());
        CliRun revisions = cli("revisions", "sample", String.valueOf(sampleId));

        assertThat(stored.exitCode()).as(stored.err()).isEqualTo(SieveCli.OK);
        assertThat(stored.out()).startsWith("stored state curve ").contains(" of sample " + sampleId
                + ": aged 2000 h under lamp bank B, 5 points, 400–600 nm, from lid-aged.csv");
        assertThat(stored.out()).contains("states of sample " + sampleId);
        assertThat(revisions.out()).contains("aged 2000 h under lamp bank B");
        assertThat(countStateRows(sampleId)).isEqualTo(1);
    }

    @Test
    void stateCurveIsRetiredAndRestoredByItsIdAndIsNeverCorrected(@TempDir Path dir) throws Exception {
        assertThat(cli("materials", "--q", "orange").exitCode()).isEqualTo(SieveCli.OK); // seeds the demo library
        long sampleId = thinnestSampleOf("resin-lid-amber");
        Path file = dir.resolve("amber-aged.csv");
        Files.writeString(file, "wavelength_nm,transmittance\n400,0.001\n500,0.2\n600,0.8\n");
        CliRun stored = cli("import-state", "--sample", String.valueOf(sampleId), "--state", "aged", "--dose", "50",
                "--dose-nm", "365", file.toString());
        String id = stored.out().replaceFirst("(?s)^stored state curve (\\d+) .*", "$1");

        CliRun retired = cli("retire", "state-curve", id);
        CliRun listed = cli("revisions", "sample", String.valueOf(sampleId));
        CliRun restored = cli("restore", "state-curve", id);
        CliRun corrected = cli("correct", "state-curve", id, "--reason", "typo");

        assertThat(retired.exitCode()).as(retired.err()).isEqualTo(SieveCli.OK);
        assertThat(retired.out()).startsWith("retired state curve " + id + " of sample " + sampleId);
        assertThat(listed.out()).contains("aged 50 J/cm² at 365 nm").contains("retired ");
        assertThat(restored.out()).startsWith("restored state curve " + id);
        assertThat(corrected.exitCode()).isEqualTo(SieveCli.USAGE);
        assertThat(corrected.err()).contains("a state curve is not corrected");
    }

    @Test
    void badValuesAreRefusedByTheirOptionAndAnUnknownSampleExitsOne(@TempDir Path dir) throws Exception {
        Path file = dir.resolve("print.csv");
        Files.writeString(file, "wavelength_nm,transmittance\n350,0.0001\n400,0.0002\n500,0.01\n");

        CliRun noPrinting = cli("import-state", "--sample", "1", "--state", "printed", file.toString());
        CliRun both = cli("import-state", "--sample", "1", "--state", "aged", "--hours", "5", "--dose", "3",
                "--dose-nm", "365", file.toString());
        CliRun missing = cli("import-state", "--sample", "999999", "--state", "printed", "--ink-load", "100",
                file.toString());

        assertThat(noPrinting.exitCode()).isEqualTo(SieveCli.USAGE);
        assertThat(noPrinting.err()).contains("--ink-load:");
        assertThat(both.exitCode()).isEqualTo(SieveCli.USAGE);
        assertThat(both.err()).contains("--dose:").contains("not both");
        assertThat(missing.exitCode()).isEqualTo(SieveCli.FAILED);
        assertThat(missing.err()).contains("not imported: no sample with id 999999");
    }

    private static long thinnestSampleOf(String slug) throws Exception {
        try (Connection c = DriverManager.getConnection(DB_URL, "sa", "");
             ResultSet r = c.createStatement().executeQuery("SELECT s.id FROM sample s JOIN material m ON m.id = s.material_id"
                     + " WHERE m.slug = '" + slug + "' ORDER BY s.thickness_mm LIMIT 1")) {
            assertThat(r.next()).isTrue();
            return r.getLong(1);
        }
    }

    private static int countStateRows(long sampleId) throws Exception {
        try (Connection c = DriverManager.getConnection(DB_URL, "sa", "");
             ResultSet r = c.createStatement().executeQuery("SELECT COUNT(*) FROM sample_state_curve WHERE sample_id = "
                     + sampleId)) {
            r.next();
            return r.getInt(1);
        }
    }
}
