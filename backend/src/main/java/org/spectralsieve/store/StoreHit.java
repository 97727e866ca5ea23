package org.spectralsieve.store;

import org.spectralsieve.requirement.Verdict;

/**
 * One material's best sample as the store ranks it. Margins come from the store's quantized OD and
 * single-pass reflection model; the caller re-evaluates returned rows exactly on the stored curve.
 *
 * @param thicknessRangeMm the thicknesses that meet every clause, {lo, hi}; null when thickness is not a
 *                         design variable or no thickness in the allowed range works
 */
public record StoreHit(int curve, long sampleId, StoredMaterial material, Verdict verdict, double worstMarginDecades,
                       double thicknessMm, double[] thicknessRangeMm) {
}
