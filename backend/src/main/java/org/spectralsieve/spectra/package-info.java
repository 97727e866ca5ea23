/**
 * Imported reference spectra: emitters (a lamp or LED capture, a solar reference spectrum; relative
 * W/nm) and responses (a photoinitiator's absorbance, a resist's sensitivity, a sensor's responsivity;
 * relative weights) that users bring as files, usable by name wherever a built-in one is.
 *
 * <p>An edge package: it reads files through the importers ({@code SpectrumValues}), stores them with
 * jOOQ ({@link org.spectralsieve.spectra.ReferenceSpectrumRepository}, table {@code reference_spectrum})
 * and turns them into the core's {@code Emitter} and {@code Response}
 * ({@link org.spectralsieve.spectra.ImportedSpectrumLookup}). The weighting core knows nothing of it.
 *
 * <p>Invariants: a stored spectrum has exactly the points the file held (bit-exact; an emitter is cut to
 * the tool's 100–1100 nm when used, not when stored); its name is a lower-case slug, unique per kind and
 * never a built-in name; rows are written or deleted whole, never updated; every refusal is an
 * {@code ImportException} (file, line, field), an {@code IngestException}, an {@code ImportLimitException}
 * or an {@code ImportRequestException} naming the parameter, each a 4xx at the HTTP edge.
 */
package org.spectralsieve.spectra;
