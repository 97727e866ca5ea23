/**
 * Spectral curves as immutable values, framework-free.
 *
 * <p>Units and invariants:
 * <ul>
 *   <li>Wavelengths in nanometres (nm), finite, &gt; 0, strictly increasing along a curve.</li>
 *   <li>Transmittance as a fraction (0.25 = 25 %), finite, in [0, 1.5]; values slightly above 1 are
 *       accepted because noise on a clear sample reads high.</li>
 *   <li>Optical density = absorbance = −log10 T (decadic).</li>
 *   <li>Every point has a detection limit (fraction in [0, 1)) and a below-detection flag; a flagged point
 *       is an upper bound, never a value, and anything derived from it stays a bound.</li>
 *   <li>Interpolation is in absorbance between neighbouring points; nothing is extrapolated outside the
 *       measured range.</li>
 *   <li>A curve has at least 2 points. Violations throw {@link org.spectralsieve.spectrum.CurveException}
 *       quoting the index and value.</li>
 * </ul>
 */
package org.spectralsieve.spectrum;
