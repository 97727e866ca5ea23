package org.spectralsieve.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.ResultSet;
import org.junit.jupiter.api.Test;

/**
 * {@code retire}, {@code restore}, {@code correct} and {@code revisions} run in-process against an in-memory
 * copy of the illustrative demo library (docs/undo.md).
 */
class UndoCommandsTest {

    private static final String DB_URL = "jdbc:h2:mem:cli-undo-test;DB_CLOSE_DELAY=-1";

    private static CliRun cli(String... args) {
        return CliRun.against(DB_URL, args);
    }

    @Test
    void aSampleIsRetiredHiddenFromTheListingRestoredAndCorrectedAsANewRevision() throws Exception {
        assertThat(cli("materials", "--q", "orange").exitCode()).isEqualTo(SieveCli.OK); // seeds the demo library
        long sampleId = thinnestSampleOf("resin-lid-orange");

        CliRun retired = cli("retire", "sample", String.valueOf(sampleId));
        CliRun listed = cli("materials", "--q", "orange");
        CliRun restored = cli("restore", "sample", String.valueOf(sampleId));
        CliRun relisted = cli("materials", "--q", "orange");
        CliRun refused = cli("correct", "sample", String.valueOf(sampleId), "--thickness-mm", "-1", "--reason", "typo");
        CliRun corrected = cli("correct", "sample", String.valueOf(sampleId), "--thickness-mm", "3.1",
                "--reason", "caliper reading replaces the nominal thickness");
        CliRun revisions = cli("revisions", "sample", String.valueOf(sampleId));

        assertThat(retired.exitCode()).as(retired.err()).isEqualTo(SieveCli.OK);
        assertThat(retired.out()).startsWith("retired sample " + sampleId);
        assertThat(listed.out()).contains("resin-tank sheet  5 ");
        assertThat(restored.out()).startsWith("restored sample " + sampleId);
        assertThat(relisted.out()).contains("resin-tank sheet  3, 5 ");
        assertThat(refused.exitCode()).isEqualTo(SieveCli.FAILED);
        assertThat(refused.err()).contains("not corrected: --thickness-mm: must be above 0");
        assertThat(corrected.exitCode()).as(corrected.err()).isEqualTo(SieveCli.OK);
        assertThat(corrected.out()).contains("revision 2");
        assertThat(revisions.out().lines().filter(l -> l.contains("caliper")).findFirst().orElseThrow()).contains("2*");
        assertThat(revisions.out().lines().skip(1).findFirst().orElseThrow()).startsWith("  1 ").contains("  3  ");
    }

    @Test
    void anUnknownKindIsAUsageErrorAndAMissingSampleExitsOne() {
        CliRun kind = cli("retire", "lamp", "7");
        CliRun missing = cli("restore", "sample", "999999");

        assertThat(kind.exitCode()).isEqualTo(SieveCli.USAGE);
        assertThat(kind.err()).contains("sample, material, emitter or response");
        assertThat(missing.exitCode()).isEqualTo(SieveCli.FAILED);
        assertThat(missing.err()).contains("no sample with id 999999");
    }

    private static long thinnestSampleOf(String slug) throws Exception {
        try (Connection c = DriverManager.getConnection(DB_URL, "sa", "");
             ResultSet r = c.createStatement().executeQuery("SELECT s.id FROM sample s JOIN material m ON m.id = s.material_id"
                     + " WHERE m.slug = '" + slug + "' ORDER BY s.thickness_mm LIMIT 1")) {
            assertThat(r.next()).isTrue();
            return r.getLong(1);
        }
    }
}
