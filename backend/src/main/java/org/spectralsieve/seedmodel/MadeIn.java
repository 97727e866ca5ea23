package org.spectralsieve.seedmodel;

import java.util.List;
import java.util.Map;
import java.util.Optional;
import static java.util.Map.entry;

/**
 * The thicknesses each demo material is stocked in and/or made in, by slug, written into the catalogue as
 * {@code madeThicknesses}. Films in µm, sheets and parts in mm. Invented for the illustrative workshop
 * shelf, with sizes as the trade commonly sells them (common practice, no source): float glass 2–19 mm,
 * cast acrylic 2–25 mm, polycarbonate sheet 1–12 mm, PET and FEP films 12–350 µm, polyimide film 25–125 µm.
 * Coated and laminated parts exist only as the part measured. Kept apart from the curve parameters on
 * purpose: these are facts about the stock, not about its spectrum.
 *
 * @param unit  "mm" or "um"
 * @param stock stock sizes, possibly empty
 * @param range {thinnest, thickest} made, null when only the stock sizes exist
 */
public record MadeIn(String unit, List<Double> stock, double[] range) {

    private static MadeIn mm(double[] range, double... stock) {
        return new MadeIn("mm", java.util.Arrays.stream(stock).boxed().toList(), range);
    }

    private static MadeIn um(double[] range, double... stock) {
        return new MadeIn("um", java.util.Arrays.stream(stock).boxed().toList(), range);
    }

    private static double[] range(double lo, double hi) {
        return new double[] {lo, hi};
    }

    private static final Map<String, MadeIn> BY_SLUG = Map.ofEntries(
            entry("clear-float-glass", mm(range(2, 19), 2, 3, 4, 5, 6, 8, 10, 12)),
            entry("low-iron-float-glass", mm(range(3, 19), 4, 6, 8, 10)),
            entry("green-tint-float-glass", mm(range(4, 10), 4, 6, 8)),
            entry("bronze-tint-float-glass", mm(range(4, 10), 4, 6, 8)),
            entry("grey-tint-float-glass", mm(range(4, 10), 4, 6, 8)),
            entry("weathered-float-glass", mm(null, 3)),
            entry("borosilicate-sheet", mm(range(2, 25), 2, 3.3, 5, 8)),
            entry("borosilicate-crown-windows", mm(range(1, 50), 2, 5, 10)),
            entry("dense-flint-glass", mm(range(1, 50), 5, 10)),
            entry("uv-pass-black-glass", mm(range(1, 5), 1, 2, 3)),
            entry("uv-fused-silica", mm(range(0.5, 25), 1, 2, 3, 6)),
            entry("fused-quartz-standard", mm(range(0.5, 20), 1, 2, 3)),
            entry("ozone-free-quartz", mm(range(0.5, 3), 1, 2)),
            entry("cast-acrylic-clear", mm(range(2, 25), 2, 3, 4, 5, 6, 8, 10)),
            entry("extruded-acrylic-clear", mm(range(1.5, 10), 2, 3, 4, 5, 6)),
            entry("uvt-acrylic", mm(range(2, 12), 3, 6)),
            entry("uvt-acrylic-aged", mm(null, 6)),
            entry("uv-filtering-acrylic", mm(range(2, 12), 3, 6)),
            entry("smoked-grey-acrylic", mm(range(2, 8), 3, 5)),
            entry("opal-acrylic-diffuser", mm(range(2, 6), 3)),
            entry("polycarbonate-uv-stabilised", mm(range(1, 12), 2, 3, 4, 6, 8, 10)),
            entry("polycarbonate-unstabilised", mm(range(1, 12), 2, 3)),
            entry("petg-sheet", mm(range(0.5, 6), 1, 2, 3, 5)),
            entry("polystyrene-sheet", mm(range(0.5, 6), 1, 2)),
            entry("ptfe-sheet", mm(range(0.5, 10), 0.5, 1, 2)),
            entry("resin-lid-orange", mm(null, 3, 5)),
            entry("resin-lid-amber", mm(null, 3)),
            entry("resin-lid-red", mm(null, 3)),
            entry("resin-lid-yellow", mm(null, 3)),
            entry("resin-lid-green", mm(null, 3)),
            entry("clear-silicone-sheet", mm(range(0.5, 6), 1, 2, 3)),
            entry("clear-pet-film", um(range(12, 350), 50, 75, 100, 125, 175, 250)),
            entry("fep-film", um(range(12.5, 500), 25, 50, 127, 250)),
            entry("fep-film-fogged", um(null, 127)),
            entry("polyimide-film", um(range(25, 125), 25, 50, 75, 125)),
            entry("matte-drafting-film", um(null, 50, 75, 100)),
            entry("uv-blocking-window-film", um(null, 75)),
            entry("inkjet-film-clear", um(null, 120)),
            entry("red-masking-film", um(null, 112)),
            entry("amber-masking-film", um(null, 112)),
            entry("black-stencil-film", um(null, 112)),
            entry("inkjet-film-printed-black", um(null, 125)),
            entry("toner-transparency-black", um(null, 108)),
            entry("uv-coated-float-glass", mm(null, 4)),
            entry("uv-coated-borosilicate", mm(null, 3.3)),
            entry("low-e-coated-float", mm(null, 4)),
            entry("sunscreen-film-broad-on-quartz", mm(null, 2)),
            entry("sunscreen-film-uvb-on-quartz", mm(null, 2)),
            entry("laminated-glass-pvb", mm(null, 6.38, 8.76)),
            entry("polycarbonate-uv-capped", mm(null, 4)));

    public static Optional<MadeIn> of(String slug) {
        return Optional.ofNullable(BY_SLUG.get(slug));
    }
}
