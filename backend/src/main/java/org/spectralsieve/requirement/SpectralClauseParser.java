package org.spectralsieve.requirement;

import java.math.BigDecimal;
import java.util.List;
import java.util.Optional;
import org.spectralsieve.requirement.Token.Kind;
import org.spectralsieve.weighting.Emitter;
import org.spectralsieve.weighting.Response;

/**
 * The spectral clauses: transmittance levels over a wavelength or band, UV ratings and cutoff windows.
 *
 * <pre>
 * transmittance = [ verb ] [ "mean" ] level [ "of" "UV" ] band
 *               | [ verb ] level "of" emitter [ "weighted" "by" response ]     (a WeightedClause)
 * verb          = "passes" | "blocks" | "transmits" | "transmittance" | "T"   (and "pass", "block", "transmit")
 * rating        = "UV" number [ level ]                    ("UV400": blocks under 1% from 290 to 400 nm)
 * level         = [ comparison ] [ "to" ] ( number [ "%" ] | "OD" [ comparison ] number ) [ "or" ( "more" | "less" ) ]
 * band          = "at" wavelength | "from" wavelength ( "to" | "-" ) wavelength | "between" wavelength "and" wavelength
 * cutoff        = [ number [ "%" ] ] "cutoff" [ "at" number [ "%" ] ] ( "from" … | "between" … )
 * </pre>
 *
 * Emitter and response names are those of the lookup the text is read with ({@link SpectrumNames}).
 * A comparison says which side of the number T must lie on; with a percentage or fraction "over" means
 * passing and "under" blocking, with an optical density the reverse (a higher density lets less through).
 * The verb may fix the side: "passes" alone means at least, "transmits" needs a comparison, and "blocks"
 * reads a percentage or fraction as the trade does: "blocks under 1%" is what gets
 * through, "blocks 99%" and "blocks over 99%" the share kept out, both T at most 1%; a level that would
 * keep less than half the light out has two readings and is refused with both.
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

    /**
     * A UV rating blocks from here up to its wavelength: 290 nm is where the UPF and critical-wavelength
     * methods start (REFERENCE.md §2–3), the shortest sunlight reaching the ground.
     */
    static final double UV_RATING_FROM_NM = 290;
    /** What a rating without a level lets through: at most 1% (common practice, no source). */
    static final double UV_RATING_DEFAULT_T = 0.01;
    /** Ratings in use run UV380 to UV420 (PRACTICE.md, safety eyewear); the limits only catch slips. */
    static final double UV_RATING_MIN_NM = 300;
    static final double UV_RATING_MAX_NM = 500;
    private static final BigDecimal HUNDRED = BigDecimal.valueOf(100);

    private final TokenCursor in;
    private final SpectrumNames names;

    SpectralClauseParser(TokenCursor in, SpectrumNames names) {
        this.in = in;
        this.names = names;
    }

    /**
     * What the word before a level says about it. "passes" wants light through; "blocks" keeps it out and
     * may give the share kept out ("blocks 99%"); "transmits" (or "T", "transmittance") leaves the side to
     * the comparison; a UV rating ("UV400") gives the most it lets through; NONE when the level stands alone.
     */
    enum Verb {
        NONE, PASSES, BLOCKS, TRANSMITS, RATING;

        static Verb of(Token word) {
            String w = word.lower();
            if (w.startsWith("pass")) {
                return PASSES;
            }
            return w.startsWith("block") ? BLOCKS : TRANSMITS;
        }

        /** The direction the verb itself demands, or null when the comparison decides. */
        Direction direction() {
            return switch (this) {
                case PASSES -> Direction.PASS;
                case BLOCKS, RATING -> Direction.BLOCK;
                case NONE, TRANSMITS -> null;
            };
        }
    }

    /**
     * A transmittance clause, or a weighted one when the level is followed by "of"; {@code verb} is the
     * already consumed "passes"/"blocks"/"transmits"/"T" token, or null.
     */
    Clause transmittance(Token start, Token verb) {
        Verb kind = verb == null ? Verb.NONE : Verb.of(verb);
        boolean mean = in.acceptWord("mean");
        Level level = level(verb, kind, mean);
        if (atOfUv()) {
            ofUv();
        } else if (in.atWord("of")) {
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

    /**
     * "of UV" only says what the band is ("blocks 99.9% of UV from 290 to 400 nm"); the band decides, and
     * must be named. The words go to the emitter names instead only when one starts with "uv" (an imported
     * "UV lamp") and no band follows.
     */
    private boolean atOfUv() {
        return in.atWord("of") && in.peek(1).isWord("uv")
                && (isBandStart(in.peek(2)) || !names.emitterStartsWith("uv"));
    }

    /** Consumes "of UV", which must be followed by the band. */
    private void ofUv() {
        in.next(); // "of"
        Token uv = in.next();
        if (!isBandStart(in.peek())) {
            throw in.error(Expected.keywords("from", "between", "at").because("after 'of " + uv.text()
                    + "' (name the band, as where UV starts differs: 280, 290 or 315 nm; e.g. 'from 290 to 400 nm')"));
        }
    }

    private static boolean isBandStart(Token t) {
        return t.isWord("at") || t.isWord("from") || t.isWord("between");
    }

    /**
     * "UV400", "UV400 under 0.5%", "UV 420 OD 3": blocking from {@link #UV_RATING_FROM_NM} up to the rated
     * wavelength, at most 1% unless a level is given. The rating word is next.
     */
    TransmittanceClause uvRating(Token start) {
        in.next(); // "UV"
        Token number = in.next();
        double nm = number.kind() == Kind.NUMBER ? new BigDecimal(number.text()).doubleValue() : Double.NaN;
        if (!(nm >= UV_RATING_MIN_NM && nm <= UV_RATING_MAX_NM)) {
            throw TokenCursor.outOfRange(number, "a UV rating from UV" + plain(UV_RATING_MIN_NM) + " to UV"
                    + plain(UV_RATING_MAX_NM) + ", such as 'UV400' (blocking up to 400 nm)", number.quoted());
        }
        Level level = new Level(Direction.BLOCK, UV_RATING_DEFAULT_T, ThresholdUnit.PERCENT);
        if (!endsClause(in.peek())) {
            level = level(start, Verb.RATING, false);
        }
        Level read = level;
        String text = in.slice(start.start(), in.previous().end());
        return TokenCursor.build(start, () -> new TransmittanceClause(Direction.BLOCK, Aggregate.EVERY_POINT,
                new Band(UV_RATING_FROM_NM, nm), read.thresholdT(), read.unit(), text));
    }

    /** A separator, the end or a confidence demand ("with 95% confidence"): a UV rating without its own level. */
    private static boolean endsClause(Token t) {
        return t.kind() == Kind.END || t.kind() == Kind.COMMA || t.isWord("and") || t.isWord("with");
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

    /** A level after {@code verb} (the consumed verb or rating token, null for {@link Verb#NONE}). */
    Level level(Token verb, Verb kind, boolean mean) {
        // how messages name what came before the level: "blocks", or the whole rating "UV400"
        String label = verb == null ? "" : kind == Verb.RATING ? in.slice(verb.start(), in.previous().end()) : verb.text();
        Token comparisonToken = in.peek();
        Sense sense = comparison();
        if (sense == null && !(in.atWord("to") || in.atWord("od") || in.at(Kind.NUMBER))) {
            throw in.error(levelStart(kind, mean));
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
        Written written = new Written(verb, label, kind, mean, number, value, unit);
        if (!density && kind == Verb.BLOCKS) {
            return blocking(written, sense, thresholdT);
        }
        return new Level(direction(sense, density, written, comparisonToken), thresholdT, unit);
    }

    /** The level as typed, for the readings an ambiguous one is refused with. */
    private record Written(Token verb, String label, Verb kind, boolean mean, Token number, BigDecimal value,
                           ThresholdUnit unit) {

        BigDecimal whole() {
            return unit == ThresholdUnit.PERCENT ? HUNDRED : BigDecimal.ONE;
        }

        /** "1%" or "0.01", as the user wrote the unit. */
        String amount(BigDecimal v) {
            return v.stripTrailingZeros().toPlainString() + (unit == ThresholdUnit.PERCENT ? "%" : "");
        }

        /** "blocks under 1%", "transmits mean under 99%": a level in the user's unit, after the verb given. */
        String form(String verbWord, String comparison, BigDecimal v) {
            return verbWord + (mean ? " mean " : " ") + comparison + " " + amount(v);
        }
    }

    /**
     * "blocks" with a percentage or fraction. The trade gives a blocking level either as what gets through
     * ("blocks under 1%") or as the share kept out ("blocks 99%", "blocks over 99.9%"). A ceiling
     * ("under", "at most", "or less") is read as what gets through, a bare number or a floor ("over", "at
     * least", "or more") as the share kept out, and either is accepted only where it keeps at least half the
     * light out: on the other side of 50% the reading would let most light through, which a blocking
     * requirement does not mean, and the likelier intent is the other reading, so both are shown instead.
     */
    private Level blocking(Written w, Sense sense, double asWritten) {
        int side = w.value().multiply(BigDecimal.valueOf(2)).compareTo(w.whole());
        if (sense == Sense.LOWER && side <= 0) {
            return new Level(Direction.BLOCK, asWritten, w.unit());
        }
        if (sense != Sense.LOWER && side >= 0) {
            BigDecimal through = w.whole().subtract(w.value());
            if (through.signum() <= 0) {
                throw TokenCursor.outOfRange(w.number(), "a share kept out below " + w.amount(w.whole())
                        + " (no part keeps out all light; ask for strong blocking as 'blocks over 99.99%' or 'OD 4')",
                        "'" + w.amount(w.value()) + "'");
            }
            double t = w.unit() == ThresholdUnit.PERCENT ? through.movePointLeft(2).doubleValue() : through.doubleValue();
            return new Level(Direction.BLOCK, t, w.unit());
        }
        throw twoReadings(w, sense);
    }

    /** A "blocks" level on the wrong side of 50% for its reading: both readings, the stricter first. */
    private RequirementSyntaxException twoReadings(Written w, Sense sense) {
        Token last = in.previous();
        String typed = in.slice(w.verb().start(), last.end());
        BigDecimal n = w.value();
        BigDecimal rest = w.whole().subtract(n);
        String strict;
        String loose;
        String readings;
        if (sense == Sense.LOWER) {
            // "blocks under 99%": a ceiling of 99% lets nearly anything pass; keeping 99% out is a ceiling of 1%
            strict = w.form("blocks", "under", rest);
            loose = w.form("transmits", "under", n);
            readings = "transmittance at most " + w.amount(n) + " (write '" + loose + "'), which lets most light"
                    + " through, or " + w.amount(n) + " of the light kept out, transmittance at most " + w.amount(rest)
                    + " (write '" + strict + "')";
        } else {
            // "blocks 1%": keeping 1% out is a ceiling of 99%; the likelier intent is a ceiling of 1%
            strict = w.form("blocks", "under", n);
            loose = w.form("transmits", "under", rest);
            readings = w.amount(n) + " of the light kept out, transmittance at most " + w.amount(rest) + " (write '"
                    + loose + "'), which lets most light through, or transmittance at most " + w.amount(n)
                    + " (write '" + strict + "')";
        }
        return new RequirementSyntaxException(w.verb().start(), last.end() - w.verb().start(),
                "a blocking level with one reading; '" + typed + "' can mean " + readings, "'" + typed + "'",
                List.of(strict, loose), false);
    }

    private Direction direction(Sense sense, boolean density, Written w, Token comparisonToken) {
        if (sense == null && density) {
            sense = Sense.HIGHER; // "OD 3" on its own is a blocking figure: at least that density
        }
        if (sense == null) {
            switch (w.kind()) {
                case PASSES -> {
                    return Direction.PASS;
                }
                case TRANSMITS -> throw eitherSide(w);
                case RATING -> throw TokenCursor.outOfRange(w.number(), "a comparison such as 'under' before the number"
                        + " (a UV rating's level is the most it lets through, e.g. 'UV400 under 0.5%')", w.number().quoted());
                default -> throw TokenCursor.outOfRange(w.number(), "a comparison such as 'over' or 'under' before the"
                        + " number", w.number().quoted());
            }
        }
        Direction direction = (sense == Sense.HIGHER) != density ? Direction.PASS : Direction.BLOCK;
        Direction demanded = w.kind().direction();
        if (demanded != null && direction != demanded) {
            boolean wantHigher = (demanded == Direction.PASS) != density;
            List<String> fitting = wantHigher ? HIGHER_WORDS : LOWER_WORDS;
            Token at = comparisonToken.kind() == Kind.NUMBER ? w.number() : comparisonToken;
            throw TokenCursor.outOfRange(at, Expected.keywords(fitting.toArray(String[]::new))
                    .after(w.label() + (density ? " … OD" : "")).describe(), at.quoted());
        }
        return direction;
    }

    /** "transmits 80%": at least or at most? Both readings, as forms to pick from. */
    private RequirementSyntaxException eitherSide(Written w) {
        Token last = in.previous();
        String typed = in.slice(w.verb().start(), last.end());
        String verbWord = w.verb().text();
        String over = w.form(verbWord, "over", w.value());
        String under = w.form(verbWord, "under", w.value());
        return new RequirementSyntaxException(w.verb().start(), last.end() - w.verb().start(),
                "a comparison; '" + typed + "' can mean transmittance at least " + w.amount(w.value()) + " (write '"
                        + over + "') or at most " + w.amount(w.value()) + " (write '" + under + "')",
                "'" + typed + "'", List.of(over, under), false);
    }

    private Expected levelStart(Verb kind, boolean mean) {
        List<String> words = new java.util.ArrayList<>();
        if (kind != Verb.BLOCKS && kind != Verb.RATING) {
            words.addAll(HIGHER_WORDS);
        }
        if (kind != Verb.PASSES) {
            words.addAll(LOWER_WORDS);
        }
        if (kind == Verb.BLOCKS) {
            words.add("to OD");
        }
        words.add("OD");
        if (!mean && kind != Verb.RATING) {
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

    Sense comparisonWord(Token t) {
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
