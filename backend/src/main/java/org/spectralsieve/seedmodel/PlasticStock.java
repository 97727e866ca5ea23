package org.spectralsieve.seedmodel;

import static org.spectralsieve.seedmodel.MaterialClass.OTHER;
import static org.spectralsieve.seedmodel.MaterialClass.PLASTIC_SHEET;
import static org.spectralsieve.seedmodel.MaterialClass.RESIN_TANK_SHEET;
import static org.spectralsieve.seedmodel.StockParts.PC_INDEX;
import static org.spectralsieve.seedmodel.StockParts.PC_UNSTABILISED;
import static org.spectralsieve.seedmodel.StockParts.PMMA_INDEX;
import static org.spectralsieve.seedmodel.StockParts.STANDARD_ACRYLIC;
import static org.spectralsieve.seedmodel.StockParts.UV_ABSORBER_ALPHA_PER_MM;
import static org.spectralsieve.seedmodel.StockParts.acrylicWith;

import java.util.List;

/**
 * Plastic sheet stock, tinted resin-tank sheets and other bulk polymers. Thicknesses are sheet stock
 * sizes (PRACTICE.md §6 #36 acrylic, #37 polycarbonate).
 */
final class PlasticStock {

    private PlasticStock() {
    }

    /** UVT acrylic as supplied: no UV absorber, only the polymer's own edge [S26]. */
    private static final Absorption UVT_ACRYLIC = Absorption.of(new LogisticEdge(280, 50, 0.0015, 30));

    /**
     * The same sheet after about 2,000 h under lamps: colour centres absorbing most on the UV-B side (300 nm) and a
     * weaker, broad yellowing band reaching into the violet (360 nm), so the loss is largest near the cut-off, the
     * cut-off moves to longer wavelengths and the visible barely changes (PRACTICE.md §1 "Solarization / yellowing",
     * [S22][S24]; the band sizes are a modelled illustration, not a dose law).
     */
    private static final Absorption UVT_ACRYLIC_AGED = Absorption.of(new LogisticEdge(280, 50, 0.0015, 30),
            new GaussianBand(300, 0.10, 60), new GaussianBand(360, 0.02, 80));

    /** The lamp bank the demo lamp cover aged under (invented, Fernhollow workshop). */
    static final String TUNNEL_LAMP_BANK = "Fernhollow curing-tunnel lamp bank A (medium-pressure mercury)";

    /** The curves of demo plastic samples in other states (docs/material-states.md). */
    static List<StateSpec> states() {
        return List.of(StateSpec.aged("uvt-acrylic", 6, 2000, TUNNEL_LAMP_BANK,
                SampleSpec.bulk(6, UVT_ACRYLIC_AGED, Stock.lot("uvt-acrylic", 6)),
                "the lamp cover after 2,000 h: UV-B lost first, the cut-off moved longer, the visible nearly unchanged"
                        + " (PRACTICE.md §1, common practice)"));
    }

    static List<MaterialSpec> materials() {
        return List.of(
                // WHY: standard acrylic passes little below 345 nm, thickness-dependent 345–395 nm, ~92 % above
                // [S25][S27]; "little" is a few % through 280–340 nm at 3 mm, as measured clear sheet shows
                // (calibrated: StockParts.STANDARD_ACRYLIC, docs/demo-library.md).
                Stock.bulk("cast-acrylic-clear", "Clear cast acrylic sheet, general stock", PLASTIC_SHEET,
                        "Standard clear cast PMMA: a few % through 280–340 nm at 3 mm, closing with thickness, "
                                + "rising through 345–395 nm to about 92 % through the visible. Modelled.",
                        List.of("acrylic", "PMMA", "cast", "clear"), PMMA_INDEX, STANDARD_ACRYLIC, 2, 3, 6),
                // WHY: another practitioner puts the acrylic cut at ~360–375 nm [S27] (PRACTICE §6 #6); the
                // extruded stock carries a slightly heavier stabiliser band, moved 5 nm longer (common practice,
                // no source), so its 3 mm 50 % point sits near 378 nm.
                Stock.bulk("extruded-acrylic-clear", "Clear extruded acrylic sheet, offcut bin", PLASTIC_SHEET,
                        "Extruded PMMA with a slightly later UV edge than the cast stock (passes above about "
                                + "375 nm). Modelled.",
                        List.of("acrylic", "PMMA", "extruded", "clear"), PMMA_INDEX,
                        new Absorption(List.of(StockParts.PMMA_INTRINSIC_EDGE, StockParts.ACRYLIC_STABILISER_UVB_BAND,
                                new GaussianBand(349, 1.0, 38), new FlatBackground(0.0015))), 2, 3, 5),
                // WHY: UVT acrylic begins to transmit ~250 nm, ≈ 80 % at 300 nm, ≈ 92 % at 400 nm [S26].
                Stock.bulk("uvt-acrylic", "UV-transmitting cast acrylic, lamp-cover grade", PLASTIC_SHEET,
                        "Cast PMMA without UV absorber: transmission from about 250 nm, around 80 % at 300 nm; "
                                + "little thickness effect above 320 nm. Modelled.",
                        List.of("acrylic", "PMMA", "UVT", "UV-B", "lamp cover"), PMMA_INDEX, UVT_ACRYLIC, 3, 6),
                // WHY: UVT sheet degrades over 2,000–5,000 h, UV-B lost before UV-A; thick sheet grows a
                // "yellow core" [S22][S24].
                Stock.bulk("uvt-acrylic-aged", "UV-transmitting acrylic, ex-lamp cover (about 2,000 h)", PLASTIC_SHEET,
                        "The UVT grade after long lamp exposure: UV-B loss first, a yellowing tail into the violet. "
                                + "Modelled ageing, not a dose law.",
                        List.of("acrylic", "PMMA", "UVT", "aged", "solarised"), PMMA_INDEX, UVT_ACRYLIC_AGED, 6),
                // WHY: UV-filtering acrylic absorbs ~98 % of UV and cuts at 390–400 nm [S25][S27]; measured
                // UV-absorbing sheet (3 mm) reaches 50 % near 389 nm over a 12 nm 1 %→50 % rise and is clear from
                // 420 nm, so the blue tail [S27] mentions is left out (calibrated, docs/demo-library.md).
                Stock.bulk("uv-filtering-acrylic", "UV-filtering acrylic, framing grade", PLASTIC_SHEET,
                        "PMMA with a strong UV absorber: under 1 % to about 377 nm, 50 % near 389 nm at 3 mm, "
                                + "clear from about 420 nm. Easy to mistake for clear sheet. Modelled.",
                        List.of("acrylic", "PMMA", "UV-blocking", "framing", "museum"), PMMA_INDEX,
                        Absorption.of(new LogisticEdge(400, UV_ABSORBER_ALPHA_PER_MM, 1e-5, 19),
                                new FlatBackground(0.0003)), 3, 6),
                // WHY: grey acrylic is a dyed standard acrylic: neutral in the visible, clearer in the near
                // infrared (common practice, no source).
                Stock.bulk("smoked-grey-acrylic", "Smoked grey acrylic sheet", PLASTIC_SHEET,
                        "Transparent grey cast PMMA: about 40 % in the visible at 3 mm, the standard acrylic UV "
                                + "edge, rising again beyond 750 nm. Modelled.",
                        List.of("acrylic", "PMMA", "tinted", "grey"), PMMA_INDEX,
                        acrylicWith(new GaussianBand(520, 0.25, 400), new FlatBackground(0.05)), 3),
                // WHY: opal sheet is pigment-filled, so it scatters, must be read as total transmittance, and
                // cannot be rescaled by Beer–Lambert [S47].
                Stock.withSamples(Stock.bulk("opal-acrylic-diffuser", "Opal white acrylic diffuser", PLASTIC_SHEET,
                        "White opal PMMA for light boxes: scatter loss, standard acrylic edge. Total geometry; "
                                + "thickness rescaling not valid. Modelled.",
                        List.of("acrylic", "PMMA", "diffuser", "opal", "scattering"), PMMA_INDEX,
                        acrylicWith(new ScatterLoss(0.25, 0.6)), 3),
                        s -> s.withGeometry(Geometry.TOTAL)),
                // WHY: UV-stabilised polycarbonate blocks ~100 % up to ~380 nm [S29]; 3 mm passes tens of % at
                // 405 nm (common practice, no source); measured UV-stabilised sheet (3 mm) reaches 50 % near 399 nm
                // over a 13 nm 1 %→50 % rise and about 87 % in the visible (calibrated, docs/demo-library.md).
                Stock.bulk("polycarbonate-uv-stabilised", "Clear polycarbonate sheet, UV-stabilised", PLASTIC_SHEET,
                        "General-purpose clear PC with UV absorber: nearly opaque to 385 nm, 50 % near 400 nm at "
                                + "3 mm, so it does not block 405 nm. Modelled.",
                        List.of("polycarbonate", "PC", "UV-stabilised", "enclosure", "face shield"), PC_INDEX,
                        Absorption.of(new LogisticEdge(399.5, UV_ABSORBER_ALPHA_PER_MM, 7e-4, 16.5),
                                new FlatBackground(0.0075)), 2, 3, 6),
                // WHY: PC without UV absorber (food-contact grades) blocks only below ~290 nm [S30].
                Stock.bulk("polycarbonate-unstabilised", "Clear polycarbonate sheet, food-contact grade", PLASTIC_SHEET,
                        "PC with no UV absorber: passes UVA and part of UVB, blocks below about 290 nm. Yellows "
                                + "in use. Modelled.",
                        List.of("polycarbonate", "PC", "no UV absorber"), PC_INDEX, PC_UNSTABILISED, 2, 3),
                // WHY: PETG is a terephthalate copolyester, absorbing below ~320 nm like PET [S31] (common practice).
                Stock.bulk("petg-sheet", "Clear PETG sheet, thermoforming stock", PLASTIC_SHEET,
                        "Copolyester sheet: edge near 320 nm, about 89 % in the visible. Modelled.",
                        List.of("PETG", "copolyester", "thermoforming"), new IndexSpec.Constant(1.57),
                        Absorption.of(new LogisticEdge(318, 60, 0.002, 5), new FlatBackground(0.003)), 1, 2, 3),
                // WHY: polystyrene's aromatic absorption gives an edge near 290 nm (common practice, no source).
                Stock.bulk("polystyrene-sheet", "Clear polystyrene sheet, display stock", PLASTIC_SHEET,
                        "General-purpose polystyrene: edge near 290 nm, n about 1.59. Modelled.",
                        List.of("polystyrene", "PS"), new IndexSpec.Constant(1.59),
                        Absorption.of(new LogisticEdge(292, 60, 0.002, 6), new FlatBackground(0.003)), 1, 2),
                // WHY: PTFE passes ≈ 60 % at 254 nm as a thin sleeve and scatters; not an imaging window [S32].
                Stock.withSamples(Stock.bulk("ptfe-sheet", "PTFE sheet, skived", PLASTIC_SHEET,
                        "White skived PTFE: a diffuser through the UV-C, roughly 60 % at 254 nm at 0.5 mm. "
                                + "Total geometry; thickness rescaling not valid. Modelled.",
                        List.of("PTFE", "fluoropolymer", "diffuser", "scattering", "254 nm"), new IndexSpec.Constant(1.35),
                        Absorption.of(new ScatterLoss(0.8, 0.3), new FlatBackground(0.01)), 0.5, 1),
                        s -> s.withGeometry(Geometry.TOTAL)),
                // WHY (all tinted sheets below): resin-printer lids are tinted acrylic that must stop the
                // printer's 405 nm; orange/red cut at ~520–600 nm, yellow at ~480–500 nm, green is a notch
                // that may leak deep red (PRACTICE.md §3, [S10]; colours common practice, no source).
                resinSheet("resin-lid-orange", "Orange resin-printer lid sheet",
                        "Orange-tinted cast acrylic: under 1 % from the UV to about 520 nm, clear in the red.",
                        new LogisticEdge(545, 15, 0.002, 8), 3, 5),
                resinSheet("resin-lid-amber", "Amber resin-printer lid sheet",
                        "Amber-tinted cast acrylic: blocks to about 500 nm, passes yellow and red.",
                        new LogisticEdge(510, 12, 0.002, 8), 3),
                resinSheet("resin-lid-red", "Red resin-printer lid sheet",
                        "Red-tinted cast acrylic: blocks to about 590 nm.",
                        new LogisticEdge(598, 15, 0.002, 7), 3),
                resinSheet("resin-lid-yellow", "Yellow resin-printer lid sheet",
                        "Yellow-tinted cast acrylic: blocks to about 480 nm; the most see-through of the lids.",
                        new LogisticEdge(478, 12, 0.002, 7), 3),
                Stock.withSamples(Stock.bulk("resin-lid-green", "Green resin-printer lid sheet", RESIN_TANK_SHEET,
                        "Green-tinted cast acrylic: a pass band around 500–560 nm, blocks the violet and the red, "
                                + "leaks deep red beyond about 720 nm. Modelled.",
                        List.of("acrylic", "tinted", "resin printer", "405 nm", "green"), PMMA_INDEX,
                        acrylicWith(new LogisticEdge(480, 12, 0.002, 8),
                                new GaussianBand(650, 3.0, 100), new FlatBackground(0.002)), 3),
                        s -> s.startingAt(250)),
                // WHY: optically clear silicone passes deep into the UV and serves as LED optics up to ~200 °C
                // [S38]; n ≈ 1.41 (common practice, no source).
                Stock.bulk("clear-silicone-sheet", "Optically clear silicone sheet", OTHER,
                        "Clear cast silicone: passes well down to about 280 nm, some 254 nm at 1 mm. Modelled.",
                        List.of("silicone", "LED optics", "flexible"), new IndexSpec.Constant(1.41),
                        Absorption.of(new UrbachEdge(254, 0.3, 0.325), new FlatBackground(0.003)), 1, 2, 3));
    }

    /** A tinted cast-acrylic lid sheet: standard acrylic body plus one dye edge; measured from 250 nm. */
    private static MaterialSpec resinSheet(String slug, String name, String description, LogisticEdge dye,
                                           double... thicknessesMm) {
        MaterialSpec m = Stock.bulk(slug, name, RESIN_TANK_SHEET, description + " Modelled.",
                List.of("acrylic", "tinted", "resin printer", "405 nm"), PMMA_INDEX,
                acrylicWith(dye, new FlatBackground(0.002)), thicknessesMm);
        return Stock.withSamples(m, s -> s.startingAt(250));
    }
}
