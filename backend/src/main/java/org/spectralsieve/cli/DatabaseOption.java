package org.spectralsieve.cli;

import picocli.CommandLine.Option;

/** The one option every command that reads the library shares. */
final class DatabaseOption {

    @Option(names = "--db-url", paramLabel = "JDBC-URL",
            description = "Library database, e.g. jdbc:h2:file:./data/sieve. Default: the server's"
                    + " (SIEVE_DB_URL, else the H2 file under ./data).")
    String url;
}
