/**
 * JCAMP-DX 4.24 and 5.01 (the open IUPAC exchange format: McDonald &amp; Wilks 1988, Appl. Spectrosc.
 * 42:151; Lampen et al. 1999, Pure Appl. Chem. 71:1549): {@link
 * org.spectralsieve.importers.jcamp.JcampReader} turns a file into a {@link
 * org.spectralsieve.importers.ParsedSpectrum}, {@link org.spectralsieve.importers.jcamp.JcampWriter}
 * writes one back.
 *
 * <p>Units and invariants: a {@link org.spectralsieve.importers.jcamp.JcampBlock} holds x and y in the
 * file's own units with XFACTOR/YFACTOR applied, in file order, plus the ordinates exactly as written
 * ({@code rawY}). The reader then converts x to nanometres (1/CM by λ = 10⁷/ν̃, no points invented)
 * and reverses the arrays when x ran downwards, so every result has strictly increasing wavelengths.
 * Labels are compared after removing spaces, dashes, slashes and underscores and ignoring case
 * ({@code ##XY DATA} = {@code ##XYDATA}); {@code $$} starts a comment to the end of the line.
 *
 * <p>Every refusal is an {@link org.spectralsieve.importers.ImportException} naming the file, the
 * 1-based line and the JCAMP label at fault (e.g. {@code ##NPOINTS}); no other exception type escapes
 * a read.
 */
package org.spectralsieve.importers.jcamp;
