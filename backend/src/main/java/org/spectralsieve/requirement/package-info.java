/**
 * The requirement language and its evaluation, framework-free.
 *
 * <p>Units: wavelengths in nm, transmittance as a fraction (0..1), thickness in mm, margins in
 * decades (optical-density units): a margin of +1 means the sample beats the threshold by a factor of
 * ten, a negative margin means the clause is missed. A value read at or below a curve's detection limit
 * is an upper bound and never proves that light passes.
 */
package org.spectralsieve.requirement;
