/**
 * The command line of the same jar: {@code search}, {@code export}, {@code materials}, {@code import} and {@code import-spectrum}, each a picocli
 * command that starts the Spring context without a web server, uses the same beans as the HTTP API and
 * prints plain text (or the API's JSON) on stdout and diagnostics on stderr. The read-only {@code materials},
 * {@code search} (table) and {@code figures} first try {@link org.spectralsieve.cli.PlainLibraryServices}: the
 * same services wired in plain Java, taken only when the context would neither migrate, nor load the demo
 * library, nor read a setting it does not ({@link org.spectralsieve.cli.LibraryContext#open});
 * {@code -Dsieve.cli.wiring=spring} keeps the context (docs/command-line-start-up.md).
 *
 * <p>Exit codes: 0 done; 1 understood but cannot be carried out (no such sample, a layer that cannot be
 * rescaled, the database held by another process); 2 the command line cannot be read (bad option, a
 * requirement text that does not parse). Thicknesses are in mm, margins in decades of transmittance.
 */
package org.spectralsieve.cli;
