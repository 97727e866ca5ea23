package org.spectralsieve.requirement;

import java.math.BigDecimal;
import java.util.List;
import java.util.Optional;
import org.spectralsieve.requirement.Token.Kind;
import org.spectralsieve.weighting.Emitter;
import org.spectralsieve.weighting.Response;

/**
 * The spectral clauses: transmittance levels over a wavelength or band, and cutoff windows.
 *
 * <pre>
 * transmittance = [ verb ] [ "mean" ] level band
 *               | [ verb ] level "of" emitter [ "weighted" "by" response ]     (a WeightedClause)
 * level         = [ comparison ] [ "to" ] ( number [ "%" ] | "OD" [ comparison ] number ) [ "or" ( "more" | "less" ) ]
 * band          = "at" wavelength | "from" wavelength ( "to" | "-" ) wavelength | "between" wavelength "and" wavelength
 * cutoff        = [ number [ "%" ] ] "cutoff" [ "at" number [ "%" ] ] ( "from" … | "between" … )
 * </pre>
 *
 * Emitter and response names are those of the lookup the text is read with ({@link SpectrumNames}).
 * A comparison says which side of the number T must lie on; with a percentage or fraction "over" means
 * passing and "under" blocking, with an optical density the reverse (a higher density lets less through).
 */
final class SpectralClauseParser {

    /** Which side of the number the value must lie on, before translating to pass or block. */
    enum Sense { HIGHER, LOWER }

    record Level(Direction direction, double thresholdT, ThresholdUnit unit) {
    }

    record Wavelength(Token number, BigDecimal value, Token unit) {
    }

    static final List<String> HIGHER_WORDS = List.of("over", "above", "more than", "at least", ">=");
    static final List<String> LOWER_WORDS = List.of("under", "below", "less than", "at most", "<=");
    private static final List<String> COMPARISONS = java.util.stream.Stream.concat(HIGHER_WORDS.stream(),
            LOWER_WORDS.stream()).toList();

    private final TokenCursor in;
    private final SpectrumNames names;

    SpectralClauseParser(TokenCursor in, SpectrumNames names) {
        this.in = in;
        this.names = names;
    }

    /**
     * A transmittance clause, or a weighted one when the level is followed by "of"; {@code verb} is the
     * already consumed "passes"/"blocks" token, or null.
     */
    Clause transmittance(Token start, Token verb) {
        Direction verbDirection = verb == null ? null
                : verb.lower().startsWith("pass") ? Direction.PASS : Direction.BLOCK;
        boolean mean = in.acceptWord("mean");
        Level level = level(verb, verbDirection, mean);
        if (in.atWord("of")) {
            if (mean) {
                throw in.error(Expected.keywords("from", "between")
                        .because("(a weighted figure is an average already; 'mean' needs a band)"));
            }
            return weighted(start, level);
        }
        Band band = band(mean, mean ? "a mean needs a band of two wavelengths" : "");
        String text = in.slice(start.start(), in.previous().end());
        return TokenCursor.build(start, () -> new TransmittanceClause(level.direction(),
                mean ? Aggregate.MEAN : Aggregate.EVERY_POINT, band, level.thresholdT(), level.unit(), text));
    }

    /** "… of led 365 [weighted by erythema]": the emitter's light, weighted by the response if one is named. */
    private WeightedClause weighted(Token start, Level level) {
        in.next(); // "of"
        Emitter emitter = names.emitter("of");
        Optional<Response> response = Optional.empty();
        if (in.acceptWord("weighted")) {
            in.expectWord(Expected.keywords("by").after("weighted"), "by");
            response = Optional.of(names.response("weighted by"));
        }
        Weighting weighting = Weighting.of(emitter, response);
        String text = in.slice(start.start(), in.previous().end());
        return TokenCursor.build(start, () -> new WeightedClause(level.direction(), level.thresholdT(), level.unit(),
                weighting, text));
    }

    Level level(Token verb, Direction verbDirection, boolean mean) {
        Token comparisonToken = in.peek();
        Sense sense = comparison();
        if (sense == null && !(in.atWord("to") || in.atWord("od") || in.at(Kind.NUMBER))) {
            throw in.error(levelStart(verb, verbDirection, mean));
        }
        if (sense != null && !(in.atWord("to") || in.atWord("od") || in.at(Kind.NUMBER))) {
            throw in.error(Expected.keywords("OD").or("a number").after(in.previous().text()));
        }
        if (in.atWord("to") && in.peek(1).isWord("od")) {
            in.next(); // "blocks to OD 4"
        }
        boolean density = in.atWord("od");
        if (density) {
            in.next();
            Token inner = in.peek();
            Sense innerSense = comparison();
            if (innerSense != null && sense != null) {
                throw TokenCursor.outOfRange(inner, "a number after 'OD' (one comparison per clause)", inner.quoted());
            }
            if (innerSense != null) {
                sense = innerSense;
                comparisonToken = inner;
            }
        }
        Token number = in.peek();
        BigDecimal value = in.expectNumber((density ? Expected.keywords(COMPARISONS.toArray(String[]::new))
                : Expected.keywords("OD")).or("a number").after(in.previous().text()));
        ThresholdUnit unit = density ? ThresholdUnit.OPTICAL_DENSITY
                : in.at(Kind.PERCENT) ? ThresholdUnit.PERCENT : ThresholdUnit.FRACTION;
        if (unit == ThresholdUnit.PERCENT) {
            in.next();
        }
        double thresholdT = threshold(number, value, unit);
        if (sense == null && in.atWord("or")) {
            in.next();
            comparisonToken = in.peek();
            sense = in.expectWord(Expected.keywords("more", "less").after("or"), "more", "less").isWord("more")
                    ? Sense.HIGHER : Sense.LOWER;
        }
        return new Level(direction(sense, density, verb, verbDirection, comparisonToken, number), thresholdT, unit);
    }

    private Direction direction(Sense sense, boolean density, Token verb, Direction verbDirection,
                                Token comparisonToken, Token number) {
        if (sense == null && density) {
            sense = Sense.HIGHER; // "OD 3" on its own is a blocking figure: at least that density
        }
        if (sense == null) {
            if (verbDirection == null) {
                throw TokenCursor.outOfRange(number, "a comparison such as 'over' or 'under' before the number",
                        number.quoted());
            }
            return verbDirection;
        }
        Direction direction = (sense == Sense.HIGHER) != density ? Direction.PASS : Direction.BLOCK;
        if (verbDirection != null && direction != verbDirection) {
            boolean wantHigher = (verbDirection == Direction.PASS) != density;
            List<String> fitting = wantHigher ? HIGHER_WORDS : LOWER_WORDS;
            Token at = comparisonToken.kind() == Kind.NUMBER ? number : comparisonToken;
            throw TokenCursor.outOfRange(at, Expected.keywords(fitting.toArray(String[]::new))
                    .after(verb.text() + (density ? " … OD" : "")).describe(), at.quoted());
        }
        return direction;
    }

    private Expected levelStart(Token verb, Direction verbDirection, boolean mean) {
        List<String> words = new java.util.ArrayList<>();
        if (verbDirection != Direction.BLOCK) {
            words.addAll(HIGHER_WORDS);
        }
        if (verbDirection != Direction.PASS) {
            words.addAll(LOWER_WORDS);
        }
        if (verbDirection == Direction.BLOCK) {
            words.add("to OD");
        }
        words.add("OD");
        if (!mean) {
            words.add("mean");
        }
        Expected expected = Expected.keywords(words.toArray(String[]::new)).or("a number");
        return expected.after(in.previous().text());
    }

    /** Reads "over", "at least", ">=" and the like; consumes nothing when no comparison stands there. */
    Sense comparison() {
        Token t = in.peek();
        switch (t.kind()) {
            case AT_LEAST -> {
                in.next();
                return Sense.HIGHER;
            }
            case AT_MOST -> {
                in.next();
                return Sense.LOWER;
            }
            case WORD -> {
                return comparisonWord(t);
            }
            default -> {
                return null;
            }
        }
    }

    private Sense comparisonWord(Token t) {
        switch (t.lower()) {
            case "over", "above" -> {
                in.next();
                return Sense.HIGHER;
            }
            case "under", "below" -> {
                in.next();
                return Sense.LOWER;
            }
            case "more", "less" -> {
                in.next();
                in.expectWord(Expected.keywords("than").after(t.text()), "than");
                return t.isWord("more") ? Sense.HIGHER : Sense.LOWER;
            }
            case "at" -> {
                Token second = in.peek(1);
                if (second.isWord("least") || second.isWord("most")) {
                    in.next();
                    in.next();
                    return second.isWord("least") ? Sense.HIGHER : Sense.LOWER;
                }
                return null;
            }
            default -> {
                return null;
            }
        }
    }

    private static double threshold(Token number, BigDecimal value, ThresholdUnit unit) {
        return switch (unit) {
            case PERCENT -> {
                double t = value.movePointLeft(2).doubleValue();
                if (!RequirementLimits.isThreshold(t)) {
                    throw TokenCursor.outOfRange(number, "a percentage above 0 and at most 100", "'" + number.text() + "%'");
                }
                yield t;
            }
            case FRACTION -> {
                double t = value.doubleValue();
                if (!RequirementLimits.isThreshold(t)) {
                    boolean looksLikePercent = t > 1 && t <= 100;
                    throw new RequirementSyntaxException(number.start(),
                            "a fraction above 0 and at most 1 (or a percentage with '%')", number.quoted(),
                            looksLikePercent ? number.text() + "%" : null);
                }
                yield t;
            }
            case OPTICAL_DENSITY -> {
                if (!RequirementLimits.isOpticalDensity(value.doubleValue())) {
                    throw TokenCursor.outOfRange(number, "an optical density above 0 and at most "
                            + (int) RequirementLimits.MAX_OPTICAL_DENSITY, "'OD " + number.text() + "'");
                }
                yield RequirementLimits.transmittanceForDensity(value);
            }
        };
    }

    /** "cutoff between 380 and 395 nm", "10% cutoff from 380 to 395 nm", "cutoff at 1% between …". */
    CutoffClause cutoff(Token start) {
        Double level = in.at(Kind.NUMBER) ? cutoffLevel() : null;
        Token word = in.expectWord(Expected.keywords("cutoff"), "cutoff", "cut-off");
        if (level == null && in.acceptWord("at")) {
            level = cutoffLevel();
        }
        double levelT = level == null ? 0.5 : level;
        Band window = band(true, "after '" + word.text() + "': a cutoff window needs two wavelengths");
        String text = in.slice(start.start(), in.previous().end());
        return TokenCursor.build(start, () -> new CutoffClause(levelT, window, text));
    }

    private double cutoffLevel() {
        Token number = in.peek();
        BigDecimal value = in.expectNumber(Expected.described("a cutoff level such as '10%'").after("at"));
        boolean percent = in.at(Kind.PERCENT);
        if (percent) {
            in.next();
        }
        double t = percent ? value.movePointLeft(2).doubleValue() : value.doubleValue();
        if (!RequirementLimits.isCutoffLevel(t)) {
            throw TokenCursor.outOfRange(number, "a cutoff level above 0 and below 100%",
                    "'" + number.text() + (percent ? "%" : "") + "'");
        }
        return t;
    }

    /** A wavelength or band; {@code why} explains, for a mean or cutoff, why a single wavelength will not do. */
    Band band(boolean needRange, String why) {
        if (!needRange && in.acceptWord("at")) {
            return Band.at(nanometres(wavelength(true), null));
        }
        boolean between = in.atWord("between");
        if (!between && !in.atWord("from")) {
            Expected expected = needRange ? Expected.keywords("from", "between")
                    : Expected.keywords("at", "from", "between", "of");
            throw in.error(why.isEmpty() ? expected.because("for the wavelength, band or source") : expected.because("(" + why + ")"));
        }
        in.next();
        Wavelength from = wavelength(false);
        if (between) {
            in.expectWord(Expected.keywords("and").after("between " + from.number().text()), "and");
        } else if (!in.acceptWord("to")) {
            in.expect(Kind.DASH, Expected.keywords("to", "-").after("from " + from.number().text()));
        }
        Wavelength to = wavelength(true);
        double fromNm = nanometres(from, to.unit());
        double toNm = nanometres(to, null);
        if (!(toNm > fromNm)) {
            throw TokenCursor.outOfRange(to.number(), "a wavelength above " + plain(fromNm)
                    + " nm (a band runs from short to long wavelengths)", to.number().quoted());
        }
        return new Band(fromNm, toNm);
    }

    Wavelength wavelength(boolean unitRequired) {
        Token number = in.peek();
        BigDecimal value = in.expectNumber(Expected.described("a wavelength in nm").after(in.previous().text()));
        Expected units = Expected.keywords("nm", "µm", "um").after(number.text());
        Token unit = null;
        if (isWavelengthUnit(in.peek())) {
            unit = in.next();
        } else if (unitRequired) {
            throw in.error(units);
        }
        return new Wavelength(number, value, unit);
    }

    static boolean isWavelengthUnit(Token t) {
        return t.isWord("nm") || t.isWord("µm") || t.isWord("μm") || t.isWord("um");
    }

    /** The wavelength in nm, checked against the limits; a first wavelength without unit takes the second's. */
    static double nanometres(Wavelength w, Token fallbackUnit) {
        Token unit = w.unit() != null ? w.unit() : fallbackUnit;
        double nm = unit.isWord("nm") ? w.value().doubleValue() : w.value().movePointRight(3).doubleValue();
        if (!RequirementLimits.isWavelength(nm)) {
            throw TokenCursor.outOfRange(w.number(), "a wavelength from " + plain(RequirementLimits.MIN_WAVELENGTH_NM)
                    + " to " + plain(RequirementLimits.MAX_WAVELENGTH_NM) + " nm",
                    "'" + w.number().text() + " " + unit.text() + "'" + (unit.isWord("nm") ? "" : " (" + plain(nm) + " nm)"));
        }
        return nm;
    }

    static String plain(double value) {
        return BigDecimal.valueOf(value).stripTrailingZeros().toPlainString();
    }
}
