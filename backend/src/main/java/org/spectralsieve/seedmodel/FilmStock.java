package org.spectralsieve.seedmodel;

import static org.spectralsieve.seedmodel.MaterialClass.FILM;
import static org.spectralsieve.seedmodel.MaterialClass.MASK_FILM;
import static org.spectralsieve.seedmodel.StockParts.PET;
import static org.spectralsieve.seedmodel.StockParts.PET_INDEX;

import java.util.List;

/**
 * Films and photo-stencil mask films. Photographic and mask bases are 4-mil (≈ 100 µm) polyester [S4];
 * mask films are fixed constructions (base plus a dyed or printed layer).
 */
final class FilmStock {

    private FilmStock() {
    }

    private static final double BASE_MM = 0.1;

    private static Layer petBase() {
        return new Layer("polyester base", BASE_MM, PET);
    }

    static List<MaterialSpec> materials() {
        return List.of(
                // WHY: PET absorbs up to ~320 nm [S31]; uncoated ceiling ≈ 88.6 % (derived, PRACTICE.md §1);
                // measured PET film (0.125 mm) reaches 50 % near 323 nm over a 12 nm 1 %→50 % rise, then climbs
                // slowly to its plateau by about 420 nm (calibrated, docs/demo-library.md).
                Stock.bulk("clear-pet-film", "Clear polyester film, roll stock", FILM,
                        "Biaxially oriented PET film: opaque below about 310 nm, 50 % near 320–325 nm, rising "
                                + "slowly through 330–420 nm to about 88 % in the visible. Modelled.",
                        List.of("PET", "polyester", "film base"), PET_INDEX, PET, 0.05, 0.1, 0.25),
                // WHY: FEP has high UV transmittance; vat film > 92 % when new [S39][S40]; ceiling 95.9 % (n ≈ 1.34).
                Stock.bulk("fep-film", "FEP film, resin-vat and LED-cover stock", FILM,
                        "Clear FEP fluoropolymer film: over 92 % from the UV-A through the visible, still high at "
                                + "254 nm, falling towards 190 nm. Modelled new condition.",
                        List.of("FEP", "fluoropolymer", "resin vat", "LED cover", "254 nm"), new IndexSpec.Constant(1.34),
                        FEP, 0.05, 0.127, 0.25),
                // WHY: vat FEP fogs with use [S40]; fog is scatter, so it costs most in the violet and UV.
                Stock.bulk("fep-film-fogged", "FEP film, ex-vat (fogged by use)", FILM,
                        "The FEP stock after many prints: scatter haze lowers the direct beam, most of all at short "
                                + "wavelengths. Regular geometry. Modelled ageing.",
                        List.of("FEP", "fluoropolymer", "resin vat", "aged", "scattering"), new IndexSpec.Constant(1.34),
                        FEP_FOGGED, 0.127),
                // WHY: polyimide film is amber: opaque through the UV and violet, and its charge-transfer edge is
                // a broad Urbach tail, so even thin film still absorbs at 500–550 nm; 50 % near 505 nm at 25 µm and
                // near 555 nm at 125 µm (from memory of published film curves, no stored source); n ≈ 1.70 from memory.
                Stock.bulk("polyimide-film", "Amber polyimide film, high-temperature tape stock", FILM,
                        "Polyimide film: opaque below about 440 nm, a broad thickness-dependent edge through "
                                + "460–600 nm (50 % near 505 nm at 25 µm, 555 nm at 125 µm), clear in the red. Modelled.",
                        List.of("polyimide", "high temperature", "amber"), new IndexSpec.Constant(1.70),
                        Absorption.of(new UrbachEdge(505, 22, 0.14)), 0.025, 0.05, 0.125),
                // WHY: a matte-coated drafting film is a diffuser: read in total geometry, not rescalable [S47];
                // its base is PET, which absorbs up to ~320 nm [S31].
                Stock.withSamples(Stock.bulk("matte-drafting-film", "Matte drafting film, double-sided", FILM,
                        "Polyester drafting film with a matte coating both sides: diffusing, total geometry, "
                                + "PET edge near 320 nm. Modelled.",
                        List.of("PET", "drafting film", "diffuser", "scattering", "vellum"), PET_INDEX,
                        Absorption.of(StockParts.PET_TEREPHTHALATE_EDGE, StockParts.PET_TAIL, new ScatterLoss(2.0, 0.5)), 0.075),
                        s -> s.withGeometry(Geometry.TOTAL)),
                // WHY: UV-blocking window film stops ~99 % of UV below 380 nm (common practice, no source); the
                // absorber sits in the adhesive, so the film is a fixed construction.
                Stock.fixed("uv-blocking-window-film", "UV-blocking clear window film", FILM,
                        "Clear PET window film whose adhesive carries a UV absorber: under 1 % below about 380 nm, "
                                + "clear in the visible. Modelled free film.",
                        List.of("PET", "window film", "UV-blocking"), PET_INDEX,
                        List.of(Stock.stack(new Layer("polyester film", 0.05, PET),
                                new Layer("UV-absorbing adhesive", 0.025,
                                        Absorption.of(StockParts.uvAbsorber(398, 2500, 0.05)))))),
                // WHY: a clean inkjet-film base passes ~80–88 % across 350–420 nm; its receptive coating lowers
                // this (derived, PRACTICE.md §2).
                Stock.fixed("inkjet-film-clear", "Inkjet positive film, unprinted", FILM,
                        "Clear 100 µm polyester with an ink-receptive coating: about 80–85 % across 350–420 nm. "
                                + "Modelled.",
                        List.of("inkjet film", "film positive", "screen printing", "PET"), PET_INDEX,
                        List.of(Stock.stack(petBase(), receptiveCoating()))),
                // WHY: hand-cut red/amber masking films look transparent but have a UV density ≈ 4 [S3];
                // floor 1e-5 models a double-monochromator reading so OD 4 is still a value.
                maskFilm("red-masking-film", "Red hand-cut masking film",
                        "Red dyed layer on 100 µm polyester: OD about 4 from the UV to 560 nm, clear red.",
                        new LogisticEdge(585, 800, 0.5, 8), 1e-5),
                maskFilm("amber-masking-film", "Amber hand-cut masking film",
                        "Amber dyed layer on 100 µm polyester: OD about 4 from the UV to 500 nm, see-through at 550 nm.",
                        new LogisticEdge(522, 800, 0.5, 6), 1e-5),
                // WHY: a black stencil film is opaque across the UV and visible; dye blacks leak in the near
                // infrared (common practice, no source). Floor 1e-4: only the leak is a value.
                maskFilm("black-stencil-film", "Black photo-stencil film",
                        "Black dyed layer on 100 µm polyester: beyond the floor of the instrument from the UV to "
                                + "about 750 nm, leaking in the near infrared.",
                        new LogisticEdge(790, 1500, 1, 15), 1e-4),
                // WHY: a film positive's printed black should reach OD 3 over 350–420 nm [S3]; inkjet dye blacks
                // sit near it and leak beyond 700 nm (common practice, no source).
                Stock.withSamples(Stock.fixed("inkjet-film-printed-black", "Inkjet positive film, printed solid black",
                        MASK_FILM,
                        "The inkjet film with a solid black at the usual ink load: OD about 3 from the UV to 650 nm, "
                                + "rising transmission beyond 700 nm. Modelled.",
                        List.of("inkjet film", "film positive", "screen printing", "Dmax"), PET_INDEX,
                        List.of(Stock.stack(petBase(), receptiveCoating(),
                                new Layer("printed black ink", 0.005, Absorption.of(new LogisticEdge(690, 1380, 5, 20)))))),
                        s -> s.withDetectionLimit(1e-4)),
                // WHY: copier transparencies are the worst for density, so people double them up [S7].
                Stock.fixed("toner-transparency-black", "Copier transparency, solid toner black", MASK_FILM,
                        "Toner black on copier transparency film: OD about 2, far short of a stencil positive's "
                                + "needs. Modelled.",
                        List.of("transparency", "toner", "film positive", "screen printing"), PET_INDEX,
                        List.of(Stock.stack(petBase(),
                                new Layer("toner layer", 0.008, Absorption.of(new FlatBackground(575)))))));
    }

    /** The resin printer the demo vat film fogged in (invented, Fernhollow workshop). */
    static final String VAT_PRINTER = "Fernhollow resin printer's 405 nm LED array";

    /** FEP as supplied: the fluoropolymer's edge towards 190 nm and a trace background [S39][S40]. */
    private static final Absorption FEP = Absorption.of(new UrbachEdge(190, 4.0, 0.7), new FlatBackground(0.1));

    /** The same film fogged by use: scatter haze out of the direct beam, heavier at short wavelengths [S40]. */
    private static final Absorption FEP_FOGGED = Absorption.of(new UrbachEdge(190, 4.0, 0.7), new FlatBackground(0.1),
            new ScatterLoss(1.2, 1.5));

    /**
     * An inkjet dye black at full (100 %) ink load, 5 µm: OD about 4 through 350–420 nm, falling through the visible
     * (about OD 2.6 at 550 nm, 1.1 at 600 nm) so the print still shows some red; dye blacks leak towards the red (PRACTICE.md §2: a
     * black should reach OD 3, ideally 4, over 350–420 nm [S3]; the visible leak is common practice, no source).
     */
    private static Layer inkjetBlack(double inkLoadPercent) {
        double load = inkLoadPercent / 100;
        return new Layer("printed black ink, " + inkLoadPercent + " % load", 0.005,
                Absorption.of(new LogisticEdge(630, 2000 * load, 30 * load, 40)));
    }

    /** The curves of demo film samples in other states (docs/material-states.md). */
    static List<StateSpec> states() {
        return List.of(
                StateSpec.printed("inkjet-film-clear", 0.12, 100, 4.0,
                        Stock.stack(petBase(), receptiveCoating(), inkjetBlack(100)).withDetectionLimit(1e-5)
                                .withLot(Stock.lot("inkjet-film-clear", 0.12)),
                        "printed solid black at full ink load: OD about 4 over 350–420 nm, some red still passes"
                                + " (PRACTICE.md §2)"),
                StateSpec.printed("inkjet-film-clear", 0.12, 50, null,
                        Stock.stack(petBase(), receptiveCoating(), inkjetBlack(50)).withDetectionLimit(1e-5)
                                .withLot(Stock.lot("inkjet-film-clear", 0.12)),
                        "a lighter print at half the ink load: about half the density, short of OD 3 (PRACTICE.md §2)"),
                StateSpec.aged("fep-film", 0.127, 600, VAT_PRINTER,
                        SampleSpec.bulk(0.127, FEP_FOGGED, Stock.lot("fep-film", 0.127)),
                        "the vat film after 600 h of printing: haze lowers the direct beam across the band, a little"
                                + " more towards the UV (PRACTICE.md §1, [S40])"));
    }

    /** Ink-receptive coating: a little absorption and haze, heavier towards the UV. */
    private static Layer receptiveCoating() {
        return new Layer("ink-receptive coating", 0.02,
                Absorption.of(new FlatBackground(1.5), new ScatterLoss(1.0, 1.0)));
    }

    private static MaterialSpec maskFilm(String slug, String name, String description, LogisticEdge dye,
                                         double detectionLimit) {
        MaterialSpec m = Stock.fixed(slug, name, MASK_FILM, description + " Modelled.",
                List.of("masking film", "mask film", "stencil", "screen printing", "hand-cut"), PET_INDEX,
                List.of(Stock.stack(petBase(), new Layer("dyed masking layer", 0.012, Absorption.of(dye)))));
        return Stock.withSamples(m, s -> s.withDetectionLimit(detectionLimit));
    }
}
