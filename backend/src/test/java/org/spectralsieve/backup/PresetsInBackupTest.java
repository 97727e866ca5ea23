package org.spectralsieve.backup;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.OutputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import org.jooq.DSLContext;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.spectralsieve.accounts.Account;
import org.spectralsieve.accounts.AccountAdministration;
import org.spectralsieve.accounts.Role;
import org.spectralsieve.library.db.Tables;
import org.spectralsieve.presets.PresetCaller;
import org.spectralsieve.presets.PresetDraft;
import org.spectralsieve.presets.PresetLibrary;
import org.springframework.context.ConfigurableApplicationContext;

/**
 * Stored presets travel in a backup (docs/presets.md): restored into an empty database they come back with their
 * ids and owners. Restored into a server that keeps its own accounts (the archive's are left out, and the same account
 * id may be someone else there), a private preset is kept retired and owned by nobody: never shown to a stranger.
 */
class PresetsInBackupTest {

    @TempDir
    Path folder;

    @Test
    void presetsComeBackWithTheirIdsAndAPrivateOneIsNeverHandedToAServersOwnAccount() throws Exception {
        Path archive = folder.resolve("with-presets.zip");
        long sharedId;
        long privateId;
        try (ConfigurableApplicationContext source = LibraryApp.h2("presets-source", false)) {
            Account wren = source.getBean(AccountAdministration.class).createAccount("wren", Role.VIEWER, "larkspur-lane-bench-7");
            PresetLibrary presets = source.getBean(PresetLibrary.class);
            sharedId = presets.create(PresetCaller.LOCAL, new PresetDraft("Fernhollow cover",
                    "passes over 85% from 380 to 410 nm", "illustrative"), false).id();
            privateId = presets.create(PresetCaller.account(wren.id(), false), new PresetDraft("Wren lid",
                    "blocks under 1% from 300 to 500 nm", ""), false).id();
            try (OutputStream out = Files.newOutputStream(archive)) {
                source.getBean(LibraryBackup.class).write(out);
            }
        }

        try (ConfigurableApplicationContext fresh = LibraryApp.h2("presets-fresh", false)) {
            fresh.getBean(LibraryRestore.class).restore(archive);
            DSLContext db = fresh.getBean(DSLContext.class);
            assertThat(db.select(Tables.REQUIREMENT_PRESET.ID).from(Tables.REQUIREMENT_PRESET).orderBy(Tables.REQUIREMENT_PRESET.ID)
                    .fetch(Tables.REQUIREMENT_PRESET.ID)).containsExactly(sharedId, privateId);
            assertThat(fresh.getBean(PresetLibrary.class).find(PresetCaller.LOCAL, "Fernhollow cover").id()).isEqualTo(sharedId);
        }

        try (ConfigurableApplicationContext server = LibraryApp.h2("presets-own-admin", false)) {
            // the server's admin gets account id 1, as wren had in the archive
            Account admin = server.getBean(AccountAdministration.class).createAccount("juniper-admin", Role.ADMIN,
                    "fernhollow-ledger-42");
            server.getBean(LibraryRestore.class).restore(archive);
            DSLContext db = server.getBean(DSLContext.class);
            var row = db.selectFrom(Tables.REQUIREMENT_PRESET).where(Tables.REQUIREMENT_PRESET.ID.eq(privateId)).fetchOne();
            assertThat(row.getOwnerAccountId()).isNull();
            assertThat(row.getRetiredAt()).as("kept, retired").isNotNull();
            PresetLibrary presets = server.getBean(PresetLibrary.class);
            assertThat(presets.list(PresetCaller.account(admin.id(), true))).extracting(p -> p.name())
                    .contains("Fernhollow cover").doesNotContain("Wren lid");
        }
    }
}
