/**
 * Optics of plane parallel parts in air at normal incidence, framework-free; light at an angle and spread beams in
 * {@link org.spectralsieve.optics.ObliqueIncidence} and {@link org.spectralsieve.optics.BeamSpread}
 * (docs/oblique-incidence.md).
 *
 * <p>Units and invariants:
 * <ul>
 *   <li>Wavelengths in nm (Sellmeier coefficients internally in µm and µm²); thicknesses in mm.</li>
 *   <li>Transmittance, reflectance and internal transmittance K as fractions. K and R lie in [0, 1]
 *       and [0, 1) respectively.</li>
 *   <li>One rescaling rule ({@link org.spectralsieve.optics.SlabReading}), used by every thickness model
 *       of the project: a reading below the lossless ceiling 2n/(n² + 1) by more than its uncertainty
 *       (0.5 %T) is rescaled with the Fresnel surfaces of the stated index and Beer–Lambert; a reading at,
 *       near or above that ceiling shows no absorption the data can resolve, so it keeps its own T through an
 *       effective surface reflectance R' = (1 − T)/(1 + T) (K = 1): continuous in thickness, equal to the
 *       measurement at the measured thickness, never rising. The absorption its uncertainty hides is
 *       extrapolated as an uncertainty; beyond the far thickness (where it reaches 0.01 decades) the
 *       rescaled point is flagged as an upper bound, never a value. Details and checks:
 *       docs/rescaling-model.md.</li>
 *   <li>A stack of measured parts in air satisfies T1·T2 ≤ T ≤ T1·T2/(1 − R1·R2) at every wavelength
 *       (R the parts' reflectances as elements): each element passes exactly its own (rescaled) reading.</li>
 *   <li>Refractive indices are real, n >= 1, relative to air (n = 1).</li>
 *   <li>Reflections add incoherently (intensities, not amplitudes): the parts are far thicker than the
 *       coherence length of the sources concerned.</li>
 *   <li>Beer–Lambert applies to internal transmittance only; surface reflections are removed before and
 *       restored after scaling.</li>
 * </ul>
 */
package org.spectralsieve.optics;
