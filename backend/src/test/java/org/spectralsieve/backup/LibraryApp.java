package org.spectralsieve.backup;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.atomic.AtomicInteger;
import org.spectralsieve.SpectralSieveApplication;
import org.springframework.boot.Banner;
import org.springframework.boot.WebApplicationType;
import org.springframework.boot.builder.SpringApplicationBuilder;
import org.springframework.context.ConfigurableApplicationContext;

/** The application without its web server, on a database of the test's choosing (one context per library). */
final class LibraryApp {

    private static final AtomicInteger NEXT = new AtomicInteger();

    private LibraryApp() {
    }

    /** A new private in-memory H2 library; {@code demo} loads the illustrative demo library into it. */
    static ConfigurableApplicationContext h2(String label, boolean demo) {
        return start("jdbc:h2:mem:backup-" + label + "-" + NEXT.incrementAndGet() + ";DB_CLOSE_DELAY=-1", demo,
                List.of());
    }

    static ConfigurableApplicationContext start(String url, boolean demo, List<String> more) {
        List<String> args = new ArrayList<>(List.of("--spring.datasource.url=" + url,
                "--sieve.seed.load-on-empty=" + demo, "--logging.level.root=WARN"));
        args.addAll(more);
        return new SpringApplicationBuilder(SpectralSieveApplication.class)
                .web(WebApplicationType.NONE)
                .bannerMode(Banner.Mode.OFF)
                .logStartupInfo(false)
                .run(args.toArray(String[]::new));
    }
}
