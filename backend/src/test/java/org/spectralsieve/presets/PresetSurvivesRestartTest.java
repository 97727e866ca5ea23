package org.spectralsieve.presets;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Path;
import org.flywaydb.core.Flyway;
import org.h2.jdbcx.JdbcDataSource;
import org.jooq.DSLContext;
import org.jooq.SQLDialect;
import org.jooq.impl.DSL;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.spectralsieve.audit.ActingUser;
import org.spectralsieve.requirement.RequirementParser;

/** A saved preset, and its retirement, are there after the H2 file database is closed and opened again. */
class PresetSurvivesRestartTest {

    @TempDir
    Path folder;

    private DSLContext open() {
        JdbcDataSource ds = new JdbcDataSource();
        // closed when its last connection closes, as when the process stops: the next open reads the file again
        ds.setURL("jdbc:h2:file:" + folder.resolve("library") + ";DB_CLOSE_DELAY=0");
        ds.setUser("sa");
        Flyway.configure().dataSource(ds).load().migrate();
        return DSL.using(ds, SQLDialect.H2);
    }

    @Test
    void aSavedPresetAndARetiredOneAreAsLeftAfterReopening() {
        PresetStore before = new PresetStore(open(), ActingUser.named("wren"));
        SavedPreset kept = before.create(null, new PresetDraft("Fernhollow window", "passes over 85% from 380 to 410 nm",
                "illustrative").checked("", RequirementParser::parse));
        SavedPreset gone = before.create(null, new PresetDraft("Old lid", "blocks under 1% from 300 to 500 nm", "")
                .checked("", RequirementParser::parse));
        before.retire(gone.id());

        PresetStore after = new PresetStore(open(), ActingUser.named("wren"));
        assertThat(after.visibleTo(PresetCaller.LOCAL)).containsExactly(kept);
        SavedPreset next = after.create(null, new PresetDraft("Old lid", "blocks under 1% from 300 to 500 nm", "")
                .checked("", RequirementParser::parse));
        assertThat(next.id()).isGreaterThan(gone.id());
    }
}
