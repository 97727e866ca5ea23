/**
 * From an uploaded file to a stored sample.
 *
 * <p>Units: wavelengths in nm (the importers convert µm, Å and cm⁻¹); curves as transmittance
 * fractions (percent and absorbance converted); detection limits as fractions in [0, 1); thickness in
 * mm; file sizes in bytes.
 *
 * <p>Invariants: a preview never writes; a store writes the material (when new), sample, curve and
 * original bytes in one transaction, or nothing; a stored curve has exactly the points the preview
 * parsed; the kept bytes hash to the curve's {@code source_sha256}. Every refusal is one of
 * {@code ImportException} (file, line, field), {@link org.spectralsieve.ingest.IngestException},
 * {@link org.spectralsieve.ingest.ImportLimitException} or
 * {@link org.spectralsieve.ingest.ImportRequestException}, each a 4xx problem at the HTTP edge.
 */
package org.spectralsieve.ingest;
