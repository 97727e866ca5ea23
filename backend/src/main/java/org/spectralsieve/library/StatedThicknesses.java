package org.spectralsieve.library;

import java.util.List;
import org.spectralsieve.optics.PhysicalRanges;

/**
 * The thicknesses a material's record states it exists in: stock thicknesses (mm, possibly none) and/or a
 * made range (mm, both ends NaN when none is stated). Films are stated in mm too (0.025 mm = 25 µm).
 * What a material stating nothing is judged by is the search's rule, not a stored value.
 */
public record StatedThicknesses(List<Double> stockMm, double minMm, double maxMm) {

    /** Stock sizes one material may list: far more than any maker offers, and they fit their column (V4). */
    public static final int MAX_STOCK = 50;

    public static final StatedThicknesses NONE = new StatedThicknesses(List.of(), Double.NaN, Double.NaN);

    public StatedThicknesses {
        stockMm = stockMm.stream().sorted().distinct().toList();
        if (stockMm.size() > MAX_STOCK) {
            throw new IllegalArgumentException("at most " + MAX_STOCK + " stock thicknesses, got " + stockMm.size());
        }
        for (double s : stockMm) {
            PhysicalRanges.requireThicknessMm("a stock thickness", s);
        }
        if (Double.isNaN(minMm) != Double.isNaN(maxMm)) {
            throw new IllegalArgumentException("a made range needs both ends (mm), got " + minMm + " to " + maxMm);
        }
        if (!Double.isNaN(minMm)) {
            PhysicalRanges.requireThicknessMm("the made range's thinnest end", minMm);
            PhysicalRanges.requireThicknessMm("the made range's thickest end", maxMm);
        }
        if (!Double.isNaN(minMm) && !(minMm > 0 && maxMm >= minMm && Double.isFinite(maxMm))) {
            throw new IllegalArgumentException("a made range runs from a thickness > 0 up to one not below it (mm), got "
                    + minMm + " to " + maxMm);
        }
        for (double s : stockMm) {
            if (hasRange() && (s < minMm || s > maxMm)) {
                throw new IllegalArgumentException("stock thickness " + s + " mm lies outside the made range "
                        + minMm + " to " + maxMm + " mm");
            }
        }
    }

    private boolean hasRange() {
        return !Double.isNaN(minMm);
    }

    public boolean rangeStated() {
        return hasRange();
    }

    public boolean stated() {
        return hasRange() || !stockMm.isEmpty();
    }
}
