/**
 * Importers: one reader per open file format, each turning a file into a neutral {@link
 * org.spectralsieve.importers.ParsedSpectrum} or refusing it with one checked {@link
 * org.spectralsieve.importers.ImportException} that names source, line and field. Formats only: no
 * calibration, no material knowledge, no framework, no database.
 *
 * <p>Units and invariants of every result: wavelengths in nanometres (converted from the file's
 * {@link org.spectralsieve.importers.XUnit}), strictly increasing, finite, at least two points; values
 * kept as written with their {@link org.spectralsieve.importers.YKind} (fraction, percent, or decadic
 * absorbance A = −log10 T); a per-point flag marks values that are only upper bounds ("at or below
 * detection"). Numbers are parsed locale-independently (a dot is the decimal mark).
 *
 * <p>Formats here: delimited text ({@link org.spectralsieve.importers.DelimitedTextReader}), including
 * the project's own sieve curve CSV written by {@link org.spectralsieve.importers.DelimitedTextWriter}.
 */
package org.spectralsieve.importers;
