package org.spectralsieve.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.ResultSet;
import org.junit.jupiter.api.Test;
import org.spectralsieve.audit.ActingUser;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * The command line records its changes as {@code command line (<OS user name>)}, and its search names the revisions
 * each row was judged on and the library generation, in the table and in {@code --json}, moving with a correction
 * (docs/audit.md). In-process, on an in-memory copy of the illustrative demo library.
 */
class AuditCommandsTest {

    private static final String DB_URL = "jdbc:h2:mem:cli-audit-test;DB_CLOSE_DELAY=-1";
    private static final String REQUIREMENT = "blocks under 1% at 405 nm, class resin-tank sheet";

    private static CliRun cli(String... args) {
        return CliRun.against(DB_URL, args);
    }

    @Test
    void aChangeMadeOnTheCommandLineIsRecordedAsTheOperatingSystemsUser() throws Exception {
        assertThat(cli("materials", "--q", "green").exitCode()).isEqualTo(SieveCli.OK); // seeds the demo library
        long sampleId = sampleOf("resin-lid-green");

        CliRun retired = cli("retire", "sample", String.valueOf(sampleId));

        assertThat(retired.exitCode()).as(retired.err()).isEqualTo(SieveCli.OK);
        String[] newest = newestEntry();
        assertThat(newest[0]).isEqualTo("command line (" + System.getProperty("user.name") + ")");
        assertThat(newest[1]).isEqualTo("retire");
        assertThat(newest[2]).isEqualTo("sample " + sampleId);
        cli("restore", "sample", String.valueOf(sampleId));
        assertThat(newestEntry()[1]).isEqualTo("restore");
    }

    @Test
    void theCommandLinesActorNamesAnUnknownUserWhenTheSystemGivesNone() {
        assertThat(ActingUser.commandLineName("wren")).isEqualTo("command line (wren)");
        assertThat(ActingUser.commandLineName(" ")).isEqualTo("command line (unknown user)");
        assertThat(ActingUser.commandLineName(null)).isEqualTo("command line (unknown user)");
    }

    @Test
    void aSearchNamesTheRevisionsItUsedAndTheyMoveWithACorrection() throws Exception {
        assertThat(cli("materials", "--q", "amber").exitCode()).isEqualTo(SieveCli.OK);
        long sampleId = sampleOf("resin-lid-amber");
        JsonMapper json = JsonMapper.builder().build();

        JsonNode before = json.readTree(cli("search", REQUIREMENT, "--json", "--limit", "50").out());
        CliRun corrected = cli("correct", "sample", String.valueOf(sampleId), "--lot", "FH-LOT-4", "--reason",
                "lot was swapped");
        JsonNode after = json.readTree(cli("search", REQUIREMENT, "--json", "--limit", "50").out());
        CliRun table = cli("search", REQUIREMENT, "--limit", "50");

        assertThat(corrected.exitCode()).as(corrected.err()).isEqualTo(SieveCli.OK);
        int revisionBefore = rowOf(before, sampleId).path("sampleRevision").asInt();
        assertThat(rowOf(after, sampleId).path("sampleRevision").asInt()).isEqualTo(revisionBefore + 1);
        assertThat(after.path("libraryGeneration").asLong()).isGreaterThan(before.path("libraryGeneration").asLong());
        assertThat(table.out()).contains("revisions: sample " + (revisionBefore + 1) + ", material ")
                .contains("Library generation " + after.path("libraryGeneration").asLong());
    }

    private static JsonNode rowOf(JsonNode answer, long sampleId) {
        for (JsonNode row : answer.path("results")) {
            if (row.path("sampleId").asLong() == sampleId) {
                return row;
            }
        }
        throw new AssertionError("no row for sample " + sampleId + " in " + answer);
    }

    /** actor, action, "kind id" of the newest audit entry. */
    private static String[] newestEntry() throws Exception {
        try (Connection c = DriverManager.getConnection(DB_URL, "sa", "");
             ResultSet r = c.createStatement().executeQuery(
                     "SELECT actor, action, subject_kind, subject_id FROM audit_entry ORDER BY id DESC LIMIT 1")) {
            assertThat(r.next()).isTrue();
            return new String[] {r.getString(1), r.getString(2), r.getString(3) + " " + r.getLong(4)};
        }
    }

    private static long sampleOf(String slug) throws Exception {
        try (Connection c = DriverManager.getConnection(DB_URL, "sa", "");
             ResultSet r = c.createStatement().executeQuery("SELECT s.id FROM sample s JOIN material m ON m.id = s.material_id"
                     + " WHERE m.slug = '" + slug + "' ORDER BY s.thickness_mm LIMIT 1")) {
            assertThat(r.next()).isTrue();
            return r.getLong(1);
        }
    }
}
