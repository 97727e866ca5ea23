package org.spectralsieve.seedmodel;

import static org.spectralsieve.seedmodel.MaterialClass.COATING;
import static org.spectralsieve.seedmodel.MaterialClass.LAMINATE;
import static org.spectralsieve.seedmodel.StockParts.CLEAR_FLOAT;
import static org.spectralsieve.seedmodel.StockParts.PC_INDEX;
import static org.spectralsieve.seedmodel.StockParts.PC_UNSTABILISED;
import static org.spectralsieve.seedmodel.StockParts.SODA_LIME_INDEX;

import java.util.List;
import org.spectralsieve.optics.SellmeierIndex;

/** Fixed constructions: coatings on glass or quartz, laminates. None of them can be rescaled by thickness. */
final class LayeredStock {

    private LayeredStock() {
    }

    private static final Absorption BOROSILICATE =
            Absorption.of(new UrbachEdge(285, 1.0, 0.12), new IronBand(0.05), new FlatBackground(0.0008));
    private static final Absorption UV_FUSED_SILICA =
            Absorption.of(new UrbachEdge(175, 1.0, 0.15), new FlatBackground(0.0003));

    /**
     * Clear lacquer with a UV absorber; blocks under 1 % below about 380 nm at 5 µm. The edge has the
     * calibrated absorber slope (StockParts.uvAbsorber), so the lacquer already takes some 20 % at 405 nm.
     */
    private static Layer uvBlockingLacquer() {
        return new Layer("UV-absorbing lacquer", 0.005, Absorption.of(StockParts.uvAbsorber(404, 2500, 0.5)));
    }

    static List<MaterialSpec> materials() {
        return List.of(
                // WHY: a UV-blocking coating turns a window into a blocker below ~380 nm (common practice, no
                // source); the glass under it is the clear float body (window glass blocks UVB [S27]).
                Stock.fixed("uv-coated-float-glass", "Clear float glass with UV-blocking lacquer", COATING,
                        "4 mm clear float with a 5 µm UV-absorbing lacquer: under 1 % below about 380 nm. Modelled.",
                        List.of("coating", "UV-blocking", "float", "viewing window"), SODA_LIME_INDEX,
                        List.of(Stock.stack(new Layer("clear float glass", 4, CLEAR_FLOAT), uvBlockingLacquer()))),
                Stock.fixed("uv-coated-borosilicate", "Borosilicate with UV-blocking lacquer", COATING,
                        "3.3 mm borosilicate with the same UV-absorbing lacquer: a heat-tolerant viewing window "
                                + "that blocks below about 380 nm. Modelled.",
                        List.of("coating", "UV-blocking", "borosilicate", "viewing window"), new IndexSpec.Constant(1.47),
                        List.of(Stock.stack(new Layer("borosilicate glass", 3.3, BOROSILICATE), uvBlockingLacquer()))),
                // WHY: low-E coated glass can block up to 94 % of UV [S1]; the coating also cuts the near infrared.
                Stock.fixed("low-e-coated-float", "Low-E coated float glass, double-glazing offcut", COATING,
                        "4 mm float with a soft low-emissivity coating: most UV stopped, about 80 % visible, "
                                + "falling in the near infrared. Modelled (the coating's reflection is folded into "
                                + "its absorption; at normal incidence T is what matters).",
                        List.of("coating", "low-E", "float", "glazing", "exposure unit trap"), SODA_LIME_INDEX,
                        List.of(Stock.stack(new Layer("clear float glass", 4, CLEAR_FLOAT),
                                new Layer("low-E coating", 0.001, Absorption.of(new LogisticEdge(385, 2500, 60, 10),
                                        new GaussianBand(1300, 1200, 600)))))),
                // WHY: in-vitro sunscreen tests spread a thin film on a UV-transparent plate and read 290–400 nm
                // (REFERENCE.md §3); broad-spectrum filters combine a UV-B band near 310 nm and a UV-A band near
                // 355 nm (common practice, no source).
                Stock.fixed("sunscreen-film-broad-on-quartz", "Broad-spectrum sunscreen film on quartz plate", COATING,
                        "A 13 µm broad-spectrum sunscreen film on 2 mm UV-grade fused silica: UV-B and UV-A "
                                + "bands, clear visible. Modelled, not a product test.",
                        List.of("sunscreen", "in vitro", "quartz", "UV-A", "UV-B"),
                        new IndexSpec.Sellmeier(SellmeierIndex.FUSED_SILICA),
                        List.of(Stock.stack(new Layer("fused silica plate", 2, UV_FUSED_SILICA),
                                new Layer("sunscreen film", 0.013, Absorption.of(new GaussianBand(310, 450, 40),
                                        new GaussianBand(357, 380, 45)))))),
                Stock.fixed("sunscreen-film-uvb-on-quartz", "UV-B-only sunscreen film on quartz plate", COATING,
                        "A 13 µm UV-B-filter film on 2 mm UV-grade fused silica: strong near 310 nm, little UV-A "
                                + "protection. Modelled, not a product test.",
                        List.of("sunscreen", "in vitro", "quartz", "UV-B"),
                        new IndexSpec.Sellmeier(SellmeierIndex.FUSED_SILICA),
                        List.of(Stock.stack(new Layer("fused silica plate", 2, UV_FUSED_SILICA),
                                new Layer("sunscreen film", 0.013, Absorption.of(new GaussianBand(308, 500, 35)))))),
                // WHY: PVB interlayers carry UV absorbers so laminated glass blocks nearly all UV below ~380 nm
                // (common practice, no source); 3+0.38+3 and 4+0.76+4 mm are the usual builds.
                Stock.fixed("laminated-glass-pvb", "Laminated safety glass, PVB interlayer", LAMINATE,
                        "Two clear float panes bonded with PVB: the interlayer's absorber blocks below about "
                                + "380 nm; glass adds its iron band. Modelled.",
                        List.of("laminate", "PVB", "safety glass", "UV-blocking"), SODA_LIME_INDEX,
                        List.of(pvbLaminate(3, 0.38), pvbLaminate(4, 0.76))),
                // WHY: outdoor polycarbonate uses a co-extruded UV-absorbing cap layer [S29]; the body itself is
                // then a grade without absorber [S30].
                Stock.fixed("polycarbonate-uv-capped", "Polycarbonate sheet with co-extruded UV cap", LAMINATE,
                        "4 mm polycarbonate whose 50 µm cap layer holds the UV absorber: blocks to about 385 nm, like "
                                + "the UV-stabilised sheet, "
                                + "whichever face is lit. Modelled.",
                        List.of("polycarbonate", "PC", "co-extruded", "UV cap", "outdoor"), PC_INDEX,
                        List.of(Stock.stack(new Layer("UV cap layer", 0.05, Absorption.of(StockParts.uvAbsorber(404, 1500, 0.01))),
                                new Layer("polycarbonate body", 3.95, PC_UNSTABILISED)))));
    }

    private static SampleSpec pvbLaminate(double paneMm, double interlayerMm) {
        Absorption pvb = Absorption.of(StockParts.uvAbsorber(395, 800, 0.005));
        return Stock.stack(new Layer("clear float glass", paneMm, CLEAR_FLOAT),
                new Layer("PVB interlayer", interlayerMm, pvb),
                new Layer("clear float glass", paneMm, CLEAR_FLOAT));
    }
}
