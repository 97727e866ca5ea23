package org.spectralsieve.seedmodel;

import static org.spectralsieve.seedmodel.MaterialClass.FUSED_SILICA;
import static org.spectralsieve.seedmodel.MaterialClass.OPTICAL_GLASS;
import static org.spectralsieve.seedmodel.MaterialClass.WINDOW_GLASS;
import static org.spectralsieve.seedmodel.StockParts.CLEAR_FLOAT;
import static org.spectralsieve.seedmodel.StockParts.SODA_LIME_INDEX;
import static org.spectralsieve.seedmodel.StockParts.SODA_LIME_MATRIX_EDGE;

import java.util.List;
import org.spectralsieve.optics.SellmeierIndex;

/** Glass on the workshop shelf: window glass, optical glass, fused silica. */
final class GlassStock {

    private GlassStock() {
    }

    static List<MaterialSpec> materials() {
        return List.of(
                // WHY: window glass blocks UVB; strong cut-off below ~340 nm [S27]; 2/4/6 mm are glazier stock.
                Stock.bulk("clear-float-glass", "Clear float glass, glazier offcuts", WINDOW_GLASS,
                        "Ordinary soda-lime float glass with the usual iron content: green edge, UV edge near 320–340 nm, "
                                + "a broad iron band towards 1000 nm. Modelled.",
                        List.of("soda-lime", "float", "glazing", "exposure unit"), SODA_LIME_INDEX, CLEAR_FLOAT, 2, 4, 6),
                // WHY: low-iron glass has about 1/10 the iron and is the screen-printer's exposure-glass fix [S1].
                Stock.bulk("low-iron-float-glass", "Low-iron float glass, exposure-table stock", WINDOW_GLASS,
                        "Soda-lime float with about a tenth of the usual iron: edge moved some 25 nm shorter, no green "
                                + "edge tint, more of 350–420 nm passed. Modelled.",
                        List.of("soda-lime", "low-iron", "exposure unit", "screen printing"), SODA_LIME_INDEX,
                        Absorption.of(new IronBand(0.1), SODA_LIME_MATRIX_EDGE, new FlatBackground(0.001)), 4, 6),
                // WHY: tinted glass passes under 35 % of UV [S1]; green tint is extra ferrous iron.
                Stock.bulk("green-tint-float-glass", "Green-tint float glass, greenhouse stock", WINDOW_GLASS,
                        "Float glass with about two and a half times the usual iron: deeper near-infrared band, "
                                + "edge pushed into the UVA. Modelled.",
                        List.of("soda-lime", "tinted", "glazing"), SODA_LIME_INDEX,
                        Absorption.of(new IronBand(2.5), SODA_LIME_MATRIX_EDGE, new FlatBackground(0.003)), 4, 6),
                // WHY: bronze and grey glazing pass under 35 % of UV [S1]; bronze takes blue more than red.
                Stock.bulk("bronze-tint-float-glass", "Bronze-tint float glass, shopfront offcuts", WINDOW_GLASS,
                        "Body-tinted float glass, absorbing more towards blue and violet, UV edge as float. Modelled.",
                        List.of("soda-lime", "tinted", "glazing"), SODA_LIME_INDEX,
                        Absorption.of(new IronBand(1.0), SODA_LIME_MATRIX_EDGE, new GaussianBand(400, 0.16, 240),
                                new FlatBackground(0.04)), 4, 6),
                // WHY: grey glazing dims fairly evenly across the visible and passes under 35 % of UV [S1].
                Stock.bulk("grey-tint-float-glass", "Grey-tint float glass, door-panel stock", WINDOW_GLASS,
                        "Body-tinted neutral grey float, about half the light passed at 4 mm. Modelled.",
                        List.of("soda-lime", "tinted", "glazing"), SODA_LIME_INDEX,
                        Absorption.of(new IronBand(1.0), SODA_LIME_MATRIX_EDGE, new GaussianBand(560, 0.12, 320),
                                new FlatBackground(0.06)), 4),
                // WHY: sun-weathered window glass loses 30–60 % of its UV transmission at 310 nm and 25–50 % at
                // 320 nm in 3 months, the loss sitting at the edge, not at 365 nm [S21].
                Stock.bulk("weathered-float-glass", "Clear float glass, ex-skylight (sun-weathered)", WINDOW_GLASS,
                        "The clear float body after months of sun: a solarisation band at the UV edge lowers "
                                + "310–330 nm by roughly a third; 365 nm and the visible are unchanged. Modelled.",
                        List.of("soda-lime", "float", "aged", "solarised"), SODA_LIME_INDEX,
                        Absorption.of(new IronBand(1.0), SODA_LIME_MATRIX_EDGE, new FlatBackground(0.002),
                                new GaussianBand(315, 0.15, 45)), 3),
                // WHY: borosilicate 50 % point ~290–310 nm at 2–3 mm (common practice, no source);
                // ≥ 90 % over 350–420 nm as "technical glass" [S2]; 3.3 mm is the usual flat stock.
                Stock.bulk("borosilicate-sheet", "Borosilicate technical glass sheet", WINDOW_GLASS,
                        "Low-expansion borosilicate flat glass, almost iron-free: edge near 290–300 nm, over 90 % "
                                + "from 340 nm up. Modelled.",
                        List.of("borosilicate", "technical glass", "LED window", "exposure unit"),
                        new IndexSpec.Constant(1.47),
                        Absorption.of(new UrbachEdge(285, 1.0, 0.12), new IronBand(0.05), new FlatBackground(0.0008)),
                        2, 3.3, 5),
                // WHY: a low-dispersion borosilicate crown optical glass: λ80/λ5 ≈ 330/290 nm at 10 mm (glass
                // colour code, from memory; PRACTICE.md [S46b] explains the code). Measured only from 250 nm.
                // Named generically: the trade reads a six-digit glass code as one maker's flagship grade.
                Stock.withSamples(Stock.bulk("borosilicate-crown-windows", "Borosilicate crown optical glass windows",
                        OPTICAL_GLASS,
                        "Low-dispersion borosilicate crown optical glass (n about 1.52 in the visible) with a "
                                + "Sellmeier dispersion; internal transmittance near 1 above 350 nm. Modelled on a "
                                + "250–1100 nm instrument range.",
                        List.of("optical glass", "crown", "window", "sellmeier"),
                        new IndexSpec.Sellmeier(SellmeierIndex.CROWN_517642),
                        Absorption.of(new UrbachEdge(290, 0.29, 0.168), new FlatBackground(0.0003)), 2, 5, 10),
                        s -> s.startingAt(250)),
                // WHY: dense flint glasses absorb further into the UVA than crowns (lead/titanium edge,
                // common practice, no source); n ≈ 1.62 at 587 nm from memory.
                Stock.withSamples(Stock.bulk("dense-flint-glass", "Dense flint glass prism blanks", OPTICAL_GLASS,
                        "High-index flint: edge near 350–370 nm at 10 mm, so it is no window for 365 nm. Modelled "
                                + "on a 250–1100 nm instrument range.",
                        List.of("optical glass", "flint", "high index"),
                        new IndexSpec.Table(List.of(400.0, 480.0, 587.6, 700.0, 1000.0),
                                List.of(1.652, 1.635, 1.620, 1.612, 1.603)),
                        Absorption.of(new UrbachEdge(340, 0.29, 0.125), new FlatBackground(0.0005)), 5, 10),
                        s -> s.startingAt(250)),
                // WHY: "black light" UV-pass glass passes about 320–390 nm, blocks the visible and leaks deep
                // red/near infrared (common practice, no source).
                Stock.withSamples(Stock.bulk("uv-pass-black-glass", "UV-pass black filter glass", OPTICAL_GLASS,
                        "Dark violet-black filter glass: a passband around 365 nm, visible blocked, a leak beyond "
                                + "about 700 nm. Modelled on a 250–1100 nm instrument range.",
                        List.of("filter glass", "UV-pass", "black light", "365 nm"), SODA_LIME_INDEX,
                        Absorption.of(new UrbachEdge(300, 1.0, 0.10), new GaussianBand(480, 6, 90),
                                new GaussianBand(560, 8, 110), new GaussianBand(640, 6, 90), new FlatBackground(0.005)),
                        2, 3),
                        s -> s.startingAt(250)),
                // WHY: UV-grade synthetic fused silica passes 254 nm and transmits down to ~190–200 nm [S33][S34];
                // quartz sleeves pass ~95 % at 254 nm [S32]. Malitson 1965 dispersion.
                Stock.bulk("uv-fused-silica", "UV-grade synthetic fused silica windows", FUSED_SILICA,
                        "Synthetic fused silica of UV grade: usable to 190 nm, no band at 245 nm, flat to 1100 nm. "
                                + "Modelled.",
                        List.of("fused silica", "quartz", "UV-C", "254 nm", "mercury lamp"),
                        new IndexSpec.Sellmeier(SellmeierIndex.FUSED_SILICA),
                        Absorption.of(new UrbachEdge(175, 1.0, 0.15), new FlatBackground(0.0003)), 1, 3, 6),
                // WHY: most grades cut off near 200 nm [S34]; fused natural quartz (not UV grade) carries an
                // absorption band near 245 nm (oxygen-deficiency centre, common practice, no source).
                Stock.bulk("fused-quartz-standard", "Fused quartz plate, standard (non-UV) grade", FUSED_SILICA,
                        "Electrically fused natural quartz: edge near 200–210 nm and a band at 245 nm that costs "
                                + "some 15 % at 254 nm through 3 mm. Modelled.",
                        List.of("fused quartz", "quartz", "heat resistant"),
                        new IndexSpec.Sellmeier(SellmeierIndex.FUSED_SILICA),
                        Absorption.of(new UrbachEdge(200, 1.0, 0.2), new GaussianBand(245, 0.08, 30),
                                new FlatBackground(0.0005)), 2, 3),
                // WHY: low-pressure mercury emits at 253.7 and 184.9 nm [S44]; "ozone-free" doped quartz keeps
                // 254 nm and stops 185 nm (common practice, no source).
                Stock.bulk("ozone-free-quartz", "Ozone-free doped quartz tube wall", FUSED_SILICA,
                        "Titania-doped fused quartz: opaque at 185–200 nm so a germicidal lamp makes no ozone, "
                                + "clear at 254 nm. Modelled flat section of tube wall.",
                        List.of("quartz", "germicidal", "254 nm", "ozone-free"),
                        new IndexSpec.Sellmeier(SellmeierIndex.FUSED_SILICA),
                        Absorption.of(new UrbachEdge(225, 1.0, 0.12), new FlatBackground(0.0005)), 1, 2));
    }
}
