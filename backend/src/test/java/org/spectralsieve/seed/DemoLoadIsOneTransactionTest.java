package org.spectralsieve.seed;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.ResultSet;
import java.util.UUID;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.spectralsieve.SpectralSieveApplication;
import org.springframework.boot.Banner;
import org.springframework.boot.WebApplicationType;
import org.springframework.boot.builder.SpringApplicationBuilder;
import org.springframework.context.ConfigurableApplicationContext;
import tools.jackson.databind.json.JsonMapper;
import tools.jackson.databind.node.ArrayNode;
import tools.jackson.databind.node.ObjectNode;

/**
 * The demo library is stored in one transaction in the running application: a catalogue whose last entry is
 * broken stops the start and leaves the library empty (so the next start loads it again), not with the
 * materials before the broken one; a sound catalogue is stored whole.
 */
class DemoLoadIsOneTransactionTest {

    @Test
    void aBrokenEntryLeavesNothingOfTheDemoLibraryBehind(@TempDir Path seed) throws Exception {
        Path real = Path.of("..", "seed-materials");
        ObjectNode catalogue = (ObjectNode) JsonMapper.builder().build().readTree(real.resolve("catalogue.json").toFile());
        ArrayNode materials = (ArrayNode) catalogue.get("materials");
        ObjectNode broken = (ObjectNode) materials.get(0).deepCopy();
        broken.put("slug", "broken-entry");
        ((ObjectNode) broken.get("samples").get(0)).put("file", "curves/no-such-file.csv");
        materials.add(broken);
        Files.writeString(seed.resolve("catalogue.json"), catalogue.toString());
        Files.createSymbolicLink(seed.resolve("curves"), real.resolve("curves").toAbsolutePath());
        String url = "jdbc:h2:mem:seed-" + UUID.randomUUID() + ";DB_CLOSE_DELAY=-1";

        assertThatThrownBy(() -> start(url, seed.toUri().toString())).hasStackTraceContaining("broken-entry");

        assertThat(count(url, "material")).isZero();
        assertThat(count(url, "sample")).isZero();
    }

    @Test
    void aSoundCatalogueIsStoredWhole() throws Exception {
        String url = "jdbc:h2:mem:seed-" + UUID.randomUUID() + ";DB_CLOSE_DELAY=-1";
        int inCatalogue = JsonMapper.builder().build().readTree(Path.of("..", "seed-materials", "catalogue.json").toFile())
                .get("materials").size();
        try (ConfigurableApplicationContext ignored = start(url, "classpath:seed-materials/")) {
            assertThat(count(url, "material")).isEqualTo(inCatalogue);
        }
    }

    private static ConfigurableApplicationContext start(String url, String location) {
        return new SpringApplicationBuilder(SpectralSieveApplication.class).web(WebApplicationType.NONE)
                .bannerMode(Banner.Mode.OFF).logStartupInfo(false)
                .run("--spring.datasource.url=" + url, "--sieve.seed.load-on-empty=true", "--sieve.seed.location=" + location,
                        "--sieve.index.dir=", "--logging.level.root=WARN");
    }

    private static long count(String url, String table) throws Exception {
        try (Connection c = DriverManager.getConnection(url, "sa", "");
             ResultSet r = c.createStatement().executeQuery("SELECT COUNT(*) FROM " + table)) {
            r.next();
            return r.getLong(1);
        }
    }
}
