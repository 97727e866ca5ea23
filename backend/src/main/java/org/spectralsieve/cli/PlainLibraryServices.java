package org.spectralsieve.cli;

import com.zaxxer.hikari.HikariConfig;
import com.zaxxer.hikari.HikariDataSource;
import java.sql.SQLException;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import org.flywaydb.core.Flyway;
import org.flywaydb.core.api.MigrationState;
import org.jooq.DSLContext;
import org.jooq.SQLDialect;
import org.jooq.impl.DSL;
import org.jooq.impl.DataSourceConnectionProvider;
import org.jooq.impl.DefaultConfiguration;
import org.spectralsieve.api.WeightingConfiguration;
import org.spectralsieve.audit.ActingUser;
import org.spectralsieve.library.H2CommitOnAnswer;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.LibraryConfiguration;
import org.spectralsieve.library.SampleCurves;
import org.spectralsieve.search.SearchConfiguration;
import org.spectralsieve.search.SearchService;
import org.spectralsieve.search.text.LibraryTextSearch;
import org.spectralsieve.search.text.TextSearchConfiguration;
import org.spectralsieve.spectra.ReferenceSpectrumRepository;
import org.spectralsieve.weighting.SpectrumLookup;
import org.springframework.boot.logging.LogLevel;
import org.springframework.boot.logging.LoggingInitializationContext;
import org.springframework.boot.logging.LoggingSystem;

/**
 * The read-only commands' services wired in plain Java: a connection pool, jOOQ and the very classes the
 * Spring context makes, through the same factory methods its configuration classes call. It skips what a
 * command on an existing library does not need (building a context of ~500 beans: configuration parsing,
 * condition evaluation, the controllers', JSON and validation beans), which was most of a command's second
 * of CPU after the class archive (docs/command-line-start-up.md).
 *
 * <p>It answers only when that is sure to give what the Spring context gives; otherwise {@link #open} returns
 * nothing and the command starts the context, which then does the work itself:
 * <ul>
 *   <li>a setting the context would act on and this wiring would not ({@link PlainWiringSettings#unhonoured});</li>
 *   <li>a schema that Flyway would migrate or refuse: every migration of the program applied and successful,
 *       none pending or unknown, and Flyway's validation (checksums) passes;</li>
 *   <li>an empty library the demo library would be loaded into;</li>
 *   <li>any failure to open the database (e.g. an H2 file held by the server): the context reports it in the
 *       command line's usual words.</li>
 * </ul>
 * Like the context, it makes an H2 file's commits durable first ({@link H2CommitOnAnswer}).
 */
final class PlainLibraryServices implements LibraryServices {

    private final HikariDataSource dataSource;
    private final JooqLibraryRepository repository;
    private final SearchService search;
    private final LibraryTextSearch textSearch;
    private final SpectrumLookup spectra;

    /** Made at once, as the context makes its beans, so that a bad setting is refused before any answer. */
    private PlainLibraryServices(HikariDataSource dataSource, DSLContext db, PlainWiringSettings settings) {
        this.dataSource = dataSource;
        this.repository = new JooqLibraryRepository(db, ActingUser.commandLine()); // read-only commands: none writes
        this.search = SearchConfiguration.newSearchService(repository, settings.curveCacheMb(), settings.judgementLanes());
        this.spectra = WeightingConfiguration.newSpectrumLookup(new ReferenceSpectrumRepository(db, ActingUser.commandLine()));
        this.textSearch = TextSearchConfiguration.newTextSearch(repository, settings.indexFolder());
    }

    /** @param commandLine the settings the Spring context would be given ({@code --name=value}) */
    static Optional<LibraryServices> open(List<String> commandLine) {
        PlainWiringSettings settings = PlainWiringSettings.read(commandLine);
        Optional<String> url = settings.databaseUrl();
        Optional<SQLDialect> dialect = settings.dialect();
        if (!settings.unhonoured().isEmpty() || url.isEmpty() || dialect.isEmpty()) {
            return Optional.empty();
        }
        quietLogging(settings);
        HikariDataSource dataSource = null;
        try {
            dataSource = new HikariDataSource(poolFor(url.get(), settings));
            H2CommitOnAnswer.makeCommitsDurable(dataSource, url.get());
            if (!schemaIsCurrent(dataSource)) {
                dataSource.close();
                return Optional.empty();
            }
            PlainLibraryServices services = new PlainLibraryServices(dataSource, jooq(dataSource, dialect.get()), settings);
            if (settings.loadDemoLibraryWhenEmpty() && services.repository.countMaterials() == 0) {
                services.close();
                return Optional.empty();
            }
            return Optional.of(services);
        } catch (RuntimeException | SQLException e) {
            if (dataSource != null) {
                dataSource.close();
            }
            return Optional.empty();
        }
    }

    /** As Spring Boot's logging start-up does, with the command line's quiet levels (stdout carries the answer). */
    private static void quietLogging(PlainWiringSettings settings) {
        LoggingSystem logging = LoggingSystem.get(PlainLibraryServices.class.getClassLoader());
        logging.beforeInitialize();
        logging.initialize(new LoggingInitializationContext(settings.environment()), null, null);
        for (String[] level : PlainWiringSettings.logLevels()) {
            String logger = level[0].equals("root") ? LoggingSystem.ROOT_LOGGER_NAME : level[0];
            logging.setLogLevel(logger, LogLevel.valueOf(level[1].toUpperCase(Locale.ROOT)));
        }
    }

    /**
     * The pool Spring Boot makes from the same three settings (Hikari, driver found from the URL), except that
     * it opens one connection rather than filling ten: a command uses one or two, and on two cores the filling
     * thread only takes CPU from the command.
     */
    private static HikariConfig poolFor(String url, PlainWiringSettings settings) {
        HikariConfig pool = new HikariConfig();
        pool.setJdbcUrl(url);
        pool.setUsername(settings.databaseUser());
        pool.setPassword(settings.databasePassword());
        pool.setMinimumIdle(1);
        return pool;
    }

    /**
     * True when the Spring context's Flyway migrate would find nothing to do: every migration applied
     * successfully, none pending and none unknown to this program, and the checksums validate.
     */
    private static boolean schemaIsCurrent(HikariDataSource dataSource) {
        Flyway flyway = Flyway.configure(PlainLibraryServices.class.getClassLoader()).dataSource(dataSource).load();
        boolean allApplied = Arrays.stream(flyway.info().all()).allMatch(m -> m.getState() == MigrationState.SUCCESS);
        return allApplied && flyway.validateWithResult().validationSuccessful;
    }

    /** jOOQ as the context configures it: the dialect setting and unquoted names (LibraryConfiguration). */
    private static DSLContext jooq(HikariDataSource dataSource, SQLDialect dialect) {
        DefaultConfiguration configuration = new DefaultConfiguration();
        configuration.set(new DataSourceConnectionProvider(dataSource));
        configuration.set(dialect);
        LibraryConfiguration.renderNamesUnquoted(configuration);
        return DSL.using(configuration);
    }

    @Override
    public JooqLibraryRepository repository() {
        return repository;
    }

    @Override
    public SearchService search() {
        return search;
    }

    @Override
    public LibraryTextSearch textSearch() {
        return textSearch;
    }

    @Override
    public SpectrumLookup spectra() {
        return spectra;
    }

    @Override
    public SampleCurves sampleCurves() {
        return new SampleCurves(repository);
    }

    @Override
    public String wiring() {
        return "plain";
    }

    @Override
    public void close() {
        try {
            textSearch.close();
        } finally {
            dataSource.close();
        }
    }
}
