/**
 * Optics of plane parallel parts in air at normal incidence, framework-free.
 *
 * <p>Units and invariants:
 * <ul>
 *   <li>Wavelengths in nm (Sellmeier coefficients internally in µm and µm²); thicknesses in mm.</li>
 *   <li>Transmittance, reflectance and internal transmittance K as fractions. K and R lie in [0, 1]
 *       and [0, 1) respectively; a measured T may exceed the lossless ceiling through noise and is then
 *       treated as K = 1.</li>
 *   <li>Refractive indices are real, n >= 1, relative to air (n = 1).</li>
 *   <li>Reflections add incoherently (intensities, not amplitudes): the parts are far thicker than the
 *       coherence length of the sources concerned.</li>
 *   <li>Beer–Lambert applies to internal transmittance only; surface reflections are removed before and
 *       restored after scaling.</li>
 * </ul>
 */
package org.spectralsieve.optics;
