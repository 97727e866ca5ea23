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
        if (requirement.oblique()) {
            parts.add(requirement.light().words());
        }
        requirement.layer().ifPresent(layer -> parts.add(layer(layer)));
        return String.join(", ", parts);
    }

    static String clause(Clause clause) {
        if (clause instanceof TransmittanceClause t) {
            return transmittance(t);
        }
        if (clause instanceof WeightedClause w) {
            return weighted(w);
        }
        if (clause instanceof CriticalWavelengthClause c) {
            return "critical wavelength " + (c.comparison() == Comparison.AT_LEAST ? "at least " : "at most ")
                    + number(c.nm()) + " nm";
        }
        if (clause instanceof RelativeClause r) {
            return relative(r);
        }
        if (clause instanceof StateClause s) {
            return state(s.state()) + " " + clause(s.inner());
        }
        CutoffClause c = (CutoffClause) clause;
        return (c.levelT() == 0.5 ? "cutoff " : "cutoff at " + percent(c.levelT()) + " ")
                + "between " + number(c.window().fromNm()) + " and " + number(c.window().toNm()) + " nm";
    }

    /** "at 380 nm at most 1% of its 550 nm value", "from 350 to 420 nm printed black at most 0.1% of the base". */
    private static String relative(RelativeClause r) {
        String level = (r.direction() == Direction.PASS ? "at least " : "at most ") + percent(r.fraction()) + " of ";
        if (r.ownWavelength()) {
            String prefix = r.state().kind() == org.spectralsieve.states.StateKind.AS_SUPPLIED ? "" : state(r.state()) + " ";
            return prefix + band(r.band()) + " " + level + "its " + number(r.referenceNm()) + " nm value";
        }
        return band(r.band()) + " the " + state(r.state()) + " " + level + "the " + state(r.referenceState());
    }

    private static String state(StateAsked s) {
        return switch (s.kind()) {
            case AS_SUPPLIED -> "base";
            case PRINTED -> "printed black";
            case AGED -> "after " + number(s.amount()) + (s.inHours() ? " h"
                    : " J/cm² at " + number(s.doseNm()) + " nm");
        };
    }

    static String layer(FixedLayer layer) {
        return (layer.placement() == FixedLayer.Placement.BEHIND ? "behind " : "on ") + number(layer.thicknessMm())
                + " mm " + layer.material();
    }

    private static String transmittance(TransmittanceClause t) {
        boolean mean = t.aggregate() == Aggregate.MEAN;
        return (mean ? "mean " : "") + level(t.direction(), t.thresholdT(), t.unit(), !mean) + " " + band(t.band())
                + ConfidenceDemandParser.render(t);
    }

    /**
     * The level as the model holds it; {@code verb} puts "passes"/"blocks" before a percentage or fraction.
     * A ceiling above 50% is written "transmits at most": the parser reads "blocks" only for levels that keep
     * at least half the light out, since "blocks at most 99%" could also mean keeping 99% out.
     */
    private static String level(Direction direction, double thresholdT, ThresholdUnit unit, boolean verb) {
        boolean pass = direction == Direction.PASS;
        String start = !verb ? "" : pass ? "passes " : thresholdT > 0.5 ? "transmits " : "blocks ";
        return switch (unit) {
            case PERCENT -> start + (pass ? "at least " : "at most ") + percent(thresholdT);
            case FRACTION -> start + (pass ? "at least " : "at most ") + number(thresholdT);
            // a higher density lets less through, so blocking reads "OD at least"
            case OPTICAL_DENSITY -> "OD " + (pass ? "at most " : "at least ") + density(thresholdT);
        };
    }

    /** Names are written as stored ("led-365"); the parser reads them back whatever separates their words. */
    private static String weighted(WeightedClause w) {
        if (w.weighting() instanceof Weighting.Luminous) {
            return "luminous " + level(w.direction(), w.thresholdT(), w.unit(), false);
        }
        Weighting.Spectral s = (Weighting.Spectral) w.weighting();
        return switch (s.preset()) {
            case ERYTHEMAL -> "erythemal " + level(w.direction(), w.thresholdT(), w.unit(), false);
            case UV_HAZARD -> "uv hazard " + level(w.direction(), w.thresholdT(), w.unit(), false);
            case EMITTER -> level(w.direction(), w.thresholdT(), w.unit(), true) + " of " + s.emitter().name()
                    + s.response().map(r -> " weighted by " + r.name()).orElse("");
        };
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
