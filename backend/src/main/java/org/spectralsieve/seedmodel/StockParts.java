package org.spectralsieve.seedmodel;

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

    /** Standard clear PMMA edge. WHY: very small T below 345 nm, thickness-dependent 345–395 nm, ~92 % above ([S25]). */
    static final LogisticEdge STANDARD_ACRYLIC_EDGE = new LogisticEdge(362, 30, 0.001, 17);

    static final Absorption STANDARD_ACRYLIC = Absorption.of(STANDARD_ACRYLIC_EDGE, new FlatBackground(0.0005));

    /** PET body. WHY: PET absorbs UV up to ~320 nm ([S31]); the terephthalate band is so strong that 50 µm and 250 µm cut within a few nm. */
    static final Absorption PET = Absorption.of(new LogisticEdge(318, 500, 0.02, 4), new FlatBackground(0.05));

    /** Body of a polycarbonate without UV absorber. WHY: such grades block only below ~290 nm ([S30]). */
    static final Absorption PC_UNSTABILISED = Absorption.of(new LogisticEdge(296, 80, 0.003, 7), new FlatBackground(0.002));
}
