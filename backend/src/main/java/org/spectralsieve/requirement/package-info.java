/**
 * The requirement language and its evaluation, framework-free.
 *
 * <p>Units: wavelengths in nm, transmittance as a fraction (0..1), thickness in mm, margins in
 * decades (optical-density units): a margin of +1 means the sample beats the threshold by a factor of
 * ten, a negative margin means the clause is missed. A value read at or below a curve's detection limit
 * is an upper bound and never proves that light passes.
 *
 * <p>The text language ({@link org.spectralsieve.requirement.RequirementParser}) holds thresholds as
 * inclusive transmittance fractions whatever the user typed ("over 80%", "OD 3 or more" = T at most
 * 10^-3); its limits (wavelengths 100-3000 nm, thickness above 0 and at most 1000 mm, OD above 0 and at
 * most 10) live in {@link org.spectralsieve.requirement.RequirementLimits}, shared with the JSON form.
 * Every rejected text raises {@link org.spectralsieve.requirement.RequirementSyntaxException} with a
 * 0-based character position.
 */
package org.spectralsieve.requirement;
