/**
 * Weighted figures: what of a source's light, weighted by a response, passes a stored curve.
 *
 * <p>Units and invariants:
 * <ul>
 *   <li>Wavelengths in nanometres (nm). Emitter spectra are relative spectral power (W/nm, any scale);
 *       responses are relative weights (dimensionless, 1 at their maximum unless the source says
 *       otherwise). Both are zero outside their stated range and never negative.</li>
 *   <li>Integrals use the trapezoid rule on a uniform grid from the response's range start: 1 nm, or the
 *       emitter's finer step when it has narrow lines ({@link org.spectralsieve.weighting.Emitter#stepNm()}).
 *       Two figures follow their standards' plain sums on a fixed grid instead: luminous transmittance
 *       (the 5 nm rows of the shipped CIE tables, 380-780 nm) and UPF (1 nm, 290-400 nm).</li>
 *   <li>Curves are read through {@code Curve.transmittanceAt} and never extrapolated: a figure whose range
 *       the curve does not cover is "not available" with the reason, never a guess.</li>
 *   <li>A figure that used a point below the detection limit is a bound (see
 *       {@link org.spectralsieve.weighting.Figure.Bound}), never a plain value.</li>
 *   <li>Tables are plain text files under {@code weighting/} on the class path, read by
 *       {@link org.spectralsieve.weighting.WeightingTable}, which fails with file:line.</li>
 * </ul>
 */
package org.spectralsieve.weighting;
