package org.spectralsieve.requirement;

import java.math.BigDecimal;
import java.math.MathContext;
import java.util.ArrayList;
import java.util.List;

/**
 * The canonical text of a requirement: "at least"/"at most" (the model's inclusive thresholds), bands in
 * nm, each number in the unit the user chose, spectral clauses joined by "and", filters by commas.
 * Numbers are written in their shortest decimal form that reads back to the same double.
 */
final class RequirementRenderer {

    private RequirementRenderer() {
    }

    static String render(Requirement requirement) {
        List<String> clauses = requirement.clauses().stream().map(RequirementRenderer::clause).toList();
        List<String> parts = new ArrayList<>();
        parts.add(String.join(" and ", clauses));
        ThicknessSpec thickness = requirement.thickness();
        switch (thickness.kind()) {
            case FIXED -> parts.add("at " + number(thickness.minMm()) + " mm");
            case RANGE -> parts.add("thickness " + number(thickness.minMm()) + " to " + number(thickness.maxMm()) + " mm");
            case AS_MEASURED -> { }
        }
        requirement.materialClass().ifPresent(label -> parts.add("class " + label));
        requirement.geometry().ifPresent(geometry -> parts.add("geometry " + geometry));
        return String.join(", ", parts);
    }

    static String clause(Clause clause) {
        if (clause instanceof TransmittanceClause t) {
            return transmittance(t);
        }
        CutoffClause c = (CutoffClause) clause;
        return (c.levelT() == 0.5 ? "cutoff " : "cutoff at " + percent(c.levelT()) + " ")
                + "between " + number(c.window().fromNm()) + " and " + number(c.window().toNm()) + " nm";
    }

    private static String transmittance(TransmittanceClause t) {
        boolean pass = t.direction() == Direction.PASS;
        String start = t.aggregate() == Aggregate.MEAN ? "mean " : "";
        String level = switch (t.unit()) {
            case PERCENT -> (start.isEmpty() ? (pass ? "passes " : "blocks ") : "")
                    + (pass ? "at least " : "at most ") + percent(t.thresholdT());
            case FRACTION -> (start.isEmpty() ? (pass ? "passes " : "blocks ") : "")
                    + (pass ? "at least " : "at most ") + number(t.thresholdT());
            // a higher density lets less through, so blocking reads "OD at least"
            case OPTICAL_DENSITY -> "OD " + (pass ? "at most " : "at least ") + density(t.thresholdT());
        };
        return start + level + " " + band(t.band());
    }

    private static String band(Band band) {
        return band.isPoint() ? "at " + number(band.fromNm()) + " nm"
                : "from " + number(band.fromNm()) + " to " + number(band.toNm()) + " nm";
    }

    private static String percent(double t) {
        return BigDecimal.valueOf(t).movePointRight(2).stripTrailingZeros().toPlainString() + "%";
    }

    static String number(double value) {
        return BigDecimal.valueOf(value).stripTrailingZeros().toPlainString();
    }

    /** The shortest density whose transmittance is exactly t, so that the text reads back to the same value. */
    private static String density(double t) {
        BigDecimal exact = new BigDecimal(RequirementLimits.densityForTransmittance(t));
        for (int digits = 1; digits <= 17; digits++) {
            BigDecimal candidate = exact.round(new MathContext(digits)).stripTrailingZeros();
            if (RequirementLimits.transmittanceForDensity(candidate) == t) {
                return candidate.toPlainString();
            }
        }
        return number(RequirementLimits.densityForTransmittance(t));
    }
}
