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
 *
 * <p>Evaluation (the exact reference; a faster engine must agree with it):
 * <ul>
 *   <li>{@link org.spectralsieve.requirement.ClauseEvaluator} judges one clause on one curve: worst point
 *       of a band, trapezoid mean, cutoff in a window; nothing extrapolated; bounds used as bounds. An
 *       unverified clause carries the margin computed from its bound, or NaN when nothing could be read.
 *       A transmittance clause also gets a confidence ({@link org.spectralsieve.requirement.ClauseConfidence}:
 *       the probability that the true value meets the threshold, Gaussian in absorbance; empty when it cannot
 *       be said), which "… with 95% confidence" can demand (docs/confidence.md).</li>
 *   <li>{@link org.spectralsieve.requirement.ThicknessSolver} treats thickness as a design variable for a
 *       bulk sample: the interval of thicknesses where every clause is proven to hold, and the thickness
 *       maximising the worst margin.</li>
 *   <li>{@link org.spectralsieve.requirement.SampleEvaluator} applies the requirement's thickness rule
 *       to one {@link org.spectralsieve.requirement.Candidate}; {@link org.spectralsieve.requirement.Ranking}
 *       orders the results by {@link org.spectralsieve.requirement.RankingOrder}, one row per material, in the
 *       groups of {@link org.spectralsieve.requirement.Standing} (docs/ranking.md).</li>
 * </ul>
 * Weighted clauses ({@link org.spectralsieve.requirement.WeightedClause}: an emitter's light, a response,
 * erythemal, UV hazard, luminous) and the critical wavelength are judged on integrated figures from
 * {@code weighting} ({@link org.spectralsieve.requirement.FigureClauses}); a fixed layer
 * ({@link org.spectralsieve.requirement.FixedLayer}, resolved by the caller to a
 * {@link org.spectralsieve.requirement.StackLayer}) puts a library part in every candidate's light path
 * ({@link org.spectralsieve.requirement.CandidatePath}). Emitter and response names resolve through the
 * {@code SpectrumLookup} the text is read with, never a static catalogue.
 *
 * <p>Invariants: a MEETS clause has margin >= 0; a sample meets only if every clause meets and misses if
 * any clause misses; expected misses are values with an explanation, never exceptions — exceptions are
 * for invalid input and name the parameter and value.
 */
package org.spectralsieve.requirement;
