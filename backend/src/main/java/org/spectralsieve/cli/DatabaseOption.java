package org.spectralsieve.cli;

import picocli.CommandLine.Option;

/**
 * The one option every command that reads the library shares. Whatever H2 file URL is given, the library
 * context makes its commits durable before answering (library.H2CommitOnAnswer, docs/durability.md).
 */
final class DatabaseOption {

    @Option(names = "--db-url", paramLabel = "JDBC-URL",
            description = "Library database, e.g. jdbc:h2:file:./data/sieve. Default: the server's"
                    + " (SIEVE_DB_URL, else the H2 file under ./data). An H2 file database writes every"
                    + " commit before answering (WRITE_DELAY 0) unless the URL sets WRITE_DELAY itself.")
    String url;
}
