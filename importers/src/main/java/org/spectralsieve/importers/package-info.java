/**
 * Importers: one reader per open file format, each turning a file into a neutral {@link
 * org.spectralsieve.importers.ParsedSpectrum} or refusing it with one checked {@link
 * org.spectralsieve.importers.ImportException} that names source, line and field. Formats only: no
 * calibration, no material knowledge, no framework, no database.
 *
 * <p>Units and invariants of every result: wavelengths in nanometres (converted from the file's
 * {@link org.spectralsieve.importers.XUnit}: nm, µm, Å, or cm⁻¹ as λ = 10⁷/ν̃, which keeps a uniform
 * wavenumber grid's points and invents none), strictly increasing (descending files are reversed with a
 * note; files that change direction are refused naming each turning line), finite, at least two points;
 * values kept as written with their {@link org.spectralsieve.importers.YKind} (fraction, percent, or
 * decadic absorbance A = −log10 T); a per-point flag marks values that are only upper bounds ("at or
 * below detection"). Numbers are parsed locale-independently; a decimal comma is detected from the data
 * or set in {@link org.spectralsieve.importers.ReadOptions}.
 *
 * <p>Formats here:
 * <ul>
 *   <li>delimited text ({@link org.spectralsieve.importers.DelimitedTextReader}): comma, semicolon, tab,
 *       blanks or mixed; preambles and {@code #} metadata; replicate columns
 *       ({@link org.spectralsieve.importers.Replicates}); the project's own sieve curve CSV written by
 *       {@link org.spectralsieve.importers.DelimitedTextWriter};</li>
 *   <li>raw detector counts ({@link org.spectralsieve.importers.RawCountsReader} → {@link
 *       org.spectralsieve.importers.RawCounts} → {@link org.spectralsieve.importers.RawCountsResult}):
 *       one file with a wavelength column and {@code dark}, {@code reference}, {@code sample} columns
 *       (optionally {@code sample_10ms}, repeated {@code dark.1}, {@code dark.2}), or one file per capture
 *       ({@code # role: dark}, column {@code counts}); {@code # exposure_ms: 100}, {@code # scans: 10}.
 *       T = ((S − D)/t_S)/((R − D)/t_R), each dark at its capture's exposure; per-point detection limit
 *       3σ_dark/(R − D) scaled for exposure and scans, or the stray-light floor when larger; saturated
 *       points excluded; several exposures combined point by point (see {@code RawTransmittance});</li>
 *   <li>relative spectra ({@link org.spectralsieve.importers.DelimitedValuesReader}, {@code
 *       JcampReader.readValues} → {@link org.spectralsieve.importers.SpectrumValues}): a source's power or
 *       a response's weights, the same layouts and x units as above, values kept as written (no percent
 *       guess, no absorbance conversion), negative values and all-zero spectra refused;</li>
 *   <li>datasheet points ({@link org.spectralsieve.importers.DatasheetPointsReader}): sparse points read
 *       off a graph, stored as given, provenance "datasheet"; the backend interpolates them in absorbance.</li>
 * </ul>
 */
package org.spectralsieve.importers;
