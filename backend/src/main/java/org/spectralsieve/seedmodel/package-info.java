/**
 * Seed model: a small physical generator for the illustrative demo library.
 *
 * <p>Units and invariants, for every type here:
 * <ul>
 *   <li>wavelengths in nanometres (nm), thickness in millimetres (mm);</li>
 *   <li>absorption coefficients α in 1/mm on the natural-log scale, so the internal transmittance of a
 *       layer of thickness d is K = exp(−α·d) (W. J. Smith, Modern Optical Engineering, eqs. 10.2–10.3);
 *       α is finite and non-negative;</li>
 *   <li>transmittance as a fraction in [0, 1]; external transmittance comes from the incoherent slab
 *       T = (1 − R)²K / (1 − R²K²) with R the normal-incidence Fresnel reflectance in air (Smith eq. 10.5),
 *       so an uncoated regular sample never exceeds 2n/(n²+1);</li>
 *   <li>every curve written from here is modelled and illustrative, not a measurement.</li>
 * </ul>
 * The package is plain Java: no framework type appears here, only the project's own optics core.
 */
package org.spectralsieve.seedmodel;
