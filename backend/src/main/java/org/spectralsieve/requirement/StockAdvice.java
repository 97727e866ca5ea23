package org.spectralsieve.requirement;

import java.util.List;
import java.util.Objects;

/**
 * Which stock thicknesses to buy when thickness is a design variable. {@code inside}: the material's
 * stock sizes inside the feasible interval, each proven to meet, best worst margin first. When none is,
 * {@code closestMiss} is the stock size in the asked range that comes closest (largest worst margin; it may
 * be unverified rather than missed), and {@code missMm} how far it lies from the feasible interval (NaN when
 * there is no interval); both null/NaN when the material states no stock sizes in the asked range.
 * {@code elsewhere}: the pieces of the material's feasible thicknesses that its other samples give, apart from
 * the row's own interval. Samples of one material measured at different thicknesses need not agree (a sheet
 * thinner than measured is judged on the nearest sample), so a stock size can meet on another sample outside
 * the row's interval; naming those pieces says why.
 */
public record StockAdvice(List<StockFit> inside, StockFit closestMiss, double missMm, List<ThicknessInterval> elsewhere) {

    /** One stock size judged: its verdict and worst clause margin in decades (NaN when no clause could be read). */
    public record StockFit(double thicknessMm, Verdict verdict, double worstMarginDecades) {
        public StockFit {
            Objects.requireNonNull(verdict, "verdict");
        }
    }

    public static final StockAdvice NONE = new StockAdvice(List.of(), null, Double.NaN);

    public StockAdvice(List<StockFit> inside, StockFit closestMiss, double missMm) {
        this(inside, closestMiss, missMm, List.of());
    }

    public StockAdvice {
        inside = List.copyOf(inside);
        elsewhere = List.copyOf(elsewhere);
        if (!inside.isEmpty() && closestMiss != null) {
            throw new IllegalArgumentException("a closest miss is given only when no stock size is inside");
        }
    }

    public boolean any() {
        return !inside.isEmpty() || closestMiss != null || !elsewhere.isEmpty();
    }

    /** The same advice with the material's feasible pieces that other samples give. */
    public StockAdvice withElsewhere(List<ThicknessInterval> pieces) {
        return new StockAdvice(inside, closestMiss, missMm, pieces);
    }

    /**
     * "stock sizes that meet, best margin first: 4 mm (margin 0.52 decades), 3 mm (0.31)", "no stock size
     * meets; 2 mm comes closest: worst margin −0.12 decades, 0.35 mm outside the feasible interval" or "no stock
     * size is proven to meet; 2 mm comes closest: unverified there (…)", then "; the material's other samples
     * meet at 3.873–6 mm" when they do; empty when there is nothing to speak of.
     */
    public String describe() {
        String stock = describeStock();
        if (elsewhere.isEmpty()) {
            return stock;
        }
        StringBuilder pieces = new StringBuilder();
        for (int i = 0; i < elsewhere.size(); i++) {
            ThicknessInterval p = elsewhere.get(i);
            pieces.append(i == 0 ? "" : ", ").append(Wording.mmSpan(p.loMm(), p.hiMm()));
        }
        String others = "the material's other samples meet at " + pieces;
        return stock.isEmpty() ? others : stock + "; " + others;
    }

    private String describeStock() {
        if (!inside.isEmpty()) {
            StringBuilder out = new StringBuilder("stock sizes that meet, best margin first: ");
            for (int i = 0; i < inside.size(); i++) {
                StockFit f = inside.get(i);
                out.append(i == 0 ? "" : ", ").append(Wording.mm(f.thicknessMm())).append(" (")
                        .append(i == 0 ? "margin " : "").append(Wording.plain(f.worstMarginDecades()))
                        .append(i == 0 ? " decades)" : ")");
            }
            return out.toString();
        }
        if (closestMiss == null) {
            return "";
        }
        String where = Double.isNaN(missMm) ? "" : ", " + Wording.mm(missMm) + " outside the feasible interval";
        String size = Wording.mm(closestMiss.thicknessMm());
        if (closestMiss.verdict() == Verdict.UNVERIFIED) {
            // nothing fails there, so "comes closest" with a positive margin would read as a near meet: say what is missing
            String margin = Double.isNaN(closestMiss.worstMarginDecades()) ? ""
                    : "; worst margin " + Wording.plain(closestMiss.worstMarginDecades()) + " decades on what they show";
            return "no stock size is proven to meet; " + size + " comes closest: unverified there (no clause fails, but "
                    + "the data cannot show every clause" + margin + ")" + where;
        }
        String how = Double.isNaN(closestMiss.worstMarginDecades()) ? "its clauses cannot be read there"
                : "worst margin " + Wording.plain(closestMiss.worstMarginDecades()) + " decades";
        return "no stock size meets; " + size + " comes closest: " + how + where;
    }
}
