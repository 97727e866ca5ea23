package org.spectralsieve.states;

/**
 * What was printed on a film for a printed-black curve: the ink load in percent of the printer's full coverage, the
 * optical density the printer or a densitometer states, or both; NaN where not stated, but never both NaN.
 */
public record Printing(double inkLoadPercent, double statedDensity) {

    /** Ink loads above full coverage exist (several passes, ink limits over 100 %); 400 % is past any real setting. */
    public static final double MAX_INK_LOAD_PERCENT = 400;
    /** Past any density a densitometer reads. */
    public static final double MAX_STATED_DENSITY = 10;

    public Printing {
        if (Double.isNaN(inkLoadPercent) && Double.isNaN(statedDensity)) {
            throw new IllegalArgumentException("a printed curve states its ink load (%) or its density, or both");
        }
        if (!Double.isNaN(inkLoadPercent) && !(inkLoadPercent > 0 && inkLoadPercent <= MAX_INK_LOAD_PERCENT)) {
            throw new IllegalArgumentException("ink load must lie above 0 and at most 400 %, got " + inkLoadPercent);
        }
        if (!Double.isNaN(statedDensity) && !(statedDensity > 0 && statedDensity <= MAX_STATED_DENSITY)) {
            throw new IllegalArgumentException("a stated density must lie above 0 and at most 10, got " + statedDensity);
        }
    }

    /** "100 % ink", "density 4.0", "100 % ink, density 4.0". */
    public String describe() {
        String ink = Double.isNaN(inkLoadPercent) ? "" : Exposure.number(inkLoadPercent) + " % ink";
        String density = Double.isNaN(statedDensity) ? "" : "density " + statedDensity;
        return ink.isEmpty() ? density : density.isEmpty() ? ink : ink + ", " + density;
    }
}
