/**
 * The derived, in-memory spectral store that requirement searches scan, framework-free.
 *
 * <p>Every curve is resampled (never extrapolated) onto one common wavelength grid and held
 * wavelength-major: one {@code short[]} column per grid wavelength, one entry per curve, so a clause
 * at one wavelength reads one or two contiguous columns. Each entry is the optical density in steps of
 * {@link org.spectralsieve.store.OdCode#STEP} decades with one flag bit for "upper bound on T" (at or
 * below the detection limit, where the entry is that bound, the larger of value and limit, as the exact
 * judgement reads it; or beyond the code's range). The store is rebuilt from the database,
 * which stays the single source of truth; final answers are re-evaluated exactly on stored curves.
 */
package org.spectralsieve.store;
