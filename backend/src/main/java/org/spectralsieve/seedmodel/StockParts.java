package org.spectralsieve.seedmodel;

import java.util.ArrayList;
import java.util.List;

/**
 * Absorption bodies and index models shared by several catalogue entries. Each constant says WHY its
 * numbers look as they do; "common practice" refers to PRACTICE.md with its source tag.
 */
final class StockParts {

    private StockParts() {
    }

    /** Soda-lime silicate matrix edge; together with iron it puts float glass's edge at 320–340 nm. */
    static final UrbachEdge SODA_LIME_MATRIX_EDGE = new UrbachEdge(290, 1.0, 0.10);

    /** Ordinary clear float body. WHY: window glass blocks UVB and cuts strongly below ~340 nm ([S27]); 3 mm ≈ 80–85 % at 365 nm (common practice, no source). */
    static final Absorption CLEAR_FLOAT = Absorption.of(new IronBand(1.0), SODA_LIME_MATRIX_EDGE, new FlatBackground(0.002));

    /** Soda-lime index, n_d ≈ 1.52 (common practice, no source); dispersion only moves R by ~0.2 %. */
    static final IndexSpec SODA_LIME_INDEX = new IndexSpec.Constant(1.52);

    /** PMMA index 1.49 (REFERENCE.md §8, Sultanova 2009: n_d = 1.4906). */
    static final IndexSpec PMMA_INDEX = new IndexSpec.Constant(1.49);

    /**
     * Polycarbonate: measured indices of Sultanova, Kasarova, Nikolov 2009 (Acta Phys. Pol. A 116:585),
     * 436.8–1052 nm, as quoted in REFERENCE.md §8; the table holds its end values outside that range.
     */
    static final IndexSpec PC_INDEX = new IndexSpec.Table(
            List.of(436.8, 486.1, 587.6, 632.8, 703.0, 833.0, 879.0, 1052.0),
            List.of(1.612, 1.599, 1.585, 1.580, 1.575, 1.569, 1.568, 1.565));

    /** PET index ≈ 1.65, the value behind PRACTICE.md's 88.6 % ceiling (derived there). */
    static final IndexSpec PET_INDEX = new IndexSpec.Constant(1.65);

    /*
     * Calibrated parts. Each number below is a parameter of a physical part (edge position, width, band
     * strength), chosen so that the demo curve at the stated thickness matches a measured sheet of the same
     * kind within the tolerances of DemoVersusMeasuredTest (50 % point within 3 nm, 1 %→50 % width within a
     * factor 1.5, T at 300/313/365/405 nm within 3 % absolute). No measured value is stored here; the
     * calibration is listed in docs/demo-library.md.
     */

    /** Intrinsic PMMA absorption edge: an Urbach tail that closes the sheet below about 260 nm. */
    static final UrbachEdge PMMA_INTRINSIC_EDGE = new UrbachEdge(250, 2.5, 0.20);

    /**
     * General-purpose clear acrylic sheet is not absorber-free: a light stabiliser loading gives two weak
     * bands, near 300 and 345 nm. WHY: measured clear PMMA sheet (3 mm) passes several % through 280–340 nm
     * with a dip at each band and a 50 % point near 374 nm, so the "very small transmission below 345 nm"
     * of [S25] is a few %, not zero; α ≈ 1/mm at the band peaks makes that window close with thickness.
     */
    static final GaussianBand ACRYLIC_STABILISER_UVB_BAND = new GaussianBand(299, 0.75, 40);
    static final GaussianBand ACRYLIC_STABILISER_UVA_BAND = new GaussianBand(344, 0.98, 38);

    /** Standard clear PMMA: intrinsic edge, the two stabiliser bands and a small bulk loss. */
    static final Absorption STANDARD_ACRYLIC = acrylicWith(new FlatBackground(0.0012));

    /** The standard acrylic body plus further parts (a dye, a scatterer): tinted and filled sheets share its UV. */
    static Absorption acrylicWith(AbsorptionPart... extra) {
        List<AbsorptionPart> parts = new ArrayList<>(
                List.of(PMMA_INTRINSIC_EDGE, ACRYLIC_STABILISER_UVB_BAND, ACRYLIC_STABILISER_UVA_BAND));
        parts.addAll(List.of(extra));
        return new Absorption(parts);
    }

    /**
     * Strong UV absorber in a sheet (benzotriazole-type, common practice, no source): saturates at α = 50/mm
     * below the edge, and its log α falls over a logistic width of 16–19 nm. WHY the width: measured
     * UV-absorbing PMMA and polycarbonate sheets (3 mm) go from 1 % to 50 % in 12–13 nm; a width of 5 nm
     * (three times too steep) overstated what a 385–405 nm LED loses.
     */
    static final double UV_ABSORBER_ALPHA_PER_MM = 50;

    /**
     * Steepness of a UV absorber's edge as d(ln α)/dλ at its midpoint, 1/nm. Calibrated: the fitted
     * polycarbonate and UV-filtering acrylic edges give 0.17 and 0.20. The slope belongs to the absorber
     * molecule, not to how much of it a layer holds (α = concentration × its absorptivity), so thin
     * absorber layers (lacquers, interlayers, cap layers, adhesives) share it.
     */
    static final double UV_ABSORBER_LOG_SLOPE_PER_NM = 0.18;

    /** A UV absorber edge at {@code edgeNm} with the shared slope: logistic width = ln(α₋/α₊)/(4·slope). */
    static LogisticEdge uvAbsorber(double edgeNm, double alphaBelowPerMm, double alphaAbovePerMm) {
        double width = Math.log(alphaBelowPerMm / alphaAbovePerMm) / (4 * UV_ABSORBER_LOG_SLOPE_PER_NM);
        return new LogisticEdge(edgeNm, alphaBelowPerMm, alphaAbovePerMm, width);
    }

    /** Terephthalate absorption of PET: the strong band that closes the film below about 315 nm. */
    static final LogisticEdge PET_TEREPHTHALATE_EDGE = new LogisticEdge(330, 500, 1e-4, 12.5);

    /**
     * PET's weak absorption tail from 330 nm into the violet, an Urbach tail. WHY: measured PET film rises
     * gradually from about 80 % at 340 nm to its visible plateau near 400–450 nm instead of jumping there.
     */
    static final UrbachEdge PET_TAIL = new UrbachEdge(340, 0.86, 0.18);

    /** PET body. WHY: PET absorbs UV up to ~320 nm ([S31]), then a tail into the violet (see PET_TAIL). */
    static final Absorption PET = Absorption.of(PET_TEREPHTHALATE_EDGE, PET_TAIL, new FlatBackground(0.01));

    /** Body of a polycarbonate without UV absorber. WHY: such grades block only below ~290 nm ([S30]). */
    static final Absorption PC_UNSTABILISED = Absorption.of(new LogisticEdge(296, 80, 0.003, 7), new FlatBackground(0.002));
}
