package org.spectralsieve.requirement;

import java.util.List;
import java.util.Objects;

/**
 * Which stock thicknesses to buy when thickness is a design variable. {@code inside}: the material's
 * stock sizes inside the feasible interval, each proven to meet, best worst margin first. When none is,
 * {@code closestMiss} is the stock size in the asked range that comes closest (largest worst margin),
 * and {@code missMm} how far it lies from the feasible interval (NaN when there is no interval); both
 * null/NaN when the material states no stock sizes in the asked range.
 */
public record StockAdvice(List<StockFit> inside, StockFit closestMiss, double missMm) {

    /** One stock size judged: its verdict and worst clause margin in decades (NaN when no clause could be read). */
    public record StockFit(double thicknessMm, Verdict verdict, double worstMarginDecades) {
        public StockFit {
            Objects.requireNonNull(verdict, "verdict");
        }
    }

    public static final StockAdvice NONE = new StockAdvice(List.of(), null, Double.NaN);

    public StockAdvice {
        inside = List.copyOf(inside);
        if (!inside.isEmpty() && closestMiss != null) {
            throw new IllegalArgumentException("a closest miss is given only when no stock size is inside");
        }
    }

    public boolean any() {
        return !inside.isEmpty() || closestMiss != null;
    }

    /**
     * "stock sizes that meet, best margin first: 4 mm (margin 0.52 decades), 3 mm (0.31)" or "no stock size
     * meets; 2 mm comes closest: worst margin −0.12 decades, 0.35 mm outside the feasible interval"; empty
     * when there is no stock size to speak of.
     */
    public String describe() {
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
        String how = Double.isNaN(closestMiss.worstMarginDecades()) ? "its clauses cannot be read there"
                : "worst margin " + Wording.plain(closestMiss.worstMarginDecades()) + " decades";
        String where = Double.isNaN(missMm) ? "" : ", " + Wording.mm(missMm) + " outside the feasible interval";
        return "no stock size meets; " + Wording.mm(closestMiss.thicknessMm()) + " comes closest: " + how + where;
    }
}
