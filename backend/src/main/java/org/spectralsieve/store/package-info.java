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
 *
 * <p>Beside the columns, per curve: the weighted screen's bins ({@link org.spectralsieve.store.WeightedScreen}) and
 * the exact figures as measured of seven built-in weightings as 16-bit log codes ({@link
 * org.spectralsieve.store.FigureCodes}), computed once from the curve the exact judgement reads; each code holds its
 * figure within one step of 2·10⁻⁴ decades either side (docs/weighted-screening.md, "Figures in the store").
 *
 * <p>The weighted screen by capability: {@link org.spectralsieve.store.WeightedScreen} is the entry point (the bins
 * per curve, the margin bounds of a whole store, and its {@code Query}: the bounds of one clause as measured,
 * thinned, thickened, behind a layer, from the figure codes, and the code pass over blocks of curves, with
 * {@code LayerBins}, a fixed layer's bins); {@link org.spectralsieve.store.WeightedBinsBuilder} fills the bins at
 * store time (a fresh curve, a carried row, a slot without a bound); {@link org.spectralsieve.store.BinCodes} is
 * the one-byte code of a bound on T, the T it stands for and its powers; {@link org.spectralsieve.store.BinShares}
 * is each bin's share of a figure's weight (with a layer's upper readings, and the figure's integration points);
 * {@link org.spectralsieve.store.SurfaceBounds} is what an index says about a curve's surfaces (R_max, R_min, an
 * element's reflectance, the least far factor).
 */
package org.spectralsieve.store;
