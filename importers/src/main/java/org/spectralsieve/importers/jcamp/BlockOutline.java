package org.spectralsieve.importers.jcamp;

import java.util.Objects;
import java.util.Optional;
import org.spectralsieve.importers.XUnit;

/**
 * What a person needs to choose a block of a JCAMP-DX file, read without interpreting its values: the
 * number the block option takes ({@link JcampBlock#index()}, a LINK file's outer block being 0), title,
 * point count, wavelength range and the units as the file writes them.
 *
 * @param number  the block's {@link JcampBlock#index()}, as the blocks warning and the block option number it
 * @param fromNm  the shortest wavelength in nm; NaN when XUNITS is missing or unknown (the range cannot be told)
 * @param toNm    the longest wavelength in nm; NaN as {@code fromNm}
 * @param xUnits  {@code ##XUNITS=} as written, "" when absent
 * @param yUnits  {@code ##YUNITS=} as written, "" when absent
 */
public record BlockOutline(int number, String title, int points, double fromNm, double toNm, String xUnits,
                           String yUnits) {

    public BlockOutline {
        Objects.requireNonNull(title, "title");
        Objects.requireNonNull(xUnits, "xUnits");
        Objects.requireNonNull(yUnits, "yUnits");
    }

    /** The outline of a block with data; the x range converted to nm by its XUNITS where they are known. */
    public static BlockOutline of(JcampBlock block) {
        return of(block, Optional.empty());
    }

    /**
     * As {@link #of(JcampBlock)}, the range converted by {@code forcedUnit} when present: a user who overrides
     * a contradictory XUNITS sees the range the import will read, not the one the file's label implies.
     */
    public static BlockOutline of(JcampBlock block, Optional<XUnit> forcedUnit) {
        double[] x = block.x();
        Optional<XUnit> unit = forcedUnit.isPresent() ? forcedUnit
                : block.label(Labels.XUNITS).flatMap(JcampUnits::xUnit);
        double lo = Double.NaN;
        double hi = Double.NaN;
        if (unit.isPresent() && x.length > 0) {
            lo = Double.POSITIVE_INFINITY;
            hi = Double.NEGATIVE_INFINITY;
            for (double v : x) {
                double nm = unit.get().toNanometres(v);
                lo = Math.min(lo, nm);
                hi = Math.max(hi, nm);
            }
            if (!(Double.isFinite(lo) && Double.isFinite(hi))) {
                lo = Double.NaN; // an x of 0 cm⁻¹ has no wavelength: say the range cannot be told
                hi = Double.NaN;
            }
        }
        return new BlockOutline(block.index(), block.title(), x.length, lo, hi,
                block.label(Labels.XUNITS).orElse(""), block.label(Labels.YUNITS).orElse(""));
    }

    /** True when the range in nm is known. */
    public boolean hasRange() {
        return !Double.isNaN(fromNm);
    }
}
